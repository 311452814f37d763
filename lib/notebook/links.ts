/** Links and images in a notebook document: which addresses are allowed and how a link is presented. */
import { NOTEBOOK_LIMITS as L, type TiptapNode } from './shape';

/**
 * A link's target, rel and class are ours (see linkPresentation): accepted as plain text so the
 * editor's own output passes, and dropped before the document is stored.
 */
export const LINK_PRESENTATION_ATTRS = ['target', 'rel', 'class'] as const;

const UPLOAD_SRC = /^\/api\/v1\/uploads\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** True only for the app's own upload addresses, e.g. /api/v1/uploads/{uuid}. */
export function isOwnUploadSrc(src: string): boolean {
  return UPLOAD_SRC.test(src);
}

/**
 * http:, https:, mailto: or a same-site path. "//host" and "/\host" are refused because
 * browsers read them as another host.
 */
export function isAllowedLinkHref(href: string): boolean {
  if (href.length === 0 || href.length > L.maxHrefChars) return false;
  // Control characters and spaces are how "java\tscript:" tricks get past naive checks.
  if (/[\u0000-\u0020\u007f]/.test(href)) return false;
  if (href.startsWith('/')) return !(href.startsWith('//') || href.startsWith('/\\'));
  let url: URL;
  try {
    url = new URL(href);
  } catch {
    return false;
  }
  return url.protocol === 'http:' || url.protocol === 'https:' || url.protocol === 'mailto:';
}

/**
 * How every link is rendered, whatever the document says: addresses elsewhere open in a new tab
 * without access to this page (noopener) or our address (noreferrer), and pass on no ranking
 * (nofollow); same-site paths open in place.
 */
export function linkPresentation(href: string): { target?: '_blank'; rel?: 'noopener noreferrer nofollow' } {
  return href.startsWith('/') ? {} : { target: '_blank', rel: 'noopener noreferrer nofollow' };
}

/** The document as stored: links lose the target, rel and class that rendering sets itself. */
export function withoutLinkPresentation(node: TiptapNode): TiptapNode {
  const out: TiptapNode = { ...node };
  if (node.marks) {
    out.marks = node.marks.map((m) => {
      if (m.type !== 'link' || !m.attrs) return m;
      const attrs = Object.fromEntries(Object.entries(m.attrs).filter(([k]) => !(LINK_PRESENTATION_ATTRS as readonly string[]).includes(k)));
      return { ...m, attrs };
    });
  }
  if (node.content) out.content = node.content.map(withoutLinkPresentation);
  return out;
}
