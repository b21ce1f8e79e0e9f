import { describe, expect, it } from 'vitest';
import {
  absoluteEnthalpy,
  absoluteEntropy,
  crossingsBetween,
  enthalpyChange,
  enthalpyIncrement,
  entropy,
  entropyChange,
  formAt,
  heatCapacity,
  phaseTransitions,
  TemperatureOutOfRangeError,
  validRange,
  type SpeciesThermoModel,
} from '@shared/chemistry/thermo';
import { entry, nasaModel, refH, refRangeH, refS } from './nasa-fixture';

// Reference data: NASA TM-4513 entries (fixture) evaluated by the independent straight-line code
// of nasa-fixture.ts; published figures from memory where named.
const koh = nasaModel('KOH(cr)', [
  ['α', 'KOH(a)'],
  ['β', 'KOH(b)'],
  [null, 'KOH(L)'],
]);

describe('polymorph sequence KOH(a) → KOH(b) → KOH(L) (NASA TM-4513)', () => {
  it('finds the transitions at 516 K and 679 K with the jump of H between the entries', () => {
    const transitions = phaseTransitions(koh);
    expect(transitions.map((t) => t.temperature)).toEqual([516, 679]);
    const ab = refH(entry('KOH(b)'), 516) - refH(entry('KOH(a)'), 516);
    expect(transitions[0]!.enthalpy).toBeCloseTo(ab, 9);
    expect(transitions[0]!.enthalpy).toBeCloseTo(6.45, 1); // JANAF KOH α→β at 516 K, 6.45 kJ/mol (from memory)
    expect(transitions[0]!.entropy).toBeCloseTo((ab * 1000) / 516, 9);
    expect(transitions[0]!.from).toEqual({ index: 0, form: 'α', label: 'KOH(a)' });
    expect(transitions[0]!.to).toEqual({ index: 1, form: 'β', label: 'KOH(b)' });
  });

  it('H(600 K) − H(298.15 K) includes the α→β jump, and the path reports it', () => {
    const expected = refH(entry('KOH(b)'), 600) - refH(entry('KOH(a)'), 298.15);
    expect(enthalpyIncrement(koh, 600)).toBeCloseTo(expected, 9);
    const crossed = crossingsBetween(koh, 298.15, 600);
    expect(crossed).toHaveLength(1);
    expect(crossed[0]).toMatchObject({ kind: 'transition', temperature: 516 });
    expect(crossingsBetween(koh, 298.15, 800).map((c) => c.temperature)).toEqual([516, 679]);
    expect(crossingsBetween(koh, 800, 298.15).map((c) => c.temperature)).toEqual([679, 516]);
    expect(enthalpyChange(koh, 800, 298.15)).toBeCloseTo(
      -(refH(entry('KOH(L)'), 800) - refH(entry('KOH(a)'), 298.15)),
      9,
    );
    // S: the entries' absolute S carry the transition entropy.
    expect(entropyChange(koh, 298.15, 600)).toBeCloseTo(refS(entry('KOH(b)'), 600) - refS(entry('KOH(a)'), 298.15), 9);
  });

  it('at the transition temperature the lower form applies; the boundary counts once the path goes past it', () => {
    expect(formAt(koh, 516).label).toBe('KOH(a)');
    expect(formAt(koh, 516.001).label).toBe('KOH(b)');
    expect(enthalpyIncrement(koh, 516)).toBeCloseTo(refH(entry('KOH(a)'), 516) - refH(entry('KOH(a)'), 298.15), 9);
    expect(crossingsBetween(koh, 298.15, 516)).toEqual([]);
    expect(crossingsBetween(koh, 516, 600)).toHaveLength(1);
    expect(heatCapacity(koh, 516)).toBeCloseTo(heatCapacity(koh, 515.999999), 3);
  });

  it('uses the 300 K start of KOH(a) from 298.15 K', () => {
    expect(validRange(koh)).toEqual({ min: 298.15, max: 5000, statedMin: 300, extendedToReference: true });
  });
});

