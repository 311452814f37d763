import { SignInForm } from '@/components/auth/SignInForm';
import { signInErrorMessage } from '@/lib/sign-in-errors';

export const metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ error?: string | string[]; reset?: string; joined?: string; ended?: string }> }) {
  const q = await searchParams;
  // Only codes we issue become a message; any other text in the URL shows nothing.
  const error = typeof q.error === 'string' ? signInErrorMessage(q.error) : undefined;
  const note = q.reset
    ? 'Your password was changed and every earlier session ended. Sign in with the new one.'
    : q.joined
      ? 'Welcome aboard. Sign in to your new workspace.'
      : q.ended
        ? 'You were signed out on every device. Sign in again here.'
        : undefined;
  return (
    <>
      <h1 className="mb-1 text-2xl font-semibold">Sign in</h1>
      <p className="mb-6 text-sm text-rind-600">{note ?? 'Your formulas, trials and tastings are waiting.'}</p>
      <SignInForm initialError={error} />
    </>
  );
}
