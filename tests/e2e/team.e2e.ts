/**
 * Team administration and account settings. Each test signs in as the roles it needs, each in
 * its own browser context, and invents its own people and names, so order does not matter.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { axeBlocking } from './axe';
import {
  apiAs,
  fieldMessage,
  fillSignIn,
  linkMailedTo,
  openTeamArea,
  screenshot,
  signIn,
  unique,
  useBrowser,
  type TestBrowser,
} from './helpers';

const browser = useBrowser();

/**
 * A team admin invites a new address to Kestrel Bay as a member through the Members page, in a
 * context of their own; the link is read from the outbox. Returns the address and the link's path.
 */
async function invite(b: TestBrowser): Promise<{ email: string; path: string }> {
  const email = `${unique('new.chemist')}@kestrel.example`;
  const admin = await b.newPerson();
  await signIn(admin, 'teamAdmin');
  await openTeamArea(admin, 'members');
  await admin.getByRole('textbox', { name: 'E-mail' }).fill(email);
  await admin.getByRole('button', { name: 'Send invitation' }).click();
  await admin.getByRole('cell', { name: email }).waitFor();
  const path = await linkMailedTo(email);
  expect(path).toMatch(/^\/invitations\/[^/]+$/);
  return { email, path };
}

/** Fills the join form of an invitation for a new account and waits until the team opens. */
async function createAccount(page: Page, path: string, name: string, password: string): Promise<void> {
  await page.goto(path);
  await page.getByTestId('invite-name').locator('input').fill(name);
  await page.getByTestId('new-password').locator('input').fill(password);
  await page.getByTestId('new-password-confirm').locator('input').fill(password);
  await page.getByRole('button', { name: 'Create the account and join' }).click();
  await page.waitForURL(/\/teams\/[^/]+\/notes$/);
}

/** Set-up only: the team admin invites a new address over the API; returns it and the mailed link. */
async function inviteByApi(): Promise<{ email: string; path: string }> {
  const email = `${unique('new.chemist')}@kestrel.example`;
  const { api, session } = await apiAs('teamAdmin');
  try {
    const teamId = session.teams[0]!.id;
    const reply = await api.post(`/api/v1/teams/${teamId}/invitations`, { data: { email, role: 'member' } });
    expect(reply.status()).toBe(201);
  } finally {
    await api.dispose();
  }
  return { email, path: await linkMailedTo(email) };
}

describe('team administration and account settings', () => {
  it('says how long to wait after too many failed sign-ins', async () => {
    const { page } = browser;
    // An address with no account: the limit counts failures per address typed, so demo users stay usable.
    const email = `${unique('nobody')}@kestrel.example`;
    await page.goto('/sign-in');
    const error = page.getByTestId('sign-in-error');
    let text = '';
    for (let attempt = 0; attempt < 8 && !text.startsWith('Too many attempts'); attempt += 1) {
      const reply = page.waitForResponse((r) => r.url().endsWith('/api/v1/session') && r.request().method() === 'POST');
      await fillSignIn(page, email, `wrong-${attempt}`);
      await reply;
      await error.waitFor();
      text = ((await error.textContent()) ?? '').trim();
    }
    expect(text).toMatch(/^Too many attempts — try again in \d+ s\.$/);
    await screenshot(page, 'sign-in-rate-limited');
  });

  it('lets an invitee create an account with a checked new password and land in the team', async () => {
    const { page } = browser;
    const { email, path } = await invite(browser);
    await page.goto(path);
    await page.getByText('Join a team').waitFor();
    expect(await page.getByText(email).count()).toBeGreaterThan(0);
    expect(await axeBlocking(page, 'invitation, new account')).toEqual([]);

    // The rule the server enforces shows as the user types; a differing repetition is caught before sending.
    await page.getByTestId('invite-name').locator('input').fill('Nia Newcomer');
    const password = page.getByTestId('new-password').locator('input');
    await password.fill('short');
    await expect.poll(() => fieldMessage(password)).toBe('At least 10 characters: 5 more to go.');
    await password.fill('a-long-enough-secret');
    await expect.poll(() => fieldMessage(password)).toBe('At least 10 characters: met.');
    await page.getByTestId('new-password-confirm').locator('input').fill('a-long-enough-secreT');
    await page.getByRole('button', { name: 'Create the account and join' }).click();
    const repeat = page.getByLabel('Repeat the password', { exact: true });
    await expect.poll(() => fieldMessage(repeat)).toBe('The two passwords differ.');
    expect(await repeat.getAttribute('aria-invalid')).toBe('true');
    await screenshot(page, 'invitation-new-account');

    await page.getByTestId('new-password-confirm').locator('input').fill('a-long-enough-secret');
    await page.getByRole('button', { name: 'Create the account and join' }).click();
    await page.waitForURL(/\/teams\/[^/]+\/notes$/);
    expect(await page.getByTestId('account-menu').textContent()).toContain('Nia Newcomer');
    // Invited as a member, the newcomer may write notes.
    await page.getByTestId('note-new').waitFor();
  }, 120_000);

  it('changes the password: a wrong current one is named under its field, the new one then signs in', async () => {
    const { page } = browser;
    const { email, path } = await inviteByApi();
    await createAccount(page, path, 'Pia Password', 'first-secret-123');
    await page.goto('/account');

    await page.getByLabel('Current password', { exact: true }).fill('not-my-password');
    await page.getByTestId('new-password').locator('input').fill('second-secret-456');
    await page.getByTestId('new-password-confirm').locator('input').fill('second-secret-456');
    await page.getByRole('button', { name: 'Change password' }).click();
    const current = page.getByLabel('Current password', { exact: true });
    await expect.poll(() => fieldMessage(current)).toBe('The current password is wrong.');
    await screenshot(page, 'account-password-wrong-current');

    await page.getByLabel('Current password', { exact: true }).fill('first-secret-123');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByText('Password changed.').waitFor();

    const later = await browser.newPerson();
    await signIn(later, { email, password: 'second-secret-456' });
  }, 120_000);

  it('creates a personal API token and shows its secret once', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.goto('/account');
    const name = unique('plant notebook');
    await page.getByRole('textbox', { name: 'Token name' }).fill(name);
    await page.getByRole('button', { name: 'Create token' }).click();
    const secret = page.getByTestId('token-secret').locator('input');
    await secret.waitFor();
    expect(await secret.inputValue()).toMatch(/^tl_/);
    await page.getByRole('cell', { name }).waitFor();
    await screenshot(page, 'account-token');
    await page.reload();
    await page.getByRole('cell', { name }).waitFor();
    expect(await page.getByTestId('token-secret').count()).toBe(0);
  });

  it('lets the site admin create a team, whose first admin is invited by e-mail', async () => {
    const { page } = browser;
    await signIn(page, 'siteAdmin');
    await page.goto('/admin/teams');
    const team = unique('Pilot bay');
    const adminEmail = `${unique('first.admin')}@pilot.example`;
    await page.getByRole('textbox', { name: 'Team name' }).fill(team);
    await page.getByRole('textbox', { name: 'First team admin (e-mail)' }).fill(adminEmail);
    await page.getByRole('button', { name: 'Create team' }).click();
    await page.getByRole('cell', { name: team }).waitFor();
    await page.goto('/admin/outbox');
    await page.getByTestId('outbox-message').filter({ hasText: adminEmail }).first().waitFor();
  });
});
