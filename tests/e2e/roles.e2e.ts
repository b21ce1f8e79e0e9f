import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo, demoPassword, openBrowser, screenshot, signIn, signOut, type Browser } from './helpers';

let browser: Browser;
beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => browser?.close());

describe('signing in and what each role sees', () => {
  it('shows the server’s message inline for a wrong password', async () => {
    const { page } = browser;
    await page.goto('/sign-in');
    await page.locator('[data-testid="sign-in-email"] input').fill(demo.viewer);
    await page.locator('[data-testid="sign-in-password"] input').fill('not-the-password');
    await page.getByTestId('sign-in-submit').click();
    const error = page.getByTestId('sign-in-error');
    await error.waitFor();
    expect(await error.textContent()).toMatch(/E-mail or password is wrong/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-wrong-password');
  });

  it('sends an anonymous visitor to sign-in and back to the page afterwards', async () => {
    const { page } = browser;
    await page.goto('/account');
    await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('redirect') === '/account');
    await page.locator('[data-testid="sign-in-email"] input').fill(demo.viewer);
    await page.locator('[data-testid="sign-in-password"] input').fill(demoPassword);
    await page.getByTestId('sign-in-submit').click();
    await page.waitForURL(/\/account$/);
    await page.getByRole('heading', { name: 'Account' }).waitFor();
  });

  it('shows the viewer team areas without Admin, and the not-allowed view on an admin page', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.getByTestId('nav-notes').waitFor();
    expect(await page.getByTestId('nav-members').count()).toBe(1);
    expect(await page.getByTestId('nav-admin').count()).toBe(0);
    await page.goto('/admin/users');
    const forbidden = page.getByTestId('forbidden-view');
    await forbidden.waitFor();
    expect(await forbidden.textContent()).toMatch(/Not allowed.*Site admin/s);
    expect(new URL(page.url()).pathname).toBe('/admin/users');
    await screenshot(page, 'viewer-forbidden');
  });

  it('lets the viewer read notes but offers no edit controls', async () => {
    const { page } = browser;
    await page.getByTestId('nav-notes').click();
    await page.getByTestId('note-card').first().waitFor();
    expect(await page.getByTestId('note-new').count()).toBe(0);
    expect(await page.getByTestId('note-edit').count()).toBe(0);
    expect(await page.getByTestId('note-delete').count()).toBe(0);
    await screenshot(page, 'viewer-notes');
  });

  it('signs out and leaves the team page', async () => {
    const { page } = browser;
    await signOut(page);
    expect(await page.getByTestId('nav-notes').count()).toBe(0);
    await page.goto('/account');
    await page.waitForURL(/\/sign-in/);
  });

  it('lets a member create a note', async () => {
    const { page } = browser;
    await signIn(page, demo.member);
    await page.getByTestId('nav-notes').click();
    await page.getByTestId('note-new').click();
    const title = `Reflux trial ${Date.now()}`;
    await page.locator('[data-testid="note-title"] input').fill(title);
    await page
      .locator('[data-testid="note-body"] textarea')
      .fill('Hold the jacket at 65 °C; log the exotherm every minute.');
    await page.getByTestId('note-save').click();
    const card = page.getByTestId('note-card').filter({ hasText: title });
    await card.waitFor();
    expect(await card.getByTestId('note-edit').count()).toBe(1);
    // The note is stored: it is still there after a reload.
    await page.reload();
    await page.getByTestId('note-card').filter({ hasText: title }).waitFor();
    await screenshot(page, 'member-notes');
    await signOut(page);
  });

  it('lets the site admin read a reset e-mail in the outbox', async () => {
    const { page } = browser;
    await page.goto('/reset-password');
    await page.locator('[data-testid="reset-email"] input').fill(demo.viewer);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByTestId('reset-sent').waitFor();

    await signIn(page, demo.siteAdmin);
    await page.getByTestId('nav-admin').click();
    await page.getByTestId('admin-users-table').waitFor();
    await page.getByRole('link', { name: 'Outbox' }).click();
    const message = page.getByTestId('outbox-message').filter({ hasText: demo.viewer }).first();
    await message.waitFor();
    await message.click();
    const text = page.getByTestId('outbox-text');
    expect(await text.textContent()).toMatch(/\/reset-password\?token=/);
    expect(await text.locator('a').count()).toBeGreaterThan(0);
    await screenshot(page, 'admin-outbox');
  });
});
