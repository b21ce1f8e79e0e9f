/** The reaction workbench, signed out. Every test opens its own fresh page. */
import { describe, expect, it } from 'vitest';
import { screenshot, useBrowser } from './helpers';

const browser = useBrowser();

describe('reaction workbench (signed out)', () => {
  it('balances propane combustion and shows the element table', async () => {
    const { page } = browser;
    await page.goto('/');
    const field = page.locator('[data-testid="equation-input"] input');
    await field.fill('C3H8 + O2 -> CO2 + H2O');
    const status = page.getByTestId('balance-status');
    await expect.poll(() => status.getAttribute('data-status')).toBe('balanced');
    // C3H8 + 5 O2 → 3 CO2 + 4 H2O: the textbook result for propane combustion (common practice, no source).
    const equation = page.getByTestId('balanced-equation');
    await expect.poll(() => equation.textContent()).toBe('C3H8 + 5 O2 → 3 CO2 + 4 H2O');
    expect(await equation.innerHTML()).toContain('C<sub>3</sub>H<sub>8</sub>');
    const table = page.getByTestId('element-table').first();
    const rows = await table
      .locator('tbody tr')
      .evaluateAll((trs) =>
        trs.map((tr) => [...tr.querySelectorAll('th, td')].map((c) => c.textContent?.trim()).join(' ')),
      );
    expect(rows).toEqual(['C 3 3 =', 'H 8 8 =', 'O 10 10 =']);
    await screenshot(page, 'workbench-propane');
  });

  it('reverses and scales the equation', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.locator('[data-testid="equation-input"] input').fill('2 H2(g) + O2(g) -> 2 H2O(l); ΔH = -571.6 kJ');
    const equation = page.getByTestId('balanced-equation');
    await expect.poll(() => equation.textContent()).toBe('2 H2(g) + O2(g) → 2 H2O(l)');
    await page.getByTestId('reverse-switch').click();
    await expect.poll(() => equation.textContent()).toBe('2 H2O(l) → 2 H2(g) + O2(g)');
    await page.locator('[data-testid="scale-factor"] input').fill('1/2');
    await expect.poll(() => equation.textContent()).toBe('H2O(l) → H2(g) + 1/2 O2(g)');
    // Reversing flips the sign and halving halves ΔH: +571.6/2 = +285.8 kJ/mol (Hess's law).
    await expect.poll(() => page.getByTestId('balanced-enthalpy').textContent()).toMatch(/285\.8/);
    await screenshot(page, 'workbench-reversed');
  });

  it('offers a basis for several balancings and balances once coefficients are fixed', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.locator('[data-testid="equation-input"] input').fill('H2 + O2 -> H2O + H2O2');
    const status = page.getByTestId('balance-status');
    await expect.poll(() => status.getAttribute('data-status')).toBe('multiple');
    // Two independent reactions: 2 H2 + O2 -> 2 H2O and H2 + O2 -> H2O2 (common practice, no source).
    expect(await page.getByTestId('several-balancings').locator('li').count()).toBe(2);
    await page.locator('[data-testid="fix-2"] input').fill('2');
    await page.locator('[data-testid="fix-3"] input').fill('1');
    await expect.poll(() => status.getAttribute('data-status')).toBe('balanced');
    await expect.poll(() => page.getByTestId('balanced-equation').textContent()).toBe('3 H2 + 2 O2 → 2 H2O + H2O2');
    expect(await page.getByTestId('fixed-coefficients').textContent()).toContain('H2O = 2');
  });

  it('marks an unknown element at its column', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.locator('[data-testid="equation-input"] input').fill('H2 + Xx2 -> H2O');
    const error = page.getByTestId('parse-error');
    await error.waitFor();
    expect(await page.getByTestId('parse-error-span').textContent()).toBe('Xx');
    expect(await page.getByTestId('parse-error-marker').textContent()).toBe('H2 + Xx2 -> H2O');
    const text = (await error.textContent()) ?? '';
    expect(text).toContain('column 6');
    expect(text).toMatch(/Xx/);
    await screenshot(page, 'workbench-parse-error');
  });

  it('balances a pasted batch and reports the bad line with its column', async () => {
    const { page } = browser;
    await page.goto('/');
    await page
      .locator('[data-testid="batch-input"] textarea')
      .fill(['CH4 + O2 -> CO2 + H2O', '', 'H2 + Xx2 -> H2O', 'Fe2O3 + CO -> Fe + CO2'].join('\n'));
    await page.getByTestId('batch-run').click();
    await page.getByTestId('batch-summary').waitFor();
    const rows = page.getByTestId('batch-row');
    await expect.poll(() => rows.count()).toBe(3);
    const cells = await rows.evaluateAll((trs) =>
      trs.map((tr) => [...tr.querySelectorAll('td')].map((c) => c.textContent?.trim() ?? '')),
    );
    // Methane combustion and haematite reduction by CO: textbook balancings (common practice, no source).
    expect(cells[0]).toEqual(['1', 'CH4 + O2 -> CO2 + H2O', 'balanced', 'CH4 + 2 O2 → CO2 + 2 H2O']);
    expect(cells[1]!.slice(0, 3)).toEqual(['3', 'H2 + Xx2 -> H2O', 'unreadable']);
    expect(cells[1]![3]).toMatch(/^line 3, column 6: .*Xx/);
    expect(cells[2]).toEqual(['4', 'Fe2O3 + CO -> Fe + CO2', 'balanced', 'Fe2O3 + 3 CO → 2 Fe + 3 CO2']);
    await screenshot(page, 'workbench-batch');
  });
});
