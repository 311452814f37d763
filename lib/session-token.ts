/**
 * Reads next-auth's session cookie (a JWE: "dir" with A256GCM, v4's format) with the encryption key
 * derived once per secret. next-auth/jwt's own `decode` derives the key with HKDF on every call; under
 * load that derivation was the largest single item in a staff page's CPU profile. The derivation
 * below is the same as next-auth 4.24's `getDerivedEncryptionKey` (empty salt), and the decryption
 * the same `jwtDecrypt` with its 15 s clock tolerance, so cookies issued by next-auth read as before.
 */
import hkdf from '@panva/hkdf';
import { jwtDecrypt, type JWTPayload } from 'jose';

let derived: { secret: string; key: Promise<Uint8Array> } | null = null;

function encryptionKey(secret: string): Promise<Uint8Array> {
  if (derived?.secret !== secret) derived = { secret, key: hkdf('sha256', secret, '', 'NextAuth.js Generated Encryption Key', 32) };
  return derived.key;
}

/** The session's claims, or a thrown error for a token that is malformed, tampered with, expired or sealed with another secret. */
export async function decodeSessionToken(token: string, secret: string): Promise<JWTPayload> {
  const { payload } = await jwtDecrypt(token, await encryptionKey(secret), { clockTolerance: 15 });
  return payload;
}
