import { balanceResultSchema, type BalanceInput, type BalanceResult } from '@shared/schemas/balance';
import { balanceBatchResultSchema, type BalanceBatchLine } from '@shared/schemas/balance-batch';
import { http } from './http';

/** Balances one equation on the server (public, rate-limited per address). */
export function balanceEquation(input: BalanceInput, signal?: AbortSignal): Promise<BalanceResult> {
  return http.post('/balance', input, { schema: balanceResultSchema, ...(signal ? { signal } : {}) });
}

/** Balances many equations, one per line; each line gets its result or its own parse error. */
export async function balanceBatch(text: string, signal?: AbortSignal): Promise<BalanceBatchLine[]> {
  return (
    await http.post('/balance/batch', { text }, { schema: balanceBatchResultSchema, ...(signal ? { signal } : {}) })
  ).results;
}
