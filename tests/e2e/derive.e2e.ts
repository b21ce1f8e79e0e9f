/**
 * The derive page: a formation enthalpy from given combustion reactions, the address that reopens
 * it, saving a derived value for the team and the team's derived values page.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot, signIn, useBrowser } from './helpers';

const browser = useBrowser();

/** The headline ΔH as shown ("−110.50 ± 0.14 kJ/mol"), with an ASCII minus. */
async function headline(page: Page): Promise<string> {
  const text = (await page.getByTestId('derive-headline').getByTestId('value-figure').first().textContent()) ?? '';
  return text
    .replace(/\u2212/g, '-')
    .replace(/\s+/g, ' ')
    .trim();
}

/** Chooses "Reactions given here" and pastes the lines into the list. */
async function giveReactions(page: Page, lines: string[]): Promise<void> {
  await page.getByTestId('derive-using-given').click();
  await page.getByTestId('given-paste-open').click();
  await page.locator('[data-testid="given-paste"] textarea').fill(lines.join('\n'));
  await page.getByTestId('given-paste-add').click();
  await expect.poll(() => page.getByTestId('given-row').count()).toBe(lines.length);
}

async function typeTarget(page: Page, target: string): Promise<void> {
  await page.locator('[data-testid="derive-target"] input').fill(target);
}

