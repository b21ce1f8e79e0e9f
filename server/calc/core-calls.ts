// The one place the server calls the chemistry core for public calculations, with its work limits.
// It runs inside the calculation worker (calc.worker.ts), never on the request thread. The core
// counts terms, species, lines and characters before doing any work and throws WorkLimitError
// (code payload_too_large, details {limit, max, found}); the worker passes it on as data.
import { balanceBatchRequest, balanceRequest, type WorkLimits } from '@shared/chemistry/index';
import type { BalanceInput, BalanceResult } from '@shared/schemas/balance';
import type { BalanceBatchResult } from '@shared/schemas/balance-batch';
import type { CalcLimits } from '../env';

/** The server's configured limits as the core's `WorkLimits`. */
export function toWorkLimits(limits: CalcLimits): Partial<WorkLimits> {
  return {
    maxTerms: limits.maxTermsPerEquation,
    maxSpecies: limits.maxDistinctSpecies,
    maxLines: limits.maxBatchLines,
    // The request thread has already refused texts over the byte limit; characters ≤ bytes.
    maxCharacters: limits.maxBatchBytes,
  };
}

/** POST /balance, request to reply. */
export function balanceOne(input: BalanceInput, limits: CalcLimits): BalanceResult {
  return balanceRequest(input, toWorkLimits(limits));
}

/** POST /balance/batch, request to reply; a line over a limit gets its own error entry. */
export function balanceLines(text: string, limits: CalcLimits): BalanceBatchResult {
  return balanceBatchRequest({ text }, toWorkLimits(limits));
}
