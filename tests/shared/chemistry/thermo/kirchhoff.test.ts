import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import {
  GAS_CONSTANT,
  reactionPropertiesAt,
  ReactionThermoDataError,
  ThermoInputError,
  ThermoModelError,
  type ReactionThermoTerm,
  type SpeciesThermoModel,
} from '@shared/chemistry/thermo';
import { entry, nasaModel, refCp, refH, refS } from './nasa-fixture';

const R = 8.314462618; // J/(mol K), CODATA 2018 exact value (from memory)

const MODELS: Record<string, SpeciesThermoModel> = {
  'CH4(g)': nasaModel('CH4(g)', [[null, 'CH4']]),
  'O2(g)': nasaModel('O2(g)', [[null, 'O2']]),
  'CO2(g)': nasaModel('CO2(g)', [[null, 'CO2']]),
  'H2O(g)': nasaModel('H2O(g)', [[null, 'H2O']]),
  'H2O(l)': nasaModel('H2O(l)', [[null, 'H2O(L)']]),
  'H2(g)': nasaModel('H2(g)', [[null, 'H2']]),
  'N2(g)': nasaModel('N2(g)', [[null, 'N2']]),
};
const LABEL: Record<string, string> = {
  'CH4(g)': 'CH4',
  'O2(g)': 'O2',
  'CO2(g)': 'CO2',
  'H2O(g)': 'H2O',
  'H2O(l)': 'H2O(L)',
  'H2(g)': 'H2',
  'N2(g)': 'N2',
};

/** A term whose ΔfH° and S° at 298.15 K are the NASA polynomial values (independent evaluation). */
function nasaTerm(coefficient: string, species: keyof typeof MODELS, u: number | null = null): ReactionThermoTerm {
  const e = entry(LABEL[species]!);
  return {
    coefficient: new Fraction(coefficient),
    species,
    phase: species.endsWith('(g)') ? 'g' : 'l',
    formationEnthalpy: { value: refH(e, 298.15), standardUncertainty: u },
    entropy: refS(e, 298.15),
    model: MODELS[species]!,
  };
}

const methaneToSteam = () => [
  nasaTerm('-1', 'CH4(g)'),
  nasaTerm('-2', 'O2(g)'),
  nasaTerm('1', 'CO2(g)'),
  nasaTerm('2', 'H2O(g)'),
];

// Independent straight-line Kirchhoff sum on the fixture (NASA TM-4513 equations).
function straightLine(t: number, steps: [number, string][]): number {
  return steps.reduce((sum, [nu, label]) => sum + nu * refH(entry(label), t), 0);
}
const METHANE: [number, string][] = [
  [-1, 'CH4'],
  [-2, 'O2'],
  [1, 'CO2'],
  [2, 'H2O'],
];

