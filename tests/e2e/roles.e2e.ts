/** Signing in and out, and what each role may see and do. Every test starts signed out. */
import { describe, expect, it } from 'vitest';
import {
  accounts,
  fieldMessage,
  demoPassword,
  fillSignIn,
  openTeamArea,
  screenshot,
  signIn,
  signOut,
  unique,
  useBrowser,
} from './helpers';

const browser = useBrowser();

describe('signing in and what each role sees', () => {
  it('has banner, area navigation and main landmarks, and a skip link to the main region', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.getByTestId('equation-input').waitFor();
    expect(await page.getByRole('banner').count()).toBe(1);
    expect(await page.getByRole('navigation', { name: 'Areas' }).count()).toBe(1);
    expect(await page.getByRole('main').count()).toBe(1);
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Skip to the page');
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
  });

  it('shows the server’s message inline for a wrong password', async () => {
    const { page } = browser;
    await page.goto('/sign-in');
    await fillSignIn(page, accounts.viewer, 'not-the-password');
    const error = page.getByTestId('sign-in-error');
    await error.waitFor();
    expect(await error.textContent()).toMatch(/E-mail or password is wrong/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-wrong-password');
  });

  it('puts the schema’s message under an e-mail field that holds no address, and sends nothing', async () => {
    const { page } = browser;
    let sent = 0;
    page.on('request', (r) => {
      if (r.url().endsWith('/api/v1/session') && r.method() === 'POST') sent += 1;
    });
    await page.goto('/sign-in');
    await fillSignIn(page, 'not-an-address', 'whatever');
    const field = page.getByRole('textbox', { name: 'E-mail' });
    await expect.poll(() => fieldMessage(field)).toBe('Give an e-mail address, like name@lab.example.');
    expect(await field.getAttribute('aria-invalid')).toBe('true');
    expect(sent).toBe(0);
  });

  it('sends an anonymous visitor to sign-in and back to the page afterwards', async () => {
    const { page } = browser;
    await page.goto('/account');
    await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('redirect') === '/account');
    await fillSignIn(page, accounts.viewer, demoPassword());
    await page.waitForURL(/\/account$/);
    await page.getByRole('heading', { name: 'Account', level: 1 }).waitFor();
  });

  it('shows the viewer team areas without Admin, and the not-allowed view on an admin page', async () => {
    const { page } = browser;
    await signIn(page, 'viewer');
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
    await signIn(page, 'viewer');
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-card').first().waitFor();
    expect(await page.getByTestId('note-new').count()).toBe(0);
    expect(await page.getByTestId('note-edit').count()).toBe(0);
    expect(await page.getByTestId('note-delete').count()).toBe(0);
    await screenshot(page, 'viewer-notes');
  });

  it('signs out and leaves the team page', async () => {
    const { page } = browser;
    await signIn(page, 'viewer');
    await openTeamArea(page, 'notes');
    await signOut(page);
    expect(await page.getByTestId('nav-notes').count()).toBe(0);
    await page.goto('/account');
    await page.waitForURL(/\/sign-in/);
  });

  it('lets a member create a note that is still there after a reload', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-new').click();
    const title = unique('Reflux trial');
    await page.getByTestId('note-title').locator('input').fill(title);
    await page
      .getByTestId('note-body')
      .locator('textarea')
      .fill('Hold the jacket at 65 °C; log the exotherm every minute.');
    await page.getByTestId('note-save').click();
    const card = page.getByTestId('note-card').filter({ hasText: title });
    await card.waitFor();
    expect(await card.getByTestId('note-edit').count()).toBe(1);
    await page.reload();
    await page.getByTestId('note-card').filter({ hasText: title }).waitFor();
    await screenshot(page, 'member-notes');
  });

  it('asks for a note title under the field before saving', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-new').click();
    await page.getByTestId('note-save').click();
    const title = page.getByRole('textbox', { name: 'Title' });
    await expect.poll(() => fieldMessage(title)).toBe('Give the note a title.');
    expect(await title.getAttribute('aria-invalid')).toBe('true');
  });

  it('lets the site admin read a reset e-mail in the outbox', async () => {
    const { page } = browser;
    // A reset for a demo account does not change its password until the link is used.
    await page.goto('/reset-password');
    await page.getByTestId('reset-email').locator('input').fill(accounts.curator);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByTestId('reset-sent').waitFor();

    await signIn(page, 'siteAdmin');
    await page.getByTestId('nav-admin').click();
    await page.getByTestId('admin-users-table').waitFor();
    await page.getByRole('link', { name: 'Outbox' }).click();
    const message = page.getByTestId('outbox-message').filter({ hasText: accounts.curator }).first();
    await message.waitFor();
    await message.click();
    const text = page.getByTestId('outbox-text');
    expect(await text.textContent()).toMatch(/\/reset-password\?token=/);
    expect(await text.locator('a').count()).toBeGreaterThan(0);
    await screenshot(page, 'admin-outbox');
  });
});
