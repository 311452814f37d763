/**
 * CSP on prefetch requests: proxy.ts runs for every page request, including the router's
 * prefetches and RSC requests, and every response it passes carries the page policy.
 * Source for the request headers: the Next.js App Router's prefetch and RSC requests
 * (`Next-Router-Prefetch: 1`, `RSC: 1`) and browsers' speculative loads (`Purpose: prefetch`,
 * `Sec-Purpose: prefetch`, WHATWG Fetch) (memory).
 */
import { describe, expect, it } from 'vitest';
import { NextRequest } from 'next/server';
import { unstable_doesMiddlewareMatch } from 'next/experimental/testing/server';
import { config, proxy } from '@/proxy';

const PREFETCHES: Array<Record<string, string>> = [
  { purpose: 'prefetch' },
  { 'next-router-prefetch': '1', rsc: '1' },
  { rsc: '1' },
  { 'sec-purpose': 'prefetch' },
  { 'next-router-prefetch': '1', 'next-router-segment-prefetch': '/_tree', rsc: '1' },
];

describe('CSP on prefetch requests', () => {
  it('the proxy runs for page requests, prefetches and RSC requests alike', () => {
    for (const headers of [{}, ...PREFETCHES]) {
      expect(unstable_doesMiddlewareMatch({ config, url: '/trials', headers }), JSON.stringify(headers)).toBe(true);
      expect(unstable_doesMiddlewareMatch({ config, url: '/formulas/6b1f4c9e-2d3a-4e5f-8a7b-9c0d1e2f3a4b/print', headers }), JSON.stringify(headers)).toBe(true);
    }
    // The API and static files keep the fixed policy of next.config.mjs.
    expect(unstable_doesMiddlewareMatch({ config, url: '/api/v1/trials' })).toBe(false);
    expect(unstable_doesMiddlewareMatch({ config, url: '/_next/static/chunks/app.js' })).toBe(false);
  });

  it('every response it passes carries the page policy with a fresh nonce', () => {
    for (const headers of PREFETCHES) {
      const res = proxy(new NextRequest('http://localhost/trials', { headers }));
      const policy = res.headers.get('content-security-policy');
      expect(policy, JSON.stringify(headers)).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'/);
      expect(policy).toContain("frame-ancestors 'none'");
    }
  });
});
