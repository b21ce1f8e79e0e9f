import { sql } from 'drizzle-orm';
import { healthSchema } from '@shared/schemas/admin';
import { defineRoute } from './registry';

/** Liveness and database check, for load balancers and the status line. */
export const healthRoutes = [
  defineRoute({
    method: 'get',
    path: '/health',
    summary: 'Server and database status',
    tags: ['system'],
    access: 'public',
    responses: { 200: healthSchema, 503: healthSchema },
    async handler({ deps, res }) {
      let database: 'ok' | 'down' = 'ok';
      try {
        await deps.db.execute(sql`select 1`);
      } catch {
        database = 'down';
      }
      const body = { status: database === 'ok' ? 'ok' : 'degraded', database, version: deps.config.version } as const;
      if (database === 'down') res.status(503).json(body);
      return body;
    },
  }),
];
