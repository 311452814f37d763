import 'server-only';
import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe random secret for invitation, reset and API-token links (256 bits). */
export function newSecret(prefix = ''): string {
  return prefix + randomBytes(32).toString('base64url');
}

/** Links and tokens are stored only as SHA-256: a database leak does not leak working links. */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret).digest('hex');
}
