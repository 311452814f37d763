import { z } from 'zod';

/** Shown beside every password field; lib/passwords.ts enforces the same rules. */
export const PASSWORD_RULES = 'At least 10 characters, with at least one letter and one digit or symbol.';

/** The rules as a schema, free of the hashing library so forms in the browser can check as you type. */
export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  .refine((s) => /\p{L}/u.test(s), 'Include at least one letter.')
  .refine((s) => /[^\p{L}]/u.test(s), 'Include at least one digit or symbol.')
  .refine((s) => new Set(s).size >= 4, 'Use more than three different characters.');
