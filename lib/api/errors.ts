/**
 * The one error shape of the JSON API: { "error": { "code", "message", "fields"? } }.
 * 400 unreadable body, 401 not signed in, 403 not allowed, 404 not found (or another
 * workspace's), 409 conflict, 422 failed validation.
 */
import { ZodError } from 'zod';
import { AccessDenied } from '@/lib/permissions';

export type FieldErrors = Record<string, string[]>;

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

/** Validation failure from a feature module; same meaning as a ZodError. */
export class ValidationFailed extends Error {
  constructor(
    message: string,
    readonly fields: FieldErrors,
  ) {
    super(message);
    this.name = 'ValidationFailed';
  }
}

/** A state conflict (a stale revision, an immutable record, a duplicate). */
export class Conflict extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'Conflict';
  }
}

export function zodFieldErrors(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

const CODES: Record<AccessDenied['status'], string> = { 401: 'unauthenticated', 403: 'forbidden', 404: 'not_found' };

/** Maps anything a handler throws to status + body; unknown errors become a 500 without details. */
export function describeError(err: unknown): { status: number; body: { error: { code: string; message: string; fields?: FieldErrors } } } {
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