describe('ZnSO4(a): a transition inside one entry (NASA-9, joint at 540 K)', () => {
  const zn = nasaModel('ZnSO4(cr)', [
    ['α', 'ZnSO4(a)'],
    ['β', 'ZnSO4(b)'],
  ]);
  it('reports the joint with its size and includes it in H(T) − H(298.15 K)', () => {
    const e = entry('ZnSO4(a)');
    const jump = refRangeH(e, 1, 540) - refRangeH(e, 0, 540);
    const crossed = crossingsBetween(zn, 298.15, 800);
    expect(crossed).toHaveLength(1);
    expect(crossed[0]).toMatchObject({ kind: 'joint', temperature: 540, form: { label: 'ZnSO4(a)' } });
    expect(crossed[0]!.kind === 'joint' && crossed[0]!.enthalpyJump).toBeCloseTo(jump, 9);
    expect(enthalpyIncrement(zn, 800)).toBeCloseTo(refH(e, 800) - refH(e, 298.15), 9);
    // 1000 K is a smooth joint (< 0.1 kJ/mol): not reported; 1013 K is the transition to ZnSO4(b).
    expect(crossingsBetween(zn, 298.15, 1100).map((c) => [c.kind, c.temperature])).toEqual([
      ['joint', 540],
      ['transition', 1013],
    ]);
  });
});

describe('Al: liquid from 933.61 K (NASA TM-4513, CODA89)', () => {
  const liquidOnly = nasaModel('Al(l)', [[null, 'AL(L)']]);
  const aluminium = nasaModel('Al(cr)', [
    [null, 'AL(cr)'],
    [null, 'AL(L)'],
  ]);

  it('gives the absolute H of the liquid at 1000 K, inside its range', () => {
    const expected = refH(entry('AL(L)'), 1000);
    expect(absoluteEnthalpy(liquidOnly, 1000)).toBeCloseTo(expected, 9);
    expect(absoluteEnthalpy(liquidOnly, 1000)).toBeCloseTo(30.96, 2);
    expect(absoluteEntropy(liquidOnly, 1000)).toBeCloseTo(refS(entry('AL(L)'), 1000), 9);
    expect(absoluteEntropy(liquidOnly, 1000)).toBeCloseTo(entropy(liquidOnly, 1000), 12);
  });

  it('has no increment from 298.15 K for the liquid alone, but has one through the solid', () => {
    expect(() => enthalpyIncrement(liquidOnly, 1000)).toThrow(TemperatureOutOfRangeError);
    expect(() => absoluteEnthalpy(liquidOnly, 900)).toThrow(TemperatureOutOfRangeError);
    // Al(cr) has H(298.15 K) = 0 (element in its reference state), so both routes agree.
    expect(enthalpyIncrement(aluminium, 1000)).toBeCloseTo(absoluteEnthalpy(liquidOnly, 1000), 6);
  });

  it('melts at 933.61 K with ΔfusH ≈ 10.71 kJ/mol (CODATA 1989, from memory)', () => {
    const [fusion] = phaseTransitions(aluminium);
    expect(fusion!.temperature).toBe(933.61);
    expect(fusion!.enthalpy).toBeCloseTo(10.71, 1);
  });
});

describe('relative scale with stated transitions', () => {
  // Invented test species: constant Cp per form; expected values by hand (definitions of H and S).
  const model: SpeciesThermoModel = {
    species: 'Y(cr)',
    scale: 'relative',
    forms: [
      { form: 'α', label: 'Y-a', model: { kind: 'constant', cp: 50, range: [250, 400] } },
      {
        form: 'β',
        label: 'Y-b',
        model: { kind: 'constant', cp: 60, range: [400, 500] },
        transition: { temperature: 400, enthalpy: 3 },
      },
      {
        form: null,
        label: 'Y-l',
        model: { kind: 'constant', cp: 80, range: [500, 900] },
        transition: { temperature: 500, enthalpy: 12 },
      },
    ],
  };
  it('adds the stated enthalpies and ΔH/T to the integrals', () => {
    const h = (50 * (400 - 298.15) + 60 * 100 + 80 * 200) / 1000 + 3 + 12;
    expect(enthalpyIncrement(model, 700)).toBeCloseTo(h, 12);
    const s =
      50 * Math.log(400 / 298.15) + 3000 / 400 + 60 * Math.log(500 / 400) + 12000 / 500 + 80 * Math.log(700 / 500);
    expect(entropy(model, 700, 30)).toBeCloseTo(30 + s, 12);
    expect(enthalpyIncrement(model, 260)).toBeCloseTo((50 * (260 - 298.15)) / 1000, 12);
    expect(phaseTransitions(model).map((t) => [t.temperature, t.enthalpy])).toEqual([
      [400, 3],
      [500, 12],
    ]);
    expect(crossingsBetween(model, 298.15, 700).map((c) => c.kind)).toEqual(['transition', 'transition']);
  });
});
