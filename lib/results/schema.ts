import { z } from 'zod';

export const recommendationSchema = z
  .object({
    variantId: z.uuid('Choose a variant.'),
    rationale: z.string().trim().min(10, 'Say why, in a sentence or two: the evidence travels with the recommendation.').max(2000),
  })
  .strict();
