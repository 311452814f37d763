/**
 * What sign-in failures may say. next-auth puts the code a failed sign-in throws into the URL
 * (/sign-in?error=…), where anyone can write anything, so screens show only these messages of
 * ours, looked up by code; any other text shows nothing. PURE: the sign-in page and form use it.
 */
export const SIGN_IN_ERRORS = {
  missing_fields: 'Enter your e-mail and password.',
  bad_credentials: 'That e-mail and password do not match an account.',
  no_workspace: 'This account has no active workspace. Ask an administrator.',
  sign_in_failed: 'Sign-in did not work this time. Try again in a moment.',
} as const;

export type SignInErrorCode = keyof typeof SIGN_IN_ERRORS;

/** The rate-limit code carries the wait in whole minutes: too_many_attempts_12. */
const TOO_MANY = /^too_many_attempts_([1-9]\d?)$/;

export function tooManyAttemptsCode(retryAfterSeconds: number): string {
  return `too_many_attempts_${Math.min(99, Math.max(1, Math.ceil(retryAfterSeconds / 60)))}`;
}

/** Our message for a code, or undefined for anything we did not issue. */
export function signInErrorMessage(code: string | null | undefined): string | undefined {
  if (!code) return undefined;
  // next-auth's own code when authorize() returns null.
  if (code === 'CredentialsSignin') return SIGN_IN_ERRORS.bad_credentials;
  if (Object.hasOwn(SIGN_IN_ERRORS, code)) return SIGN_IN_ERRORS[code as SignInErrorCode];
  const wait = TOO_MANY.exec(code);
  if (wait) {
    const minutes = Number(wait[1]);
    return `Too many sign-in attempts. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`;
  }
  return undefined;
}
