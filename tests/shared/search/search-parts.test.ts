import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formulaReadings, normalizeText, splitPhaseSuffix } from '@shared/search';
import { rankFuzzy } from '@shared/search/fuzzy-rank';
import { wordStarts } from '@shared/search/normalize';
import { buildTrigramIndex, trigramCandidates, TrigramScratch } from '@shared/search/trigram-index';

describe('formulaReadings', () => {
  it('reads "co" as carbon monoxide and as cobalt, separate symbols first', () => {
    expect(formulaReadings('co').map((r) => r.text)).toEqual(['CO', 'Co']);
  });

  it('puts the reading typed with its case first', () => {
    expect(formulaReadings('Co').map((r) => r.text)).toEqual(['Co', 'CO']);
    expect(formulaReadings('Co')[0]?.asTyped).toBe(true);
  });

  it('gives the Hill formula and charge of each reading', () => {
    // Hill order (C, H, then alphabetical): ethanol C2H6O, sulfate O4S (from memory).
    expect(formulaReadings('c2h5oh')).toMatchObject([{ text: 'C2H5OH', hill: 'C2H6O', charge: 0 }]);
    expect(formulaReadings('so4^2-')).toMatchObject([{ formula: 'SO4^2-', hill: 'O4S', charge: -2 }]);
    expect(formulaReadings('na+')).toMatchObject([{ formula: 'Na^+', charge: 1 }]);
  });

  it('reads the electron', () => {
    expect(formulaReadings('e-')).toMatchObject([{ formula: 'e^-', charge: -1 }]);
  });

  it('leaves out text that is no formula ("water" is one: W, At, Er)', () => {
    expect(formulaReadings('water').map((r) => r.text)).toEqual(['WAtEr']);
    for (const text of ['ethanol', 'sodium', '.*', '((((', '64-17-5', '', 'c'.repeat(100), 'h2o (l)']) {
      expect(formulaReadings(text), text).toEqual([]);
    }
  });

  it('gives up on words with too many symbol spellings instead of trying them all', () => {
    // "conocono…" splits into C/O/N or Co/No in 2^n ways.
    expect(formulaReadings('cono'.repeat(8))).toEqual([]);
  });

  it('never throws, whatever the text', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 80 }), (text) => {
        expect(Array.isArray(formulaReadings(text))).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe('splitPhaseSuffix', () => {
  it('splits a phase label and a descriptor off the end', () => {
    expect(splitPhaseSuffix('H2O(l)')).toEqual({ rest: 'H2O', phase: 'l', descriptor: null });
    expect(splitPhaseSuffix('C (cr, Graphite)')).toEqual({ rest: 'C', phase: 'cr', descriptor: 'graphite' });
    expect(splitPhaseSuffix('water(G)')).toEqual({ rest: 'water', phase: 'g', descriptor: null });
  });

  it('files (s) as cr, the library phase of every crystalline solid', () => {
    expect(splitPhaseSuffix('NaCl(s)').phase).toBe('cr');
  });

  it('leaves brackets that are not phases alone', () => {
    for (const text of ['Ca(OH)2', 'iron(III) oxide', 'copper(II)', '(g)', 'Fe(CO)5']) {
      expect(splitPhaseSuffix(text)).toEqual({ rest: text, phase: null, descriptor: null });
    }
  });
});

describe('normalizeText', () => {
  it('folds case, accents, dashes and spaces', () => {
    expect(normalizeText('  Sodium   Chloride ')).toBe('sodium chloride');
    expect(normalizeText('Nickel(II) sulfate – hexahydrate')).toBe('nickel(ii) sulfate - hexahydrate');
    expect(normalizeText('Señorita\u00a0Café')).toBe('senorita cafe');
    expect(normalizeText('α-Pinene')).toBe('α-pinene');
  });

  it('drops control and zero-width characters', () => {
    expect(normalizeText('eth\u200banol\u0000')).toBe('eth anol');
    expect(normalizeText('\u0007\u001b\ufeff')).toBe('');
  });
});

describe('wordStarts', () => {
  it('finds letters after separators, not after digits inside locants', () => {
    expect(wordStarts('sodium chloride')).toEqual([7]);
    expect(wordStarts('1,2-dichloroethane')).toEqual([4]);
    expect(wordStarts('butan-2-ol')).toEqual([8]);
    expect(wordStarts('water')).toEqual([]);
  });
});

/** One edit of `word` at `at`: substitute, drop, insert, or swap with the next character. */
function edit(word: string, kind: number, at: number, letter: string): string {
  switch (kind) {
    case 0:
      return word.slice(0, at) + letter + word.slice(at + 1);
    case 1:
      return word.slice(0, at) + word.slice(at + 1);
    case 2:
      return word.slice(0, at) + letter + word.slice(at);
    default:
      return at + 1 < word.length ? word.slice(0, at) + word[at + 1] + word[at] + word.slice(at + 2) : word;
  }
}

const wordArbitrary = fc
  .string({ unit: fc.constantFrom(...'abcdefghilmnoprstuy-,1234 '), minLength: 6, maxLength: 70 })
  .map((w) => normalizeText(w))
  .filter((w) => w.length >= 6);

describe('trigram candidates and fuzzy scoring', () => {
  it('keep every text within one typo of the query (property)', () => {
    fc.assert(
      fc.property(
        wordArbitrary,
        fc.integer({ min: 0, max: 3 }),
        fc.nat(),
        fc.constantFrom(...'aeiouxz'),
        (word, kind, position, letter) => {
          const edited = edit(word, kind, position % word.length, letter);
          const query = normalizeText(edited);
          // Normalising can fold the edit into a second change ("aa 1 aaa" less its "1" leaves two
          // spaces, folded into one): such a query is two typos away, outside this property.
          fc.pre(query === edited && query.length >= 4);
          const index = buildTrigramIndex([word, 'unrelated text']);
          const candidates = trigramCandidates(index, new TrigramScratch(2), query, 10, () => true);
          expect(candidates).toContain(0);
          expect(rankFuzzy(query, [word]).map((s) => s.candidate)).toEqual([0]);
        },
      ),
      { numRuns: 1000 },
    );
  });

  it('scores a text that contains the query near 0 and a one-typo match as one edit', () => {
    const scores = rankFuzzy('ethanl', ['ethanol', 'methanol', 'propane']);
    expect(scores.map((s) => s.candidate).sort()).toEqual([0, 1]);
    expect(scores[0]?.score).toBeCloseTo(1 / 6, 10);
  });

  it('counts a swap of neighbours as one typo, which fuse.js alone does not', () => {
    expect(rankFuzzy('caesuim', ['caesium'])).toEqual([{ candidate: 0, score: 1 / 7 }]);
    expect(rankFuzzy('caseuim', ['caesium'])).toEqual([]); // two swaps
  });

  it('finds a typo in a name longer than fuse.js’s 32-character window', () => {
    const name = '10-chloro-3,15,18-trihydroxy-20-methoxyicosan-6-one';
    expect(rankFuzzy('10-chloro-3,15,18-trihyroxy-20-methoxyicosan-6-one', [name])).toHaveLength(1);
    expect(
      rankFuzzy('10-chloro-3,15,18-trihydroxy-20-methoxyicosan-6-ane', [
        name,
        '10-chloro-3,15,18-trihydroxy-20-ethylicosan-6-one',
      ]),
    ).toEqual([{ candidate: 0, score: expect.any(Number) }]);
  });
});
