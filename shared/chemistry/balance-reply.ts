/**
 * The wire edge of the balancer: the one place that turns the core's model (`Balancing`,
 * `BatchLine`) into the API replies of `POST /api/v1/balance` and `POST /api/v1/balance/batch`
 * (shared/schemas/balance.ts, balance-batch.ts). Exact numbers become fraction text ("1/2");
 * everything else is copied from the model. Nothing here re-reads text.
 */
import type { BalanceInput, BalanceResult, BalanceTerm, ParseErrorDetails } from '../schemas/balance';
import type { BalanceBatchInput, BalanceBatchLine, BalanceBatchResult } from '../schemas/balance-batch';
import { balanceEquationText } from './balance';
import { balanceEquationLines, type BatchLine } from './batch';
import { EquationParseError, WorkLimitError, type ChemistryError } from './errors';
import { formatEquation } from './format';
import type { WorkLimits } from './limits';
import { excerptAt } from './positions';
import { ratText } from './rational';
import type { Balancing, Composition, ImpossibleReason, ParseWarning } from './types';

function compositionText(composition: Composition): Record<string, string> {
  const out: Record<string, string> = {};
  for (const symbol in composition) out[symbol] = ratText(composition[symbol]!);
  return out;
}

function warningReply(w: ParseWarning, stage: 'reading' | 'balancing'): BalanceResult['warnings'][number] {
  const out: BalanceResult['warnings'][number] = { code: w.code, message: w.message };
  if (w.term !== undefined) out.term = w.term;
  if (w.column !== undefined) out.column = w.column;
  out.stage = stage;
  return out;
}

function impossibleReply(reason: ImpossibleReason): NonNullable<BalanceResult['impossible']> {
  switch (reason.kind) {
    case 'one_side':
      return {
        code: reason.kind,
        elements: [...reason.elements.map((e) => e.element), ...(reason.charge ? ['charge'] : [])],
      };
    case 'only_zero':
      return { code: reason.kind, elements: reason.conserved };
    case 'must_vanish':
    case 'must_change_side':
      return { code: reason.kind, terms: reason.terms };
    case 'no_positive_balancing':
      return { code: reason.kind };
  }
}

/**
 * The `POST /api/v1/balance` reply for a balancing. Existing fields keep their meaning; added
 * ones: `terms[].composition`, `warnings[].stage`, `basisTruncated`, `impossible`.
 */
export function toBalanceReply(balancing: Balancing): BalanceResult {
  const { equation } = balancing;
  const terms: BalanceTerm[] = equation.terms.map((t) => ({
    formula: t.species.formula,
    hill: t.species.hill,
    phase: t.species.phase,
    descriptor: t.species.descriptor,
    charge: t.species.charge,
    side: t.side,
    coefficient: ratText(t.coefficient),
    composition: compositionText(t.species.composition),
  }));
  const reply: BalanceResult = {
    status: balancing.status,
    equation: formatEquation(equation, 'text'),
    terms,
    asGiven: balancing.asGiven,
    dimension: balancing.dimension,
    warnings: [
      ...balancing.reading.warnings.map((w) => warningReply(w, 'reading')),
      ...balancing.warnings.map((w) => warningReply(w, 'balancing')),
    ],
  };
  if (balancing.givenTotals) {
    reply.givenImbalance = balancing.givenTotals.map((row) => ({
      element: row.element,
      reactants: ratText(row.reactants),
      products: ratText(row.products),
    }));
  }
  if (balancing.basis.length > 0) {
    reply.basis = balancing.basis.map((v) => v.map((x) => x.toString()));
    reply.basisTruncated = balancing.basisTruncated;
  }
  if (balancing.impossible) {
    reply.reason = balancing.impossible.message;
    reply.impossible = impossibleReply(balancing.impossible);
  }
  if (equation.enthalpy) {
    reply.enthalpy = { value: equation.enthalpy.value, unit: 'kJ/mol' };
    if (equation.enthalpy.uncertainty !== undefined) reply.enthalpy.uncertainty = equation.enthalpy.uncertainty;
  }
  return reply;
}

function lineErrorReply(
  line: BatchLine & { error: ChemistryError },
): Extract<BalanceBatchLine, { error: unknown }>['error'] {
  const { error } = line;
  if (error instanceof EquationParseError) {
    return { message: error.message, details: { ...error.position }, code: error.code, problem: error.problem };
  }
  // Not a place in the text: point at the line's start.
  const details: ParseErrorDetails = {
    line: line.line,
    column: 1,
    offset: line.offset,
    excerpt: excerptAt(line.source, 0),
    expected: [],
    length: 0,
  };
  const reply = { message: error.message, details, code: error.code, problem: error.message };
  return error instanceof WorkLimitError
    ? { ...reply, limit: { limit: error.limit, max: error.max, found: error.found } }
    : reply;
}

/** The `POST /api/v1/balance/batch` reply for balanced lines. */
export function toBalanceBatchReply(lines: readonly BatchLine[]): BalanceBatchResult {
  return {
    results: lines.map((l): BalanceBatchLine =>
      'balancing' in l
        ? { line: l.line, source: l.source, result: toBalanceReply(l.balancing) }
        : { line: l.line, source: l.source, error: lineErrorReply(l) },
    ),
  };
}

/**
 * `POST /api/v1/balance` from request to reply: balance `input` within `limits` and build the reply.
 * @throws EquationParseError, BalanceInputError, WorkLimitError as `balanceEquationText`.
 */
export function balanceRequest(input: BalanceInput, limits?: Partial<WorkLimits>): BalanceResult {
  const options = {
    ...(input.fixed === undefined ? {} : { fixed: input.fixed }),
    ...(input.normaliseTo === undefined ? {} : { normaliseTo: input.normaliseTo }),
    ...(limits === undefined ? {} : { limits }),
  };
  return toBalanceReply(balanceEquationText(input.equation, options));
}

/**
 * `POST /api/v1/balance/batch` from request to reply.
 * @throws WorkLimitError when the whole batch is over `maxCharacters` or `maxLines`.
 */
export function balanceBatchRequest(input: BalanceBatchInput, limits?: Partial<WorkLimits>): BalanceBatchResult {
  return toBalanceBatchReply(balanceEquationLines(input.text, limits === undefined ? {} : { limits }));
}
