import { describe, expect, it } from 'vitest';
import { NOTEBOOK_LIMITS, type TiptapDoc, type TiptapNode } from '@/lib/notebook/shape';
import { isAllowedLinkHref, isOwnUploadSrc } from '@/lib/notebook/links';
import { findDocProblems, mergeKeepingBoth, sanitizeDoc } from '@/lib/notebook/document';
import { saveNotebookSchema } from '@/lib/notebook/schema';
import { normaliseLinkInput, retryDelayMs } from '@/lib/notebook/autosave';

const TRIAL_ID = '6b1f4c9e-2d3a-4e5f-8a7b-9c0d1e2f3a4b';
const para = (text: string): TiptapNode => ({ type: 'paragraph', content: [{ type: 'text', text }] });

describe('link addresses', () => {
  it('accepts web, mail and same-site addresses', () => {
    expect(isAllowedLinkHref('https://example.org/pectin?grade=150#top')).toBe(true);
    expect(isAllowedLinkHref('http://example.org')).toBe(true);
    // Source: RFC 6068, The 'mailto' URI Scheme.
    expect(isAllowedLinkHref('mailto:lab@example.org')).toBe(true);
    expect(isAllowedLinkHref('/trials/6b1f4c9e/notebook')).toBe(true);
  });

  it('refuses script, data and other-host tricks', () => {
    // Source: OWASP Cross Site Scripting Prevention Cheat Sheet (javascript: and data: URLs execute script).
    expect(isAllowedLinkHref('javascript:alert(1)')).toBe(false);
    expect(isAllowedLinkHref('JaVaScRiPt:alert(1)')).toBe(false);
    expect(isAllowedLinkHref('data:text/html,<script>alert(1)</script>')).toBe(false);
    // Source: WHATWG URL Standard, basic URL parser — ASCII tab and newline are removed before the scheme is read.
    expect(isAllowedLinkHref('java\tscript:alert(1)')).toBe(false);
    expect(isAllowedLinkHref('java\nscript:alert(1)')).toBe(false);
    // Source: RFC 3986 §4.2 — "//host/path" is a network-path reference, i.e. another host.
    expect(isAllowedLinkHref('//evil.example/x')).toBe(false);
    // Source: WHATWG URL Standard — in special schemes "\" is read as "/", so "/\host" is another host too.
    expect(isAllowedLinkHref('/\\evil.example')).toBe(false);
    expect(isAllowedLinkHref('ftp://example.org/file')).toBe(false);
    expect(isAllowedLinkHref('')).toBe(false);
  });

  it('turns a bare domain into https and explains a refusal', () => {
    expect(normaliseLinkInput(' example.org/method ', isAllowedLinkHref)).toEqual({ ok: true, href: 'https://example.org/method' });
    expect(normaliseLinkInput('javascript:alert(1)', isAllowedLinkHref)).toMatchObject({ ok: false });
    expect(normaliseLinkInput('   ', isAllowedLinkHref)).toEqual({ ok: false, message: 'Enter an address.' });
  });
});

describe('image sources', () => {
  it('accepts only the app’s own upload addresses', () => {
    expect(isOwnUploadSrc('/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d')).toBe(true);
    expect(isOwnUploadSrc('https://images.example.net/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d')).toBe(false);
    expect(isOwnUploadSrc('/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d/../../me')).toBe(false);
    expect(isOwnUploadSrc('data:image/png;base64,iVBORw0KGgo=')).toBe(false);
  });
});

