'use server';

import { runAction, runPublicAction, formToObject, type ActionResult } from '@/lib/actions';
import { revalidatePath } from 'next/cache';
import { acceptInvitationSchema, preferencesSchema, requestResetSchema, resetPasswordSchema } from './schema';
import { acceptInvitation, requestPasswordReset, resetPassword, signOutEverywhere, updatePreferences } from './mutations';
import { clientAddress } from '@/lib/client-address';
import { z } from 'zod';

export async function acceptInvitationAction(_prev: ActionResult<{ email: string }> | null, form: FormData) {
  return runPublicAction(acceptInvitationSchema, formToObject(form), acceptInvitation);
}

export async function requestPasswordResetAction(_prev: ActionResult<void> | null, form: FormData) {
  const { headers } = await import('next/headers');
  const address = clientAddress(new Headers(await headers()));
  return runPublicAction(requestResetSchema, formToObject(form), (d) => requestPasswordReset(d.email, address));
}

export async function resetPasswordAction(_prev: ActionResult<void> | null, form: FormData) {
  return runPublicAction(resetPasswordSchema, formToObject(form), resetPassword);
}

export async function updatePreferencesAction(_prev: ActionResult<void> | null, form: FormData) {
  const result = await runAction('account.self', preferencesSchema, formToObject(form), updatePreferences);
  if (result.ok) revalidatePath('/', 'layout');
  return result;
}

/** Ends every session of the caller, this one included; the page then goes to sign-in. */
/** Takes no input: any argument sent to it is refused (422) and ends nothing. */
export async function signOutEverywhereAction(...args: unknown[]) {
  return runAction('account.self', z.undefined({ error: 'This takes no input.' }), args.length ? args : undefined, (actor) => signOutEverywhere(actor));
}
