import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  balanceBatchRequest,
  balanceEquationLines,
  balanceEquationText,
  BalanceInputError,
  balanceRequest,
  DEFAULT_WORK_LIMITS,
  EquationParseError,
  parseEquation,
  parseFormula,
  WorkLimitError,
} from '@shared/chemistry';
import { balanceBatchResultSchema } from '@shared/schemas/balance-batch';

/** Runs `fn` and returns what it throws (fails the test when nothing is thrown). */
function thrownBy(fn: () => unknown): unknown {
  try {
    fn();
  } catch (err) {
    return err;
  }
  throw new Error('expected a throw');
}

// The inputs that brought the server down before the work limits (Issue B): one batch line of
// 11,000 `H` terms ran it out of heap; 4,995 terms on /balance took 10.6 s and 1.7 GB.
const elevenThousand = `${Array.from({ length: 11_000 }, () => 'H').join(' + ')} -> H2`;
const fourThousandNineHundredNinetyFive = `${Array.from({ length: 4_995 }, () => 'H').join('+')}->H2`;

describe('work limits', () => {
  it('refuses 4,995 terms on one equation before balancing, naming the limit and the count', () => {
    const err = thrownBy(() => balanceRequest({ equation: fourThousandNineHundredNinetyFive }));
    expect(err).toBeInstanceOf(WorkLimitError);
    const e = err as WorkLimitError;
    expect(e.code).toBe('payload_too_large');
    expect(e.message).toBe('This equation has 4,996 terms; the limit is 80.');
    expect(e.details).toEqual({ limit: 'terms', max: 80, found: 4_996 });
  });

  it('gives the batch line of 11,000 terms its own error entry and balances the other lines', () => {
    const reply = balanceBatchRequest({ text: `H2 + O2 -> H2O\n${elevenThousand}\nN2 + H2 -> NH3` });
    expect(balanceBatchResultSchema.safeParse(reply).success).toBe(true);
    const [first, big, last] = reply.results;
    // 2 H2 + O2 → 2 H2O and N2 + 3 H2 → 2 NH3 (common practice, no source).
    expect(first && 'result' in first && first.result.equation).toBe('2 H2 + O2 -> 2 H2O');
    expect(big).toMatchObject({
      line: 2,
      error: {
        code: 'payload_too_large',
        message: 'This equation has 11,001 terms; the limit is 80.',
        limit: { limit: 'terms', max: 80, found: 11_001 },
        details: { line: 2, column: 1, offset: 15 },
      },
    });
    expect(last && 'result' in last && last.result.equation).toBe('N2 + 3 H2 -> 2 NH3');
  });

  it('counts terms without building them: the parser keeps only the first maxTerms', () => {
    const err = thrownBy(() => parseEquation('H + H + H -> H2 + H2', { limits: { maxTerms: 4 } })) as WorkLimitError;
    expect([err.limit, err.max, err.found]).toEqual(['terms', 4, 5]);
    expect(parseEquation('H + H + H -> H2', { limits: { maxTerms: 4 } }).terms).toHaveLength(4);
  });

  it('refuses more distinct species than the limit, counting repeats once', () => {
    const many = Array.from({ length: 61 }, (_, i) => `C${i + 1}H${2 * i + 4}`).join(' + ');
    const err = thrownBy(() => balanceEquationText(`${many} -> CO2 + H2O`, { limits: { maxTerms: 200 } }));
    expect(err).toMatchObject({ limit: 'species', max: 60, found: 63 });
    // 70 terms but only 2 distinct species: within the limit (one O row, so 69 independent balancings).
    const repeats = balanceEquationText(`${Array.from({ length: 69 }, () => 'O2').join(' + ')} -> O3`);
    expect([repeats.status, repeats.dimension]).toEqual(['multiple', 69]);
  });

  it('refuses a whole batch over the line or character limit before reading any line', () => {
    const lines = Array.from({ length: DEFAULT_WORK_LIMITS.maxLines + 1 }, () => 'H2 + O2 -> H2O').join('\n');
    expect(thrownBy(() => balanceEquationLines(lines))).toMatchObject({ limit: 'lines', max: 2_000, found: 2_001 });
    // Blank and comment lines are not equations and do not count.
    expect(balanceEquationLines(`${'\n# note'.repeat(3_000)}\nH2 + O2 -> H2O`)).toHaveLength(1);
    const long = `H2 + O2 -> H2O\n${' '.repeat(DEFAULT_WORK_LIMITS.maxCharacters)}`;
    const err = thrownBy(() => balanceEquationLines(long)) as WorkLimitError;
    expect([err.limit, err.found]).toEqual(['characters', 250_015]);
    expect(err.message).toBe('This batch has 250,015 characters; the limit is 250,000. Split it into smaller batches.');
  });

  it('takes smaller limits from the caller', () => {
    expect(thrownBy(() => balanceEquationLines('H2 -> H2\nO2 -> O2', { limits: { maxLines: 1 } }))).toBeInstanceOf(
      WorkLimitError,
    );
    expect(() => balanceEquationLines('H2 -> H2', { limits: { maxLines: 0 } })).toThrow(RangeError);
  });
});

