/**
 * The sign-in page shows only messages of ours: next-auth puts a failed sign-in's code into
 * /sign-in?error=…, where anyone can write any text (a phishing line, a database message).
 */
import { describe, it, expect, vi } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import type { ReactElement } from 'react';
import { SIGN_IN_ERRORS, signInErrorMessage, tooManyAttemptsCode } from '@/lib/sign-in-errors';

vi.mock('next/navigation', () => ({ useRouter: () => ({ replace: () => undefined, refresh: () => undefined }) }));
vi.mock('next-auth/react', () => ({ signIn: async () => undefined }));

const { default: SignInPage } = await import('@/app/(auth)/sign-in/page');

async function pageWithError(error: string | string[]): Promise<string> {
  return renderToStaticMarkup((await SignInPage({ searchParams: Promise.resolve({ error }) })) as ReactElement);
}

describe('sign-in error codes', () => {
  it('maps each of our codes, and the rate-limit code with its minutes, to our message', () => {
    for (const [code, message] of Object.entries(SIGN_IN_ERRORS)) expect(signInErrorMessage(code)).toBe(message);
    expect(signInErrorMessage('CredentialsSignin')).toBe(SIGN_IN_ERRORS.bad_credentials);
    expect(signInErrorMessage(tooManyAttemptsCode(12 * 60 - 5))).toBe('Too many sign-in attempts. Wait 12 minutes and try again.');
    expect(signInErrorMessage(tooManyAttemptsCode(30))).toBe('Too many sign-in attempts. Wait 1 minute and try again.');
  });

  it.each([
    'Your account is locked. Call +1 555 0100 to unlock it.',
    'invalid byte sequence for encoding "UTF8": 0x00',
    'too_many_attempts_0',
    'too_many_attempts_100',
    'too_many_attempts_5 and more',
    '__proto__',
    'toString',
    'constructor',
  ])('shows nothing of its own for %j', async (text) => {
    expect(signInErrorMessage(text)).toBeUndefined();
    const html = await pageWithError(text);
    expect(html).not.toContain(text.slice(0, 12));
    expect(html).not.toContain('role="alert"');
  });

  it('the page shows our message for a known code, and nothing for a repeated parameter', async () => {
    expect(await pageWithError('no_workspace')).toContain(SIGN_IN_ERRORS.no_workspace);
    expect(await pageWithError(['no_workspace', 'Call us'])).not.toContain('Call us');
  });
});
