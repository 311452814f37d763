import { ResetPasswordForm } from '@/components/auth/AccountForms';

export const metadata = { title: 'Choose a new password' };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <h1 className="mb-1 text-2xl font-semibold">Choose a new password</h1>
      <p className="mb-6 text-sm text-rind-600">The link works once. After this, sign in with the new password.</p>
      <ResetPasswordForm token={token} />
    </>
  );
}
