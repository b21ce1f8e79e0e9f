import { describe, expect, it } from 'vitest';
import type { LibraryModel } from '@shared/schemas/library';
import { describeCurves, sampleTemperatures, speciesCurves } from '@/lib/thermo-curves';

const source = { id: '00000000-0000-4000-8000-000000000001', key: 'test', citation: 'Test source' };
function model(partial: Pick<LibraryModel, 'scale' | 'forms' | 'range'>): LibraryModel {
  return {
    id: '00000000-0000-4000-8000-000000000002',
    source,
    entryNote: null,
    provenance: 'entered',
    provenanceNote: null,
    selected: true,
    transitions: [],
    sinceRevision: 1,
    ...partial,
  };
}

describe('speciesCurves', () => {
  it('integrates a constant Cp: H(T) − H(298.15 K) = Cp·(T − 298.15 K)', () => {
    const water = model({
      scale: 'relative',
      range: [273.15, 373.15],
      forms: [{ form: null, label: 'liquid', model: { kind: 'constant', cp: 75.3, range: [273.15, 373.15] } }],
    });
    const c = speciesCurves('H2O(l)', water, 11);
    expect(c.enthalpyScale).toBe('increment');
    expect(c.enthalpyNote).toBeNull();
    // 75.3 J/(mol K) × (373.15 − 298.15) K = 5.6475 kJ/mol (hand calculation).
    expect(c.enthalpy.at(-1)).toEqual([373.15, expect.closeTo(5.6475, 9)]);
    expect(c.cp.every(([, cp]) => cp === 75.3)).toBe(true);
  });

  it('adds the stated transition enthalpy and breaks the Cp line at it', () => {
    const twoForms = model({
      scale: 'relative',
      range: [298.15, 500],
      forms: [
        { form: 'α', label: 'a', model: { kind: 'constant', cp: 50, range: [298.15, 400] } },
        {
          form: 'β',
          label: 'b',
          model: { kind: 'constant', cp: 60, range: [400, 500] },
          transition: { temperature: 400, enthalpy: 5 },
        },
      ],
    });
    const c = speciesCurves('X(cr)', twoForms, 5);
    expect(c.marks).toEqual([{ temperature: 400, kind: 'transition', label: 'α → β', enthalpy: 5 }]);
    // Below the mark: 50 × 101.85 / 1000 = 5.0925; just above it 5 kJ/mol more (hand calculation).
    const at = c.enthalpy.findIndex(([t]) => t === 400);
    expect(c.enthalpy[at]![1]).toBeCloseTo(5.0925, 9);
    expect(c.enthalpy[at + 1]![1]).toBeCloseTo(10.0925, 6);
    expect(c.cp).toContainEqual([400, null]);
    // At 500 K: 5.0925 + 5 + 60 × 100 / 1000 = 16.0925 kJ/mol.
    expect(c.enthalpy.at(-1)![1]).toBeCloseTo(16.0925, 9);
    expect(describeCurves(c).enthalpy).toMatch(/phase change α → β at 400 K \(5.00 kJ\/mol\)/);
  });

  it('plots a formation-scale fit that starts above 298.15 K on its own scale, and says so', () => {
    // NASA-7 with Cp/R = 10 and a6 = −1000 K: H = R (10 T − 1000 K) (McBride, Gordon & Reno, NASA TM-4513 form).
    const liquid = model({
      scale: 'formation',
      range: [500, 1000],
      forms: [
        {
          form: null,
          label: 'L',
          model: { kind: 'nasa7', ranges: [500, 1000], coefficients: [[10, 0, 0, 0, 0, -1000, 0]] },
        },
      ],
    });
    const c = speciesCurves('M(l)', liquid, 6);
    expect(c.enthalpyScale).toBe('formation');
    expect(c.enthalpyNote).toMatch(/starts at 500 K, above 298\.15 K/);
    // H(600 K) = 8.314462618 × (6000 − 1000) / 1000 = 41.5723 kJ/mol (R from CODATA 2018, exact).
    expect(c.enthalpy.find(([t]) => t === 600)![1]).toBeCloseTo(41.5723, 4);
    // Cp = 10 R = 83.1446 J/(mol K).
    expect(c.cp[0]![1]).toBeCloseTo(83.1446, 4);
  });
});

describe('sampleTemperatures', () => {
  it('spaces evenly and adds the marks', () => {
    expect(sampleTemperatures(300, 500, 3, [450, 600])).toEqual([300, 400, 450, 500]);
  });
});
