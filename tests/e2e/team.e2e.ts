import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo, openBrowser, screenshot, signIn, signOut, type Browser } from './helpers';

let browser: Browser;
beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => browser?.close());

const invitee = `new.chemist.${Date.now()}@kestrel.example`;
let invitationPath = '';

describe('team administration and account settings', () => {
  it('says how long to wait after too many failed sign-ins', async () => {
    const { page } = browser;
    // An address with no account: the limit counts failures per address typed, so demo users stay usable.
    const email = `nobody.${Date.now()}@kestrel.example`;
    await page.goto('/sign-in');
    const error = page.getByTestId('sign-in-error');
    let text = '';
    for (let attempt = 0; attempt < 8 && !text.startsWith('Too many attempts'); attempt += 1) {
      await page.locator('[data-testid="sign-in-email"] input').fill(email);
      await page.locator('[data-testid="sign-in-password"] input').fill(`wrong-${attempt}`);
      const reply = page.waitForResponse((r) => r.url().endsWith('/api/v1/session') && r.request().method() === 'POST');
      await page.getByTestId('sign-in-submit').click();
      await reply;
      await error.waitFor();
      text = ((await error.textContent()) ?? '').trim();
    }
    expect(text).toMatch(/^Too many attempts — try again in \d+ s\.$/);
    await screenshot(page, 'sign-in-rate-limited');
  });

  it('lets the team admin invite someone by e-mail', async () => {
    const { page } = browser;
    await signIn(page, demo.teamAdmin);
    await page.getByTestId('nav-members').click();
    await page.getByTestId('members-table').waitFor();
    await page.getByPlaceholder('colleague@lab.example').fill(invitee);
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByRole('cell', { name: invitee }).waitFor();
    await screenshot(page, 'team-admin-members');
    await signOut(page);
  });

  it('delivers the invitation, readable in the outbox', async () => {
    const { page } = browser;
    await signIn(page, demo.siteAdmin);
    await page.goto('/admin/outbox');
    await page.getByTestId('outbox-message').filter({ hasText: invitee }).first().click();
    const link = page.getByTestId('outbox-text').locator('a').first();
    const href = (await link.getAttribute('href')) ?? '';
    expect(href).toMatch(/\/invitations\/[^/]+$/);
    invitationPath = new URL(href).pathname;
    await signOut(page);
  });

  it('lets the invitee create an account and land in the team', async () => {
    const { page } = browser;
    await page.goto(invitationPath);
    await page.getByText('Join a team').waitFor();
    expect(await page.getByText(invitee).count()).toBeGreaterThan(0);
    await page.locator('[data-testid="invite-name"] input').fill('Nia Newcomer');
    await page.locator('[data-testid="invite-password"] input').fill('a-long-enough-secret');
    await page.locator('[data-testid="invite-confirm"] input').fill('a-long-enough-secret');
    await page.getByRole('button', { name: 'Create the account and join' }).click();
    await page.waitForURL(/\/teams\/[^/]+\/notes$/);
    expect(await page.getByTestId('account-menu').textContent()).toContain('Nia Newcomer');
    // A new member may write notes.
    await page.getByTestId('note-new').waitFor();
  });

  it('creates a personal API token and shows its secret once', async () => {
    const { page } = browser;
    await page.goto('/account');
    await page.getByPlaceholder('e.g. batch notebook').fill('plant notebook');
    await page.getByRole('button', { name: 'Create token' }).click();
    const secret = page.locator('[data-testid="token-secret"] input');
    await secret.waitFor();
    expect(await secret.inputValue()).toMatch(/^tl_/);
    await page.getByRole('cell', { name: 'plant notebook' }).waitFor();
    await screenshot(page, 'account-token');
    await page.reload();
    await page.getByRole('cell', { name: 'plant notebook' }).waitFor();
    expect(await page.locator('[data-testid="token-secret"]').count()).toBe(0);
  });
});
