import { describe, expect, it } from 'vitest';
import {
  absoluteEnthalpy,
  absoluteEntropy,
  discontinuousJoints,
  enthalpyIncrement,
  heatCapacity,
  TemperatureOutOfRangeError,
  validRange,
} from '@shared/chemistry/thermo';
import { entry, nasaEntries, nasaModel, refCp, refH, refRangeCp, refRangeH, refRangeS, refS } from './nasa-fixture';

// Reference: NASA TM-4513 polynomials (McBride, Gordon & Reno, 1993), fixture lines copied from
// shared/data/nasa-tm4513; expected values by the independent straight-line evaluation in
// nasa-fixture.ts.
const GASES = [
  ['CH4(g)', 'CH4'],
  ['CO2(g)', 'CO2'],
  ['H2O(g)', 'H2O'],
  ['N2(g)', 'N2'],
  ['O2(g)', 'O2'],
] as const;

describe('NASA-7 evaluation', () => {
  for (const [key, label] of GASES) {
    const model = nasaModel(key, [[null, label]]);
    const e = entry(label);
    it(`matches the straight-line equations for ${key} from 200 K to 6000 K`, () => {
      for (const t of [200, 250, 298.15, 300, 450, 700, 999.9, 1000, 1000.1, 1500, 2500, 4000, 6000]) {
        expect(heatCapacity(model, t)).toBeCloseTo(refCp(e, t), 9);
        expect(absoluteEnthalpy(model, t)).toBeCloseTo(refH(e, t), 9);
        expect(absoluteEntropy(model, t)).toBeCloseTo(refS(e, t), 9);
        expect(enthalpyIncrement(model, t)).toBeCloseTo(refH(e, t) - refH(e, 298.15), 9);
      }
    });
  }

  it('matches the straight-line equations for H2O(l) over its range 273.15–600 K', () => {
    const model = nasaModel('H2O(l)', [[null, 'H2O(L)']]);
    const e = entry('H2O(L)');
    for (const t of [273.15, 298.15, 350, 373.15, 500, 600]) {
      expect(heatCapacity(model, t)).toBeCloseTo(refCp(e, t), 9);
      expect(enthalpyIncrement(model, t)).toBeCloseTo(refH(e, t) - refH(e, 298.15), 9);
      expect(absoluteEntropy(model, t)).toBeCloseTo(refS(e, t), 9);
    }
    expect(() => heatCapacity(model, 601)).toThrow(TemperatureOutOfRangeError);
  });

  it('gives the CODATA 1989 key values at 298.15 K that the report adopted', () => {
    // CODATA Key Values (Cox, Wagman & Medvedev, 1989), from memory: ΔfH°/kJ mol⁻¹ and S°/J K⁻¹ mol⁻¹.
    // Not independent of the NASA file (it adopted them), so only a check that we read it right.
    const codata = {
      'CO2(g)': [-393.51, 213.785],
      'H2O(g)': [-241.826, 188.835],
      'N2(g)': [0, 191.609],
      'O2(g)': [0, 205.152],
    } as const;
    for (const [key, label] of GASES) {
      if (!(key in codata)) continue;
      const [h, s] = codata[key as keyof typeof codata];
      const model = nasaModel(key, [[null, label]]);
      expect(absoluteEnthalpy(model, 298.15)).toBeCloseTo(h, 1);
      expect(absoluteEntropy(model, 298.15)).toBeCloseTo(s, 1);
    }
    const water = nasaModel('H2O(l)', [[null, 'H2O(L)']]);
    expect(absoluteEnthalpy(water, 298.15)).toBeCloseTo(-285.83, 1); // CODATA 1989, from memory
    expect(absoluteEntropy(water, 298.15)).toBeCloseTo(69.95, 1); // CODATA 1989, from memory
  });
});

describe('NASA-7 against JANAF tables (Chase, NIST-JANAF Thermochemical Tables, 4th ed., 1998; from memory)', () => {
  // H°(T) − H°(298.15 K) in kJ/mol as tabulated by JANAF, typed from memory.
  const janaf: Record<string, [string, Record<number, number>]> = {
    'N2(g)': ['N2', { 500: 5.911, 1000: 21.463 }],
    'CO2(g)': ['CO2', { 500: 8.305, 1000: 33.397 }],
    'H2O(g)': ['H2O', { 500: 6.925, 1000: 26.0 }],
    'O2(g)': ['O2', { 500: 6.084, 1000: 22.707 }],
  };
  for (const [key, [label, values]] of Object.entries(janaf)) {
    it(`agrees with JANAF H − H298 for ${key} at 500 K and 1000 K within 0.01 kJ/mol`, () => {
      const model = nasaModel(key, [[null, label]]);
      for (const [t, h] of Object.entries(values))
        expect(Math.abs(enthalpyIncrement(model, Number(t)) - h)).toBeLessThan(0.01);
    });
  }
});

