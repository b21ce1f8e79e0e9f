/**
 * Calorimetry: a member uploads a run's time–temperature readings, maps the columns, reduces the
 * run, keeps it with the team, proposes it to the library with the readings file as evidence,
 * saves it to a reaction set whose page shows the same ΔH, and opens it back in /calorimetry. The readings are an invented run, generated here from Newton's
 * law with a first-order heat release (tests/shared/chemistry/calorimetry/support.ts).
 */
import { describe, expect, it } from 'vitest';
import { newtonianReadings } from '../shared/chemistry/calorimetry/support';
import { apiAs, screenshot, signIn, unique, useBrowser } from './helpers';

const browser = useBrowser();

/** 100 mL + 100 mL of 0.5 mol/L acid and base: the rise of a quiet calorimeter, in °C, a reading every 5 s. */
function readingsCsv(): string {
  const rows = newtonianReadings({
    k: 1e-4,
    convergence: 295.9,
    start: 295.65,
    rise: 3.36,
    release: 0.1,
    mixingTime: 300,
    step: 5,
    end: 900,
  }).map(([t, kelvin]) => `${t},${(kelvin - 273.15).toFixed(4)}`);
  return ['time_s,temperature_C', ...rows].join('\n');
}

describe('calorimetry page', () => {
  it('lets a member reduce a run from uploaded readings, save it to the team and a set, and propose it', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.getByTestId('nav-calorimetry').click();
    await page.waitForURL(/\/calorimetry$/);
    await expect.poll(() => page.getByTestId('calorimetry-cautions').first().isVisible()).toBe(true);

    await page.getByRole('textbox', { name: 'Volume of the solution (mL)' }).fill('200');
    await page.getByRole('textbox', { name: 'Calorimeter heat capacity (J/K)' }).fill('0');
    await page.getByText('Time–temperature file').click();
    await page.getByTestId('readings-file').setInputFiles({
      name: 'neutralisation-run-1.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(readingsCsv(), 'utf8'),
    });
    const preview = page.getByTestId('readings-preview');
    await expect.poll(() => preview.textContent()).toContain('temperature_C');
    await page.getByRole('textbox', { name: 'Mixing time (s)' }).fill('300');
    await page.getByRole('textbox', { name: 'After-period starts (s)' }).fill('400');

    await page.getByRole('textbox', { name: 'Equation as written' }).fill('HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)');
    await page.getByRole('textbox', { name: 'Amount of the limiting reactant (mol)' }).fill('0.05');
    await page.getByTestId('cp-reduce').click();

    const deltaH = page.getByTestId('cp-deltaH');
    await deltaH.waitFor();
    // q = 200 g × 4.184 J/(g K) × ~3.36 K ≈ 2.81 kJ over 0.05 mol: about −56 kJ/mol (hand-computed).
    const shown = Number(((await deltaH.textContent()) ?? '').replace('\u2212', '-').split(/\s/)[0]);
    expect(shown).toBeLessThan(-54);
    expect(shown).toBeGreaterThan(-58);
    await page.getByTestId('drift-plot').waitFor();
    await page.getByTestId('calorimetry-contributions').waitFor();

    const label = unique('Neutralisation');
    await page.getByRole('textbox', { name: 'Run label' }).fill(label);
    await page.getByRole('button', { name: 'Save run to team' }).click();
    await expect.poll(() => page.getByTestId('run-saved').textContent()).toContain(label);
    await screenshot(page, 'calorimetry-saved');

    // The team holds the run with its readings file as evidence.
    const { api, session } = await apiAs('viewer');
    try {
      const teamId = session.teams[0]!.id;
      const list = (await (await api.get(`/api/v1/teams/${teamId}/calorimetry/runs`)).json()) as {
        runs: { id: string; label: string }[];
      };
      const line = list.runs.find((r) => r.label === label);
      expect(line).toBeDefined();
      const run = (await (await api.get(`/api/v1/teams/${teamId}/calorimetry/runs/${line!.id}`)).json()) as {
        evidence: { fileName: string } | null;
        result: { deltaT: { source: string } };
      };
      expect(run.evidence?.fileName).toBe('neutralisation-run-1.csv');
      expect(run.result.deltaT.source).toBe('series');
    } finally {
      await api.dispose();
    }

    // Propose: the draft amendment carries the run data and the readings file as evidence.
    await page.getByTestId('propose-run').click();
    const proposed = page.getByTestId('run-proposed');
    await expect.poll(() => proposed.textContent(), { timeout: 15_000 }).toContain('as evidence');
    const amendmentPath = (await proposed.getByRole('link').getAttribute('href'))!;
    const amendmentId = amendmentPath.split('/').pop()!;
    const member = await apiAs('member');
    try {
      const amendment = (await (await member.api.get(`/api/v1/amendments/${amendmentId}`)).json()) as {
        rationale: string;
        files: { name: string; mediaType: string }[];
      };
      expect(amendment.files).toEqual([
        expect.objectContaining({ name: 'neutralisation-run-1.csv', mediaType: 'text/csv' }),
      ]);
      expect(amendment.rationale).toMatch(/ΔH = −q\/ξ/);
      expect(amendment.rationale).toMatch(/Drift \(heat exchange\) applied/);
    } finally {
      await member.api.dispose();
    }

    // Save to a new reaction set; its page shows the server's ΔH for the run, the same figure.
    const figureOf = (text: string | null) =>
      Number(
        (text ?? '')
          .replace(/[^\d.\u2212-]+/g, ' ')
          .trim()
          .replace('\u2212', '-')
          .split(/\s/)[0],
      );
    const pageDeltaH = figureOf(await deltaH.textContent());
    await page.getByTestId('save-to-set').click();
    const title = unique('Calorimetry set');
    await page.getByTestId('new-set-title').locator('input').fill(title);
    await page.getByTestId('save-to-set-confirm').click();
    await page.getByTestId('saved-set-link').click();
    await page.waitForURL(/\/sets\/[^/]+$/);
    const setFigure = page.getByTestId('item-delta-h');
    await expect.poll(() => setFigure.count(), { timeout: 20_000 }).toBe(1);
    // Both are rounded to the uncertainty: they agree within the last digit shown.
    expect(Math.abs(figureOf(await setFigure.textContent()) - pageDeltaH)).toBeLessThan(0.15);
    expect(await page.getByTestId('set-results').textContent()).toContain('Readings file: neutralisation-run-1.csv');
    // The run's own cautions (runaway at scale, acid into water) join the set's.
    expect(await page.getByTestId('set-cautions').textContent()).toMatch(/run away/);
    await screenshot(page, 'calorimetry-set');

    // The item opens back in /calorimetry with its inputs, reduced again.
    await page.getByRole('tab', { name: 'Edit' }).click();
    await page.getByTestId('open-item-1').click();
    await page.waitForURL(/\/calorimetry\?/);
    await page.getByTestId('calorimetry-opened-from').waitFor();
    await expect.poll(() => page.getByTestId('cp-deltaH').count(), { timeout: 15_000 }).toBe(1);
    expect(figureOf(await page.getByTestId('cp-deltaH').textContent())).toBeCloseTo(pageDeltaH, 6);
    expect(await page.getByTestId('cp-loaded-readings').textContent()).toContain('neutralisation-run-1.csv');
  });

  it('reduces a bomb run with a readings file, buoyancy and a nitric-acid titration', async () => {
    const { page } = browser;
    await page.goto('/calorimetry');
    await page.getByText('Bomb (constant volume)', { exact: true }).click();
    await page.getByRole('textbox', { name: 'Sample formula' }).fill('C10H8');
    // Scoped: the constant-pressure tab has a 'Typed' choice of its own, still in the page while the tabs switch.
    await page.getByLabel('Energy equivalent').getByText('Typed', { exact: true }).click();
    await page.getByRole('textbox', { name: 'Energy equivalent (J/K)' }).fill('10170');
    const cell = (column: string) => page.getByRole('textbox', { name: `Sample runs, run 1: ${column}` });
    await cell('Mass (g)').fill('1.435');
    await cell('u(mass) (g)').fill('0.0001');
    await cell('Fuse (J)').fill('50');
    await cell('u(fuse) (J)').fill('2');
    await cell('Or titrant (mL)').fill('6.0');
    await cell('u(titrant) (mL)').fill('0.05');
    await cell('Titrant c (mol/L)').fill('0.1');
    await cell('Sample density (g/cm³)').fill('1.17');
    // The rise from readings: a quiet bomb rising by about 5.67 K after firing at 300 s (invented run).
    const rows = newtonianReadings({
      k: 1e-4,
      convergence: 298.5,
      start: 298.3,
      rise: 5.67,
      release: 0.05,
      mixingTime: 300,
      step: 5,
      end: 900,
    }).map(([t, kelvin]) => `${t},${(kelvin - 273.15).toFixed(4)}`);
    await page.getByTestId('readings-file').setInputFiles({
      name: 'naphthalene-run-1.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(['time_s,temperature_C', ...rows].join('\n'), 'utf8'),
    });
    await page.getByRole('textbox', { name: 'Firing time (s)' }).fill('300');
    await page.getByTestId('bomb-use-readings').click();
    await expect
      .poll(() => page.getByTestId('bomb-runs-with-readings').textContent())
      .toContain('naphthalene-run-1.csv');
    await page.getByRole('button', { name: 'Reduce the runs' }).click();
    const result = page.getByTestId('bomb-result');
    await result.waitFor();
    // ε·ΔT ≈ 10.17 kJ/K × 5.67 K ≈ 57.7 kJ from 1.435 g of C10H8 (128.17 g/mol): ΔcU ≈ −5.1 × 10³ kJ/mol
    // (Chang's naphthalene example, from memory; the fuse and nitric-acid energies take a little off).
    const text = (await result.textContent()) ?? '';
    const deltaCU = Number(/ΔcU\s*([−-]?[\d.]+)/.exec(text)?.[1]?.replace('\u2212', '-'));
    expect(deltaCU).toBeLessThan(-4900);
    expect(deltaCU).toBeGreaterThan(-5300);
    await screenshot(page, 'calorimetry-bomb');
  });

  it('takes the calorimeter heat capacity from an electrical calibration run', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await page.getByTestId('nav-calorimetry').click();
    await page.waitForURL(/\/calorimetry$/);
    // Before an equation is typed the limiting-reactant select says so instead of showing an index.
    await expect.poll(() => page.getByTestId('cp-limiting').textContent()).toContain('Type the equation first');

    await page.getByRole('textbox', { name: 'Volume of the solution (mL)' }).fill('100');
    await page.getByText('From calibration runs').click();
    const run = page.getByTestId('cp-calibration-run-0');
    await run.getByRole('textbox', { name: 'Heater current (A)' }).fill('2');
    await run.getByRole('textbox', { name: 'Heater voltage (V)' }).fill('5');
    await run.getByRole('textbox', { name: 'Heating time (s)' }).fill('300');
    await run.getByRole('textbox', { name: 'Temperature change (K)' }).fill('2.5');
    await run.getByRole('textbox', { name: 'Mass of the contents (g)' }).fill('200');
    await page.getByRole('textbox', { name: 'Initial temperature (°C)' }).fill('22.0');
    await page.getByRole('textbox', { name: 'Final temperature (°C)' }).fill('25.0');
    await page.getByRole('textbox', { name: 'Equation as written' }).fill('HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)');
    await expect.poll(() => page.getByTestId('cp-limiting').textContent()).toContain('HCl(aq)');
    await page.getByRole('textbox', { name: 'Amount of the limiting reactant (mol)' }).fill('0.05');
    await page.getByTestId('cp-reduce').click();

    // Common practice, no source: C = I·V·t/ΔT − m·c = 2 A × 5 V × 300 s / 2.5 K − 200 g × 4.184 J/(g K)
    // = 1200 − 836.8 = 363.2 J/K (hand arithmetic).
    const shown = page.getByTestId('cp-calibration-result');
    await expect.poll(() => shown.textContent()).toContain('363.2');
    expect(await shown.textContent()).toContain('one calibration run');
    await page.setViewportSize({ width: 1280, height: 900 });
    await screenshot(page, 'calorimetry-calibration-1280');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'calorimetry-calibration-390');
    await run.getByText('Hot and cold water').click();
    await run.getByRole('textbox', { name: 'Final temperature of the mix (°C)' }).waitFor();
    await run.screenshot({ path: 'tests/e2e/screenshots/calorimetry-calibration-mixing-390.png' });
  });
});
