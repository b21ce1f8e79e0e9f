import { sql } from 'drizzle-orm';
import type { ServiceContext } from '../context';

export interface Health {
  status: 'ok' | 'degraded';
  database: 'ok' | 'down';
  version: string;
}

/** Whether the database answers; never throws, so a load balancer always gets a reply. */
export async function checkHealth(ctx: ServiceContext, _input: object = {}): Promise<Health> {
  let database: Health['database'] = 'ok';
  try {
    await ctx.db.execute(sql`select 1`);
  } catch (err) {
    database = 'down';
    ctx.log.error({ err, requestId: ctx.meta.requestId }, 'health check: the database does not answer');
  }
  return { status: database === 'ok' ? 'ok' : 'degraded', database, version: ctx.config.version };
}
