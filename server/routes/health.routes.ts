import { healthSchema } from '@shared/schemas/admin';
import { checkHealth } from '../services/health.service';
import { defineRoute, ReplyWithStatus } from './registry';

/** Liveness and database check, for load balancers and the status line. */
export const healthRoutes = [
  defineRoute({
    method: 'get',
    path: '/health',
    summary: 'Server and database status',
    description: '503 with database "down" when the database does not answer.',
    tags: ['system'],
    access: 'public',
    responses: { 200: healthSchema, 503: healthSchema },
    async handler({ ctx }) {
      const health = await checkHealth(ctx, {});
      return health.database === 'ok' ? health : new ReplyWithStatus(503, health);
    },
  }),
];
