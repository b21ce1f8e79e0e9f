import fc from 'fast-check';
import Fraction from 'fraction.js';
import { describe, it } from 'vitest';
import {
  enthalpyChange,
  reactionPropertiesAt,
  type ReactionThermoTerm,
  type SpeciesThermoModel,
} from '@shared/chemistry/thermo';
import { entry, nasaModel, refH } from './nasa-fixture';

// Property-based tests (fast-check): laws that hold whatever the numbers.

const closeTo = (a: number, b: number, scale = 1) =>
  Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b), scale);

describe('enthalpyChange is additive over intervals inside one form', () => {
  const models: [SpeciesThermoModel, number, number][] = [
    [nasaModel('CO2(g)', [[null, 'CO2']]), 200, 6000],
    [nasaModel('ZnSO4(cr)', [['α', 'ZnSO4(a)']]), 300, 1013],
    [
      {
        species: 'N2(g)',
        scale: 'relative',
        forms: [
          {
            form: null,
            label: 'table',
            model: {
              kind: 'cp-table',
              points: [
                [250, 29.1],
                [400, 29.25],
                [700, 30.75],
                [1000, 32.7],
              ],
            },
          },
        ],
      },
      250,
      1000,
    ],
    [
      {
        species: 'N2(g)',
        scale: 'relative',
        forms: [
          {
            form: null,
            label: 'fit',
            model: {
              kind: 'shomate',
              ranges: [100, 500, 2000],
              coefficients: [
                [28.98641, 1.853978, -9.647459, 16.63537, 0.000117, -8.671914, 226.4168, 0],
                [19.50583, 19.88705, -8.598535, 1.369784, 0.527601, -4.935202, 212.39, 0],
              ],
            },
          },
        ],
      },
      100,
      2000,
    ],
  ];
  for (const [model, lo, hi] of models) {
    it(`H(a→b) + H(b→c) = H(a→c) for ${model.forms[0]!.model.kind} ${model.species}`, () => {
      const t = fc.double({ min: lo, max: hi, noNaN: true });
      fc.assert(
        fc.property(t, t, t, (a, b, c) =>
          closeTo(enthalpyChange(model, a, b) + enthalpyChange(model, b, c), enthalpyChange(model, a, c), 100),
        ),
        { numRuns: 300 },
      );
    });
  }
  it('H(a→b) = −H(b→a)', () => {
    const model = models[0]![0];
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 6000, noNaN: true }),
        fc.double({ min: 200, max: 6000, noNaN: true }),
        (a, b) => enthalpyChange(model, a, b) === -enthalpyChange(model, b, a),
      ),
    );
  });
});

describe('reaction laws', () => {
  const LABELS = ['CH4', 'O2', 'CO2', 'H2O', 'N2', 'H2'] as const;
  const models = Object.fromEntries(LABELS.map((l) => [l, nasaModel(`${l}(g)`, [[null, l]])]));
  const term = fc.record({
    label: fc.constantFrom(...LABELS),
    n: fc.integer({ min: -6, max: 6 }).filter((n) => n !== 0),
    d: fc.integer({ min: 1, max: 4 }),
    u: fc.option(fc.double({ min: 0, max: 2, noNaN: true }), { nil: null, freq: 5 }),
  });
  // One term per species (the data of a species is one library entry).
  const reaction = fc.uniqueArray(term, { minLength: 1, maxLength: 6, selector: (t) => t.label }).map((ts) =>
    ts.map((t): ReactionThermoTerm => ({
      coefficient: new Fraction(t.n, t.d),
      species: `${t.label}(g)`,
      phase: 'g',
      formationEnthalpy: { value: refH(entry(t.label), 298.15), standardUncertainty: t.u },
      entropy: null,
      model: models[t.label]!,
    })),
  );
  const temperature = fc.double({ min: 298.15, max: 3000, noNaN: true });

  it('reversing a reaction flips ΔrH°(T) and keeps u', () => {
    fc.assert(
      fc.property(reaction, temperature, (terms, t) => {
        const forward = reactionPropertiesAt(terms, { temperature: t });
        const reverse = reactionPropertiesAt(
          terms.map((x) => ({ ...x, coefficient: x.coefficient.neg() })),
          { temperature: t },
        );
        return (
          closeTo(reverse.enthalpy, -forward.enthalpy) &&
          closeTo(reverse.uncertainty.standardUncertainty, forward.uncertainty.standardUncertainty) &&
          reverse.uncertaintyComplete === forward.uncertaintyComplete
        );
      }),
      { numRuns: 200 },
    );
  });

  it('scaling by a fraction f > 0 scales ΔrH°(T) and u by f', () => {
    const factor = fc
      .tuple(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 9 }))
      .map(([n, d]) => new Fraction(n, d));
    fc.assert(
      fc.property(reaction, temperature, factor, (terms, t, f) => {
        const base = reactionPropertiesAt(terms, { temperature: t });
        const scaled = reactionPropertiesAt(
          terms.map((x) => ({ ...x, coefficient: x.coefficient.mul(f) })),
          { temperature: t },
        );
        const k = f.valueOf();
        return (
          closeTo(scaled.enthalpy, k * base.enthalpy) &&
          closeTo(scaled.uncertainty.standardUncertainty, k * base.uncertainty.standardUncertainty) &&
          scaled.gasAmountChange.equals(base.gasAmountChange.mul(f))
        );
      }),
      { numRuns: 200 },
    );
  });
});
