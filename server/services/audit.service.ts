import { desc, lt } from 'drizzle-orm';
import type { AuditEvent } from '@shared/schemas/admin';
import type { ServiceContext } from '../context';
import { auditLog } from '../db/tables/index';

/** Newest events first, `limit` of them, older than `before` when given. */
export async function listAuditEvents(
  ctx: ServiceContext,
  input: { limit: number; before?: string | undefined },
): Promise<{ events: AuditEvent[] }> {
  const rows = await ctx.db
    .select()
    .from(auditLog)
    .where(input.before ? lt(auditLog.at, new Date(input.before)) : undefined)
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(input.limit);
  return {
    events: rows.map((r) => ({
      id: r.id,
      at: r.at.toISOString(),
      action: r.action,
      actorEmail: r.actorEmail,
      ip: r.ip,
      detail: r.detail,
    })),
  };
}
