/**
 * The one way a server action runs: resolve the actor, authorise, validate with the
 * feature's zod schema, call the feature function, and turn failures into a typed result
 * that forms show inline. Nothing is written when validation or authorisation fails.
 */
import type { z } from 'zod';
import { actorFromHeaders } from '@/lib/auth';
import { assertSameOrigin } from '@/lib/api/route';
import { authorize, AccessDenied, type Actor, type Permission } from '@/lib/permissions';
import { ApiError, describeError } from '@/lib/api/errors';
import { type FieldErrors } from '@/lib/errors';
import { logger } from '@/lib/log';

export type ActionResult<T = undefined> =
  | { ok: true; data: T; message?: string }
  | { ok: false; status: number; error: string; fields?: FieldErrors };

function failure(err: unknown): ActionResult<never> {
  const { status, body } = describeError(err);
  if (status >= 500) logger.error({ err }, 'server action failed');
  return { ok: false, status, error: body.error.message, ...(body.error.fields ? { fields: body.error.fields } : {}) };
}

/** For signed-in work: the permission is checked before the input is even parsed. */
export async function runAction<S extends z.ZodType, T>(
  permission: Permission,
  schema: S,
  input: unknown,
  fn: (actor: Actor, data: z.infer<S>) => Promise<T>,
): Promise<ActionResult<T>> {
  try {
    const { headers } = await import('next/headers');
    const requestHeaders = new Headers(await headers());
    const actor = await actorFromHeaders(requestHeaders);
    // The session cookie rides along on any cross-site post; Next.js checks action origins too, this does not rely on it.
    if (actor?.via === 'session') assertSameOrigin(requestHeaders);
    const allowed = authorize(actor, permission);
    const parsed = schema.safeParse(checkedShape(input));
    if (!parsed.success) throw parsed.error;
    return { ok: true, data: await fn(allowed, parsed.data) };
  } catch (err) {
    return failure(err);
  }
}

/** For the signed-out flows (accept an invitation, reset a password): validation only. */
export async function runPublicAction<S extends z.ZodType, T>(
  schema: S,
  input: unknown,
  fn: (data: z.infer<S>) => Promise<T>,
): Promise<ActionResult<T>> {
  try {
    const parsed = schema.safeParse(checkedShape(input));
    if (!parsed.success) throw parsed.error;
    return { ok: true, data: await fn(parsed.data) };
  } catch (err) {
    return failure(err);
  }
}

/** What formToObject returns for an argument that is not FormData (a hand-made call, not the app's form). */
class NotAForm {}

const WRONG_SHAPE = 'This form arrived in a shape the server does not accept. Reload the page and try again.';

/** The action's input, or a 400 when formToObject was handed something other than a form. */
function checkedShape(input: unknown): unknown {
  if (input instanceof NotAForm) throw new ApiError(400, 'bad_request', WRONG_SHAPE);
  return input;
}

/**
 * FormData to an object for schema parsing (repeated keys become arrays). The object has no
 * prototype, so a field named __proto__ or constructor is an ordinary key that schemas refuse or
 * ignore. Anything that is not FormData becomes a marker that runAction answers with 400.
 */
export function formToObject(form: unknown): Record<string, unknown> {
  if (!(form instanceof FormData)) return new NotAForm() as Record<string, unknown>;
  const out = Object.create(null) as Record<string, unknown>;
  for (const [key, value] of form.entries()) {
    if (key.startsWith('$ACTION')) continue;
    if (Object.prototype.hasOwnProperty.call(out, key)) out[key] = ([] as unknown[]).concat(out[key], value);
    else out[key] = value;
  }
  return out;
}

export { AccessDenied };
