import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, useBrowser } from './helpers';

// Tall enough that a page screenshot holds the panels.
const browser = useBrowser({ viewport: { width: 1360, height: 2600 } });

const MINUS = '\u2212';

/** A figure as shown ("−3.63 ± 0.47 kJ/mol") → −3.63. */
function shownNumber(text: string): number {
  const match = /([−-]?\d+(?:\.\d+)?)/.exec(text);
  if (!match) throw new Error(`no number in "${text}"`);
  return Number(match[1]!.replace(MINUS, '-'));
}

/** A species' model line as the seed library holds it (read here, independently of the app). */
function seedModel(key: string): { forms: { model: Record<string, unknown> }[] } {
  for (const file of ['seeds/library/models-extra.jsonl', 'seeds/library/models-nasa.jsonl']) {
    for (const line of readFileSync(path.resolve(file), 'utf8').split('\n')) {
      if (line.trim() === '') continue;
      const entry = JSON.parse(line) as { species: string; forms: { model: Record<string, unknown> }[] };
      if (entry.species === key) return entry;
    }
  }
  throw new Error(`no model for ${key}`);
}

/**
 * H(T) of a NASA-7 polynomial in kJ/mol: H/(RT) = a1 + a2 T/2 + a3 T²/3 + a4 T³/4 + a5 T⁴/5 + a6/T
 * (McBride, Gordon & Reno, NASA TM-4513, 1993), written out here independently of the app.
 */
function nasaEnthalpy(a: number[], t: number): number {
  const h = a[0]! + (a[1]! * t) / 2 + (a[2]! * t ** 2) / 3 + (a[3]! * t ** 3) / 4 + (a[4]! * t ** 4) / 5 + a[5]! / t;
  return (h * 8.314462618 * t) / 1000;
}

async function text(page: Page, testId: string): Promise<string> {
  return ((await page.getByTestId(testId).first().textContent()) ?? '').replace(/\s+/g, ' ').trim();
}

