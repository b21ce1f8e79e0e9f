import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import {
  CalorimetryInputError,
  reduceConstantPressureRun,
  type ConstantPressureRun,
  type Measured,
} from '@shared/chemistry/calorimetry';
import { seededNormal } from './support';

const m = (value: number, u: number | null = null): Measured => ({ value, u });

/**
 * Chang, Chemistry (McGraw-Hill), the worked example on constant-pressure calorimetry (from memory;
 * example number not checked): 1.00 × 10² mL of 0.500 M HCl mixed with 1.00 × 10² mL of 0.500 M
 * NaOH, both at 22.50 °C, reach 25.86 °C; density 1.00 g/mL and specific heat 4.184 J/(g °C) as
 * for water, calorimeter heat capacity negligible: ΔH = −56.2 kJ per mol of water formed.
 */
const changNeutralisation: ConstantPressureRun = {
  solution: { kind: 'volume', volume: m(200), density: m(1.0) },
  specificHeat: m(4.184),
  calorimeterHeatCapacity: m(0),
  deltaT: m(25.86 - 22.5),
  limiting: {
    coefficient: new Fraction(1),
    species: 'HCl(aq)',
    quantity: { kind: 'solution', concentration: m(0.5), volume: m(100) },
  },
};

describe('reduceConstantPressureRun', () => {
  it('reproduces the textbook neutralisation: q = 2.81 kJ, ΔH = −56.2 kJ/mol (Chang, from memory)', () => {
    const r = reduceConstantPressureRun(changNeutralisation);
    expect(r.solutionMass.value).toBeCloseTo(200, 10);
    expect(r.q.value).toBeCloseTo(2.81, 2);
    expect(r.extent.value).toBeCloseTo(0.05, 12);
    expect(r.deltaH.value).toBeCloseTo(-56.2, 1);
  });

  it('lands near the strong acid–strong base check value of −55.8 kJ/mol (common practice, no source)', () => {
    // −55.8 kJ per mol of water at 25 °C and infinite dilution is the usual check value; runs
    // at finite concentration give a somewhat more negative figure, as this one does.
    const r = reduceConstantPressureRun(changNeutralisation);
    expect(r.deltaH.value).toBeLessThan(-55.8);
    expect(r.deltaH.value).toBeGreaterThan(-55.8 - 1.5);
  });

  it('gives ΔH per mole of reaction as written: doubling the equation doubles ΔH', () => {
    const doubled = {
      ...changNeutralisation,
      limiting: { ...changNeutralisation.limiting, coefficient: new Fraction(2) },
    };
    expect(reduceConstantPressureRun(doubled).deltaH.value).toBeCloseTo(
      2 * reduceConstantPressureRun(changNeutralisation).deltaH.value,
      10,
    );
  });

  it('gives ΔH > 0 for a temperature fall (an endothermic dissolution)', () => {
    const cold = { ...changNeutralisation, deltaT: m(-1.2) };
    expect(reduceConstantPressureRun(cold).deltaH.value).toBeGreaterThan(0);
    expect(reduceConstantPressureRun(cold).q.value).toBeLessThan(0);
  });

  it('reads the limiting amount as mol, or as a mass with its molar mass', () => {
    const byAmount = reduceConstantPressureRun({
      ...changNeutralisation,
      limiting: { ...changNeutralisation.limiting, quantity: { kind: 'amount', amount: m(0.05) } },
    });
    // 0.05 mol of HCl is 1.8230 g at M = 36.46 g/mol (CIAAW 2021 weights: 1.008 + 35.45).
    const byMass = reduceConstantPressureRun({
      ...changNeutralisation,
      limiting: { ...changNeutralisation.limiting, quantity: { kind: 'mass', mass: m(1.823), molarMass: m(36.458) } },
    });
    expect(byAmount.deltaH.value).toBeCloseTo(-56.23, 2);
    expect(byMass.deltaH.value).toBeCloseTo(byAmount.deltaH.value, 1);
  });

  it('propagates the stated uncertainties as a seeded Monte Carlo run of the same inputs does', () => {
    const run: ConstantPressureRun = {
      solution: { kind: 'volume', volume: m(100.0, 0.3), density: m(1.02, 0.01) },
      specificHeat: m(4.0, 0.05),
      calorimeterHeatCapacity: m(25, 8),
      deltaT: m(6.4, 0.05),
      limiting: {
        coefficient: new Fraction(1),
        species: 'HCl(aq)',
        quantity: { kind: 'solution', concentration: m(1.0, 0.005), volume: m(50.0, 0.05) },
      },
    };
    const r = reduceConstantPressureRun(run);
    // The model written out again here, not taken from the code under test.
    const normal = seededNormal(20240611);
    const draws = 200_000;
    let sum = 0;
    let sumSq = 0;
    for (let i = 0; i < draws; i++) {
      const V = 100 + 0.3 * normal();
      const rho = 1.02 + 0.01 * normal();
      const c = 4.0 + 0.05 * normal();
      const C = 25 + 8 * normal();
      const dT = 6.4 + 0.05 * normal();
      const conc = 1.0 + 0.005 * normal();
      const vol = 50 + 0.05 * normal();
      const dH = -((V * rho * c + C) * dT) / 1000 / ((conc * vol) / 1000);
      sum += dH;
      sumSq += dH * dH;
    }
    const mean = sum / draws;
    const sd = Math.sqrt((sumSq - draws * mean * mean) / (draws - 1));
    expect(r.deltaH.value).toBeCloseTo(mean, 1);
    expect(r.deltaH.u / sd).toBeGreaterThan(0.98);
    expect(r.deltaH.u / sd).toBeLessThan(1.02);
    // The budget accounts for the whole variance.
    const shares = r.deltaH.contributions.reduce((a, c) => a + (c.varianceShare ?? 0), 0);
    expect(shares).toBeCloseTo(1, 10);
    expect(r.deltaH.missing).toEqual([]);
  });

  it('says which inputs have no stated uncertainty', () => {
    const r = reduceConstantPressureRun(changNeutralisation);
    expect(r.deltaH.missing).toContain('deltaT');
    expect(r.deltaH.missing).toContain('solution.volume');
  });

  it('names the field at fault', () => {
    const bad = { ...changNeutralisation, specificHeat: m(-1) };
    expect(() => reduceConstantPressureRun(bad)).toThrow(CalorimetryInputError);
    expect(() => reduceConstantPressureRun(bad)).toThrow(expect.objectContaining({ path: ['specificHeat', 'value'] }));
    expect(() => reduceConstantPressureRun({ ...changNeutralisation, deltaT: m(0) })).toThrow(
      expect.objectContaining({ code: 'unprocessable' }),
    );
  });
});
