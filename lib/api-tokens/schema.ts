import { z } from 'zod';

export const createTokenSchema = z.object({
  label: z.string().trim().min(1, 'Give the token a label, for example the script that uses it.').max(80, 'Use at most 80 characters.'),
}).strict();

export interface TokenRow {
  tokenId: string;
  label: string;
  displayPrefix: string;
  createdAt: string;
  lastUsedAt: string | null;
}
