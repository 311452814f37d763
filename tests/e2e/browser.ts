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

export async function screenshot(page: Page, name: string, fullPage = true) {
  const dir = path.resolve('test-results');
  fs.mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage });
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

/** What a walk must never meet on a page: console errors, CSP violations, uncaught exceptions. */
export interface PageWatch {
  problems: string[];
}

/**
 * Starts watching a page before its first navigation: console errors, `securitypolicyviolation`
 * events (W3C CSP Level 3) and uncaught exceptions (`pageerror`) are collected with the path they
 * happened on. Dialogs (the editor's "leave with unsaved changes?") are accepted.
 */
export async function watchPage(page: Page): Promise<PageWatch> {
  const watch: PageWatch = { problems: [] };
  const where = () => {
    try {
      return new URL(page.url()).pathname;
    } catch {
      return page.url();
    }
  };
  await page.exposeFunction('__setwellReportViolation', (v: { directive: string; blocked: string; path: string }) =>
    watch.problems.push(`CSP violation on ${v.path}: ${v.directive} blocked ${v.blocked}`),
  );
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __setwellReportViolation: (v: unknown) => void }).__setwellReportViolation({
        directive: e.effectiveDirective,
        blocked: e.blockedURI,
        path: location.pathname,
      });
    });
  });
  page.on('console', (msg) => {
    if (msg.type() === 'error') watch.problems.push(`console error on ${where()}: ${msg.text()}`);
  });
  page.on('pageerror', (err) => watch.problems.push(`uncaught exception on ${where()}: ${err.message}`));
  page.on('dialog', (dialog) => void dialog.accept());
  return watch;
}

/**
 * The page's sideways scroll: the document is wider than the window when
 * `document.scrollingElement.scrollWidth > clientWidth`. On overflow it names the widest elements
 * that stick out past the right edge (outside a box that scrolls on its own), to find the culprit.
 */
export async function sidewaysOverflow(page: Page): Promise<string | null> {
  // A string, not a function: the test transform may wrap named functions in helpers the page lacks.
  return page.evaluate<string | null>(`(() => {
    const root = document.scrollingElement;
    if (root.scrollWidth <= root.clientWidth) return null;
    const width = root.clientWidth;
    // Clipped by a box that scrolls (or hides) on its own. An absolutely placed element escapes
    // every box up to its containing block, the nearest positioned ancestor.
    const clipped = (el) => {
      let placed = getComputedStyle(el).position === 'absolute';
      if (getComputedStyle(el).position === 'fixed') return true;
      for (let p = el.parentElement; p && p !== document.body; p = p.parentElement) {
        const style = getComputedStyle(p);
        if (placed && style.position === 'static') continue;
        if (['auto', 'scroll', 'hidden', 'clip'].includes(style.overflowX)) return true;
        placed = style.position === 'absolute';
      }
      return false;
    };
    const culprits = [...document.body.querySelectorAll('*')]
      .filter((el) => el.getBoundingClientRect().right > width + 1 && !clipped(el))
      .map((el) => ({
        element: el.tagName.toLowerCase() + (el.getAttribute('data-testid') ? '[data-testid=' + el.getAttribute('data-testid') + ']' : '') + '.' + String(el.className).split(/\\s+/).slice(0, 4).join('.'),
        right: Math.round(el.getBoundingClientRect().right),
        text: (el.textContent || '').trim().slice(0, 40),
      }))
      .sort((a, b) => b.right - a.right)
      .slice(0, 5);
    return 'page is ' + root.scrollWidth + ' px wide in a ' + width + ' px window; sticking out: ' + JSON.stringify(culprits);
  })()`);
}

/**
 * One stop of a walk: waits for the page to settle, fails on sideways scroll and on anything the
 * watch collected so far, and saves a full-page screenshot to test-results/<name>.png.
 */
export async function checkpoint(page: Page, watch: PageWatch, name: string): Promise<void> {
  // Settle: pages that poll (the tasting page, the organiser's progress) never go fully quiet.
  await page.waitForLoadState('networkidle', { timeout: 3000 }).catch(() => undefined);
  await screenshot(page, name);
  const overflow = await sidewaysOverflow(page);
  const problems = [...watch.problems, ...(overflow ? [`sideways scroll on ${new URL(page.url()).pathname}: ${overflow}`] : [])];
  watch.problems.length = 0;
  if (problems.length) throw new Error(`${name}:\n${problems.join('\n')}`);
}

export const DESKTOP = { width: 1366, height: 900 };
export const PHONE = { width: 390, height: 844 };

/** One person's walk through the app in one window size, stopping at checkpoints. */
export interface Walk {
  page: Page;
  watch: PageWatch;
  /** A checkpoint named walk-<name>-<n>-<label> (see checkpoint()). */
  stop: (label: string) => Promise<void>;
  /** Follows a main-navigation entry: the side rail on wide screens, the Menu drawer on phones. */
  nav: (label: string) => Promise<void>;
  close: () => Promise<void>;
}