describe('reactionPropertiesAt: CH4 + 2 O2 → CO2 + 2 H2O(g)', () => {
  it('ΔrH°(298.15 K) = −802.56 kJ/mol from the NASA polynomials (domain notes §3, [calc]; re-derived here)', () => {
    const r = reactionPropertiesAt(methaneToSteam(), { temperature: 298.15 });
    expect(r.enthalpy).toBeCloseTo(straightLine(298.15, METHANE), 9);
    expect(r.enthalpy).toBeCloseTo(-802.56, 2);
    expect(r.referenceEnthalpy).toBeCloseTo(r.enthalpy, 12);
    expect(r.estimate).toBe(false);
  });

  it('ΔrH°(1000 K) = −801.22 kJ/mol by Kirchhoff with the NASA polynomials', () => {
    const r = reactionPropertiesAt(methaneToSteam(), { temperature: 1000 });
    expect(r.enthalpy).toBeCloseTo(straightLine(1000, METHANE), 9);
    expect(r.enthalpy).toBeCloseTo(-801.22, 2);
    expect(r.method).toBe('integrated');
    expect(r.species.every((s) => s.enthalpyBasis === 'value+increment' && s.crossings!.length === 0)).toBe(true);
  });

  it('the constant-Cp estimate, only on request and flagged, gives −795.64 kJ/mol', () => {
    const r = reactionPropertiesAt(methaneToSteam(), { temperature: 1000, method: 'constant-cp' });
    const dCp = METHANE.reduce((sum, [nu, label]) => sum + nu * refCp(entry(label), 298.15), 0);
    expect(r.enthalpy).toBeCloseTo(straightLine(298.15, METHANE) + (dCp * (1000 - 298.15)) / 1000, 9);
    expect(r.enthalpy).toBeCloseTo(-795.64, 2);
    expect(r.estimate).toBe(true);
    expect(r.method).toBe('constant-cp');
    expect(r.notes[0]).toMatch(/Constant-Cp estimate/);
    expect(r.species.find((s) => s.species === 'CO2(g)')!.heatCapacity298).toBeCloseTo(refCp(entry('CO2'), 298.15), 9);
  });

  it('ΔrU° = ΔrH° − Δn(gas)RT (Δn = 0 to steam; −2 to liquid water)', () => {
    const steam = reactionPropertiesAt(methaneToSteam(), { temperature: 298.15 });
    expect(steam.gasAmountChange.equals(0)).toBe(true);
    expect(steam.internalEnergy).toBeCloseTo(steam.enthalpy, 12);
    const liquid = reactionPropertiesAt(
      [nasaTerm('-1', 'CH4(g)'), nasaTerm('-2', 'O2(g)'), nasaTerm('1', 'CO2(g)'), nasaTerm('2', 'H2O(l)')],
      { temperature: 298.15 },
    );
    expect(liquid.gasAmountChange.equals(-2)).toBe(true);
    // RT = 2.479 kJ/mol at 298.15 K (domain notes §4, [calc]).
    expect(liquid.internalEnergy - liquid.enthalpy).toBeCloseTo(2 * 2.479, 2);
    // ΔcH°(CH4) to liquid water ≈ −890.6 kJ/mol (NASA values; NBS 1982 tables give −890.3 with ΔfH(CH4) = −74.81, from memory).
    expect(liquid.enthalpy).toBeCloseTo(-890.6, 0);
  });

  it('uses R = 8.314462618 J/(mol K)', () => {
    expect(GAS_CONSTANT).toBe(R);
  });
});

describe('reactionPropertiesAt: ΔrS°, ΔrG°, K', () => {
  const formation = () => [nasaTerm('-1', 'H2(g)'), nasaTerm('-1/2', 'O2(g)'), nasaTerm('1', 'H2O(g)')];
  it('ΔfG°(H2O, g, 1000 K) ≈ −192.59 kJ/mol and log Kf ≈ 10.06 (JANAF, Chase 1998; from memory)', () => {
    const r = reactionPropertiesAt(formation(), { temperature: 1000 });
    expect(Math.abs(r.gibbsEnergy! - -192.59)).toBeLessThan(0.05);
    expect(Math.abs(r.log10K! - 10.06)).toBeLessThan(0.01);
    expect(r.equilibriumConstant).toBeCloseTo(10 ** r.log10K!, -6);
    expect(r.lnK).toBeCloseTo((-r.gibbsEnergy! * 1000) / (R * 1000), 9);
  });
  it('ΔfG°(H2O, g, 298.15 K) ≈ −228.57 kJ/mol (NBS 1982 / CODATA 1989, from memory)', () => {
    const r = reactionPropertiesAt(formation(), { temperature: 298.15 });
    expect(Math.abs(r.gibbsEnergy! - -228.57)).toBeLessThan(0.02);
    expect(r.entropy).toBeCloseTo(-44.43, 1); // ΔfS° from CODATA S° values 188.835 − 130.680 − 205.152/2 (from memory)
  });
  it('leaves ΔrS°, ΔrG° and K null and names the species when an S° is missing', () => {
    const terms = formation();
    terms[0] = { ...terms[0]!, entropy: null, model: null };
    const r = reactionPropertiesAt(terms, { temperature: 298.15 });
    expect(r.entropy).toBeNull();
    expect(r.gibbsEnergy).toBeNull();
    expect(r.equilibriumConstant).toBeNull();
    expect(r.entropyMissing).toEqual(['H2(g)']);
  });
});

