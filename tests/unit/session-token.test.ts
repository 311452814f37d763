import { describe, expect, it } from 'vitest';
import { encode } from 'next-auth/jwt';
import { decodeSessionToken } from '@/lib/session-token';

// The cookie is issued by next-auth 4.24 (`encode`); these checks hold our reader to its format and
// to the refusals a session reader must make. Source: next-auth/jwt's own encode (the reference
// implementation of the format), and RFC 7516 (JWE) for what a tampered token must do: fail.
const secret = 'unit-test-secret-unit-test-secret-0000';

describe('decodeSessionToken', () => {
  it('reads the claims of a cookie next-auth issued', async () => {
    const token = await encode({ token: { sub: 'user-1', epoch: 3 }, secret });
    const claims = await decodeSessionToken(token, secret);
    expect(claims.sub).toBe('user-1');
    expect(claims.epoch).toBe(3);
  });

  it('reads cookies sealed with a second secret after the first (the key follows the secret)', async () => {
    const other = 'another-secret-another-secret-another-1';
    await decodeSessionToken(await encode({ token: { sub: 'a' }, secret }), secret);
    const claims = await decodeSessionToken(await encode({ token: { sub: 'b' }, secret: other }), other);
    expect(claims.sub).toBe('b');
  });

  it('refuses a cookie sealed with another secret', async () => {
    const token = await encode({ token: { sub: 'user-1' }, secret: 'not-the-server-secret-not-the-server-se' });
    await expect(decodeSessionToken(token, secret)).rejects.toThrow();
  });

  it('refuses a tampered cookie', async () => {
    const token = await encode({ token: { sub: 'user-1' }, secret });
    const parts = token.split('.');
    const cipher = parts[3];
    parts[3] = (cipher[0] === 'A' ? 'B' : 'A') + cipher.slice(1);
    await expect(decodeSessionToken(parts.join('.'), secret)).rejects.toThrow();
  });

  it('refuses an expired cookie (past the 15 s tolerance next-auth allows)', async () => {
    const token = await encode({ token: { sub: 'user-1' }, secret, maxAge: -60 });
    await expect(decodeSessionToken(token, secret)).rejects.toThrow();
  });

  it('refuses what is not a token at all', async () => {
    await expect(decodeSessionToken('not.a.token', secret)).rejects.toThrow();
    await expect(decodeSessionToken('', secret)).rejects.toThrow();
  });
});
