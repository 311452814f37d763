/** Structured JSON logs. Secrets and taster answers are never logged; the redact list is a second guard. */
import pino from 'pino';

export const logger = pino({
  level: process.env.LOG_LEVEL ?? 'info',
  base: { app: 'setwell' },
  redact: {
    paths: ['password', '*.password', 'token', '*.token', 'authorization', '*.authorization', 'cookie', '*.cookie', 'secret', '*.secret'],
    censor: '[redacted]',
  },
});
