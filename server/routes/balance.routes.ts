import { balanceInputSchema, balanceResultSchema } from '@shared/schemas/balance';
import { balanceBatchInputSchema, balanceBatchResultSchema } from '@shared/schemas/balance-batch';
import { MAX_EQUATION_CHARS, measureBatchText } from '../calc/work-limits';
import type { AppConfig } from '../env';
import { balanceBatch, balanceEquation } from '../services/balance.service';
import { defineRoute } from './registry';

const n = (value: number) => value.toLocaleString('en');

/** The limits both calculation endpoints share, in words. */
function sharedLimits(config: AppConfig): string[] {
  const { limits, timeBudgetMs, requestsPerMinute, linesPerMinute } = config.calc;
  return [
    `At most ${n(limits.maxTermsPerEquation)} terms (CALC_MAX_TERMS) and ${n(limits.maxDistinctSpecies)} distinct species (CALC_MAX_SPECIES) in one equation, and ${n(MAX_EQUATION_CHARS)} characters: 413 payload_too_large with details {limit: "termsPerEquation" | "distinctSpecies" | "equationLength", max, found}.`,
    `Replies are at most ${n(limits.maxReplyBytes)} bytes (CALC_MAX_REPLY_BYTES): 413 with details.limit "replyBytes".`,
    `Each calculation runs off the request thread within ${n(timeBudgetMs)} ms, waiting included (CALC_TIME_BUDGET_MS), and a memory ceiling: past the time budget, or when every worker is busy and the queue is full, 503 unavailable with Retry-After; past the memory ceiling, 413 with details.limit "memoryMb".`,
    `Per network address: ${n(requestsPerMinute)} requests a minute (CALC_RATE_LIMIT_PER_MINUTE) and ${n(linesPerMinute)} equation lines a minute (CALC_LINES_PER_MINUTE; one equation counts as one line): 429 with Retry-After.`,
  ];
}

/** The batch's own cheap checks, before anything is parsed: size, line length, equation lines. */
function measureBatchWork(body: unknown, config: AppConfig): number {
  const text = (body as { text?: unknown } | undefined)?.text;
  // Not a string: validation answers 400 next; count it as one line meanwhile.
  if (typeof text !== 'string') return 1;
  return Math.max(1, measureBatchText(text, config.calc.limits).equationLines);
}

/** Public calculations: anyone (and any script) may balance equations, within the work limits. */
export const balanceRoutes = [
  defineRoute({
    method: 'post',
    path: '/balance',
    summary: 'Balance a chemical equation with exact coefficients',
    description: 'Unreadable text gives 400 parse_error with line, column and what was expected there.',
    tags: ['calculations'],
    access: 'public',
    rateLimit: 'calc',
    describeLimits: sharedLimits,
    request: { body: balanceInputSchema },
    responses: { 200: balanceResultSchema },
    handler: ({ ctx, body }) => balanceEquation(ctx, body),
  }),
  defineRoute({
    method: 'post',
    path: '/balance/batch',
    summary: 'Balance many equations, one per line',
    description:
      'Each line gets its result or its own parse error; one bad line does not fail the batch. Blank lines and lines starting with # are skipped and do not count as equation lines.',
    tags: ['calculations'],
    access: 'public',
    rateLimit: 'calc',
    measureWork: measureBatchWork,
    describeLimits: (config) => [
      `At most ${n(config.calc.limits.maxBatchLines)} equation lines (CALC_MAX_BATCH_LINES) and ${n(config.calc.limits.maxBatchBytes)} bytes of text (CALC_MAX_BATCH_BYTES) in one batch, checked before any parsing: 413 payload_too_large with details {limit: "batchLines" | "batchBytes", max, found}. A line longer than one equation may be gives 413 with details.limit "equationLength" and details.line.`,
      `A line over the term or species limit gets its own error entry (code payload_too_large, with the limit); the other lines are balanced as usual.`,
      ...sharedLimits(config),
    ],
    request: { body: balanceBatchInputSchema },
    responses: { 200: balanceBatchResultSchema },
    handler: ({ ctx, body }) => balanceBatch(ctx, body),
  }),
];
