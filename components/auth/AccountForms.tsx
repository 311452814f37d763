'use client';

import { useState } from 'react';
import Link from 'next/link';
import { Field } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { acceptInvitationAction, requestPasswordResetAction, resetPasswordAction } from '@/lib/account/actions';
import { acceptInvitationSchema, requestResetSchema, resetPasswordSchema } from '@/lib/account/schema';
import { PASSWORD_RULES } from '@/lib/password-rules';

/** The form's own values as the FormData the (signed-out) actions take. */
function asForm(values: Record<string, string>): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(values)) form.set(k, v);
  return form;
}

/** Controlled values, so nothing typed is lost when the server refuses; each edit re-checks that field. */
function useValues(initial: Record<string, string>, revalidate: (name: string, values: unknown) => void) {
  const [values, setValues] = useState(initial);
  const bind = (name: string) => ({
    name,
    value: values[name] ?? '',
    onChange: (e: React.ChangeEvent<HTMLInputElement>) => {
      const next = { ...values, [name]: e.target.value };
      setValues(next);
      revalidate(name, next);
      // The repeated password depends on the first one.
      if (name === 'password' && 'confirm' in next) revalidate('confirm', next);
    },
  });
  return { values, bind };
}

export function ForgotPasswordForm() {
  const form = useFormAction(requestPasswordResetAction, { schema: requestResetSchema });
  const { values, bind } = useValues({ email: '' }, form.revalidate);
  const [sent, setSent] = useState(false);
  if (sent) {
    return (
      <Notice tone="success" title="Check your inbox">
        If that address has a Setwell account, a reset link is on its way. It works once and expires in an hour.
      </Notice>
    );
  }
  return (
    <form onSubmit={async (e) => { e.preventDefault(); if ((await form.run(null, asForm(values)))?.ok) setSent(true); }} className="space-y-4" noValidate>
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <Field label="E-mail" type="email" autoComplete="username" required errors={form.fields.email} {...bind('email')} />
      <Button type="submit" className="w-full" disabled={form.pending}>
        {form.pending ? 'Sending…' : 'Send me a reset link'}
      </Button>
    </form>
  );
}

function PasswordPair({ fields, bind }: { fields: Record<string, string[]>; bind: (name: string) => { name: string; value: string; onChange: (e: React.ChangeEvent<HTMLInputElement>) => void } }) {
  return (
    <>
      <Field label="New password" type="password" autoComplete="new-password" required errors={fields.password} hint={PASSWORD_RULES} {...bind('password')} />
      <Field label="Repeat the password" type="password" autoComplete="new-password" required errors={fields.confirm} {...bind('confirm')} />
    </>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const form = useFormAction(resetPasswordAction, { schema: resetPasswordSchema });
  const { values, bind } = useValues({ token, password: '', confirm: '' }, form.revalidate);
  const [done, setDone] = useState(false);
  if (done) {
    return (
      <Notice tone="success" title="Password changed">
        <Link href="/sign-in?reset=1" className="underline">
          Sign in with your new password
        </Link>
      </Notice>
    );
  }
  return (
    <form onSubmit={async (e) => { e.preventDefault(); if ((await form.run(null, asForm(values)))?.ok) setDone(true); }} className="space-y-4" noValidate>
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <PasswordPair fields={form.fields} bind={bind} />
      <Button type="submit" className="w-full" disabled={form.pending}>
        {form.pending ? 'Saving…' : 'Set the new password'}
      </Button>
    </form>
  );
}

export function AcceptInvitationForm({ token, hasAccount }: { token: string; hasAccount: boolean }) {
  const form = useFormAction(acceptInvitationAction, { schema: acceptInvitationSchema });
  const { values, bind } = useValues({ token, name: '', password: '', confirm: '' }, form.revalidate);
  const [joined, setJoined] = useState<string>();
  if (joined) {
    return (
      <Notice tone="success" title="You have joined">
        <Link href="/sign-in?joined=1" className="underline">
          Sign in as {joined}
        </Link>
      </Notice>
    );
  }
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const res = await form.run(null, asForm(values));
    if (res?.ok) setJoined(res.data.email);
  }
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <Field label="Your name" autoComplete="name" required errors={form.fields.name} {...bind('name')} />
      {hasAccount ? (
        <Notice>
          You already have a Setwell account. Choose a password anyway to confirm; your existing password stays the one you sign in
          with.
        </Notice>
      ) : null}
      <PasswordPair fields={form.fields} bind={bind} />
      <Button type="submit" className="w-full" disabled={form.pending}>
        {form.pending ? 'Joining…' : 'Accept and join'}
      </Button>
    </form>
  );
}
