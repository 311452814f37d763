import { z } from 'zod';

/**
 * The environment, validated once. Called from instrumentation.ts at server start so a bad
 * value stops the server with a readable message instead of failing on the first request.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgresql:// connection URL'),
  NEXTAUTH_SECRET: z.string().min(32, 'must be at least 32 characters of random data'),
  NEXTAUTH_URL: z.url(),
  APP_URL: z.url(),
  SMTP_URL: z.string().regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL'),
  MAIL_FROM: z.string().min(3),
  /** The SMTP fake's web view; only set in development and tests. */
  MAIL_OUTBOX_URL: z.url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Setwell cannot start: the environment is invalid.\n${lines.join('\n')}`);
  }
  cached = parsed.data;
  return cached;
}
