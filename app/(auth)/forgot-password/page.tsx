import Link from 'next/link';
import { ForgotPasswordForm } from '@/components/auth/AccountForms';

export const metadata = { title: 'Forgot password' };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="mb-1 text-2xl font-semibold">Forgot your password?</h1>
      <p className="mb-6 text-sm text-rind-600">Enter your e-mail and we will send you a link to choose a new one.</p>
      <ForgotPasswordForm />
      <p className="mt-4 text-center text-sm">
        <Link href="/sign-in" className="text-damson-700 underline underline-offset-2">
          Back to sign in
        </Link>
      </p>
    </>
  );
}
