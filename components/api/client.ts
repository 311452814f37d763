/** Client-side calls to the JSON API: one fetcher, errors surfaced with the API's own message. */
import { readErrorBody } from '@/lib/api/error-body';

export class ApiClientError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields?: Record<string, string[]>,
  ) {
    super(message);
  }
}

export async function apiFetch<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, {
    ...init,
    headers: { 'content-type': 'application/json', ...(init?.headers ?? {}) },
    credentials: 'same-origin',
  });
  const body = await res.json().catch(() => ({}));
  if (!res.ok) {
    const err = readErrorBody(body);
    throw new ApiClientError(err.message ?? `Request failed (${res.status}).`, res.status, err.fields ?? undefined);
  }
  return body as T;
}
