/**
 * The Content Security Policy of every page, built per request around a fresh nonce (proxy.ts).
 * Pure: no Next imports, so the unit test and the proxy share it.
 *
 * What the app needs, and no more:
 * - scripts: only those carrying this request's nonce (Next adds it to its own tags) and what they
 *   load ('strict-dynamic'); development adds 'unsafe-eval' for React's dev tooling only.
 * - styles: our own stylesheets and nonce-carrying <style> tags (Next's own). Tiptap's runtime
 *   <style> injection is switched off; its rules live in app/globals.css.
 * - images: our origin (uploads and thumbnails come through /api/v1/uploads) and data: for the
 *   join QR code, which the panel page renders as a data URL.
 * - fonts: our origin (next/font/local serves them from /_next/static/media).
 * - connections: our origin (the JSON API); development adds the dev server's websocket.
 */
export interface CspOptions {
  nonce: string;
  development: boolean;
}

export function contentSecurityPolicy({ nonce, development }: CspOptions): string {
  const directives: Record<string, string[]> = {
    'default-src': ["'self'"],
    'script-src': ["'self'", `'nonce-${nonce}'`, "'strict-dynamic'", ...(development ? ["'unsafe-eval'"] : [])],
    'style-src': ["'self'", `'nonce-${nonce}'`],
    'img-src': ["'self'", 'data:'],
    'font-src': ["'self'"],
    'connect-src': ["'self'", ...(development ? ['ws:', 'wss:'] : [])],
    'object-src': ["'none'"],
    'frame-src': ["'none'"],
    'worker-src': ["'self'"],
    'manifest-src': ["'self'"],
    'base-uri': ["'self'"],
    'form-action': ["'self'"],
    'frame-ancestors': ["'none'"],
  };
  return Object.entries(directives)
    .map(([name, values]) => `${name} ${values.join(' ')}`)
    .join('; ');
}

/** A nonce of 128 random bits, base64 (CSP3 nonce-source grammar). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
