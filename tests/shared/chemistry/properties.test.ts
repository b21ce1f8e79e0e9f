import fc from 'fast-check';
import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { balanceRequest, formatFormula, parseFormula } from '@shared/chemistry';
import { counts } from './support';

// Property-based tests (fast-check). Formula structures are generated here; their text, their
// atom counts and their Hill formulas are worked out by the test's own small reference code
// (with fraction.js), never by the functions under test.

const SYMBOLS = [
  'H',
  'C',
  'N',
  'O',
  'S',
  'Cl',
  'Na',
  'K',
  'Fe',
  'Cu',
  'Co',
  'Mn',
  'Cr',
  'P',
  'Ca',
  'Mg',
  'D',
  'Og',
  'Ts',
];

type Item = { symbol: string; count: number } | { bracket: '(' | '['; items: Item[]; count: number };
interface Part {
  multiplier: [number, number]; // n/d
  items: Item[];
}
interface Species {
  parts: Part[];
  charge: number;
  phase: string | null;
}

const item: fc.Memo<Item> = fc.memo((depth) =>
  depth <= 1
    ? fc.record({ symbol: fc.constantFrom(...SYMBOLS), count: fc.integer({ min: 1, max: 12 }) })
    : fc.oneof(
        { weight: 3, arbitrary: item(1) },
        {
          weight: 1,
          arbitrary: fc.record({
            bracket: fc.constantFrom('(' as const, '[' as const),
            items: fc.array(item(depth - 1), { minLength: 1, maxLength: 3 }),
            count: fc.integer({ min: 1, max: 6 }),
          }),
        },
      ),
);

const multiplier = fc.oneof(
  { weight: 4, arbitrary: fc.integer({ min: 1, max: 10 }).map((n): [number, number] => [n, 1]) },
  { weight: 1, arbitrary: fc.constantFrom<[number, number]>([1, 2], [3, 2], [1, 3], [2, 3], [1, 4], [5, 8]) },
);

const speciesArb: fc.Arbitrary<Species> = fc.record({
  parts: fc
    .array(fc.record({ multiplier, items: fc.array(item(3), { minLength: 1, maxLength: 4 }) }), {
      minLength: 1,
      maxLength: 3,
    })
    .map((ps) => ps.map((p, i) => (i === 0 ? { ...p, multiplier: [1, 1] as [number, number] } : p))),
  charge: fc.integer({ min: -4, max: 4 }),
  phase: fc.constantFrom(null, 's', 'l', 'g', 'aq', 'cr', 'am'),
});

// ----- The test's own reference code --------------------------------------------------------

/** Plain caret text, written here: "(SO4)3", "·1/2H2O", "^2-", "(aq)". */
function writeItems(items: Item[]): string {
  return items
    .map((it) => {
      const count = it.count === 1 ? '' : String(it.count);
      if ('symbol' in it) return it.symbol + count;
      return (it.bracket === '(' ? `(${writeItems(it.items)})` : `[${writeItems(it.items)}]`) + count;
    })
    .join('');
}
function writeSpecies(s: Species): string {
  const body = s.parts
    .map((p, i) => {
      const [n, d] = p.multiplier;
      const m = i === 0 || (n === 1 && d === 1) ? '' : d === 1 ? String(n) : `${n}/${d}`;
      return m + writeItems(p.items);
    })
    .join('·');
  const charge =
    s.charge === 0 ? '' : `^${Math.abs(s.charge) === 1 ? '' : Math.abs(s.charge)}${s.charge > 0 ? '+' : '-'}`;
  return body + charge + (s.phase ? `(${s.phase})` : '');
}

/** Atom counts by recursion over the structure, with fraction.js. */
function referenceComposition(s: Species): Map<string, Fraction> {
  const out = new Map<string, Fraction>();
  const add = (items: Item[], factor: Fraction): void => {
    for (const it of items) {
      if ('symbol' in it) out.set(it.symbol, (out.get(it.symbol) ?? new Fraction(0)).add(factor.mul(it.count)));
      else add(it.items, factor.mul(it.count));
    }
  };
  for (const p of s.parts) add(p.items, new Fraction(p.multiplier[0], p.multiplier[1]));
  return out;
}
const asText = (m: Map<string, Fraction>): Record<string, string> =>
  Object.fromEntries([...m].map(([symbol, f]) => [symbol, f.toFraction()]));

/** Hill order as hill.ts documents it, written independently: C, H, D, T first when C is present. */
function referenceHill(m: Map<string, Fraction>): string {
  const symbols = [...m.keys()].sort();
  const ordered = m.has('C')
    ? ['C', 'H', 'D', 'T'].filter((s) => m.has(s)).concat(symbols.filter((s) => !['C', 'H', 'D', 'T'].includes(s)))
    : symbols;
  return ordered
    .map((s) => {
      const f = m.get(s)!;
      if (f.equals(1)) return s;
      const decimal = f.toString(); // "4.5", or "4.(3)" when the decimal repeats
      return s + (decimal.includes('(') ? f.toFraction() : decimal);
    })
    .join('');
}

