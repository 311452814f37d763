/**
 * Structured JSON logs (pino). Secrets and taster answers are never logged: request paths go
 * through pathForLog (seat tokens and link tokens masked), errors through the err serializer
 * (no SQL statement, which carries the bound values, and no row details), and the redact list
 * is a last guard for fields named like secrets.
 */
import pino, { type LoggerOptions } from 'pino';

const SQL_START = /^\s*(select|insert|update|delete|with|begin|commit|rollback|savepoint|release|set|lock)\b/i;

/** Database errors arrive as "<statement with values> - <server message>": keep the message only. */
export function withoutStatement(message: string): string {
  if (!SQL_START.test(message)) return message;
  const cut = message.lastIndexOf(' - ');
  return cut >= 0 ? message.slice(cut + 3) : '[database error; statement not logged]';
}

/** PostgreSQL error fields that can quote row values ("Failing row contains (…)", "Key (…)=(…)"). */
const ROW_FIELDS = ['detail', 'where', 'internalQuery', 'query', 'sql', 'bindings', 'parameters', 'params'];

type SerializedError = Record<string, unknown> & { message?: string; stack?: string; cause?: unknown };

function cleanError(value: unknown): unknown {
  if (!value || typeof value !== 'object') return value;
  const e = { ...(value as SerializedError) };
  for (const f of ROW_FIELDS) delete e[f];
  if (typeof e.message === 'string') {
    const message = withoutStatement(e.message);
    if (typeof e.stack === 'string' && message !== e.message) {
      // The stack's first line repeats the message; keep only the frames.
      const frames = e.stack.split('\n').filter((l) => /^\s+at\s/.test(l) || l === '');
      e.stack = [`${String(e.type ?? e.name ?? 'Error')}: ${message}`, ...frames].join('\n');
    }
    e.message = message;
  }
  if (e.cause) e.cause = cleanError(e.cause);
  return e;
}

const TOKEN_IN_PATH = /\b(sws|swt)_[A-Za-z0-9_-]+/g;
const LINK_TOKEN = /\/(accept-invite|reset-password)\/[^/?#]+/g;

/** The path of a request URL, without its query and with every token masked. */
export function pathForLog(url: string): string {
  let pathname: string;
  try {
    pathname = new URL(url, 'http://local').pathname;
  } catch {
    pathname = '[unreadable path]';
  }
  return pathname.replace(TOKEN_IN_PATH, '$1_[redacted]').replace(LINK_TOKEN, '/$1/[redacted]');
}

export const logOptions: LoggerOptions = {
  level: process.env.LOG_LEVEL ?? 'info',
  base: { app: 'setwell' },
  serializers: { err: (err: unknown) => cleanError(pino.stdSerializers.err(err as Error)) },
  redact: {
    paths: [
      'password', '*.password', 'passwordHash', '*.passwordHash', 'token', '*.token', 'seatToken', '*.seatToken',
      'authorization', '*.authorization', 'cookie', '*.cookie', 'secret', '*.secret', 'idempotencyKey', '*.idempotencyKey',
      'value', '*.value', 'answers', '*.answers',
    ],
    censor: '[redacted]',
  },
};

export const logger = pino(logOptions);
