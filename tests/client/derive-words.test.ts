import { describe, expect, it } from 'vitest';
import type { DeriveResult, DeriveRoute } from '@shared/schemas/derive';
import {
  agreementVerdict,
  basisSentence,
  formedSpecies,
  givenReactionWords,
  multiplierParts,
  multiplierText,
  otherWarnings,
  pText,
  routeBadge,
  searchStoppedSentence,
} from '@/lib/derive-words';

const kj = (value: number, uncertainty: number | null = null) => ({ value, uncertainty, unit: 'kJ/mol' as const });

function route(over: Partial<DeriveRoute> = {}): DeriveRoute {
  return {
    steps: [],
    deltaH: kj(-110.53, 0.17),
    agrees: true,
    uncertaintyComplete: true,
    missing: [],
    normalizedResidual: null,
    ...over,
  };
}

function result(over: Partial<DeriveResult> = {}): DeriveResult {
  return {
    status: 'derived',
    target: 'C(cr, graphite) + 1/2 O2(g) -> CO(g)',
    deltaH: kj(-110.53, 0.17),
    basis: 'single-route',
    uncertaintyComplete: true,
    uncertaintyMissing: [],
    routes: [route()],
    consistent: true,
    agreement: null,
    search: { examined: 12, found: 1, stoppedBy: null },
    libraryRevision: 1,
    warnings: [],
    ...over,
  };
}

const agreeing = () =>
  result({
    basis: 'combined',
    routes: [route({ normalizedResidual: 0.4 }), route({ normalizedResidual: -0.9 })],
    agreement: { chiSquare: 0.97, degreesOfFreedom: 1, pValue: 0.3247 },
  });

describe('basisSentence', () => {
  it('says how the headline value was obtained', () => {
    expect(basisSentence(result())).toBe('The only route found.');
    expect(basisSentence(agreeing())).toMatch(/^Combined by generalised least squares from the 2 routes/);
    const disagreeing = result({
      basis: 'best-route',
      consistent: false,
      routes: [route(), route()],
      agreement: { chiSquare: 9, degreesOfFreedom: 1, pValue: 0.0027 },
    });
    expect(basisSentence(disagreeing)).toMatch(/do not agree within their uncertainties, so they are not combined/);
    const untested = result({ basis: 'best-route', routes: [route(), route({ uncertaintyComplete: false })] });
    expect(basisSentence(untested)).toMatch(/fewer than two routes state a full uncertainty/);
  });
});

describe('agreementVerdict', () => {
  it('has nothing to test with no route or one route', () => {
    expect(agreementVerdict(result({ status: 'unreachable', routes: [], deltaH: null })).tone).toBe('none');
    expect(agreementVerdict(result()).headline).toBe('One route only: there is nothing to compare it with.');
  });

  it('reports agreement with χ², degrees of freedom and p', () => {
    const v = agreementVerdict(agreeing());
    expect(v.tone).toBe('agree');
    expect(v.headline).toBe('The 2 routes compared agree within their uncertainties.');
    expect(v.statistics).toBe(
      'χ² = 0.970 on 1 degree of freedom, p = 0.32 (the routes are taken to disagree when p < 0.05).',
    );
    expect(v.flagged).toEqual([]);
  });

  it('flags each route beyond 2σ and counts routes left out for want of an uncertainty', () => {
    const v = agreementVerdict(
      result({
        basis: 'best-route',
        consistent: false,
        routes: [
          route({ normalizedResidual: 0.5 }),
          route({ normalizedResidual: -3.14, agrees: false }),
          route({ uncertaintyComplete: false, missing: ['given reaction 2'] }),
        ],
        agreement: { chiSquare: 10.2, degreesOfFreedom: 1, pValue: 0.00001 },
      }),
    );
    expect(v.tone).toBe('disagree');
    expect(v.headline).toBe(
      'The 2 routes compared do not agree within their uncertainties (1 route without a full uncertainty left out).',
    );
    expect(v.statistics).toContain('p = < 0.0001');
    expect(v.flagged).toEqual(['Route 2 is flagged: it lies 3.1σ from the combined value (more than 2σ).']);
  });

  it('explains when the routes share every input', () => {
    const v = agreementVerdict({ ...agreeing(), agreement: { chiSquare: 0, degreesOfFreedom: 0, pValue: null } });
    expect(v.statistics).toMatch(/rest on the same inputs/);
  });
});

