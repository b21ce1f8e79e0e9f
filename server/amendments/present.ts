import type {
  AmendmentComment,
  AmendmentConflict,
  AmendmentSummary,
  amendmentEventSchema,
} from '@shared/schemas/amendments';
import type { z } from 'zod';
import type { amendmentComments, amendmentEvents, amendments } from '../db/tables/index';
import { identityLabel } from '../library/identities';

/** Amendment rows → API shapes (shared/schemas/amendments.ts). */

type AmendmentRow = typeof amendments.$inferSelect;

export function presentSummary(
  row: AmendmentRow,
  extra: { species: string[]; commentCount: number },
): AmendmentSummary {
  return {
    id: row.id,
    title: row.title,
    state: row.state,
    author: { id: row.authorId, name: row.authorName },
    baseRevision: row.baseRevision,
    resultRevision: row.resultRevision,
    revertOf: row.revertOf,
    origin: row.origin,
    entryCount: row.entryCount,
    species: extra.species.slice(0, 20),
    commentCount: extra.commentCount,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    openedAt: row.openedAt?.toISOString() ?? null,
    closedAt: row.closedAt?.toISOString() ?? null,
  };
}

export function presentComment(row: typeof amendmentComments.$inferSelect): AmendmentComment {
  return {
    id: row.id,
    author: { id: row.authorId, name: row.authorName },
    body: row.body,
    createdAt: row.createdAt.toISOString(),
  };
}

export function presentEvent(row: typeof amendmentEvents.$inferSelect): z.infer<typeof amendmentEventSchema> {
  return {
    action: row.action,
    from: row.fromState,
    to: row.toState,
    by: row.actorName === null ? null : { id: row.actorId, name: row.actorName },
    at: row.at.toISOString(),
    reason: row.reason,
    detail: row.detail,
  };
}

/**
 * The later revisions that touched what an amendment targets: each with the identities both
 * share, in words.
 */
export function conflictsWith(
  targets: readonly string[],
  later: readonly { number: number; amendmentId: string | null; summary: string; touched: string[] }[],
): AmendmentConflict[] {
  const wanted = new Set(targets);
  const out: AmendmentConflict[] = [];
  for (const revision of later) {
    const shared = revision.touched.filter((identity) => wanted.has(identity));
    if (shared.length === 0) continue;
    out.push({
      revision: revision.number,
      amendmentId: revision.amendmentId,
      title: revision.summary,
      targets: shared.map((identity) => ({ identity, label: identityLabel(identity) })),
    });
  }
  return out;
}
