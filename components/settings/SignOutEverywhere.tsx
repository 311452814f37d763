'use client';

import { useState } from 'react';
import { signOut } from 'next-auth/react';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { signOutEverywhereAction } from '@/lib/account/actions';

/** Ends every session of this account (phones, other browsers, this one); asks first. */
export function SignOutEverywhere() {
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();

  async function confirm() {
    setBusy(true);
    setError(undefined);
    const result = await signOutEverywhereAction();
    if (!result.ok) {
      setBusy(false);
      setConfirming(false);
      setError(result.error);
      return;
    }
    // This device's cookie no longer works either; clear it and go to sign-in.
    await signOut({ callbackUrl: '/sign-in?ended=1' });
  }

  return (
    <section className="mt-10 max-w-md space-y-3" aria-labelledby="sessions-title">
      <h2 id="sessions-title" className="text-lg font-semibold">Sessions</h2>
      <p className="text-sm text-rind-600">
        Signed in on a shared computer or a lost phone? End every session of your account at once, this one included.
        API tokens are not affected: revoke them under API tokens.
      </p>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <Button tone="secondary" type="button" onClick={() => setConfirming(true)} disabled={busy}>
        Sign out everywhere
      </Button>
      <ConfirmDialog
        open={confirming}
        busy={busy}
        title="Sign out everywhere?"
        body="Every browser and phone signed in to your account is signed out, this one too. You sign in again with your password."
        confirmLabel="Sign out everywhere"
        onCancel={() => setConfirming(false)}
        onConfirm={() => void confirm()}
      />
    </section>
  );
}
