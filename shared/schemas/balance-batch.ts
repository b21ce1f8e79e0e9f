import { z } from 'zod';
import { balanceResultSchema, parseErrorDetailsSchema, workLimitDetailsSchema } from './balance';

/** POST /api/v1/balance/batch request: one equation per line; blank lines and "#" comments are skipped. */
export const balanceBatchInputSchema = z.object({
  // The configured batch limits (CALC_MAX_BATCH_BYTES, CALC_MAX_BATCH_LINES) apply first, with 413.
  text: z.string().min(1, 'Type at least one equation.').max(2_000_000),
});
export type BalanceBatchInput = z.infer<typeof balanceBatchInputSchema>;

/**
 * One line of a batch: its balance result, or why it could not be balanced (line numbers from 1).
 * `details` places the problem in the whole input; for a line over a work limit it points at the
 * line's start and `limit` says which limit.
 */
export const balanceBatchLineSchema = z.union([
  z.object({ line: z.number().int().min(1), source: z.string(), result: balanceResultSchema }),
  z.object({
    line: z.number().int().min(1),
    source: z.string(),
    error: z.object({
      message: z.string(),
      details: parseErrorDetailsSchema,
      /** Added: the error code, as the single-equation endpoint would answer it. */
      code: z.enum(['parse_error', 'payload_too_large', 'validation_failed', 'unprocessable']).optional(),
      /** Added: the message without its place (for tables that show line and column apart). */
      problem: z.string().optional(),
      /** Added for `payload_too_large`: the limit, its value and what the line has. */
      limit: workLimitDetailsSchema.optional(),
    }),
  }),
]);
export type BalanceBatchLine = z.infer<typeof balanceBatchLineSchema>;

/** POST /api/v1/balance/batch reply, lines in input order. */
export const balanceBatchResultSchema = z.object({ results: z.array(balanceBatchLineSchema) });
export type BalanceBatchResult = z.infer<typeof balanceBatchResultSchema>;
