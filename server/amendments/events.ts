import type { AmendmentAction, AmendmentState } from '@shared/schemas/amendments';
import type { ServiceContext } from '../context';

/**
 * What happened to an amendment, announced once its transaction has committed. This is the one
 * place where news of amendments leaves the service: today it writes one log line; e-mail
 * notifications (to the author on return, decline and acceptance, to curators when one opens)
 * hook in here, as a background job (`ctx.jobs.run`), never inside the transaction. Every event
 * is also in `amendment_events` (serial ids), which a notification job can read from.
 */
export interface AmendmentNotice {
  amendmentId: string;
  title: string;
  action: AmendmentAction | 'comment';
  from: AmendmentState | null;
  to: AmendmentState;
  actor: { id: string; name: string };
  authorId: string | null;
  reason?: string | null;
  /** The revision an acceptance made. */
  revision?: number;
}

export function amendmentChanged(ctx: ServiceContext, notice: AmendmentNotice): void {
  ctx.log.info(
    { amendment: notice.amendmentId, action: notice.action, from: notice.from, to: notice.to, revision: notice.revision },
    `amendment ${notice.action}: ${notice.title}`,
  );
}
