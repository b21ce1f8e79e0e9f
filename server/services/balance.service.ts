import type { BalanceInput } from '@shared/schemas/balance';
import type { BalanceBatchInput } from '@shared/schemas/balance-batch';
import type { ServiceContext } from '../context';
import { RawJson } from '../lib/raw-json';

/** Balances one equation in the calculation pool, within the work limits and the time budget. */
export async function balanceEquation(ctx: ServiceContext, input: BalanceInput): Promise<RawJson> {
  return new RawJson(await ctx.calc.run({ kind: 'balance', input }));
}

/** Balances one equation per line in the calculation pool; the size checks ran before (measureBatchWork). */
export async function balanceBatch(ctx: ServiceContext, input: BalanceBatchInput): Promise<RawJson> {
  return new RawJson(await ctx.calc.run({ kind: 'batch', text: input.text }));
}
