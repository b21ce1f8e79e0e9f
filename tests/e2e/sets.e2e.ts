/**
 * Reaction sets in the browser: a member saves work to a set, shares it by link, and the link
 * opens in a fresh browser without sign-in with the same ΔH and sources; revoked, it opens nothing.
 */
import { describe, expect, it } from 'vitest';
import { screenshot, signIn, unique, useBrowser } from './helpers';

const browser = useBrowser();

const PROPANE = 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)';
const DERIVATION_TARGET = 'CO(g) + 1/2 O2(g) -> CO2(g)';

describe('reaction sets', () => {
  it('saves a reaction and a derivation to a set, shares it, and the link shows the same numbers until revoked', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.goto('/');
    await page.locator('[data-testid="equation-input"] input').fill(PROPANE);
    await page.getByTestId('enthalpy-result').waitFor({ timeout: 15_000 });

    // Save to a new set from the workbench.
    const title = unique('Burner set');
    await page.getByTestId('save-to-set').click();
    await page.getByTestId('new-set-title').locator('input').fill(title);
    await page.getByTestId('save-to-set-confirm').click();
    await page.getByTestId('saved-set-link').click();
    await page.waitForURL(/\/teams\/[^/]+\/sets\/[^/]+$/);
    await expect.poll(() => page.getByTestId('set-title').textContent()).toBe(title);

    // Add a Hess's-law derivation on the set page; autosave says when it is saved.
    await page.getByRole('tab', { name: 'Edit' }).click();
    await page.getByRole('button', { name: 'Add a derivation' }).click();
    await page.getByLabel('Target reaction').fill(DERIVATION_TARGET);
    await expect
      .poll(() => page.getByTestId('save-status').textContent(), { timeout: 15_000 })
      .toContain('All changes saved');
    await page.getByRole('tab', { name: 'Results' }).click();
    // Saved means saved: once the save lands the page stops calling the draft unsaved.
    await expect
      .poll(() => page.getByText('Results are for the last saved version.').count(), { timeout: 15_000 })
      .toBe(0);
    const figures = page.getByTestId('item-delta-h');
    await expect.poll(() => figures.count(), { timeout: 15_000 }).toBe(2);
    const teamFigures = await figures.allTextContents();
    const teamSources = await page.getByTestId('sources').locator('.key').allTextContents();
    expect(teamSources.length).toBeGreaterThan(0);
    // ΔcH° of propane to liquid water −2219.2 kJ/mol (NIST Chemistry WebBook; from memory); U+2212 minus.
    expect(teamFigures[0]).toMatch(/−2219/);
    await screenshot(page, 'set-page');

    // Make a share link.
    await page.getByRole('tab', { name: 'Share links' }).click();
    await page.getByTestId('create-link').click();
    const urlField = page.getByTestId('new-link-url').locator('input');
    await urlField.waitFor();
    const url = await urlField.inputValue();
    expect(url).toMatch(/\/shared\/[A-Za-z0-9_-]{65}$/);

    // A fresh browser without an account sees the same numbers and sources.
    const reader = await browser.newPerson();
    const sharedPath = new URL(url).pathname;
    const reply = await reader.goto(sharedPath);
    expect(reply?.headers()['referrer-policy']).toBe('no-referrer');
    expect(reply?.headers()['x-robots-tag']).toContain('noindex');
    await expect.poll(() => reader.getByTestId('set-title').textContent(), { timeout: 15_000 }).toBe(title);
    await expect.poll(() => reader.getByTestId('item-delta-h').allTextContents()).toEqual(teamFigures);
    expect(await reader.getByTestId('sources').locator('.key').allTextContents()).toEqual(teamSources);
    expect(await reader.getByTestId('set-cautions').textContent()).toContain('screening');
    expect(await reader.getByTestId('account-menu').count()).toBe(0);
    await screenshot(reader, 'shared-set');

    // Revoke: the link opens the not-found page.
    await page.getByTestId('revoke-link').click();
    await expect.poll(() => page.getByTestId('share-links').textContent()).toContain('revoked');
    await reader.reload();
    await expect
      .poll(() => reader.getByRole('heading', { level: 1 }).textContent(), { timeout: 15_000 })
      .toBe('This link opens nothing');
    expect(await reader.getByTestId('item-delta-h').count()).toBe(0);
  });

  it('lists the team sets with search and tag filter, and shows a stale save as a conflict', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    const title = unique('Conflict set');
    // Create through the API of the signed-in page, then edit from two tabs.
    const teamId = await page.evaluate(async () => {
      const session = await (await fetch('/api/v1/session')).json();
      return session.teams[0].id as string;
    });
    const created = await page.evaluate(
      async ({ teamId, title }) => {
        const res = await fetch(`/api/v1/teams/${teamId}/sets`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify({ title, tags: ['e2e-tag'], items: [{ kind: 'note', text: 'first' }] }),
        });
        return (await res.json()) as { id: string };
      },
      { teamId, title },
    );
    await page.goto(`/teams/${teamId}/sets`);
    await page.getByLabel('Search').fill(title);
    await expect.poll(() => page.getByTestId('set-row').count(), { timeout: 15_000 }).toBe(1);
    // The tag filter keeps only sets with the tag.
    await page.getByLabel('Search').fill('');
    await page.getByTestId('tag-filter').click();
    await page.locator('.n-base-select-option', { hasText: 'e2e-tag' }).click();
    await expect
      .poll(async () => (await page.getByTestId('set-row').allTextContents()).every((row) => row.includes('e2e-tag')))
      .toBe(true);
    expect(await page.getByTestId('set-row').count()).toBeGreaterThan(0);

    await page.goto(`/teams/${teamId}/sets/${created.id}`);
    await page.getByRole('tab', { name: 'Edit' }).click();
    // Someone else saves version 2 meanwhile.
    await page.evaluate(
      async ({ teamId, id }) => {
        await fetch(`/api/v1/teams/${teamId}/sets/${id}`, {
          method: 'PUT',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify({ version: 1, description: 'changed elsewhere' }),
        });
      },
      { teamId, id: created.id },
    );
    await page.getByTestId('set-title-input').locator('input').fill(`${title} renamed`);
    await page.getByTestId('set-conflict').waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('save-status').textContent()).toContain('Not saved');
    await page.getByTestId('reapply-edit').click();
    await expect
      .poll(() => page.getByTestId('save-status').textContent(), { timeout: 15_000 })
      .toContain('All changes saved');
    const saved = await page.evaluate(
      async ({ teamId, id }) => (await fetch(`/api/v1/teams/${teamId}/sets/${id}`)).json(),
      { teamId, id: created.id },
    );
    // Both edits kept: nothing silently overwritten.
    expect(saved).toMatchObject({ title: `${title} renamed`, description: 'changed elsewhere', version: 3 });
  });

  it('says which item and field a refused save is about, asks before leaving with it, and saves once fixed', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    const teamId = await page.evaluate(async () => {
      const session = await (await fetch('/api/v1/session')).json();
      return session.teams[0].id as string;
    });
    const created = await page.evaluate(
      async ({ teamId, title }) => {
        const res = await fetch(`/api/v1/teams/${teamId}/sets`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify({ title, items: [{ kind: 'note', text: 'first' }] }),
        });
        return (await res.json()) as { id: string };
      },
      { teamId, title: unique('Refused set') },
    );
    await page.goto(`/teams/${teamId}/sets/${created.id}`);
    await page.getByRole('tab', { name: 'Edit' }).click();
    await page.getByTestId('add-reaction').click();
    const status = page.getByTestId('save-status');
    await expect
      .poll(() => status.textContent(), { timeout: 15_000 })
      .toContain('item 2 (Reaction: ), Equation: Type the equation.');

    // Leaving with the refused edit asks first; staying keeps the page and the edit.
    let asked = '';
    page.once('dialog', (dialog) => {
      asked = dialog.message();
      void dialog.dismiss();
    });
    await page.getByTestId('nav-workbench').click();
    await expect.poll(() => asked).toContain('Leave anyway');
    expect(new URL(page.url()).pathname).toBe(`/teams/${teamId}/sets/${created.id}`);

    await page.getByLabel('Equation').last().fill(PROPANE);
    await expect.poll(() => status.textContent(), { timeout: 15_000 }).toContain('All changes saved');
    await page.getByRole('tab', { name: 'Results' }).click();
    await expect.poll(() => page.getByTestId('item-delta-h').count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByText('Results are for the last saved version.').count()).toBe(0);
  });
});
