import bcrypt from 'bcryptjs';
import { z } from 'zod';

const BCRYPT_COST = 11;

export { PASSWORD_RULES } from '@/lib/password-rules';

export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  .refine((s) => /\p{L}/u.test(s), 'Include at least one letter.')
  .refine((s) => /[^\p{L}]/u.test(s), 'Include at least one digit or symbol.')
  .refine((s) => new Set(s).size >= 4, 'Use more than three different characters.');

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a fixed hash when the user has none, so timing does not reveal which e-mails exist.
  return bcrypt.compare(password, hash ?? '$2b$11$C6UzMDM.H6dfI/f/IKcEeO5Bg5S7RVtGc3ZaJ6XoG6l8mS1xwQ6nW');
}
