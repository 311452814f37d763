import { z } from 'zod';
import { name } from '@/lib/input';

export const createTokenSchema = z.object({
  label: name('Give the token a label, for example the script that uses it.', 80),
}).strict();

export interface TokenRow {
  tokenId: string;
  label: string;
  displayPrefix: string;
  createdAt: string;
  lastUsedAt: string | null;
}
