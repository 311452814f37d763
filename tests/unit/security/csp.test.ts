/**
 * The page policy (lib/csp.ts). Source for the directive semantics: W3C Content Security Policy
 * Level 3 (nonce-source, 'strict-dynamic', 'unsafe-eval', fetch directives falling back to default-src).
 */
import { describe, it, expect } from 'vitest';
import { contentSecurityPolicy, newNonce } from '@/lib/csp';

const directives = (policy: string) => new Map(policy.split('; ').map((d) => [d.split(' ')[0], d.split(' ').slice(1)]));

describe('contentSecurityPolicy', () => {
  it('allows scripts only by nonce (and what they load), never inline or eval in production', () => {
    const p = directives(contentSecurityPolicy({ nonce: 'abc123', development: false }));
    expect(p.get('script-src')).toEqual(["'self'", "'nonce-abc123'", "'strict-dynamic'"]);
    expect(p.get('style-src')).toEqual(["'self'", "'nonce-abc123'"]);
    for (const values of p.values()) {
      expect(values).not.toContain("'unsafe-inline'");
      expect(values).not.toContain("'unsafe-eval'");
      expect(values).not.toContain('*');
    }
  });

  it('keeps every other fetch to our origin (data: only for images: the join QR code)', () => {
    const p = directives(contentSecurityPolicy({ nonce: 'n', development: false }));
    expect(p.get('default-src')).toEqual(["'self'"]);
    expect(p.get('img-src')).toEqual(["'self'", 'data:']);
    expect(p.get('font-src')).toEqual(["'self'"]);
    expect(p.get('connect-src')).toEqual(["'self'"]);
    expect(p.get('object-src')).toEqual(["'none'"]);
    expect(p.get('frame-ancestors')).toEqual(["'none'"]);
    expect(p.get('base-uri')).toEqual(["'self'"]);
    expect(p.get('form-action')).toEqual(["'self'"]);
  });

  it("adds 'unsafe-eval' and the dev server's websocket in development only", () => {
    const dev = directives(contentSecurityPolicy({ nonce: 'n', development: true }));
    expect(dev.get('script-src')).toContain("'unsafe-eval'");
    expect(dev.get('connect-src')).toEqual(["'self'", 'ws:', 'wss:']);
  });

  it('makes a fresh 128-bit base64 nonce each time', () => {
    const a = newNonce();
    const b = newNonce();
    expect(a).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(Buffer.from(a, 'base64')).toHaveLength(16);
    expect(a).not.toBe(b);
  });
});
