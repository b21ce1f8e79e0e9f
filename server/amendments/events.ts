import type { AmendmentAction, AmendmentState } from '@shared/schemas/amendments';
import type { ServiceContext } from '../context';
import { deliverAmendmentNews, type AmendmentNews } from '../services/notifications.service';

/**
 * What happened to an amendment, announced once its transaction has committed. This is the one
 * place where news of amendments leaves the service: a log line, and e-mail (to curators when one
 * enters the review queue; to the author on comments, acceptance, return and decline), sent as a
 * background job (`ctx.jobs.run`), never inside the transaction. Every event is also in
 * `amendment_events`.
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
  /** The comment's text (action comment). */
  comment?: string;
  /** The revision an acceptance made. */
  revision?: number;
}

/** The e-mail a notice calls for, if any. */
export function newsFor(notice: AmendmentNotice): AmendmentNews | null {
  const base = { amendmentId: notice.amendmentId, actorId: notice.actor.id };
  const news = { title: notice.title, actorName: notice.actor.name };
  const author = notice.authorId === null ? [] : [notice.authorId];
  switch (notice.action) {
    case 'open':
      return { ...base, kind: 'amendment-opened', recipients: 'curators', news: { ...news, what: 'opened' } };
    case 'comment':
      return {
        ...base,
        kind: 'amendment-comment',
        recipients: author,
        news: { ...news, what: 'comment', comment: notice.comment ?? null },
      };
    case 'accept':
      return {
        ...base,
        kind: 'amendment-decision',
        recipients: author,
        news: { ...news, what: 'accepted', revision: notice.revision ?? null },
      };
    case 'return':
    case 'decline':
      return {
        ...base,
        kind: 'amendment-decision',
        recipients: author,
        news: { ...news, what: notice.action === 'return' ? 'returned' : 'declined', reason: notice.reason ?? null },
      };
    default:
      return null;
  }
}

export function amendmentChanged(ctx: ServiceContext, notice: AmendmentNotice): void {
  ctx.log.info(
    {
      amendment: notice.amendmentId,
      action: notice.action,
      from: notice.from,
      to: notice.to,
      revision: notice.revision,
    },
    `amendment ${notice.action}: ${notice.title}`,
  );
  const news = newsFor(notice);
  if (news) ctx.jobs.run('amendment-mail', () => deliverAmendmentNews(ctx, news));
}
