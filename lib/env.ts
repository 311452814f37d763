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
  /**
   * 'true' only when a proxy of ours sits in front and sets X-Forwarded-For / X-Forwarded-Host:
   * then the client address and the request's host are read from them. Otherwise both headers
   * are ignored (a client could write them) and the socket and Host header count.
   */
  TRUST_PROXY: z.enum(['true', 'false'], 'must be true or false').default('false'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Object storage for photos and files. Leave S3_ENDPOINT unset for AWS S3 itself. */
  S3_ENDPOINT: z.url('must be the URL of an S3-compatible store, e.g. http://127.0.0.1:4569').optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_BUCKET: z.string({ error: 'is required: the bucket that keeps photos and files' }).min(3, 'must be a bucket name (3 characters or more)'),
  S3_ACCESS_KEY_ID: z.string({ error: 'is required: the access key for the object store' }).min(1, 'is required: the access key for the object store'),
  S3_SECRET_ACCESS_KEY: z.string({ error: 'is required: the secret key for the object store' }).min(1, 'is required: the secret key for the object store'),
  /** 'true' for the local fake and MinIO, which address buckets by path rather than by host name. */
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false'], 'must be true or false').default('false'),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

const STORAGE_KEYS = { S3_ENDPOINT: true, S3_REGION: true, S3_BUCKET: true, S3_ACCESS_KEY_ID: true, S3_SECRET_ACCESS_KEY: true, S3_FORCE_PATH_STYLE: true } as const;
export type StorageEnv = Pick<Env, keyof typeof STORAGE_KEYS>;

/** Only the S3_* variables, so scripts (the S3 fake) can use lib/storage.ts without the app's secrets. */
export function storageEnv(): StorageEnv {
  if (cached) return cached;
  const parsed = envSchema.pick(STORAGE_KEYS).safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Setwell cannot reach object storage: the environment is invalid.\n${lines.join('\n')}`);
  }
  return parsed.data;
}

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
