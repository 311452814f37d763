import 'server-only';
/**
 * Page and layout adapters over lib/permissions: 401 → the sign-in page, 403 → the
 * forbidden page (HTTP 403), 404 → not found.
 */
import { redirect, forbidden, notFound } from 'next/navigation';
import { currentActor } from '@/lib/auth';
import { isUuid } from '@/lib/ids';
import { authorize, AccessDenied, type Actor, type Permission } from '@/lib/permissions';

export async function requirePage(permission: Permission): Promise<Actor> {
  try {
    return authorize(await currentActor(), permission);
  } catch (err) {
    if (err instanceof AccessDenied) {
      if (err.status === 401) redirect('/sign-in');
      if (err.status === 403) forbidden();
      notFound();
    }
    throw err;
  }
}

/** Turns a feature module's "not in this workspace" into the not-found page. */
export async function orNotFound<T>(load: Promise<T>): Promise<T> {
  try {
    return await load;
  } catch (err) {
    if (err instanceof AccessDenied && err.status === 404) notFound();
    throw err;
  }
}

/** A path id that is not a UUID is simply not found. */
export function pageId(value: string): string {
  if (!isUuid(value)) notFound();
  return value;
}
