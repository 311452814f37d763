/**
 * The one error shape of the JSON API: { "error": { "code", "message", "fields"? } }.
 * 400 unreadable body, 401 not signed in, 403 not allowed, 404 not found (or another
 * workspace's), 409 conflict, 422 failed validation, 503 database unreachable (with Retry-After).
 */
import { ZodError } from 'zod';
import { AccessDenied } from '@/lib/permissions';
import { Conflict, ValidationFailed, zodFieldErrors, type FieldErrors } from '@/lib/errors';

export class ApiError extends Error {
  constructor(
    readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

const CODES: Record<AccessDenied['status'], string> = { 401: 'unauthenticated', 403: 'forbidden', 404: 'not_found' };

/** Seconds a client is asked to wait when the database is unreachable (a restart takes a few). */
export const RETRY_AFTER_SECONDS = 5;

export type DescribedError = {
  status: number;
  body: { error: { code: string; message: string; fields?: FieldErrors } };
  headers?: Record<string, string>;
};

/** Maps anything a handler throws to status + body; unknown errors become a 500 without details. */
export function describeError(err: unknown): DescribedError {
  if (isDatabaseUnavailable(err)) {
    return {
      status: 503,
      body: { error: { code: 'unavailable', message: 'The database cannot be reached just now. Try again in a few seconds.' } },
      headers: { 'retry-after': String(RETRY_AFTER_SECONDS) },
    };
  }
  if (err instanceof ApiError) {
    return { status: err.status, body: { error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } } };
  }
  if (err instanceof AccessDenied) return { status: err.status, body: { error: { code: CODES[err.status], message: err.message } } };
  if (err instanceof ZodError) {
    return { status: 422, body: { error: { code: 'invalid', message: 'Some fields are not valid.', fields: zodFieldErrors(err) } } };
  }
  if (err instanceof ValidationFailed) return { status: 422, body: { error: { code: 'invalid', message: err.message, fields: err.fields } } };
  if (err instanceof Conflict) return { status: 409, body: { error: { code: 'conflict', message: err.message } } };
  if (err instanceof Error && err.name === 'RateLimited') return { status: 429, body: { error: { code: 'rate_limited', message: err.message } } };
  if (isUniqueViolation(err)) return { status: 409, body: { error: { code: 'conflict', message: 'That already exists.' } } };
  // Raised by the database triggers that keep production versions, batch records and the audit trail unchanged.
  if (isImmutableRecordViolation(err)) return { status: 409, body: { error: { code: 'immutable', message: 'This record cannot be changed.' } } };
  return { status: 500, body: { error: { code: 'internal', message: 'Something went wrong on our side. Nothing was changed.' } } };
}

function isImmutableRecordViolation(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: string }).code === 'P0001';
}

function isUniqueViolation(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: string }).code === '23505';
}

/** PostgreSQL SQLSTATEs that mean "the server is not there for you right now", not "your request is wrong". */
const UNAVAILABLE_SQLSTATES = new Set([
  '57P01', // admin_shutdown: the server is stopping (a restart)
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now: starting up or shutting down
  '53300', // too_many_connections
]);
/** Socket failures on the way to the database (Node's system error codes). */
const UNAVAILABLE_SOCKET_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'EAI_AGAIN', 'ENOTFOUND', 'ECONNABORTED']);
/** Errors that pg, pg-pool and knex raise with a message but no code when a connection is lost or cannot be had. */
const UNAVAILABLE_MESSAGES = [
  /^Connection terminated/, // pg: the server closed the socket (restart, crash), or a connect timeout
  /^timeout expired$/, // pg: connectionTimeoutMillis passed before the server answered
  /Client has encountered a connection error and is not queryable/, // pg: a client whose socket already failed
  /^timeout exceeded when trying to connect/, // pg-pool
  /^Knex: Timeout acquiring a connection/, // knex's pool: no connection within the acquire timeout
];

/**
 * True when the database could not be reached or went away mid-request: the honest answer is
 * 503 with Retry-After, never a 500. Looks through the wrappers MikroORM and Node put around the
 * driver's error (`cause`, AggregateError's `errors`).
 */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (typeof err !== 'object' || err === null || depth > 4) return false;
  const e = err as { code?: unknown; name?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
  if (typeof e.code === 'string') {
    if (UNAVAILABLE_SQLSTATES.has(e.code) || e.code.startsWith('08') || UNAVAILABLE_SOCKET_CODES.has(e.code)) return true;
  }
  if (e.name === 'KnexTimeoutError' || e.name === 'ConnectionException') return true;
  if (typeof e.message === 'string' && UNAVAILABLE_MESSAGES.some((m) => m.test(e.message as string))) return true;
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}