describe('reactionPropertiesAt: uncertainty', () => {
  // CODATA 1989 (CO2, H2O) and JANAF (CH4) values with uncertainties, from memory; expected u by hand.
  const terms = (): ReactionThermoTerm[] => [
    { ...nasaTerm('-1', 'CH4(g)'), formationEnthalpy: { value: -74.873, standardUncertainty: 0.34 } },
    { ...nasaTerm('-2', 'O2(g)'), formationEnthalpy: { value: 0, standardUncertainty: 0 } },
    { ...nasaTerm('1', 'CO2(g)'), formationEnthalpy: { value: -393.51, standardUncertainty: 0.13 } },
    { ...nasaTerm('2', 'H2O(g)'), formationEnthalpy: { value: -241.826, standardUncertainty: 0.04 } },
  ];
  it('is the root-sum-square of ν·u with each species’ share of the variance', () => {
    const r = reactionPropertiesAt(terms(), { temperature: 298.15 });
    expect(r.enthalpy).toBeCloseTo(-393.51 - 2 * 241.826 + 74.873, 9);
    const u = Math.sqrt(0.34 ** 2 + 0.13 ** 2 + (2 * 0.04) ** 2);
    expect(r.uncertainty.standardUncertainty).toBeCloseTo(u, 12);
    expect(r.uncertaintyComplete).toBe(true);
    expect(r.uncertainty.method).toMatch(/independent/);
    const ch4 = r.uncertainty.contributions.find((c) => c.species === 'CH4(g)')!;
    expect(ch4.contribution).toBeCloseTo(-0.34, 12);
    expect(ch4.varianceShare).toBeCloseTo(0.34 ** 2 / u ** 2, 12);
    expect(r.uncertainty.contributions.reduce((s, c) => s + c.varianceShare, 0)).toBeCloseTo(1, 12);
  });
  it('keeps the same u at 1000 K (models carry no stated uncertainty)', () => {
    expect(reactionPropertiesAt(terms(), { temperature: 1000 }).uncertainty.standardUncertainty).toBeCloseTo(
      Math.sqrt(0.34 ** 2 + 0.13 ** 2 + 0.08 ** 2),
      12,
    );
  });
  it('never counts a missing uncertainty as zero: the result is incomplete and names the species', () => {
    const t = terms();
    t[0] = { ...t[0]!, formationEnthalpy: { value: -74.873, standardUncertainty: null } };
    const r = reactionPropertiesAt(t, { temperature: 298.15 });
    expect(r.uncertaintyComplete).toBe(false);
    expect(r.uncertaintyMissing).toEqual(['CH4(g)']);
    expect(r.uncertainty.contributions.map((c) => c.species)).not.toContain('CH4(g)');
    expect(r.notes.join(' ')).toMatch(/CH4\(g\)/);
  });
});

describe('reactionPropertiesAt: species without a 298.15 K value', () => {
  // Al(l) → Al(g) at 1000 K: Al(l) enters with H°(1000 K) of its formation-scale model (NASA AL(L)).
  it('uses H_abs(T) of a formation-scale model and says the uncertainty is incomplete', () => {
    const terms: ReactionThermoTerm[] = [
      {
        coefficient: new Fraction(-1),
        species: 'Al(l)',
        phase: 'l',
        formationEnthalpy: null,
        entropy: null,
        model: nasaModel('Al(l)', [[null, 'AL(L)']]),
      },
      {
        coefficient: new Fraction(1),
        species: 'Al(g)',
        phase: 'g',
        formationEnthalpy: { value: refH(entry('AL'), 298.15), standardUncertainty: 2 },
        entropy: refS(entry('AL'), 298.15),
        model: nasaModel('Al(g)', [[null, 'AL']]),
      },
    ];
    const r = reactionPropertiesAt(terms, { temperature: 1000 });
    expect(r.enthalpy).toBeCloseTo(refH(entry('AL'), 1000) - refH(entry('AL(L)'), 1000), 9);
    expect(r.species[0]!.enthalpyBasis).toBe('model-absolute');
    expect(r.species[0]!.entropyBasis).toBe('model-absolute');
    expect(r.referenceEnthalpy).toBeNull();
    expect(r.uncertaintyComplete).toBe(false);
    expect(r.uncertaintyMissing).toEqual(['Al(l)']);
    expect(r.entropy).toBeCloseTo(refS(entry('AL'), 1000) - refS(entry('AL(L)'), 1000), 9);
  });
});

