/**
 * Shared set-up for the browser tests. One Chromium per test file, a fresh browser context (no
 * cookies, no storage) for every test, so no test depends on another having run before it:
 * each one signs in as the role it needs and creates the data it writes.
 * scripts/run-e2e.mjs starts the server and hands over its URL and the demo password.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, afterEach, beforeAll, beforeEach } from 'vitest';
import { outboxSchema } from '@shared/schemas/admin';
import { sessionInfoSchema, type SessionInfo } from '@shared/schemas/session';
import {
  chromium,
  request,
  type APIRequestContext,
  type Browser as PlaywrightBrowser,
  type BrowserContext,
  type BrowserContextOptions,
  type Locator,
  type Page,
} from 'playwright-core';

export const baseUrl = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3000';
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const screenshotDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'screenshots');

/** The demo accounts `seed-cli.ts --demo` creates (all share the password the harness chose). */
export const accounts = {
  viewer: 'vera.viewer@kestrel.example',
  member: 'milo.member@kestrel.example',
  teamAdmin: 'tara.admin@kestrel.example',
  curator: 'cora.curator@kestrel.example',
  siteAdmin: 'sam.siteadmin@kestrel.example',
  otherTeamAdmin: 'lena.larch@larchmont.example',
} as const;
export type Role = keyof typeof accounts;

/** The demo password, chosen at random by scripts/run-e2e.mjs for each run. */
export function demoPassword(): string {
  const password = process.env.E2E_PASSWORD;
  if (!password) {
    throw new Error('E2E_PASSWORD is not set: run the suite through `node scripts/run-e2e.mjs`, which seeds it.');
  }
  return password;
}

/** A string no other test (or earlier run) uses, for data a test creates. */
export function unique(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`;
}

const launchArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface TestBrowser {
  /** The page of this test's own context. */
  readonly page: Page;
  readonly context: BrowserContext;
  /** Another, separate context (another person at another computer), closed after the test. */
  newPerson: (options?: BrowserContextOptions) => Promise<Page>;
}

/**
 * Registers the hooks of a test file: Chromium starts once for the file, and every test gets a
 * new context and page, closed when the test ends. Call at the top of the file.
 */
export function useBrowser(options: BrowserContextOptions = {}): TestBrowser {
  let browser: PlaywrightBrowser | undefined;
  let contexts: BrowserContext[] = [];
  let current: { context: BrowserContext; page: Page } | undefined;

  async function open(extra: BrowserContextOptions = {}): Promise<{ context: BrowserContext; page: Page }> {
    if (!browser) throw new Error('useBrowser: Chromium is not running');
    const context = await browser.newContext({
      viewport: { width: 1360, height: 900 },
      baseURL: baseUrl,
      ...options,
      ...extra,
    });
    context.setDefaultTimeout(15_000);
    contexts.push(context);
    return { context, page: await context.newPage() };
  }

  beforeAll(async () => {
    browser = await chromium.launch({ executablePath, headless: true, args: launchArgs });
  });
  afterAll(async () => browser?.close());
  beforeEach(async () => {
    current = await open();
  });
  afterEach(async () => {
    await Promise.all(contexts.map((c) => c.close()));
    contexts = [];
    current = undefined;
  });

  const need = () => {
    if (!current) throw new Error('useBrowser: no context outside a test');
    return current;
  };
  return {
    get page() {
      return need().page;
    },
    get context() {
      return need().context;
    },
    newPerson: async (extra) => (await open(extra)).page,
  };
}

/** Fills the sign-in form (the page must show it). */
export async function fillSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByTestId('sign-in-email').locator('input').fill(email);
  await page.getByTestId('sign-in-password').locator('input').fill(password);
  await page.getByTestId('sign-in-submit').click();
}

/** Signs in through the form as a demo role (or any e-mail) and waits for the account menu. */
export async function signIn(page: Page, who: Role | { email: string; password: string }): Promise<void> {
  const { email, password } = typeof who === 'string' ? { email: accounts[who], password: demoPassword() } : who;
  await page.goto('/sign-in');
  await fillSignIn(page, email, password);
  await page.getByTestId('account-menu').waitFor();
}

/** Signs out through the account menu. */
export async function signOut(page: Page): Promise<void> {
  await page.getByTestId('account-menu').click();
  await page.getByTestId('sign-out').click();
  await page.getByTestId('sign-in-link').waitFor();
}

/**
 * An area link of the header, ready to click: links that do not fit the row sit under "More",
 * which is opened first when the link is there.
 */
export async function navLink(page: Page, key: string): Promise<Locator> {
  const link = page.getByTestId(`nav-${key}`);
  await link.waitFor({ state: 'attached' });
  if (!(await link.isVisible())) {
    const more = page.getByTestId('nav-more');
    if ((await more.getAttribute('aria-expanded')) !== 'true') await more.click();
    await link.waitFor();
  }
  return link;
}

/** Opens the current team's page from the header's nav (team ids are made by the database). */
export async function openTeamArea(page: Page, area: 'notes' | 'members' | 'sets'): Promise<void> {
  await page.goto('/');
  await (await navLink(page, area)).click();
  await page.waitForURL(new RegExp(`/teams/[^/]+/${area}$`));
}

/** The message tied to a form control by aria-describedby (FormField's error or hint), or null. */
export async function fieldMessage(control: Locator): Promise<string | null> {
  const id = await control.getAttribute('aria-describedby');
  if (!id) return null;
  return ((await control.page().locator(`[id="${id}"]`).textContent()) ?? '').trim();
}

/**
 * Signs a role in over the API, for a test's set-up that is not what the test is about (faster
 * than the form). Sends the Origin the server's CSRF check wants. Dispose of it when done.
 */
export async function apiAs(role: Role): Promise<{ api: APIRequestContext; session: SessionInfo }> {
  const api = await request.newContext({ baseURL: baseUrl, extraHTTPHeaders: { origin: baseUrl } });
  const reply = await api.post('/api/v1/session', { data: { email: accounts[role], password: demoPassword() } });
  if (!reply.ok()) throw new Error(`API sign-in as ${role} failed: HTTP ${reply.status()}`);
  return { api, session: sessionInfoSchema.parse(await reply.json()) };
}

/** The first link in the newest outbox message to `to` (read as the site admin), as a path. */
export async function linkMailedTo(to: string): Promise<string> {
  const { api } = await apiAs('siteAdmin');
  try {
    const outbox = outboxSchema.parse(await (await api.get('/api/v1/admin/outbox')).json());
    const message = outbox.messages
      .filter((m) => m.to.includes(to))
      .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))[0];
    // A sentence may end right after the link: its full stop is not part of it.
    const link = message?.text.match(/https?:\/\/\S+/)?.[0]?.replace(/[.,;)]+$/, '');
    if (!link) throw new Error(`no mail with a link to ${to} in the outbox`);
    return new URL(link).pathname;
  } finally {
    await api.dispose();
  }
}

/** Saves a full-page screenshot under tests/e2e/screenshots/ (git-ignored). */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}
