import { desc, eq, gt, sql } from 'drizzle-orm';
import type { RevisionKind } from '@shared/schemas/library-core';
import type { Db, Executor, Tx } from '../db/client';
import { libraryRevisions } from '../db/tables/index';

/** Arbitrary constant key of the advisory lock that serialises library writes across servers. */
const LIBRARY_WRITE_LOCK = 7_314_905_377;

/** The newest revision number, or null for an empty library. */
export async function currentRevision(db: Executor): Promise<number | null> {
  const [row] = await db
    .select({ number: libraryRevisions.number })
    .from(libraryRevisions)
    .orderBy(desc(libraryRevisions.number))
    .limit(1);
  return row?.number ?? null;
}

export interface NewRevision {
  kind: RevisionKind;
  summary: string;
  actor?: { id: string; email: string } | null;
  /** The amendment whose acceptance makes this revision. */
  amendmentId?: string;
  detail?: Record<string, unknown>;
}

/**
 * Runs `change` in one transaction that first takes the library write lock and creates the next
 * revision; everything the change writes carries that number. Either all of it lands or none.
 */
export async function withNewRevision<T>(
  db: Db,
  revision: NewRevision,
  change: (tx: Tx, number: number) => Promise<T>,
): Promise<{ number: number; result: T }> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${LIBRARY_WRITE_LOCK})`);
    const number = ((await currentRevision(tx)) ?? 0) + 1;
    await tx.insert(libraryRevisions).values({
      number,
      kind: revision.kind,
      summary: revision.summary,
      createdBy: revision.actor?.id ?? null,
      createdByEmail: revision.actor?.email ?? null,
      amendmentId: revision.amendmentId ?? null,
      detail: revision.detail ?? {},
    });
    const result = await change(tx, number);
    return { number, result };
  });
}

/** Updates the stored detail of a revision (counts known only after the change ran), and what it touched. */
export async function setRevisionDetail(
  tx: Executor,
  number: number,
  detail: Record<string, unknown>,
  touched?: string[],
): Promise<void> {
  await tx
    .update(libraryRevisions)
    .set({ detail, ...(touched ? { touched } : {}) })
    .where(eq(libraryRevisions.number, number));
}

/** The revisions after `after` with what each touched, oldest first (for conflict checks). */
export async function revisionsAfter(
  db: Executor,
  after: number,
): Promise<{ number: number; amendmentId: string | null; summary: string; touched: string[] }[]> {
  return db
    .select({
      number: libraryRevisions.number,
      amendmentId: libraryRevisions.amendmentId,
      summary: libraryRevisions.summary,
      touched: libraryRevisions.touched,
    })
    .from(libraryRevisions)
    .where(gt(libraryRevisions.number, after))
    .orderBy(libraryRevisions.number);
}
