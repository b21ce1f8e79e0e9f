import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  balanceEquationText,
  ChemistryError,
  elementBalanceTable,
  EquationParseError,
  formatFormula,
  parseEquation,
  parseFormula,
} from '@shared/chemistry';
import type { FormulaItem, FormulaPart, ParsedSpecies } from '@shared/chemistry';
import { hillFormula, compositionOf } from '@shared/chemistry/hill';
import { chargeText, partsText } from '@shared/chemistry/species';

// Property-based tests (fast-check). Structures are generated, formatted by us, and read back.
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

const item: fc.Memo<FormulaItem> = fc.memo((depth) =>
  depth <= 1
    ? fc.record({
        kind: fc.constant('element' as const),
        symbol: fc.constantFrom(...SYMBOLS),
        count: fc.integer({ min: 1, max: 12 }),
      })
    : fc.oneof(
        { weight: 3, arbitrary: item(1) },
        {
          weight: 1,
          arbitrary: fc.record({
            kind: fc.constant('group' as const),
            bracket: fc.constantFrom('(' as const, '[' as const),
            items: fc.array(item(depth - 1), { minLength: 1, maxLength: 3 }),
            count: fc.integer({ min: 1, max: 6 }),
          }),
        },
      ),
);
const parts: fc.Arbitrary<FormulaPart[]> = fc
  .array(
    fc.record({
      multiplier: fc.integer({ min: 1, max: 10 }),
      items: fc.array(item(3), { minLength: 1, maxLength: 4 }),
    }),
    { minLength: 1, maxLength: 3 },
  )
  .map((ps) => ps.map((p, i) => (i === 0 ? { ...p, multiplier: 1 } : p)));

const speciesArb: fc.Arbitrary<ParsedSpecies> = fc
  .tuple(parts, fc.integer({ min: -4, max: 4 }), fc.constantFrom(null, 's', 'l', 'g', 'aq', 'cr', 'am'))
  .map(([ps, charge, phase]) => {
    const composition = compositionOf(ps);
    return {
      formula: partsText(ps) + chargeText(charge),
      composition,
      charge,
      hill: hillFormula(composition),
      phase: phase as ParsedSpecies['phase'],
      descriptor: null,
      electron: false,
      parts: ps,
      chargeNotation: null,
      span: { start: 0, end: 0, column: 1 },
    };
  });

describe('formatFormula ∘ parseFormula', () => {
  it('reads back the same composition, charge and phase from text and Unicode output', () => {
    fc.assert(
      fc.property(speciesArb, (sp) => {
        for (const format of ['text', 'unicode'] as const) {
          const back = parseFormula(formatFormula(sp, format));
          expect(back.composition).toEqual(sp.composition);
          expect(back.charge).toBe(sp.charge);
          expect(back.phase).toBe(sp.phase);
          expect(back.hill).toBe(sp.hill);
        }
      }),
      { numRuns: 500 },
    );
  });
});

describe('balanceEquationText', () => {
  // Random species on both sides; whatever comes back must conserve every element and the charge.
  const side = fc.array(speciesArb, { minLength: 1, maxLength: 4 });
  it('returns only balancings that conserve each element and the charge exactly', () => {
    fc.assert(
      fc.property(side, side, (left, right) => {
        const text = (list: ParsedSpecies[]): string =>
          list.map((s) => formatFormula({ ...s, phase: null }, 'text')).join(' + ');
        const equation = `${text(left)} -> ${text(right)}`;
        const r = balanceEquationText({ equation });
        const parsed = parseEquation(equation);
        const check = (coefficients: string[]): void => {
          const rows = elementBalanceTable(
            parsed.terms.map((t, j) => ({
              composition: t.species.composition,
              charge: t.species.charge,
              side: t.side,
              coefficient: coefficients[j]!,
            })),
          );
          for (const row of rows) expect(row.reactants).toBe(row.products);
        };
        const asTyped = elementBalanceTable(
          parsed.terms.map((t) => ({
            composition: t.species.composition,
            charge: t.species.charge,
            side: t.side,
            coefficient: t.coefficient,
          })),
        );
        if (r.asGiven) expect(r.givenImbalance).toBeUndefined();
        else expect(r.givenImbalance).toEqual(asTyped);
        if (r.status !== 'impossible') {
          check(r.terms.map((t) => t.coefficient));
          expect(r.terms.every((t) => !t.coefficient.startsWith('-') && t.coefficient !== '0')).toBe(true);
        } else {
          expect(r.reason).toBeTruthy();
        }
        for (const v of r.basis ?? []) if (r.status === 'multiple') check(v);
      }),
      { numRuns: 300 },
    );
  });

  // Decomposition into elements is always possible: A_x B_y… -> A + B2 + …
  it('always balances a decomposition into the elements', () => {
    fc.assert(
      fc.property(
        fc.array(
          speciesArb.map((s) => ({ ...s, charge: 0, formula: partsText(s.parts) })),
          { minLength: 1, maxLength: 3 },
        ),
        (list) => {
          const symbols = [...new Set(list.flatMap((s) => Object.keys(s.composition)))];
          const equation = `${list.map((s) => formatFormula({ ...s, phase: null }, 'text')).join(' + ')} -> ${symbols.map((s) => `${s}2`).join(' + ')}`;
          const r = balanceEquationText({ equation });
          expect(['balanced', 'multiple']).toContain(r.status);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('parseEquation on arbitrary text', () => {
  const alphabet = fc.constantFrom(...'HCONSFeClXxq0123456789()[]{}^+-−→⇌<=>·*. ,;/ΔdkJcal₂²⁻⁺e\n\t#'.split(''));
  it('only ever throws EquationParseError, never crashes', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.string({ unit: alphabet, maxLength: 40 }),
          fc.string({ maxLength: 40 }),
          fc.string({ unit: 'binary', maxLength: 30 }),
        ),
        (text) => {
          try {
            parseEquation(text);
          } catch (err) {
            expect(err).toBeInstanceOf(EquationParseError);
            const e = err as EquationParseError;
            expect(e.position.line).toBeGreaterThanOrEqual(1);
            expect(e.position.column).toBeGreaterThanOrEqual(1);
            expect(e.message).not.toMatch(/but .* found\.$/);
          }
          try {
            balanceEquationText({ equation: text || ' ' });
          } catch (err) {
            expect(err).toBeInstanceOf(ChemistryError);
          }
        },
      ),
      { numRuns: 2000 },
    );
  });
});