describe('reactionPropertiesAt: merging, errors and input checks', () => {
  it('merges terms of the same species before summing', () => {
    const split = [
      nasaTerm('-1', 'CH4(g)'),
      nasaTerm('-1', 'O2(g)'),
      nasaTerm('-3/2', 'O2(g)'),
      nasaTerm('1', 'CO2(g)'),
      nasaTerm('2', 'H2O(g)'),
      nasaTerm('1/2', 'O2(g)'),
    ];
    const r = reactionPropertiesAt(split, { temperature: 1000 });
    expect(r.enthalpy).toBeCloseTo(straightLine(1000, METHANE), 9);
    expect(r.species.map((s) => [s.species, s.coefficient.toFraction()])).toEqual([
      ['CH4(g)', '-1'],
      ['O2(g)', '-2'],
      ['CO2(g)', '1'],
      ['H2O(g)', '2'],
    ]);
    const cancelling = reactionPropertiesAt([...methaneToSteam(), nasaTerm('-1', 'N2(g)'), nasaTerm('1', 'N2(g)')], {
      temperature: 1000,
    });
    expect(cancelling.cancelled).toEqual(['N2(g)']);
    expect(cancelling.enthalpy).toBeCloseTo(straightLine(1000, METHANE), 9);
  });

  it('names every species whose model does not cover T, with its range, and those without data', () => {
    const terms = [
      nasaTerm('-1', 'CH4(g)'),
      nasaTerm('-2', 'O2(g)'),
      nasaTerm('1', 'CO2(g)'),
      nasaTerm('2', 'H2O(l)'),
      {
        coefficient: new Fraction(1),
        species: 'X(cr)',
        phase: 'cr',
        formationEnthalpy: { value: -10, standardUncertainty: null },
        entropy: null,
        model: null,
      },
    ];
    try {
      reactionPropertiesAt(terms, { temperature: 700 });
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(ReactionThermoDataError);
      const e = err as ReactionThermoDataError;
      expect(e.code).toBe('unprocessable');
      expect(e.problems).toEqual([
        {
          kind: 'out-of-range',
          species: 'H2O(l)',
          phase: 'l',
          temperature: 700,
          range: { min: 273.15, max: 600, statedMin: 273.15, extendedToReference: false },
        },
        { kind: 'no-model', species: 'X(cr)', phase: 'cr' },
      ]);
      expect(e.message).toContain('H2O(l) has a heat-capacity model only from 273.15 K to 600 K');
      expect(e.message).toContain('X(cr) has no heat-capacity model');
    }
  });

  it('needs no model at 298.15 K', () => {
    const terms = methaneToSteam().map((t) => ({ ...t, model: null }));
    expect(reactionPropertiesAt(terms, { temperature: 298.15 }).enthalpy).toBeCloseTo(-802.56, 2);
  });

  it('rejects bad input with the field named', () => {
    expect(() => reactionPropertiesAt(methaneToSteam(), { temperature: -3 })).toThrow(ThermoInputError);
    expect(() => reactionPropertiesAt([], { temperature: 300 })).toThrow(/at least one term/);
    const zero = [{ ...nasaTerm('-1', 'CH4(g)'), coefficient: new Fraction(0) }];
    try {
      reactionPropertiesAt(zero, { temperature: 300 });
      expect.unreachable();
    } catch (err) {
      expect((err as ThermoInputError).path).toEqual(['terms', 0, 'coefficient']);
    }
    const conflicting = [
      nasaTerm('-1', 'CH4(g)'),
      { ...nasaTerm('1', 'CH4(g)'), formationEnthalpy: { value: -70, standardUncertainty: null } },
    ];
    expect(() => reactionPropertiesAt(conflicting, { temperature: 300 })).toThrow(/different data/);
    const badModel = [
      {
        ...nasaTerm('-1', 'CH4(g)'),
        model: {
          species: 'CH4(g)',
          scale: 'formation' as const,
          forms: [
            {
              form: null,
              label: 'x',
              model: { kind: 'nasa7' as const, ranges: [200, 1000], coefficients: [[1, 2, 3]] },
            },
          ],
        },
      },
    ];
    try {
      reactionPropertiesAt(badModel, { temperature: 300 });
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(ThermoModelError);
      expect((err as ThermoModelError).issues[0]!.path).toEqual([
        'terms',
        0,
        'model',
        'forms',
        0,
        'model',
        'coefficients',
        0,
      ]);
    }
  });
});
