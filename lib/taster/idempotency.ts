/**
 * Idempotency keys for answer PUTs. A key is made once per answer change and reused on
 * every retry, so the server can tell a retry from a new answer.
 */

export type RandomBytesSource = (length: number) => Uint8Array;

function defaultRandomBytes(length: number): Uint8Array {
  const bytes = new Uint8Array(length);
  globalThis.crypto.getRandomValues(bytes);
  return bytes;
}

/**
 * A version-4 UUID built from 16 random bytes. `crypto.randomUUID` exists only in secure
 * contexts, and a phone on a plain-http kitchen network is not one, so we build it ourselves.
 */
export function makeIdempotencyKey(randomBytes: RandomBytesSource = defaultRandomBytes): string {
  const bytes = randomBytes(16);
  if (bytes.length < 16) throw new Error('Need 16 random bytes for a UUID.');
  bytes[6] = (bytes[6] & 0x0f) | 0x40; // version 4
  bytes[8] = (bytes[8] & 0x3f) | 0x80; // RFC variant
  const hex = Array.from(bytes.slice(0, 16), (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20, 32)}`;
}

export const UUID_V4_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;