// ----- Properties ----------------------------------------------------------------------------

describe('parseFormula', () => {
  it('reads generated formulas with the atom counts, Hill formula, charge and phase worked out by the test', () => {
    fc.assert(
      fc.property(speciesArb, (s) => {
        const expected = referenceComposition(s);
        const read = parseFormula(writeSpecies(s));
        expect(counts(read.composition)).toEqual(asText(expected));
        expect(read.hill).toBe(referenceHill(expected));
        expect(read.charge).toBe(s.charge);
        expect(read.phase).toBe(s.phase);
      }),
      { numRuns: 500 },
    );
  });
});

describe('formatFormula ∘ parseFormula', () => {
  it('reads back its own text and Unicode output as the same species', () => {
    fc.assert(
      fc.property(speciesArb, (s) => {
        const expected = asText(referenceComposition(s));
        const read = parseFormula(writeSpecies(s));
        for (const format of ['text', 'unicode'] as const) {
          const back = parseFormula(formatFormula(read, format));
          expect(counts(back.composition)).toEqual(expected);
          expect([back.charge, back.phase]).toEqual([s.charge, s.phase]);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('balanceRequest', () => {
  // Random species on both sides; whatever comes back must conserve every element and the charge,
  // summed here with fraction.js over the test's own atom counts.
  const side = fc.array(speciesArb, { minLength: 1, maxLength: 4 });
  const totals = (list: Array<{ s: Species; sign: 1 | -1 }>, coefficients: string[]): Map<string, Fraction> => {
    const out = new Map<string, Fraction>();
    list.forEach(({ s, sign }, j) => {
      const c = new Fraction(coefficients[j]!).mul(sign);
      for (const [symbol, n] of referenceComposition(s))
        out.set(symbol, (out.get(symbol) ?? new Fraction(0)).add(c.mul(n)));
      out.set('charge', (out.get('charge') ?? new Fraction(0)).add(c.mul(s.charge)));
    });
    return out;
  };

  it('returns only balancings that conserve each element and the charge exactly', () => {
    fc.assert(
      fc.property(side, side, (left, right) => {
        const write = (list: Species[]): string => list.map((s) => writeSpecies({ ...s, phase: null })).join(' + ');
        const r = balanceRequest({ equation: `${write(left)} -> ${write(right)}` });
        const terms = [...left.map((s) => ({ s, sign: 1 as const })), ...right.map((s) => ({ s, sign: -1 as const }))];
        const conserved = (coefficients: string[]): boolean =>
          [...totals(terms, coefficients).values()].every((f) => f.equals(0));

        const asTyped = terms.map(() => '1');
        expect(r.asGiven).toBe(conserved(asTyped));
        if (!r.asGiven) {
          // The per-element table of the typed coefficients, against the test's own sums.
          const sums = new Map<string, [Fraction, Fraction]>();
          terms.forEach(({ s, sign }) => {
            const entries: Array<[string, Fraction]> = [...referenceComposition(s)];
            if (terms.some((t) => t.s.charge !== 0)) entries.push(['charge', new Fraction(s.charge)]);
            for (const [key, n] of entries) {
              const row = sums.get(key) ?? [new Fraction(0), new Fraction(0)];
              row[sign === 1 ? 0 : 1] = row[sign === 1 ? 0 : 1].add(n);
              sums.set(key, row);
            }
          });
          expect(
            Object.fromEntries(r.givenImbalance!.map((row) => [row.element, [row.reactants, row.products]])),
          ).toEqual(Object.fromEntries([...sums].map(([key, [a, b]]) => [key, [a.toFraction(), b.toFraction()]])));
        } else {
          expect(r.givenImbalance).toBeUndefined();
        }
        if (r.status !== 'impossible') {
          const found = r.terms.map((t) => t.coefficient);
          expect(conserved(found)).toBe(true);
          expect(found.every((c) => new Fraction(c).compare(0) > 0)).toBe(true);
        } else {
          expect(r.reason).toBeTruthy();
        }
        if (r.status === 'multiple') for (const v of r.basis ?? []) expect(conserved(v)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  // Decomposition into the elements is always possible: A_x B_y… -> A2 + B2 + …
  it('always balances a decomposition into the elements', () => {
    fc.assert(
      fc.property(fc.array(speciesArb, { minLength: 1, maxLength: 3 }), (list) => {
        const neutral = list.map((s) => ({ ...s, charge: 0, phase: null }));
        const symbols = [...new Set(neutral.flatMap((s) => [...referenceComposition(s).keys()]))];
        const equation = `${neutral.map(writeSpecies).join(' + ')} -> ${symbols.map((s) => `${s}2`).join(' + ')}`;
        expect(['balanced', 'multiple']).toContain(balanceRequest({ equation }).status);
      }),
      { numRuns: 200 },
    );
  });
});
