import { balanceBatchRequest, balanceRequest } from '@shared/chemistry/index';
import { balanceInputSchema, balanceResultSchema } from '@shared/schemas/balance';
import { balanceBatchInputSchema, balanceBatchResultSchema } from '@shared/schemas/balance-batch';
import { defineRoute } from './registry';

/** Public calculations: anyone (and any script) may balance equations, within a per-address rate. */
export const balanceRoutes = [
  defineRoute({
    method: 'post',
    path: '/balance',
    summary: 'Balance a chemical equation with exact coefficients',
    description: 'Unreadable text gives 400 parse_error with line, column and what was expected there.',
    tags: ['calculations'],
    access: 'public',
    rateLimit: 'calc',
    request: { body: balanceInputSchema },
    responses: { 200: balanceResultSchema },
    handler: ({ body }) => balanceRequest(body),
  }),
  defineRoute({
    method: 'post',
    path: '/balance/batch',
    summary: 'Balance many equations, one per line',
    description: 'Each line gets its result or its own parse error; one bad line does not fail the batch.',
    tags: ['calculations'],
    access: 'public',
    rateLimit: 'calc',
    request: { body: balanceBatchInputSchema },
    responses: { 200: balanceBatchResultSchema },
    handler: ({ body }) => balanceBatchRequest(body),
  }),
];