export async function startWalk(browser: Browser, name: string, viewport: { width: number; height: number }): Promise<Walk> {
  const ctx = await newContext(browser, viewport);
  const page = await ctx.newPage();
  const watch = await watchPage(page);
  let n = 0;
  return {
    page,
    watch,
    stop: (label) => checkpoint(page, watch, `walk-${name}-${String(++n).padStart(2, '0')}-${label}`),
    nav: async (label) => {
      // The side rail shows from Tailwind's lg breakpoint (1024 px); below it the drawer.
      if (viewport.width < 1024) await page.getByRole('button', { name: 'Menu' }).click();
      const before = page.url();
      await page.getByTestId('main-nav').filter({ visible: true }).getByRole('link', { name: label, exact: true }).click();
      await page.waitForURL((url) => url.href !== before);
    },
    close: () => ctx.close(),
  };
}

/** The two window sizes every walk runs in: a desktop and a phone. */
export const WINDOWS = [
  ['desktop', DESKTOP],
  ['phone', PHONE],
] as const;

/** For the CSP checks that only count violations (security, notebook bounds). */
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

/**
 * A rated tasting of two of the demo's apricot variants on one attribute, made through the API as
 * the organiser and opened; a staff taster seated when named. Tests that need an open tasting make
 * their own, so the seeded ones (which other tests close) stay as they are.
 */
export async function openApricotTasting(browser: Browser, o: { organiserEmail: string; title: string; attribute: string | string[]; seat?: string; method?: 'rated' | 'ranking'; samples?: number }): Promise<{ joinCode: string; tastingId: string }> {
  const ctx = await newContext(browser);
  const page = await ctx.newPage();
  await signIn(page, o.organiserEmail);
  await page.goto('/trials');
  await page.getByRole('link', { name: /Apricot spread: how low can the sugar go\?/ }).first().click();
  await page.waitForURL(/\/trials\/[0-9a-f-]{36}$/);
  const trialId = new URL(page.url()).pathname.split('/').pop()!;
  const write = { headers: { origin: new URL(page.url()).origin } };
  const { variants } = await (await page.request.get(`/api/v1/trials/${trialId}/variants`)).json();
  const { attributes } = await (await page.request.get('/api/v1/attributes')).json();
  const wanted = Array.isArray(o.attribute) ? o.attribute : [o.attribute];
  const attributeIds = wanted.map((name) => (attributes as Array<{ id: string; name: string }>).find((a) => a.name === name)!.id);
  const created = await page.request.post(`/api/v1/trials/${trialId}/tastings`, {
    ...write,
    data: { title: o.title, method: o.method ?? 'rated', variantIds: variants.slice(0, o.samples ?? 2).map((v: { id: string }) => v.id), attributeIds, notice: 'Apricot spreads with fruit, sugar and pectin.' },
  });
  if (created.status() !== 201) throw new Error(`tasting not created: ${await created.text()}`);
  const { tastingId } = await created.json();
  const { joinCode } = await (await page.request.post(`/api/v1/tastings/${tastingId}/open`, write)).json();
  if (o.seat) {
    await page.goto(`/tastings/${tastingId}`);
    const invite = page.getByRole('region', { name: 'Invite staff tasters' });
    await invite.getByRole('checkbox', { name: new RegExp(o.seat) }).check();
    await invite.getByRole('button', { name: 'Send invitations' }).click();
    await page.getByText('Invitations sent.').waitFor();
  }
  await ctx.close();
  return { joinCode, tastingId };
}

/** Starts a trial of the test's own from a demo formula (signed in as a developer) and waits for its page. */
export async function startOwnTrial(page: Page, trial: { title: string; question: string; formula: string }): Promise<void> {
  await page.goto('/trials/new');
  await page.getByLabel('Title').fill(trial.title);
  await page.getByLabel('Question or hypothesis').fill(trial.question);
  await page.getByLabel('Base formula').selectOption({ label: trial.formula });
  await page.getByRole('button', { name: 'Start the trial' }).click();
  await page.getByRole('heading', { level: 1, name: new RegExp(trial.title) }).waitFor();
}

/** Sets a formula editor line: the ingredient by its name (the picker builds its list as it takes focus), the quantity, and the unit if given. */
export async function setFormulaLine(page: Page, n: number, ingredient: string, quantity: string, unit?: string) {
  const picker = page.getByLabel(`Line ${n}: ingredient`);
  await picker.focus();
  const value = await picker.locator('option').filter({ hasText: new RegExp(`^${ingredient.replace(/[()]/g, '\\$&')} \\(`) }).first().getAttribute('value');
  await picker.selectOption(value!);
  await page.getByLabel(`Line ${n}: quantity`).fill(quantity);
  if (unit) await page.getByLabel(`Line ${n}: unit`).selectOption(unit);
}