describe('derive page', () => {
  it('derives ΔfH° of CO(g) from the combustion of graphite and of CO, and reopens it from its address', async () => {
    const { page } = browser;
    await page.goto('/derive');
    await typeTarget(page, 'C(cr, graphite) + 1/2 O2(g) -> CO(g)');
    // Atkins & de Paula, Physical Chemistry (Hess's law example; from memory): ΔcH°(C, graphite) =
    // −393.5 kJ/mol and ΔcH°(CO, g) = −283.0 kJ/mol.
    await giveReactions(page, [
      'C(cr, graphite) + O2(g) -> CO2(g) ; -393.5 ; 0.1',
      'CO(g) + 1/2 O2(g) -> CO2(g) ; -283.0 ; 0.1',
    ]);
    await page.getByTestId('derive-submit').click();
    await page.getByTestId('derive-result').waitFor();
    // By hand: −393.5 − (−283.0) = −110.5 kJ/mol, u = √(0.1² + 0.1²) = 0.14 kJ/mol.
    await expect.poll(() => headline(page)).toBe('-110.50 ± 0.14 kJ/mol');
    // CODATA Key Values for Thermodynamics (Cox, Wagman & Medvedev, 1989; from memory):
    // ΔfH°(CO, g) = −110.53 ± 0.17 kJ/mol. The textbook cycle lands within that uncertainty.
    const shown = Number((await headline(page)).split(' ')[0]);
    expect(Math.abs(shown - -110.53)).toBeLessThan(0.17);

    // The step table: the graphite combustion as written, the CO combustion reversed.
    const steps = page.getByTestId('route-step');
    expect(await steps.count()).toBe(2);
    const multipliers = (
      await page.getByTestId('step-multiplier').locator('.tl-visually-hidden').allTextContents()
    ).map((t) => t.replace(/\u2212/g, '-').trim());
    expect(multipliers.sort()).toEqual(['-1', '1']);
    expect(await page.getByTestId('verdict-headline').textContent()).toBe(
      'One route only: there is nothing to compare it with.',
    );
    await page.getByTestId('level-diagram').waitFor();
    expect(await page.getByTestId('level-summary').textContent()).toContain('−110.50 kJ/mol');
    await screenshot(page, 'derive-co-given');

    // The address holds the inputs: a teammate opening it sees the same derivation.
    const address = page.url();
    expect(new URL(address).searchParams.getAll('r')).toHaveLength(2);
    const teammate = await browser.newPerson();
    await teammate.goto(address);
    await teammate.getByTestId('derive-result').waitFor();
    await expect.poll(() => headline(teammate)).toBe('-110.50 ± 0.14 kJ/mol');
    expect(await teammate.locator('[data-testid="derive-target"] input').inputValue()).toBe(
      'C(cr, graphite) + 1/2 O2(g) -> CO(g)',
    );
    expect(await teammate.getByTestId('given-row').count()).toBe(2);
  });

  it('names the given reaction and column that cannot be read', async () => {
    const { page } = browser;
    await page.goto('/derive');
    await page.getByTestId('derive-using-given').click();
    await page.getByTestId('given-paste-open').click();
    await page.locator('[data-testid="given-paste"] textarea').fill('A(g) -> B(g) ; -1,5');
    await page.getByTestId('given-paste-add').click();
    const problems = page.getByTestId('given-paste-problems');
    await problems.waitFor();
    expect(await problems.textContent()).toContain('Line 1, column 16 (ΔH): “-1,5” has a decimal comma');
  });

  it("refuses a team value for a species the library holds, saves one it lacks, and lists it on the team's page", async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.goto('/derive');
    // CO(g) has a ΔfH° in the library: the team may not shadow it with its own value.
    await typeTarget(page, 'C(cr, graphite) + 1/2 O2(g) -> CO(g)');
    await giveReactions(page, [
      'C(cr, graphite) + O2(g) -> CO2(g) ; -393.5 ; 0.1',
      'CO(g) + 1/2 O2(g) -> CO2(g) ; -283.0 ; 0.1',
    ]);
    await page.getByTestId('derive-submit').click();
    await page.getByTestId('save-derived').waitFor();
    await page.getByTestId('save-derived-submit').click();
    const refused = page.getByTestId('save-derived-failure');
    await refused.waitFor();
    expect(await refused.textContent()).toContain('The library already has a ΔfH° for CO(g)');

    // Adamantane is not in the library. Combustion enthalpies (from memory, rounded as in
    // Atkins & de Paula's tables): C(graphite) −393.5, H2 −285.8, adamantane(cr) −6033 kJ/mol;
    // the last without a stated uncertainty. Read from a CSV file, as a lab would export them.
    await page.getByTestId('derive-submit').waitFor();
    await typeTarget(page, '10 C(cr, graphite) + 8 H2(g) -> C10H16(cr)');
    await page.getByTestId('given-file').setInputFiles({
      name: 'combustion.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(
        [
          'equation,dH,u,unit',
          '"C(cr, graphite) + O2(g) -> CO2(g)",-393.5,0.1,kJ/mol',
          'H2(g) + 1/2 O2(g) -> H2O(l),-285.8,0.1,kJ/mol',
          'C10H16(cr) + 14 O2(g) -> 10 CO2(g) + 8 H2O(l),-6033,,kJ/mol',
        ].join('\r\n'),
      ),
    });
    await page.getByTestId('given-paste').waitFor();
    await page.getByText('Replace the list').click();
    await expect.poll(() => page.getByTestId('given-row').count()).toBe(3);
    await page.getByTestId('derive-submit').click();
    // By hand: 10(−393.5) + 8(−285.8) − (−6033) = −3935 − 2286.4 + 6033 = −188.4 kJ/mol.
    await expect.poll(() => headline(page)).toMatch(/^-188\.4\d* /);
    expect(await page.getByTestId('derive-result').textContent()).toContain('incomplete');
    await page.getByTestId('save-derived-note').locator('textarea').fill('E2E: adamantane from combustion');
    await page.getByTestId('save-derived-submit').click();
    const done = page.getByTestId('save-derived-done');
    await done.waitFor();
    await screenshot(page, 'derive-saved');

    await done.getByRole('link').click();
    await page.waitForURL(/\/teams\/[^/]+\/derived$/);
    const row = page.getByTestId('derived-value-row').filter({ hasText: 'E2E: adamantane from combustion' }).first();
    await row.waitFor();
    const text = ((await row.textContent()) ?? '').replace(/\u2212/g, '-');
    expect(text).toContain('C10H16');
    expect(text).toContain('-188.4');
    expect(await row.getByTestId('derived-incomplete').count()).toBe(1);
    await screenshot(page, 'team-derived-values');
  });
});