// Text that could be thrown at a public endpoint: random characters of the language, any
// Unicode, deep nesting, long runs, huge numbers. Only the core's own errors may come out.
const alphabet = fc.constantFrom(...'HCONSFeClXxq0123456789()[]{}^+-−→⇌<=>·*. ,;/ΔdkJcal₂²⁻⁺e½\n\t#'.split(''));
const deepNesting = fc
  .tuple(fc.constantFrom('(', '[', '{'), fc.integer({ min: 1, max: 4_000 }), fc.constantFrom('H', 'H2', '', 'Fe3+'))
  .map(([open, depth, inner]) => `${open.repeat(depth)}${inner}${open === '(' ? ')' : ']'.repeat(depth % 7)} -> H`);
const longRuns = fc
  .tuple(
    fc.constantFrom('+', 'H', '(', ')', '2', '·', ' ', '->', 'e-', '^', '½'),
    fc.integer({ min: 100, max: 20_000 }),
  )
  .map(([unit, n]) => unit.repeat(n));
const hugeNumbers = fc
  .tuple(fc.integer({ min: 10, max: 400 }), fc.constantFrom('H', 'CuSO4·', '2H2 + O2 -> H2O, ΔH = ', 'Fe^', '1/'))
  .map(([digits, prefix]) => `${prefix}${'9'.repeat(digits)}${prefix.endsWith('= ') ? ' kJ' : ' -> H'}`);
const hostile = fc.oneof(
  fc.string({ unit: alphabet, maxLength: 60 }),
  fc.string({ unit: 'grapheme', maxLength: 60 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  deepNesting,
  longRuns,
  hugeNumbers,
);

function onlyCoreErrors(fn: () => unknown, allowed: Array<new (...args: never[]) => Error>): void {
  try {
    fn();
  } catch (err) {
    expect(allowed.some((type) => err instanceof type)).toBe(true);
    if (err instanceof EquationParseError) {
      expect(err.position.line).toBeGreaterThanOrEqual(1);
      expect(err.position.column).toBeGreaterThanOrEqual(1);
      expect(err.position.length).toBeGreaterThanOrEqual(0);
      expect(err.message).not.toMatch(/but .* found\.$/);
    }
  }
}

describe('the parser and balancer on hostile text', () => {
  it('throw nothing but EquationParseError and WorkLimitError (BalanceInputError for requests)', () => {
    fc.assert(
      fc.property(hostile, (text) => {
        onlyCoreErrors(() => parseEquation(text), [EquationParseError, WorkLimitError]);
        onlyCoreErrors(() => parseFormula(text), [EquationParseError, WorkLimitError]);
        onlyCoreErrors(
          () => balanceRequest({ equation: text }),
          [EquationParseError, WorkLimitError, BalanceInputError],
        );
        onlyCoreErrors(() => balanceEquationLines(text), [WorkLimitError]);
      }),
      { numRuns: 1_500 },
    );
  });

  it('answers every reply with finite numbers only', () => {
    fc.assert(
      fc.property(
        fc.tuple(fc.double({ noNaN: false }), fc.constantFrom('kJ', 'kcal', 'J'), fc.integer({ min: 0, max: 2 })),
        ([value, unit, normaliseTo]) => {
          const equation = `H2 + 1/2 O2 -> H2O, ΔH = ${String(value)} ${unit}`;
          try {
            const r = balanceRequest({ equation, normaliseTo });
            expect(JSON.stringify(r)).not.toMatch(/Infinity|NaN|null,"unit"/);
            if (r.enthalpy) expect(Number.isFinite(r.enthalpy.value)).toBe(true);
          } catch (err) {
            expect(err instanceof EquationParseError || err instanceof BalanceInputError).toBe(true);
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