describe('the document check', () => {
  it('accepts every node and mark the editor offers', () => {
    const doc: TiptapDoc = {
      type: 'doc',
      content: [
        { type: 'heading', attrs: { level: 3 }, content: [{ type: 'text', text: 'Set test' }] },
        { type: 'paragraph', content: [
          { type: 'text', text: 'a', marks: [{ type: 'bold' }, { type: 'italic' }, { type: 'underline' }, { type: 'strike' }, { type: 'code' }] },
          { type: 'hardBreak' },
          { type: 'text', text: 'b', marks: [{ type: 'link', attrs: { href: '/formulas', target: '_blank', rel: 'noopener noreferrer nofollow', class: null, title: null } }] },
        ] },
        { type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: false }, content: [para('Label jars')] }] },
        { type: 'bulletList', content: [{ type: 'listItem', content: [para('x')] }] },
        { type: 'orderedList', attrs: { start: 1, type: null }, content: [{ type: 'listItem', content: [para('y')] }] },
        { type: 'table', content: [{ type: 'tableRow', content: [
          { type: 'tableHeader', attrs: { colspan: 1, rowspan: 1, colwidth: null, align: null }, content: [para('Jar')] },
          { type: 'tableCell', attrs: { colspan: 1, rowspan: 1, colwidth: [120], align: 'left' }, content: [para('1')] },
        ] }] },
        { type: 'blockquote', content: [para('quote')] },
        { type: 'codeBlock', attrs: { language: null }, content: [{ type: 'text', text: 'x = 1' }] },
        { type: 'horizontalRule' },
        { type: 'image', attrs: { src: '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d', alt: 'jar.jpg', title: null, width: null, height: null } },
      ],
    };
    expect(findDocProblems(doc)).toEqual([]);
  });

  it('names the path of each refusal', () => {
    const bad = {
      type: 'doc',
      content: [
        { type: 'heading', attrs: { level: 4 }, content: [{ type: 'text', text: 'too deep a heading' }] },
        { type: 'iframe', attrs: { src: 'https://example.org' } },
        { type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'highlight' }] }] },
        { type: 'image', attrs: { src: '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d', onerror: 'alert(1)' } },
        { type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: 'yes' }, content: [para('x')] }] },
        { type: 'listItem', content: [para('orphan')] },
      ],
    };
    const paths = findDocProblems(bad).map((p) => p.path.join('.'));
    expect(paths).toEqual([
      'content.0.attrs.level',
      'content.1.type',
      'content.2.content.0.marks.0.type',
      'content.3.attrs.onerror',
      'content.4.content.0.attrs.checked',
      'content.5.type',
    ]);
    const parsed = saveNotebookSchema.safeParse({ trialId: TRIAL_ID, variantId: null, baseVersion: 0, doc: bad });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => i.path.join('.'))).toContain('doc.content.1.type');
  });

  it('refuses a document that is not a doc at the top', () => {
    expect(findDocProblems(para('x')).map((p) => p.path.join('.'))).toEqual(['type']);
    expect(findDocProblems(null)).toHaveLength(1);
  });

  it(`stops at ${NOTEBOOK_LIMITS.maxDepth} levels and ${NOTEBOOK_LIMITS.maxDocBytes / 1000} kB (project limits, no published source)`, () => {
    const nest = (levels: number): TiptapDoc => {
      // doc > blockquote × (levels − 3) > paragraph > text: `levels` nodes deep.
      let node: TiptapNode = para('deep');
      for (let i = 0; i < levels - 3; i += 1) node = { type: 'blockquote', content: [node] };
      return { type: 'doc', content: [node] };
    };
    expect(findDocProblems(nest(NOTEBOOK_LIMITS.maxDepth))).toEqual([]);
    expect(findDocProblems(nest(NOTEBOOK_LIMITS.maxDepth + 1))[0].message).toMatch(/nested more than 30/);

    const filler = 'Brix 65 '.repeat(1000); // 8000 characters, one byte each in UTF-8
    const big: TiptapDoc = { type: 'doc', content: Array.from({ length: 26 }, () => para(filler)) };
    expect(findDocProblems(big)[0].message).toMatch(/limit is 200 kB/);
    const fits: TiptapDoc = { type: 'doc', content: Array.from({ length: 24 }, () => para(filler)) };
    expect(findDocProblems(fits)).toEqual([]);
  });

  it('validates the rest of a save', () => {
    const ok = saveNotebookSchema.safeParse({ trialId: TRIAL_ID, variantId: null, baseVersion: 0, doc: { type: 'doc', content: [para('x')] } });
    expect(ok.success).toBe(true);
    expect(saveNotebookSchema.safeParse({ trialId: TRIAL_ID, variantId: null, baseVersion: -1, doc: { type: 'doc' } }).success).toBe(false);
    expect(saveNotebookSchema.safeParse({ trialId: TRIAL_ID, variantId: null, baseVersion: 1.5, doc: { type: 'doc' } }).success).toBe(false);
    expect(saveNotebookSchema.safeParse({ trialId: 'T-001', variantId: null, baseVersion: 0, doc: { type: 'doc' } }).success).toBe(false);
  });
});

describe('keeping both versions', () => {
  it('puts the parallel version under a heading naming who and when, after the current one', () => {
    const merged = mergeKeepingBoth({ type: 'doc', content: [para('current')] }, { type: 'doc', content: [para('parallel')] }, 'Ada Quill', '2026-06-14 10:15 UTC');
    expect(merged.content).toEqual([
      para('current'),
      { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Kept from a parallel edit by Ada Quill at 2026-06-14 10:15 UTC' }] },
      para('parallel'),
    ]);
    expect(findDocProblems(merged)).toEqual([]);
  });
});

describe('cleaning a stored document for display', () => {
  it('drops unknown nodes, unknown attributes and unsafe addresses, keeps the text', () => {
    const clean = sanitizeDoc({
      type: 'doc',
      content: [
        { type: 'script', content: [{ type: 'text', text: 'alert(1)' }] },
        { type: 'image', attrs: { src: 'https://example.net/x.png' } },
        { type: 'image', attrs: { src: '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d', alt: 'ok', onerror: 'alert(2)' } },
        { type: 'paragraph', content: [{ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href: 'javascript:alert(3)' } }, { type: 'bold' }] }] },
      ],
    });
    expect(clean).toEqual({
      type: 'doc',
      content: [
        { type: 'image', attrs: { src: '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d', alt: 'ok' } },
        { type: 'paragraph', content: [{ type: 'text', text: 'click', marks: [{ type: 'bold' }] }] },
      ],
    });
  });
});

describe('retry back-off', () => {
  it('doubles from 2 s up to 30 s (common practice, no published source)', () => {
    expect([1, 2, 3, 4, 5, 6].map(retryDelayMs)).toEqual([2000, 4000, 8000, 16000, 30000, 30000]);
  });
});
