/**
 * PURE, for the browser: reads the API's one error shape ({ "error": { "code", "message", "fields"? } },
 * lib/api/errors.ts) from whatever a response body turned out to be, never trusting its shape.
 */
export interface ErrorBody {
  message: string | null;
  fields: Record<string, string[]> | null;
}

export function readErrorBody(body: unknown): ErrorBody {
  const error = typeof body === 'object' && body !== null ? (body as { error?: unknown }).error : undefined;
  if (typeof error !== 'object' || error === null) return { message: null, fields: null };
  const { message, fields } = error as { message?: unknown; fields?: unknown };
  let safeFields: Record<string, string[]> | null = null;
  if (typeof fields === 'object' && fields !== null && !Array.isArray(fields)) {
    safeFields = Object.create(null) as Record<string, string[]>;
    for (const [key, value] of Object.entries(fields)) {
      if (Array.isArray(value)) safeFields[key] = value.filter((v): v is string => typeof v === 'string');
    }
  }
  return { message: typeof message === 'string' && message ? message : null, fields: safeFields };
}

/** The server's message from a failed response, or the fallback when there is none or the body is not JSON. */
export async function responseErrorMessage(res: Response, fallback: string): Promise<string> {
  try {
    return readErrorBody(await res.json()).message ?? fallback;
  } catch {
    return fallback;
  }
}