describe('routeBadge', () => {
  it('marks the only route, a route not compared, and agreeing or flagged routes', () => {
    expect(routeBadge(result(), route()).kind).toBe('only');
    const r = agreeing();
    expect(routeBadge(r, r.routes[0]!)).toMatchObject({ kind: 'agrees', text: 'agrees' });
    expect(routeBadge(r, route({ normalizedResidual: 2.6, agrees: false }))).toMatchObject({
      kind: 'flagged',
      description: 'Flagged: 2.6 standard deviations from the combined value (more than 2).',
    });
    const lacking = route({ uncertaintyComplete: false, missing: ['the ΔfH° of X(g)', 'given reaction 1'] });
    expect(routeBadge(r, lacking).description).toBe(
      'Not compared: no uncertainty is stated for the ΔfH° of X(g) and given reaction 1.',
    );
  });
});

describe('pText', () => {
  it('writes two significant figures, and a bound below 0.0001', () => {
    expect(pText(0.8912)).toBe('0.89');
    expect(pText(0.003149)).toBe('0.0031');
    expect(pText(0.00000123)).toBe('< 0.0001');
  });
});

describe('givenReactionWords', () => {
  it('numbers given reactions from 1 as the page does', () => {
    expect(givenReactionWords('reactions.0.deltaH.value: must be a number')).toBe('given reaction 1: must be a number');
    expect(givenReactionWords('No uncertainty for reaction 2 (CO(g) + …)')).toBe(
      'No uncertainty for given reaction 3 (CO(g) + …)',
    );
    expect(givenReactionWords('the given reaction 2 (x)')).toBe('the given reaction 2 (x)');
  });
});

describe('otherWarnings', () => {
  it('leaves out what the page says elsewhere', () => {
    const r = result({
      warnings: [
        { code: 'uncertainty_incomplete', message: 'x' },
        { code: 'temperature_corrected', message: 'reaction 0 (A) was brought to 298.15 K' },
        { code: 'search_stopped', message: 'y' },
      ] as DeriveResult['warnings'],
    });
    expect(otherWarnings(r)).toEqual(['given reaction 1 (A) was brought to 298.15 K']);
  });
});

describe('searchStoppedSentence', () => {
  it('is null when the search ran to the end, and says which bound stopped it otherwise', () => {
    expect(searchStoppedSentence(result())).toBeNull();
    const text = searchStoppedSentence(result({ search: { examined: 20000, found: 3, stoppedBy: 'examined' } }));
    expect(text).toBe(
      'The search stopped because it reached the limit of combinations it may examine, after examining 20,000 combinations and finding 3 routes. Other routes may exist: the ones shown are the best found so far.',
    );
    expect(searchStoppedSentence(result({ search: { examined: 5, found: 1, stoppedBy: 'time' } }))).toMatch(
      /its time budget ran out.*finding 1 route\./,
    );
  });
});

describe('multiplierParts and multiplierText', () => {
  it('split a fraction into sign, numerator and denominator with a true minus', () => {
    expect(multiplierParts('-3/2')).toEqual({ sign: '\u2212', numerator: '3', denominator: '2' });
    expect(multiplierParts('2')).toEqual({ sign: '', numerator: '2', denominator: null });
    expect(multiplierText('-1')).toBe('\u22121');
    expect(multiplierText('1/2')).toBe('1/2');
  });
});

describe('formedSpecies', () => {
  it('names the species a formation reaction forms', () => {
    expect(formedSpecies('C(cr, graphite) + 1/2 O2(g) -> CO(g)')).toBe('CO(g)');
    expect(formedSpecies('2 C(cr, graphite) + 3 H2(g) + 1/2 O2(g) -> C2H5OH(l)')).toBe('C2H5OH(l)');
  });

  it('is null for reactions that are not the formation of one mole of one species', () => {
    expect(formedSpecies('CO(g) + 1/2 O2(g) -> CO2(g)')).toBeNull();
    expect(formedSpecies('2 H2(g) + O2(g) -> 2 H2O(l)')).toBeNull();
    expect(formedSpecies('H2(g) + 1/2 O2(g) -> H2O(l) + ')).toBeNull();
  });
});
