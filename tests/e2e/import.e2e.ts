/**
 * Bulk import and the entry forms, end to end: a member uploads a CSV of values with one bad row,
 * reads the report naming its line and column, fixes the row, follows the progress and lands on
 * the draft amendment with one entry per row; and a member builds an amendment of several kinds
 * of entries on the new-amendment page.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, signIn, unique, useBrowser } from './helpers';

const browser = useBrowser({ viewport: { width: 1280, height: 1400 } });

// Columns of seeds/library/FORMAT.md (values-*.csv). The figures are invented for this test's
// throwaway database, not published values.
const header =
  'species,property,value,unit,uncertainty_kind,uncertainty,k,source,table,entry_note,provenance,pressure_bar,ion_convention,note';
const good = [
  'CO2(g),dfH298,-393.27,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
  'H2O(l),dfH298,-285.79,kJ/mol,standard,0.1,,codata-1989,,,entered,1,,',
];
const badRow = 'CO2(g),dfH298,minus four,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,';

const csv = (rows: string[]) => Buffer.from([header, ...rows].join('\n'));

/** Records every phase the progress bar shows, across the page's own navigation (the SPA keeps window). */
async function recordPhases(page: Page): Promise<void> {
  await page.evaluate(() => {
    const seen: string[] = [];
    (window as unknown as { importPhases: string[] }).importPhases = seen;
    const phaseNow = () => document.querySelector('[data-testid="import-progress"]')?.getAttribute('data-phase');
    // The bar still shows the last run's outcome: only what follows counts.
    let last = phaseNow();
    const note = () => {
      const phase = phaseNow();
      if (phase && phase !== last) seen.push(phase);
      last = phase;
    };
    new MutationObserver(note).observe(document.body, { subtree: true, childList: true, attributes: true });
  });
}

/** An option of the open naive-ui select (its options carry no ARIA role). */
const option = (page: Page, text: string | RegExp) => page.locator('.n-base-select-option', { hasText: text }).first();

describe('bulk import', () => {
  it('a member sees every bad row by line and column, fixes it, follows the progress and lands on the draft', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.goto('/amendments');
    await page.getByTestId('import-amendment').click();
    await page.waitForURL(/\/amendments\/import$/);
    // The limits come from the server's settings.
    expect(await page.getByTestId('import-limits').textContent()).toMatch(/At most \d+ files? of up to [\d.]+ MB/);
    await expect
      .poll(() => page.getByTestId('import-template').getAttribute('href'))
      .toMatch(/^\/api\/v1\/library\/export\.csv\?revision=\d+$/);

    // One bad row among good ones: the report names it, and no amendment is made.
    await page
      .getByTestId('import-files')
      .setInputFiles({ name: 'values.csv', mimeType: 'text/csv', buffer: csv([good[0]!, badRow, good[1]!]) });
    const title = unique('Imported values');
    await page.locator('[data-testid="import-title"] input').fill(title);
    await page.getByTestId('import-start').click();
    await page.getByTestId('import-report').waitFor();
    const problems = page.getByTestId('import-problem');
    expect(await problems.count()).toBe(1);
    const cells = await problems.first().locator('td').allTextContents();
    expect(cells.slice(0, 2)).toEqual(['3', 'value']);
    expect(await page.getByTestId('import-report-summary').textContent()).toContain('File: values.csv');
    expect(await page.getByTestId('import-failure').textContent()).toContain('No amendment was made');
    expect(await page.getByTestId('import-progress').getAttribute('data-phase')).toBe('failed');
    await screenshot(page, 'import-report');

    // Fixed: the page follows the job and opens the draft with one entry per row.
    await page.getByRole('button', { name: 'Remove values.csv' }).click();
    await page
      .getByTestId('import-files')
      .setInputFiles({ name: 'values.csv', mimeType: 'text/csv', buffer: csv([good[0]!, good[1]!]) });
    await recordPhases(page);
    await page.getByTestId('import-start').click();
    await page.waitForURL(/\/amendments\/[0-9a-f-]{36}$/);
    const phases = await page.evaluate(() => (window as unknown as { importPhases: string[] }).importPhases);
    expect(phases[0]).toBe('uploading');
    expect(phases.slice(1).some((p) => ['reading', 'checking', 'done'].includes(p))).toBe(true);
    expect(phases).not.toContain('failed');
    expect(await page.getByTestId('amendment-title').textContent()).toBe(title);
    await expect.poll(() => page.getByTestId('amendment-state').textContent()).toContain('Draft');
    expect(await page.getByTestId('diff-row').count()).toBe(2);
    await screenshot(page, 'import-draft');
  });
});

describe('new amendment of several entries', () => {
  it('adds a source and a value citing it, lists both, and makes one draft', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.goto('/amendments/new');
    const key = unique('e2e-source')
      .toLowerCase()
      .replace(/[^a-z0-9.-]+/g, '-');

    // A value without a species or source first: the form names the fields.
    await page.getByTestId('entry-add').click();
    await expect.poll(() => page.getByText('Pick a source.').count()).toBeGreaterThan(0);

    await page.getByTestId('entry-kind-set-source').click();
    await page.locator('[data-testid="entry-source-key"] input').fill(key);
    await page.getByTestId('entry-source-kind').click();
    await option(page, 'journal-article').click();
    await page.locator('[data-testid="entry-source-authors"] input').fill('Tester, E.');
    await page.locator('[data-testid="entry-source-title"] input').fill('An invented source for an automated test');
    await page.getByTestId('entry-add').click();
    await expect.poll(() => page.getByTestId('entry-item').count()).toBe(1);

    await page.getByTestId('entry-kind-revise-value').click();
    await page.getByTestId('entry-species').click();
    await page.getByTestId('entry-species').locator('input').fill('ammonia');
    await option(page, /^NH3\(g\) —/).click();
    await page.locator('[data-testid="entry-value"] input').fill('-45.8');
    await page.locator('[data-testid="entry-uncertainty"] input').fill('0.4');
    await page.getByTestId('entry-source-select').click();
    await option(page, `${key} (added in this amendment)`).click();
    await page.getByTestId('entry-add').click();
    await expect.poll(() => page.getByTestId('entry-item').count()).toBe(2);
    expect(await page.getByTestId('entry-item').nth(1).textContent()).toContain('ΔfH° of NH3(g): −45.8 ± 0.4 kJ/mol');

    const title = unique('Two entries');
    await page.locator('[data-testid="new-amendment-title"] input').fill(title);
    await page.locator('[data-testid="new-amendment-rationale"] textarea').fill('Made by an automated test.');
    await page.getByTestId('amendment-open-now').click(); // keep it a draft
    await screenshot(page, 'new-amendment-entries');
    await page.getByTestId('amendment-create').click();
    await page.waitForURL(/\/amendments\/[0-9a-f-]{36}$/);
    expect(await page.getByTestId('amendment-title').textContent()).toBe(title);
    await expect.poll(() => page.getByTestId('amendment-state').textContent()).toContain('Draft');
    expect(await page.getByTestId('diff-row').count()).toBe(2);
  });
});
