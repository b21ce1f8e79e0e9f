/**
 * Shared set-up for the browser tests: one Chromium per test file with a fresh profile, the base
 * URL of the server that scripts/run-e2e.mjs started, sign-in and screenshots.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const baseUrl = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3000';
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const screenshotDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'screenshots');

/** Demo accounts seeded by the server (all share one password). */
export const demo = {
  viewer: 'vera.viewer@kestrel.example',
  member: 'milo.member@kestrel.example',
  teamAdmin: 'tara.admin@kestrel.example',
  curator: 'cora.curator@kestrel.example',
  siteAdmin: 'sam.siteadmin@kestrel.example',
} as const;
export const demoPassword = 'thermoledger-demo';

export interface Browser {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

/** Starts Chromium with a fresh user-data directory and one page. */
export async function openBrowser(): Promise<Browser> {
  const profile = mkdtempSync(path.join(os.tmpdir(), 'thermoledger-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath,
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
    viewport: { width: 1360, height: 900 },
    baseURL: baseUrl,
  });
  context.setDefaultTimeout(15_000);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in through the form and waits until the header shows the account menu. */
export async function signIn(page: Page, email: string, password = demoPassword): Promise<void> {
  await page.goto('/sign-in');
  await page.locator('[data-testid="sign-in-email"] input').fill(email);
  await page.locator('[data-testid="sign-in-password"] input').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('account-menu').waitFor();
}

/** Signs out through the account menu. */
export async function signOut(page: Page): Promise<void> {
  await page.getByTestId('account-menu').click();
  await page.getByTestId('sign-out').click();
  await page.getByTestId('sign-in-link').waitFor();
}

/** Saves a full-page screenshot under tests/e2e/screenshots/ (git-ignored). */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}