describe('library and reaction enthalpy (signed out)', () => {
  it('finds ethanol, opens its species page and sees its values and plots', async () => {
    const { page } = browser;
    await page.goto('/library');
    await page.locator('[data-testid="library-search"] input').fill('ethanol');
    const row = page.getByTestId('species-row').filter({ hasText: 'C2H6O(l)' });
    await row.first().waitFor();
    await screenshot(page, 'library-search-ethanol');
    // Sorting is done by the server: the header says which way, the address keeps it.
    await page.getByRole('button', { name: /ΔfH°/ }).click();
    await expect.poll(() => page.locator('th[aria-sort="ascending"]').textContent()).toContain('ΔfH°');
    expect(page.url()).toContain('sort=deltaFH');
    // The selected ΔfH° of liquid ethanol is typed from memory in the seed: the row says so in words.
    expect(await row.first().textContent()).toContain('typed from memory');
    await row.first().locator('a.key-link').click();

    await page.getByTestId('species-name').waitFor();
    expect(await text(page, 'species-name')).toBe('ethanol');
    expect(await text(page, 'species-key')).toBe('C2H6O(l)');
    expect(await text(page, 'memory-notice')).toContain('Typed from memory');
    const values = page.getByTestId('values-dfH298').getByTestId('library-value');
    expect(await values.count()).toBeGreaterThanOrEqual(2);
    // Pedley, Naylor & Kirby (1986): ΔfH°(C2H5OH, l) = −277.0 ± 0.3 kJ/mol as 2σ, so u = 0.15 (seed value, from memory).
    expect(await values.first().textContent()).toContain(`${MINUS}277.00 ± 0.15`);
    expect(await values.first().textContent()).toContain('selected');
    expect(await text(page, 'disagreements')).toContain('differ by 0.69 kJ/mol');
    // A plot is drawn (canvas) and described in words.
    const cpPlot = page.getByTestId('plot-cp');
    await cpPlot.locator('canvas').first().waitFor();
    expect(await cpPlot.locator('figcaption').textContent()).toMatch(/Heat capacity Cp° from 273\.15 K to 351\.4 K/);
    await screenshot(page, 'species-ethanol-liquid');
    // Every plot saves as PNG and as SVG.
    for (const format of ['PNG', 'SVG']) {
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        cpPlot.getByRole('button', { name: new RegExp(`as ${format}$`) }).click(),
      ]);
      expect(download.suggestedFilename()).toBe(`C2H6O-l-Cp.${format.toLowerCase()}`);
    }
  });

  it('evaluates the esterification with its uncertainty and sources, at 350 K, and the heat of 60 g of acid', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.locator('[data-testid="equation-input"] input').fill('CH3COOH(l) + C2H5OH(l) -> CH3COOC2H5(l) + H2O(l)');
    await page.getByTestId('delta-h-298').waitFor();

    // ΔrH°(298.15 K) from the seed values: −479.3 − 285.83 + 484.5 + 277.0 = −3.63 kJ/mol, with
    // u = √(0.20² + 0.15² + 0.40² + 0.02²) = 0.47 kJ/mol (Pedley 1986 and CODATA 1989 values as seeded; hand calculation).
    expect(await text(page, 'delta-h-298')).toContain(`${MINUS}3.63 ± 0.47 kJ/mol`);
    expect(await text(page, 'uncertainty-kind')).toContain('standard uncertainty (k = 1)');
    const sources = await text(page, 'enthalpy-sources');
    expect(sources).toContain('Pedley, Naylor & Kirby');
    expect(sources).toContain('Cox, Wagman & Medvedev');
    expect(await page.getByTestId('contribution-row').count()).toBe(4);

    await page.locator('[data-testid="enthalpy-temperature"] input').fill('350');
    const atT = page.getByTestId('delta-h-t');
    await atT.waitFor();
    await expect.poll(() => atT.textContent()).toContain('ΔrH°(350 K)');
    // Kirchhoff from the seed models: constant Cp of the three organic liquids and the NASA-7 polynomial
    // of H2O(l), integrated here by hand formula from 298.15 K to 350 K.
    const cp = (key: string) => seedModel(key).forms[0]!.model.cp as number;
    const water = seedModel('H2O(l)').forms[0]!.model.coefficients as number[][];
    const increment =
      ((cp('C4H8O2(l)') - cp('CH3COOH(l)') - cp('C2H6O(l)')) * (350 - 298.15)) / 1000 +
      nasaEnthalpy(water[0]!, 350) -
      nasaEnthalpy(water[0]!, 298.15);
    const expected350 = -3.63 + increment;
    await expect
      .poll(async () =>
        Math.abs(shownNumber((await atT.getByTestId('value-figure').textContent()) ?? '') - expected350),
      )
      .toBeLessThan(0.006);
    await page.getByTestId('enthalpy-curve').locator('canvas').first().waitFor();

    await page.locator('[data-testid="amount-0"] input').fill('60');
    const heat = page.getByTestId('heat-result');
    await heat.waitFor();
    expect(await text(page, 'heat-direction')).toBe('Heat released');
    expect(await text(page, 'limiting')).toBe('CH3COOH(l)');
    // 60 g of acetic acid is 60 / 60.052 mol (CIAAW 2021 atomic weights); heat = ξ·ΔrH°(350 K).
    const expectedHeat = (60 / 60.052) * Math.abs(expected350);
    expect(Math.abs(shownNumber(await text(page, 'heat-amount')) - expectedHeat)).toBeLessThan(0.006);
    expect(await text(page, 'heat-cautions')).toMatch(/qualified/);

    await page.locator('[data-testid="batch-mass"] input').fill('0.2');
    await page.locator('[data-testid="batch-cp"] input').fill('2.2');
    await page.getByTestId('adiabatic-rise').waitFor();
    await screenshot(page, 'workbench-esterification');
    await page.getByTestId('enthalpy-panel').screenshot({ path: 'tests/e2e/screenshots/enthalpy-panel.png' });
    await page.getByTestId('quantities-panel').screenshot({ path: 'tests/e2e/screenshots/quantities-panel.png' });
  });

  it('offers the library phases of a species written without one and rewrites it when chosen', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.locator('[data-testid="equation-input"] input').fill('H2(g) + 1/2 O2(g) -> H2O');
    await page.getByTestId('enthalpy-problems').waitFor();
    await page.getByTestId('species-suggestion').filter({ hasText: 'H2O(l)' }).click();
    await expect
      .poll(() => page.locator('[data-testid="equation-input"] input').inputValue())
      .toBe('H2(g) + 1/2 O2(g) -> H2O(l)');
    // ΔfH°(H2O, l) = −285.830 ± 0.040 kJ/mol (CODATA Key Values 1989, interval → u = 0.020; from memory).
    await expect.poll(() => text(page, 'delta-h-298')).toContain(`${MINUS}285.830 ± 0.020`);
  });

  it('shows KOH(cr) with its polymorph transition and water vapour with its sources', async () => {
    const { page } = browser;
    for (const [query, key, shot] of [
      ['KOH', 'KOH(cr)', 'species-koh'],
      ['H2O', 'H2O(g)', 'species-water-vapour'],
    ] as const) {
      await page.goto(`/library?q=${encodeURIComponent(query)}`);
      await page.getByTestId('species-row').filter({ hasText: key }).first().locator('a.key-link').click();
      await page.getByTestId('species-plots').waitFor();
      await page.getByTestId('plot-h').locator('canvas').first().waitFor();
      await screenshot(page, shot);
    }
    // KOH(a) → KOH(b) at 516 K in NASA TM-4513 (the server test checks the enthalpy of the jump).
    await page.goto(`/library?q=KOH`);
    await page.getByTestId('species-row').filter({ hasText: 'KOH(cr)' }).first().locator('a.key-link').click();
    await page.getByTestId('transitions').waitFor();
    expect(await text(page, 'transitions')).toMatch(/516 phase change α → β/);
  });
});
