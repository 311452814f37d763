'use client';

import { useCallback, useRef, useState } from 'react';
import type { z } from 'zod';

/** What server actions return (lib/actions.ts's ActionResult, restated so client code imports no server module). */
export type FormActionResult<T> =
  | { ok: true; data: T; message?: string }
  | { ok: false; status: number; error: string; fields?: Record<string, string[]> };

export type FieldErrors = Record<string, string[]>;

export const NETWORK_FAILURE_MESSAGE = 'The server could not be reached. Check the connection and try again; what you entered is still here.';

interface Options {
  /** Field paths arrive prefixed with the action's argument name (`batch.lotCode`): strip it. */
  fieldPrefix?: string;
  /** Server field name → form field name, where the form converts units (`batchSizeG` → `batchSize`). */
  renameFields?: Record<string, string>;
  /** The same zod schema the server uses: a field's error is re-checked as it is edited and goes once the field is valid. */
  schema?: z.ZodType;
}

/**
 * The one client helper for forms that call a server action: pending state (never left on after a
 * failure, including a lost connection), field errors that clear as each field becomes valid, and
 * a summary message that goes once no field error is left. Inputs are the form's own state, so
 * nothing typed is lost on any error.
 */
export function useFormAction<T, A extends unknown[]>(action: (...args: A) => Promise<FormActionResult<T>>, options: Options = {}) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string>();
  const [fields, setFields] = useState<FieldErrors>({});
  // True when the message only summarises field errors ("Some fields need attention").
  const [errorSummarisesFields, setErrorSummarisesFields] = useState(false);
  const inFlight = useRef(false);
  const { fieldPrefix, renameFields, schema } = options;

  const mapFields = useCallback((raw: FieldErrors | undefined): FieldErrors => {
    const out: FieldErrors = {};
    for (const [key, messages] of Object.entries(raw ?? {})) {
      const name = fieldPrefix && key.startsWith(`${fieldPrefix}.`) ? key.slice(fieldPrefix.length + 1) : key;
      out[renameFields?.[name] ?? name] = messages;
    }
    return out;
  }, [fieldPrefix, renameFields]);

  const run = useCallback(async (...args: A): Promise<FormActionResult<T> | null> => {
    if (inFlight.current) return null;
    inFlight.current = true;
    setPending(true);
    setError(undefined);
    try {
      const result = await action(...args);
      if (result.ok) {
        setFields({});
      } else {
        const mapped = mapFields(result.fields);
        setFields(mapped);
        setError(result.error);
        setErrorSummarisesFields(Object.keys(mapped).length > 0);
      }
      return result;
    } catch {
      // A server action whose request never completes rejects (fetch failed, connection reset).
      setError(NETWORK_FAILURE_MESSAGE);
      setErrorSummarisesFields(false);
      return null;
    } finally {
      inFlight.current = false;
      setPending(false);
    }
  }, [action, mapFields]);

  /** Call as a field changes, with the values the server would get: its error stays only while the field is still invalid. */
  const revalidate = useCallback((name: string, values?: unknown) => {
    setFields((prev) => {
      if (!prev[name]) return prev;
      const next = { ...prev };
      const parsed = schema && values !== undefined ? schema.safeParse(values) : null;
      const still = parsed && !parsed.success
        ? parsed.error.issues.filter((i) => String(i.path[0] ?? '') === name).map((i) => i.message)
        : [];
      if (still.length) next[name] = still;
      else delete next[name];
      return next;
    });
  }, [schema]);

  const fail = useCallback((message: string, fieldErrors: FieldErrors = {}) => {
    setError(message);
    setFields(fieldErrors);
    setErrorSummarisesFields(Object.keys(fieldErrors).length > 0);
  }, []);

  const visibleError = error && !(errorSummarisesFields && Object.keys(fields).length === 0) ? error : undefined;
  return { pending, error: visibleError, fields, run, revalidate, fail };
}
