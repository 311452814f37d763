/** playwright-core driving Debian's chromium (never a downloaded browser) against the app on $PORT. */
import { beforeAll, afterAll } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import fs from 'node:fs';
import path from 'node:path';

export const BASE_URL = `http://127.0.0.1:${process.env.PORT ?? 3100}`;
export const MAIL_URL = process.env.MAIL_OUTBOX_URL ?? 'http://127.0.0.1:8026';
export const DEMO_PASSWORD = 'setwell-demo-2026';

export async function launch(): Promise<Browser> {
  // launch() gives every run a fresh temporary profile of its own.
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export async function newContext(browser: Browser, viewport = { width: 1280, height: 900 }): Promise<BrowserContext> {
  return browser.newContext({ baseURL: BASE_URL, viewport });
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/home');
}

/** The newest mail to the address (and, when given, whose subject matches). */
export async function mailTo(address: string, timeoutMs = 10_000, subject?: RegExp) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const messages = (await (await fetch(`${MAIL_URL}/messages`)).json()) as Array<{ to: string[]; subject: string; text: string }>;
    const found = messages.find((m) => m.to.includes(address) && (!subject || subject.test(m.subject)));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${address}${subject ? ` matching ${subject}` : ''}`);
}

export async function screenshot(page: Page, name: string) {
  const dir = path.resolve('test-results');
  fs.mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}

/** One chromium per test file, started before the first test and closed after the last. */
export function sharedBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launch();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => browser!;
}

export type Violation = { directive: string; blocked: string; page: string };

/** Records every securitypolicyviolation event and every CSP console error of the page. */
export async function watchCsp(page: Page): Promise<Violation[]> {
  const seen: Violation[] = [];
  await page.exposeFunction('__reportCspViolation', (v: Violation) => seen.push(v));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __reportCspViolation: (v: unknown) => void }).__reportCspViolation({
        directive: e.effectiveDirective,
        blocked: e.blockedURI,
        page: location.pathname,
      });
    });
  });
  page.on('console', (msg) => {
    if (msg.type() === 'error' && /Content Security Policy/i.test(msg.text())) seen.push({ directive: 'console', blocked: msg.text(), page: page.url() });
  });
  return seen;
}
