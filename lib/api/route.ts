/**
 * The wrapper every /api/v1 route handler uses: resolve the actor (token or session),
 * check Origin on cookie-authenticated writes, authorise, parse, run, and map errors to the
 * one error shape. Handlers stay a few lines long.
 */
import type { z } from 'zod';
import { actorFromHeaders } from '@/lib/auth';
import { authorize, notFound, type Actor, type Permission } from '@/lib/permissions';
import { env } from '@/lib/env';
import { requestHost } from '@/lib/client-address';
import { isUuid } from '@/lib/ids';
import { logger, pathForLog } from '@/lib/log';
import { ApiError, describeError } from '@/lib/api/errors';

type RouteContext<P> = { params: Promise<P> };

export interface ApiContext<P> {
  req: Request;
  actor: Actor;
  params: P;
  /** Reads and validates the JSON body with the given schema (400 unreadable, 422 invalid). */
  body<S extends z.ZodType>(schema: S): Promise<z.infer<S>>;
}

const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
/** The largest JSON body any handler reads (bytes). */
export const MAX_BODY_BYTES = 1_000_000;

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return Response.json(data, { status, headers: { 'cache-control': 'no-store', ...headers } });
}

/** The error response of both adapters: the one shape, its status and headers (Retry-After on 503). */
function errorResponse(req: Request, err: unknown): Response {
  const { status, body, headers } = describeError(err);
  if (status === 503) logger.warn({ err, path: pathForLog(req.url), method: req.method }, 'database unavailable');
  else if (status >= 500) logger.error({ err, path: pathForLog(req.url), method: req.method }, 'api handler failed');
  return json(body, status, headers);
}

/**
 * Cookie-authenticated writes must come from our own origin (CSRF defence beyond SameSite):
 * the Origin header must match APP_URL or the host the request was addressed to, as Next.js
 * itself checks for server actions. X-Forwarded-Host counts only behind a trusted proxy.
 */
export function assertSameOrigin(headers: Headers): void {
  const origin = headers.get('origin');
  const host = requestHost(headers);
  let originHost: string | undefined;
  try {
    originHost = origin ? new URL(origin).host : undefined;
  } catch {
    originHost = undefined;
  }
  const allowed = originHost !== undefined && (origin === new URL(env().APP_URL).origin || originHost === host);
  if (!allowed) throw new ApiError(403, 'bad_origin', 'This request did not come from the Setwell app.');
}

export function apiRoute<P = Record<string, never>>(
  permission: Permission,
  handler: (ctx: ApiContext<P>) => Promise<Response>,
) {
  return async (req: Request, routeContext?: RouteContext<P>): Promise<Response> => {
    try {
      const actor = await actorFromHeaders(req.headers);
      if (actor && actor.via === 'session' && WRITE_METHODS.has(req.method)) assertSameOrigin(req.headers);
      authorize(actor, permission);
      const params = (routeContext ? await routeContext.params : {}) as P;
      return await handler({ req, actor: actor!, params, body: (schema) => readBody(req, schema) });
    } catch (err) {
      return errorResponse(req, err);
    }
  };
}

/**
 * For routes whose authorisation is not a staff session: the phone's seat token in the path,
 * or none at all (joining with a code). Same body parsing and error shape as apiRoute.
 */
export function publicRoute<P = Record<string, never>>(handler: (ctx: Omit<ApiContext<P>, 'actor'>) => Promise<Response>) {
  return async (req: Request, routeContext?: RouteContext<P>): Promise<Response> => {
    try {
      const params = (routeContext ? await routeContext.params : {}) as P;
      return await handler({ req, params, body: (schema) => readBody(req, schema) });
    } catch (err) {
      return errorResponse(req, err);
    }
  };
}

/** JSON bodies only: application/json or a +json type, with or without parameters. */
function isJsonContentType(value: string | null): boolean {
  const type = value?.split(';')[0].trim().toLowerCase() ?? '';
  return type === 'application/json' || (type.startsWith('application/') && type.endsWith('+json'));
}

/**
 * Reads at most MAX_BODY_BYTES bytes and stops there, so an oversized body is refused without
 * being buffered whole. A body with another content type is refused (415) before it is read:
 * a form or text/plain post never reaches a schema.
 */
async function readLimitedText(req: Request): Promise<string> {
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > MAX_BODY_BYTES) throw new ApiError(413, 'too_large', 'The request body is too large.');
  if (!req.body) return '';
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > MAX_BODY_BYTES) {
      await reader.cancel();
      throw new ApiError(413, 'too_large', 'The request body is too large.');
    }
    chunks.push(value);
  }
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(Buffer.concat(chunks));
  } catch {
    throw new ApiError(400, 'bad_json', 'The request body is not valid UTF-8 JSON.');
  }
}

async function readBody<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  const hasBody = req.body !== null && req.headers.get('content-length') !== '0';
  if (hasBody && !isJsonContentType(req.headers.get('content-type'))) {
    throw new ApiError(415, 'unsupported_media_type', 'Send the request body as JSON (content-type: application/json).');
  }
  const text = await readLimitedText(req);
  let data: unknown;
  try {
    data = text.trim().length ? JSON.parse(text) : {};
  } catch {
    throw new ApiError(400, 'bad_json', 'The request body is not valid JSON.');
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw parsed.error;
  return parsed.data;
}

/** A malformed id in the path can match nothing, so it is a plain 404 like any unknown id. */
export function uuidParam(value: string | undefined, what: string): string {
  if (!isUuid(value)) throw notFound(what);
  return value;
}
