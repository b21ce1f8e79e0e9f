import { z } from 'zod';
import { balanceResultSchema, parseErrorDetailsSchema } from './balance';

/** POST /api/v1/balance/batch request: one equation per line; blank lines and "#" comments are skipped. */
export const balanceBatchInputSchema = z.object({
  text: z.string().min(1, 'Type at least one equation.').max(200_000),
});
export type BalanceBatchInput = z.infer<typeof balanceBatchInputSchema>;

/** One line of a batch: its balance result, or why it could not be read (line numbers from 1). */
export const balanceBatchLineSchema = z.union([
  z.object({ line: z.number().int().min(1), source: z.string(), result: balanceResultSchema }),
  z.object({
    line: z.number().int().min(1),
    source: z.string(),
    error: z.object({ message: z.string(), details: parseErrorDetailsSchema }),
  }),
]);
export type BalanceBatchLine = z.infer<typeof balanceBatchLineSchema>;

/** POST /api/v1/balance/batch reply, lines in input order. */
export const balanceBatchResultSchema = z.object({ results: z.array(balanceBatchLineSchema) });
export type BalanceBatchResult = z.infer<typeof balanceBatchResultSchema>;
