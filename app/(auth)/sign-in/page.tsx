import { SignInForm } from '@/components/auth/SignInForm';

export const metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ error?: string; reset?: string; joined?: string }> }) {
  const q = await searchParams;
  const note = q.reset ? 'Your password was changed. Sign in with the new one.' : q.joined ? 'Welcome aboard. Sign in to your new workspace.' : undefined;
  return (
    <>
      <h1 className="mb-1 text-2xl font-semibold">Sign in</h1>
      <p className="mb-6 text-sm text-rind-600">{note ?? 'Your formulas, trials and panels are waiting.'}</p>
      <SignInForm initialError={q.error && q.error !== 'CredentialsSignin' ? q.error : undefined} />
    </>
  );
}
