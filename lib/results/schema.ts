import { z } from 'zod';
import { longText } from '@/lib/input';

export const recommendationSchema = z
  .object({
    variantId: z.uuid('Choose a variant.'),
    rationale: longText(2000, { min: 10, required: 'Say why, in a sentence or two: the evidence travels with the recommendation.' }),
  })
  .strict();
