// The one place the server calls the chemistry core for public calculations, with its work limits.
// It runs inside the calculation worker (calc.worker.ts), never on the request thread.
//
// The core is gaining its own limits (`WorkLimits` options, `WorkLimitError` = a ChemistryError
// with code payload_too_large and details {limit, max, found}) and a renamed batch function
// (`parseEquationBatch` → `balanceEquationLines`). When that lands, each function below shrinks
// to its one marked call, passing `toWorkLimits(limits)`, and the interim counting goes away;
// the worker already turns any ChemistryError (WorkLimitError included) into its status.
import {
  balanceParsedEquation,
  parseEquation,
  parseEquationBatch,
  type BalanceInput,
  type BalanceResult,
  type BatchLine,
} from '@shared/chemistry/index';
import type { CalcLimits } from '../env';
import { assertEquationWithinLimits, measureBatchText } from './work-limits';

/** The server's limits in the shape the core's `WorkLimits` option is expected to take. */
export function toWorkLimits(limits: CalcLimits) {
  return {
    maxTerms: limits.maxTermsPerEquation,
    maxSpecies: limits.maxDistinctSpecies,
    maxLines: limits.maxBatchLines,
    maxBytes: limits.maxBatchBytes,
  };
}

/** POST /balance: parse, check the size of what was parsed, balance. */
export function balanceOne(input: BalanceInput, limits: CalcLimits): BalanceResult {
  // With core limits: return balanceEquationText(input, { limits: toWorkLimits(limits) });
  const parsed = parseEquation(input.equation);
  assertEquationWithinLimits(parsed, limits);
  return balanceParsedEquation(parsed, input);
}

/** POST /balance/batch: every equation line within the limits, then the core's batch. */
export function balanceLines(text: string, limits: CalcLimits): BatchLine[] {
  // With core limits: return balanceEquationLines(text, { limits: toWorkLimits(limits) });
  const { suspectLines } = measureBatchText(text, limits);
  if (suspectLines.length > 0) {
    const lines = text.split('\n');
    for (const lineNo of suspectLines) {
      let parsed;
      try {
        parsed = parseEquation(lines[lineNo - 1]!.replace(/\r$/, ''));
      } catch {
        continue; // an unreadable line becomes that line's parse error in the batch itself
      }
      assertEquationWithinLimits(parsed, limits, lineNo);
    }
  }
  return parseEquationBatch(text);
}