describe('joints of multi-range polynomials', () => {
  // Every joint of the fixture species; SOURCE.md (shared/data/nasa-tm4513) states that all joints
  // of the file agree within 0.1 kJ/mol except ZnSO4(a) at 540 K and Li2O(s) at 1000 K.
  const multiRange = Object.values(nasaEntries).filter((e) => e.ranges.length > 2);

  it('covers several species with joints', () => {
    expect(multiRange.map((e) => e.name)).toEqual(
      expect.arrayContaining(['CH4', 'CO2', 'H2O', 'N2', 'O2', 'SO2', 'Li2O(s)', 'ZnSO4(a)']),
    );
  });

  for (const e of multiRange) {
    it(`${e.name}: H, Cp and S of the two ranges meet at each joint (independent evaluation) and the core reports the same jumps`, () => {
      const model = nasaModel(e.name, [[null, e.name]]);
      const reported = discontinuousJoints(model);
      for (let i = 1; i < e.ranges.length - 1; i++) {
        const t = e.ranges[i]!;
        const dH = refRangeH(e, i, t) - refRangeH(e, i - 1, t);
        const dCp = refRangeCp(e, i, t) - refRangeCp(e, i - 1, t);
        const dS = refRangeS(e, i, t) - refRangeS(e, i - 1, t);
        const known = (e.name === 'ZnSO4(a)' && t === 540) || (e.name === 'Li2O(s)' && t === 1000);
        if (known) {
          const joint = reported.find((j) => j.temperature === t);
          expect(joint?.enthalpyJump).toBeCloseTo(dH, 9);
          expect(joint?.entropyJump).toBeCloseTo(dS, 9);
        } else {
          expect(Math.abs(dH)).toBeLessThan(0.1);
          expect(Math.abs(dCp)).toBeLessThan(1); // J/(mol K): smooth joins, common practice, no source
          expect(Math.abs(dS)).toBeLessThan(0.1);
          expect(reported.find((j) => j.temperature === t)).toBeUndefined();
        }
      }
    });
  }

  it('reports ZnSO4(a) at 540 K (about 5 kJ/mol) and Li2O(s) at 1000 K (about 0.3 kJ/mol) as discontinuous', () => {
    const zn = discontinuousJoints(nasaModel('ZnSO4(cr)', [['α', 'ZnSO4(a)']]));
    expect(zn).toHaveLength(1);
    expect(zn[0]!.temperature).toBe(540);
    expect(zn[0]!.enthalpyJump).toBeGreaterThan(4);
    expect(zn[0]!.enthalpyJump).toBeLessThan(6);
    const li = discontinuousJoints(nasaModel('Li2O(cr)', [[null, 'Li2O(s)']]));
    expect(li).toHaveLength(1);
    expect(li[0]!.temperature).toBe(1000);
    expect(li[0]!.enthalpyJump).toBeCloseTo(0.335, 2);
  });
});

describe('valid range', () => {
  it('uses a fit starting at 300 K from 298.15 K and says so (SO2, NASA TM-4513)', () => {
    const so2 = nasaModel('SO2(g)', [[null, 'SO2']]);
    expect(validRange(so2)).toEqual({ min: 298.15, max: 5000, statedMin: 300, extendedToReference: true });
    expect(absoluteEnthalpy(so2, 298.15)).toBeCloseTo(refH(entry('SO2'), 298.15), 9);
    expect(absoluteEnthalpy(so2, 298.15)).toBeCloseTo(-296.81, 1); // CODATA 1989 ΔfH°(SO2, g), from memory
    expect(() => heatCapacity(so2, 298.1)).toThrow(TemperatureOutOfRangeError);
  });

  it('does not extend any other start: a fit from 301 K or 273.15 K keeps its start', () => {
    const e = entry('SO2');
    const shifted = {
      species: 'X(g)',
      scale: 'formation' as const,
      forms: [
        {
          form: null,
          label: 'X',
          model: { kind: 'nasa7' as const, ranges: [301, 1000, 5000], coefficients: e.coefficients },
        },
      ],
    };
    expect(validRange(shifted).min).toBe(301);
    expect(() => enthalpyIncrement(shifted, 500)).toThrow(TemperatureOutOfRangeError);
    expect(validRange(nasaModel('H2O(l)', [[null, 'H2O(L)']])).min).toBe(273.15);
  });

  it('throws a typed error carrying the species label and the range', () => {
    const n2 = nasaModel('N2(g)', [[null, 'N2']]);
    try {
      heatCapacity(n2, 6500);
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(TemperatureOutOfRangeError);
      const e = err as TemperatureOutOfRangeError;
      expect(e.code).toBe('unprocessable');
      expect(e.entry).toEqual({
        species: 'N2(g)',
        temperature: 6500,
        range: { min: 200, max: 6000, statedMin: 200, extendedToReference: false },
      });
      expect(e.message).toContain('N2(g)');
      expect(e.message).toContain('200 K to 6000 K');
    }
  });

  it('rejects temperatures that are not finite or not above 0 K', () => {
    const n2 = nasaModel('N2(g)', [[null, 'N2']]);
    for (const t of [0, -5, Number.NaN, Number.POSITIVE_INFINITY])
      expect(() => heatCapacity(n2, t)).toThrow(/finite temperature above 0 K/);
  });
});
