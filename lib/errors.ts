/**
 * The domain's own errors: what a feature module throws when input is wrong or state forbids a
 * change. They carry no HTTP: lib/api/errors.ts maps them to status codes (422, 409) for the API
 * and the server-action adapter. Who-may-do-what errors (AccessDenied) live in lib/permissions.ts.
 */
import type { ZodError } from 'zod';

/** Messages per field path ('lines.2.quantity'); '_' for the form as a whole. */
export type FieldErrors = Record<string, string[]>;

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
