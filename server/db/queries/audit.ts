import type { RequestMeta } from '../../context';
import type { Executor } from '../client';
import { auditLog } from '../tables/index';

/** The security events the audit log records. */
export type AuditAction =
  | 'sign_in.succeeded'
  | 'sign_in.failed'
  | 'sign_out'
  | 'password_reset.requested'
  | 'password_reset.mail_failed'
  | 'password_reset.completed'
  | 'password.changed'
  | 'token.created'
  | 'token.revoked'
  | 'invitation.created'
  | 'invitation.mail_failed'
  | 'invitation.revoked'
  | 'invitation.accepted'
  | 'member.role_changed'
  | 'member.removed'
  | 'user.created'
  | 'user.site_roles_changed'
  | 'user.disabled'
  | 'user.enabled'
  | 'team.created'
  | 'library.imported'
  | 'library.amendment_accepted';

export interface AuditEntry {
  action: AuditAction;
  actor?: { id: string; email: string } | null;
  /** For events without a signed-in actor (failed sign-in), the e-mail that was tried. */
  actorEmail?: string | null;
  meta?: Pick<RequestMeta, 'ip'> | null;
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
