/**
 * The app exposed directly (TRUST_PROXY unset): X-Forwarded-For and X-Forwarded-Host are a
 * client's own words, so they neither choose the rate-limit bucket nor pass the Origin check.
 * The address is the socket's, which the hook from instrumentation.ts writes into a header of
 * its own. (The other integration files run as if behind our proxy: vitest.config.ts.)
 */
import { describe, it, expect, beforeAll, vi } from 'vitest';

vi.hoisted(() => {
  process.env.TRUST_PROXY = 'false';
});

import { callRoute, createWorkspace, type WorkspaceFixture } from './harness';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { env } from '@/lib/env';
import { clientAddress, installPeerAddressHook, PEER_ADDRESS_HEADER } from '@/lib/client-address';
import { assertSameOrigin } from '@/lib/api/route';
import { signInWithPassword } from '@/lib/auth';
import { JOIN_LIMIT, SIGN_IN_LIMITS } from '@/lib/rate-limit';
import * as joinRoute from '@/app/api/v1/tastings/join/route';
import * as tokensRoute from '@/app/api/v1/tokens/route';

let a: WorkspaceFixture;
beforeAll(async () => {
  expect(env().TRUST_PROXY).toBe('false');
  // As at server start: from now on only the hook's header names the peer.
  installPeerAddressHook();
  a = await createWorkspace('Direct');
});

describe('the client address without a trusted proxy', () => {
  it('is the socket address: a forged X-Forwarded-For or peer header from the client is ignored', async () => {
    const server = http.createServer((req, res) => res.end(clientAddress(req.headers as Record<string, unknown>)));
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    try {
      const { port } = server.address() as AddressInfo;
      const res = await fetch(`http://127.0.0.1:${port}/`, { headers: { 'x-forwarded-for': '203.0.113.5', [PEER_ADDRESS_HEADER]: '203.0.113.6', 'x-real-ip': '203.0.113.7' } });
      expect(await res.text()).toBe('127.0.0.1');
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });

  it('changing X-Forwarded-For does not reset the join-code limit', async () => {
    const peer = '192.0.2.201';
    const statuses: number[] = [];
    for (let i = 0; i <= JOIN_LIMIT.points; i++) {
      const res = await callRoute(joinRoute.POST, {
        method: 'POST', path: '/api/v1/tastings/join', caller: { kind: 'outsider' },
        body: { joinCode: 'ZZZZZ9', displayName: 'Walker' },
        headers: { [PEER_ADDRESS_HEADER]: peer, 'x-forwarded-for': `203.0.113.${i + 1}` },
      });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, JOIN_LIMIT.points).every((s) => s === 404)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    // Another socket address has its own count.
    const other = await callRoute(joinRoute.POST, {
      method: 'POST', path: '/api/v1/tastings/join', caller: { kind: 'outsider' },
      body: { joinCode: 'ZZZZZ9', displayName: 'Neighbour' },
      headers: { [PEER_ADDRESS_HEADER]: '192.0.2.202', 'x-forwarded-for': '203.0.113.1' },
    });
    expect(other.status).toBe(404);
  });

  it('changing X-Forwarded-For does not reset the per-address sign-in limit', async () => {
    const peer = '192.0.2.203';
    const attempts = Array.from({ length: SIGN_IN_LIMITS.perIp.points + 1 }, (_, i) =>
      signInWithPassword(
        { email: `spray${i}.${Date.now()}@test.example`, password: 'wrong-guess-1' },
        { [PEER_ADDRESS_HEADER]: peer, 'x-forwarded-for': `203.0.113.${i + 1}` },
      ).catch((e: Error) => e.message),
    );
    const codes = await Promise.all(attempts);
    expect(codes.filter((c) => c === 'bad_credentials').length).toBe(SIGN_IN_LIMITS.perIp.points);
    expect(codes.filter((c) => /^too_many_attempts_\d+$/.test(String(c))).length).toBe(1);
  });
});

describe('the Origin check without a trusted proxy', () => {
  it('ignores X-Forwarded-Host: a foreign Origin that matches it is refused', async () => {
    const forged = new Headers({ host: 'setwell.example', 'x-forwarded-host': 'evil.example', origin: 'https://evil.example' });
    const refused = (() => {
      try {
        assertSameOrigin(forged);
        return null;
      } catch (err) {
        return err;
      }
    })();
    expect(refused).toMatchObject({ status: 403, code: 'bad_origin' });
    expect(() => assertSameOrigin(new Headers({ host: 'setwell.example', origin: 'https://setwell.example' }))).not.toThrow();

    const res = await callRoute(tokensRoute.POST, {
      method: 'POST', path: '/api/v1/tokens', caller: { kind: 'session', person: a.people.developer },
      body: { label: 'forwarded host' }, headers: { origin: 'https://evil.example', 'x-forwarded-host': 'evil.example' },
    });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });
});
