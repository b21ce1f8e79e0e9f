import { describe, expect, it } from 'vitest';
import type { ConsistencyResult } from '@shared/schemas/derive';
import {
  birgeSentence,
  compareWithLibrary,
  flaggedSentence,
  groupExcluded,
  shortReactionRef,
} from '@/lib/consistency-words';

type Fitted = ConsistencyResult['fitted'][number];

describe('compareWithLibrary', () => {
  it('gives the difference and how many combined standard deviations it is', () => {
    // Fitted 3 ± 0.3 against the library's 0 ± 0.4: a 3-4-5 triangle, so the combined u is 0.5.
    const f: Fitted = { species: 'X(g)', value: 3, uncertainty: 0.3, library: { value: 0, uncertainty: 0.4 } };
    const c = compareWithLibrary(f)!;
    expect(c.difference).toBe(3);
    expect(c.sigmas).toBeCloseTo(6, 12);
    expect(c.fitOnly).toBe(false);
  });

  it("uses the fit's uncertainty alone when the library states none, and is null without a library value", () => {
    const f: Fitted = { species: 'X(g)', value: -1, uncertainty: 0.5, library: { value: 0, uncertainty: null } };
    expect(compareWithLibrary(f)).toEqual({ difference: -1, sigmas: -2, fitOnly: true });
    expect(compareWithLibrary({ ...f, library: null })).toBeNull();
    expect(compareWithLibrary({ ...f, uncertainty: 0 })!.sigmas).toBeNull();
  });
});

describe('birgeSentence', () => {
  it('is not defined without degrees of freedom', () => {
    expect(birgeSentence(null, 0)).toMatch(/^Not defined/);
    expect(birgeSentence(1.2, 0)).toMatch(/^Not defined/);
  });

  // The Birge ratio's spread for ν degrees of freedom is about 1/√(2ν) (common practice, no source):
  // for ν = 8 that is 0.25, so 1 ± 0.5 is the band called "close to 1".
  it('reads the ratio against its own spread', () => {
    expect(birgeSentence(1.4, 8)).toBe(
      'R_B = 1.40, close to 1 for 8 degrees of freedom: the measurements scatter about as much as their stated uncertainties lead one to expect.',
    );
    expect(birgeSentence(1.6, 8)).toMatch(/^R_B = 1.60, well above 1/);
    expect(birgeSentence(0.4, 8)).toMatch(/^R_B = 0.400, well below 1/);
    expect(birgeSentence(1, 1)).toMatch(/for 1 degree of freedom/);
  });
});

describe('flaggedSentence', () => {
  const residual = (flagged: boolean) => ({
    reaction: 'r',
    equation: 'A(g) -> B(g)',
    residual: 1,
    uncertainty: 1,
    normalized: 1,
    flagged,
  });
  const base: ConsistencyResult = {
    fitted: [],
    residuals: [],
    chiSquare: 0,
    degreesOfFreedom: 0,
    birgeRatio: null,
    excluded: [],
    heldWithoutUncertainty: [],
    libraryRevision: 1,
  };

  it('counts the measurements beyond 2σ', () => {
    expect(flaggedSentence({ ...base, residuals: [residual(false)] })).toBe(
      'No measurement lies beyond 2σ of the fit.',
    );
    expect(flaggedSentence({ ...base, residuals: [residual(true), residual(false)] })).toBe(
      '1 measurement lies beyond 2σ of the fit (marked below).',
    );
    expect(flaggedSentence({ ...base, residuals: [residual(true), residual(true)] })).toBe(
      '2 measurements lie beyond 2σ of the fit (marked below).',
    );
  });
});

describe('groupExcluded', () => {
  it('groups the measurements left out by reason, in order of first appearance', () => {
    expect(
      groupExcluded([
        { reaction: 'combustion-methane', reason: 'restates values the library already holds' },
        { reaction: 'C2H4(g) + H2(g) -> C2H6(g)', reason: 'no stated uncertainty' },
        { reaction: 'combustion-ethane', reason: 'restates values the library already holds' },
      ]),
    ).toEqual([
      { reason: 'restates values the library already holds', reactions: ['combustion-methane', 'combustion-ethane'] },
      { reason: 'no stated uncertainty', reactions: ['C2H4(g) + H2(g) -> C2H6(g)'] },
    ]);
    expect(groupExcluded([])).toEqual([]);
  });
});

describe('shortReactionRef', () => {
  it('shortens internal ids and keeps library keys', () => {
    expect(shortReactionRef('measured:c3058613-c6c3-4735-802c-d454700c1618')).toBe('measured c3058613');
    expect(shortReactionRef('combustion-methane')).toBe('combustion-methane');
  });
});
