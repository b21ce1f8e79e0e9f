/**
 * Curation end to end: a member proposes a revised ΔfH° of ammonia with a PDF as evidence, a
 * curator finds it in the queue, comments and accepts it, the species page shows the new value
 * and revision, and a reaction evaluated at the earlier revision still gives its earlier ΔH.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { baseUrl, navLink, screenshot, signIn, signOut, unique, useBrowser } from './helpers';

const browser = useBrowser({ viewport: { width: 1360, height: 1800 } });

/** A minimal PDF (the header is what the server's content check reads). */
const PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);

/** Ammonia synthesis: elements in their reference states have ΔfH° = 0 (definition of ΔfH°, common practice, no source). */
const SYNTHESIS = 'N2(g) + 3 H2(g) -> 2 NH3(g)';

async function evaluate(page: Page, revision?: number): Promise<{ value: number; revision: number }> {
  const reply = await page.request.post(`${baseUrl}/api/v1/reaction-enthalpy`, {
    data: { equation: SYNTHESIS, ...(revision === undefined ? {} : { revision }) },
    headers: { origin: baseUrl },
  });
  expect(reply.status()).toBe(200);
  const body = (await reply.json()) as { deltaH: { value: number }; libraryRevision: number };
  return { value: body.deltaH.value, revision: body.libraryRevision };
}

async function openAmmonia(page: Page): Promise<void> {
  await page.goto('/library');
  await page.locator('[data-testid="library-search"] input').fill('ammonia');
  const row = page.getByTestId('species-row').filter({ hasText: 'NH3(g)' });
  await row.first().waitFor();
  await row.first().locator('a.key-link').click();
  await page.getByTestId('species-name').waitFor();
}

describe('curation', () => {
  it('a member proposes a revised ΔfH° with a PDF, a curator comments and accepts, the library shows the new revision', async () => {
    const { page } = browser;
    const before = await evaluate(page);
    const title = unique('Revised ΔfH° of NH3(g)');
    // Invented for this test only (a throwaway database), not a published value.
    const proposed = -45.77;

    // The member proposes from the species page.
    await signIn(page, 'member');
    await openAmmonia(page);
    await page.getByTestId('propose-change').click();
    await page.locator('[data-testid="propose-title"] input').fill(title);
    await page.locator('[data-testid="propose-value"] input').fill(String(proposed));
    await page.locator('[data-testid="propose-uncertainty"] input').fill('0.30');
    await page.getByTestId('source-citation').click();
    await page
      .locator('[data-testid="propose-citation"] textarea')
      .fill('E2E scenario citation (invented for an automated test; not a published value)');
    await page.locator('[data-testid="propose-rationale"] textarea').fill('A re-measurement of the combustion.');
    await page
      .getByTestId('evidence-input')
      .setInputFiles({ name: 'evidence.pdf', mimeType: 'application/pdf', buffer: PDF });
    await screenshot(page, 'curation-propose-form');
    await page.getByTestId('propose-submit').click();
    await page.waitForURL(/\/amendments\/[0-9a-f-]{36}$/);
    const amendmentPath = new URL(page.url()).pathname;
    await expect.poll(() => page.getByTestId('amendment-state').textContent()).toContain('Open');
    expect(await page.getByTestId('evidence-link').first().textContent()).toContain('evidence.pdf');
    expect(await page.getByTestId('diff-new').first().textContent()).toContain('45.77');
    await signOut(page);

    // The curator sees it in the queue (with the count in the navigation), comments and accepts.
    await signIn(page, 'curator');
    await page.getByTestId('nav-amendments-count').waitFor({ state: 'attached' });
    await (await navLink(page, 'amendments')).click();
    const row = page.getByTestId('queue-row').filter({ hasText: title });
    await row.first().waitFor();
    await screenshot(page, 'curation-queue');
    await row.first().getByRole('link', { name: title }).click();
    await page.waitForURL(new RegExp(`${amendmentPath}$`));
    await page.getByTestId('amendment-impact').waitFor();
    await page.locator('[data-testid="comment-body"] textarea').fill('Checked against the attached report.');
    await page.getByTestId('comment-submit').click();
    await page.getByTestId('comment').filter({ hasText: 'Checked against the attached report.' }).waitFor();
    await screenshot(page, 'curation-amendment');
    await page.getByTestId('action-accept').click();
    await expect.poll(() => page.getByTestId('amendment-state').textContent()).toContain('Accepted');
    const resultText = (await page.getByTestId('result-revision').textContent()) ?? '';
    const newRevision = Number(/revision (\d+)/.exec(resultText)?.[1]);
    expect(newRevision).toBe(before.revision + 1);

    // The species page shows the new value, its revision and the history entry linking the amendment.
    await openAmmonia(page);
    const values = page.getByTestId('values-dfH298');
    await expect.poll(() => values.textContent()).toContain('45.77');
    expect(await page.locator('.rev-note').textContent()).toContain(`Revision ${newRevision}`);
    const history = page.getByTestId('history');
    expect(await history.textContent()).toContain(`Revision ${newRevision}`);
    expect(await history.getByTestId('history-amendment').first().getAttribute('href')).toBe(amendmentPath);
    await screenshot(page, 'curation-species-after');

    // A reaction evaluated at the earlier revision keeps its earlier ΔH; now it uses the new value.
    const earlier = await evaluate(page, before.revision);
    expect(earlier.revision).toBe(before.revision);
    expect(earlier.value).toBeCloseTo(before.value, 9);
    const now = await evaluate(page);
    expect(now.revision).toBe(newRevision);
    // ΔrH° = 2 ΔfH°(NH3, g) − 0 − 0 (elements in their reference states).
    expect(now.value).toBeCloseTo(2 * proposed, 6);

    // Narrow screens: the queue and the decided amendment.
    await page.setViewportSize({ width: 390, height: 1600 });
    await page.goto('/amendments?state=all');
    await page.getByTestId('queue-row').first().waitFor();
    await screenshot(page, 'curation-queue-narrow');
    await page.goto(amendmentPath);
    await page.getByTestId('amendment-diff').waitFor();
    await screenshot(page, 'curation-amendment-narrow');
  }, 180_000);
});
