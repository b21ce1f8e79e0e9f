import Fraction from 'fraction.js';
import { bench, describe } from 'vitest';
import { prepareThermoModel, reactionPropertiesAt, type ReactionThermoTerm } from '@shared/chemistry/thermo';
import { entry, nasaModel, refH, refS } from '../shared/chemistry/thermo/nasa-fixture';

// Pure-function cost of one temperature correction: 10 species with NASA TM-4513 models (fixture),
// three of them condensed with transitions or joints (KOH α→β→liquid, ZnSO4 joint at 540 K,
// Li2O joint at 1000 K), evaluated at 1000 K with ΔrS°, ΔrG°, K and the uncertainty budget.
// The coefficients are arbitrary (the function does not check balance). Read hz from `npm run bench`.
const SPECIES: [string, string, string, [string | null, string][]][] = [
  ['-1', 'CH4(g)', 'g', [[null, 'CH4']]],
  ['-2', 'O2(g)', 'g', [[null, 'O2']]],
  ['1', 'CO2(g)', 'g', [[null, 'CO2']]],
  ['2', 'H2O(g)', 'g', [[null, 'H2O']]],
  ['-1/2', 'N2(g)', 'g', [[null, 'N2']]],
  ['3/2', 'H2(g)', 'g', [[null, 'H2']]],
  ['-1', 'SO2(g)', 'g', [[null, 'SO2']]],
  [
    '1',
    'KOH(cr)',
    'cr',
    [
      ['α', 'KOH(a)'],
      ['β', 'KOH(b)'],
      [null, 'KOH(L)'],
    ],
  ],
  [
    '-1',
    'ZnSO4(cr)',
    'cr',
    [
      ['α', 'ZnSO4(a)'],
      ['β', 'ZnSO4(b)'],
    ],
  ],
  [
    '1/3',
    'Li2O(cr)',
    'cr',
    [
      [null, 'Li2O(s)'],
      [null, 'Li2O(L)'],
    ],
  ],
];

const terms: ReactionThermoTerm[] = SPECIES.map(([nu, species, phase, forms]) => {
  const first = entry(forms[0]![1]);
  return {
    coefficient: new Fraction(nu),
    species,
    phase,
    formationEnthalpy: { value: refH(first, 298.15), standardUncertainty: 0.5 },
    entropy: refS(first, 298.15),
    model: nasaModel(species, forms),
  };
});
const prepared = terms.map((t) => ({ ...t, model: prepareThermoModel(t.model!) }));

describe('reactionPropertiesAt, 10 species at 1000 K', () => {
  bench('models as stored (validated and prepared on each call)', () => {
    reactionPropertiesAt(terms, { temperature: 1000 });
  });
  bench('prepared models', () => {
    reactionPropertiesAt(prepared, { temperature: 1000 });
  });
});
