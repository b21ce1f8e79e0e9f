import { and, desc, lt } from 'drizzle-orm';
import type { AuditEvent } from '@shared/schemas/admin';
import type { Executor } from '../db/client';
import { auditLog } from '../db/tables/index';
import type { RequestMeta } from '../context';

/** The security events the audit log records. */
export type AuditAction =
  | 'sign_in.succeeded'
  | 'sign_in.failed'
  | 'sign_out'
  | 'password_reset.requested'
  | 'password_reset.completed'
  | 'password.changed'
  | 'token.created'
  | 'token.revoked'
  | 'invitation.created'
  | 'invitation.revoked'
  | 'invitation.accepted'
  | 'member.role_changed'
  | 'member.removed'
  | 'user.site_roles_changed'
  | 'user.disabled'
  | 'user.enabled'
  | 'team.created'
  | 'library.imported';

export interface AuditEntry {
  action: AuditAction;
  actor?: { id: string; email: string } | null;
  /** For events without a signed-in actor (failed sign-in), the e-mail that was tried. */
  actorEmail?: string | null;
  meta?: RequestMeta | null;
  detail?: Record<string, unknown>;
}

/** Appends one event; pass the transaction when the event belongs to a change. */
export async function recordAudit(exec: Executor, entry: AuditEntry): Promise<void> {
  await exec.insert(auditLog).values({
    action: entry.action,
    actorId: entry.actor?.id ?? null,
    actorEmail: entry.actor?.email ?? entry.actorEmail ?? null,
    ip: entry.meta?.ip ?? null,
    detail: entry.detail ?? {},
  });
}

/** Newest events first, `limit` of them, older than `before` when given. */
export async function listAuditEvents(
  exec: Executor,
  query: { limit: number; before?: string | undefined },
): Promise<AuditEvent[]> {
  const rows = await exec
    .select()
    .from(auditLog)
    .where(query.before ? and(lt(auditLog.at, new Date(query.before))) : undefined)
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(query.limit);
  return rows.map((r) => ({
    id: r.id,
    at: r.at.toISOString(),
    action: r.action,
    actorEmail: r.actorEmail,
    ip: r.ip,
    detail: r.detail,
  }));
}
