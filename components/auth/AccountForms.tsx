'use client';

import { useActionState } from 'react';
import Link from 'next/link';
import { Field } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { acceptInvitationAction, requestPasswordResetAction, resetPasswordAction } from '@/lib/account/actions';
import { PASSWORD_RULES } from '@/lib/password-rules';

export function ForgotPasswordForm() {
  const [state, action, pending] = useActionState(requestPasswordResetAction, null);
  if (state?.ok) {
    return (
      <Notice tone="success" title="Check your inbox">
        If that address has a Setwell account, a reset link is on its way. It works once and expires in an hour.
      </Notice>
    );
  }
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form action={action} className="space-y-4" noValidate>
      {state && !state.ok && !fields ? <Notice tone="danger">{state.error}</Notice> : null}
      <Field label="E-mail" name="email" type="email" autoComplete="username" required errors={fields?.email} />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? 'Sending…' : 'Send me a reset link'}
      </Button>
    </form>
  );
}

function PasswordPair({ fields }: { fields?: Record<string, string[]> }) {
  return (
    <>
      <Field label="New password" name="password" type="password" autoComplete="new-password" required errors={fields?.password} hint={PASSWORD_RULES} />
      <Field label="Repeat the password" name="confirm" type="password" autoComplete="new-password" required errors={fields?.confirm} />
    </>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const [state, action, pending] = useActionState(resetPasswordAction, null);
  if (state?.ok) {
    return (
      <Notice tone="success" title="Password changed">
        <Link href="/sign-in?reset=1" className="underline">
          Sign in with your new password
        </Link>
      </Notice>
    );
  }
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form action={action} className="space-y-4" noValidate>
      {state && !state.ok ? <Notice tone="danger">{state.error}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <PasswordPair fields={fields} />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? 'Saving…' : 'Set the new password'}
      </Button>
    </form>
  );
}

export function AcceptInvitationForm({ token, hasAccount }: { token: string; hasAccount: boolean }) {
  const [state, action, pending] = useActionState(acceptInvitationAction, null);
  if (state?.ok) {
    return (
      <Notice tone="success" title="You have joined">
        <Link href="/sign-in?joined=1" className="underline">
          Sign in as {state.data.email}
        </Link>
      </Notice>
    );
  }
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form action={action} className="space-y-4" noValidate>
      {state && !state.ok ? <Notice tone="danger">{state.error}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <Field label="Your name" name="name" autoComplete="name" required errors={fields?.name} />
      {hasAccount ? (
        <Notice>
          You already have a Setwell account. Choose a password anyway to confirm; your existing password stays the one you sign in
          with.
        </Notice>
      ) : null}
      <PasswordPair fields={fields} />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? 'Joining…' : 'Accept and join'}
      </Button>
    </form>
  );
}
