import { describe, expect, it } from 'vitest';
import { calorimetryRunSummary } from '@shared/reaction-sets/calorimetry-summary';
import type { BombInput, ConstantPressureInput } from '@shared/schemas/calorimetry';
import type { CalorimetryRunValue } from '@shared/schemas/reaction-sets-calorimetry';

/** Only the fields the summary reads; the numbers do not matter here. */
const bombValue = (applied: boolean) =>
  ({
    runKind: 'bomb',
    equation: 'C10H8(cr) + 12 O2(g) -> 10 CO2(g) + 4 H2O(l)',
    deltaH: { value: -5000, uncertainty: null, unit: 'kJ/mol' },
    sources: [],
    result: {
      combustion: { equation: '', deltaNGas: '-2', molarMass: 128.17 },
      energyEquivalent: { basis: 'typed', runs: [], certificate: null },
      standardState: { applied, note: applied ? 'applied as supplied' : 'not applied' },
    },
  }) as unknown as CalorimetryRunValue;

const run = (extra: object) => ({
  mass: { value: 1, unit: 'g' as const },
  temperature: { rise: { value: 2, unit: 'K' as const } },
  ...extra,
});

describe('calorimetryRunSummary', () => {
  it('says, for a bomb run, which corrections were applied to how many runs, Washburn included', () => {
    const inputs = {
      sample: { formula: 'C10H8', phase: 'cr' },
      energyEquivalent: { value: 10170, unit: 'J/K' },
      runs: [run({ fuse: { energy: { value: 50, unit: 'J' } }, buoyancy: { sampleDensity: 1.17 } }), run({})],
    } as BombInput;
    const summary = calorimetryRunSummary(inputs, bombValue(false));
    const by = Object.fromEntries(summary.corrections.map((c) => [c.name, c]));
    expect(by['Fuse wire']).toEqual({ name: 'Fuse wire', applied: true, detail: 'applied to 1 of 2 runs' });
    expect(by['Nitric acid']!.applied).toBe(false);
    expect(by['Buoyancy (weighing in air)']!.applied).toBe(true);
    expect(by['Standard state (Washburn)']).toMatchObject({ applied: false, detail: 'not applied' });
    expect(by['Drift (heat exchange)']!.applied).toBe(false);
    // Δn(gas) printed with the minus sign U+2212.
    expect(summary.method).toContain('Δn = −2');
  });

  it('names the drift method of a constant-pressure series and an assumed specific heat', () => {
    const inputs = {
      solution: { mass: { value: 200, unit: 'g' } },
      temperature: { series: [[0, 25]], unit: 'C', mixingTime: 300, method: 'regnault-pfaundler' },
      reaction: { equation: 'A(aq) -> B(aq)', limiting: { term: 0, amount: { value: 1, unit: 'mol' } } },
    } as unknown as ConstantPressureInput;
    const value = {
      runKind: 'constant-pressure',
      result: { basis: 'at the run’s concentrations' },
    } as unknown as CalorimetryRunValue;
    const summary = calorimetryRunSummary(inputs, value);
    const [drift, heatCapacity, specificHeat] = summary.corrections;
    expect(drift).toMatchObject({ applied: true, detail: expect.stringContaining('Regnault–Pfaundler') });
    expect(heatCapacity).toMatchObject({ applied: false, detail: expect.stringContaining('0 J/K') });
    expect(specificHeat).toMatchObject({ applied: false, detail: expect.stringContaining('4.184') });
  });
});
