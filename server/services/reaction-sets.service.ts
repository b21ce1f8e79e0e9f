import { randomUUID } from 'node:crypto';
import { and, desc, eq, sql } from 'drizzle-orm';
import { diffSetStates } from '@shared/reaction-sets/diff';
import type {
  CreateSetInput,
  ReactionSet,
  SetDiff,
  SetImportInput,
  SetItem,
  SetItemInput,
  SetList,
  SetListQuery,
  SetRevision,
  SetState,
  SetSummary,
  SetVersion,
  UpdateSetInput,
} from '@shared/schemas/reaction-sets';
import type { ActorContext, ServiceContext } from '../context';
import type { Executor, Tx } from '../db/client';
import { reactionSets, reactionSetVersions, type ReactionSetRow } from '../db/tables/index';
import { AppError, errors } from '../errors';

/**
 * Reaction sets: create, read, list, edit with optimistic concurrency, versions, diff, restore,
 * import. Every change of a set writes its next version in the same transaction; a save that
 * names a version other than the current one is refused (409) with the set as it is now.
 */

type Who = { id: string; name: string };
const who = (ctx: ActorContext): Who => ({ id: ctx.actor.user.id, name: ctx.actor.user.displayName });

export function stateOf(row: Pick<ReactionSetRow, 'title' | 'description' | 'tags' | 'items' | 'pinnedRevision'>) {
  return {
    title: row.title,
    description: row.description,
    tags: row.tags,
    items: row.items,
    revision: row.pinnedRevision ?? 'latest',
  } satisfies SetState;
}

export function toReactionSet(row: ReactionSetRow): ReactionSet {
  return {
    id: row.id,
    teamId: row.teamId,
    ...stateOf(row),
    version: row.version,
    owner: row.ownerName,
    createdAt: row.createdAt.toISOString(),
    updatedBy: row.updatedByName,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** Items as stored: every one with an id (a new one when the sender gave none). */
export function withIds(items: readonly SetItemInput[]): SetItem[] {
  return items.map((item) => ({ ...item, id: item.id ?? randomUUID() }) as SetItem);
}

/** A set of this team, or 404 (another team's set is simply not found). */
export async function findSet(exec: Executor, teamId: string, setId: string, lock = false): Promise<ReactionSetRow> {
  const query = exec
    .select()
    .from(reactionSets)
    .where(and(eq(reactionSets.id, setId), eq(reactionSets.teamId, teamId)))
    .limit(1);
  const [row] = lock ? await query.for('update') : await query;
  if (!row) throw errors.notFound('The reaction set');
  return row;
}

/** A pinned revision must exist; "latest" always does. Returns the column value (null: latest). */
async function pinnedColumn(ctx: ServiceContext, revision: SetRevision | undefined, path: string[]) {
  const latest = await ctx.library.latestRevision();
  if (revision === 'latest') return null;
  if (revision === undefined) return latest;
  if (latest === null || revision > latest)
    throw errors.validation(
      ['body', ...path],
      latest === null
        ? 'The library is empty: there is no revision to pin yet; use "latest".'
        : `There is no library revision ${revision}; the newest is ${latest}.`,
    );
  return revision;
}

/** "Title changed; 2 items added, 1 changed" — the words a version is listed with. */
export function summarizeDiff(diff: SetDiff): string {
  const parts: string[] = [];
  const fieldWords = { title: 'title', description: 'description', tags: 'tags', revision: 'library revision' };
  if (diff.fields.length > 0) {
    const words = diff.fields.map((f) => fieldWords[f.field]).join(', ');
    parts.push(`${words[0]!.toUpperCase()}${words.slice(1)} changed`);
  }
  const counts = { added: 0, changed: 0, removed: 0 };
  for (const item of diff.items) counts[item.change]++;
  const itemWords = Object.entries(counts)
    .filter(([, n]) => n > 0)
    .map(([change, n]) => `${n} ${change}`);
  if (itemWords.length > 0) {
    const total = counts.added + counts.changed + counts.removed;
    parts.push(`${total === 1 ? 'item' : 'items'} ${itemWords.join(', ')}`);
  }
  if (diff.reordered) parts.push('items reordered');
  return parts.join('; ') || 'No change';
}

async function insertVersion(tx: Tx, row: ReactionSetRow, summary: string, by: Who): Promise<void> {
  await tx.insert(reactionSetVersions).values({
    setId: row.id,
    version: row.version,
    title: row.title,
    description: row.description,
    tags: row.tags,
    items: row.items,
    pinnedRevision: row.pinnedRevision,
    summary,
    byId: by.id,
    byName: by.name,
    createdAt: row.updatedAt,
  });
}

/** Inserts a new set as version 1 (create, import, copy from a link). */
export async function insertSet(
  ctx: ActorContext,
  input: { teamId: string; state: Omit<SetState, 'revision'>; pinnedRevision: number | null; summary: string },
): Promise<ReactionSet> {
  const by = who(ctx);
  return ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(reactionSets)
      .values({
        teamId: input.teamId,
        title: input.state.title,
        description: input.state.description,
        tags: input.state.tags,
        items: input.state.items,
        pinnedRevision: input.pinnedRevision,
        version: 1,
        ownerId: by.id,
        ownerName: by.name,
        updatedById: by.id,
        updatedByName: by.name,
      })
      .returning();
    await insertVersion(tx, row!, input.summary, by);
    return toReactionSet(row!);
  });
}

export async function createSet(ctx: ActorContext, input: CreateSetInput & { teamId: string }): Promise<ReactionSet> {
  const pinnedRevision = await pinnedColumn(ctx, input.revision, ['revision']);
  return insertSet(ctx, {
    teamId: input.teamId,
    state: {
      title: input.title,
      description: input.description ?? '',
      tags: dedupe(input.tags ?? []),
      items: withIds(input.items ?? []),
    },
    pinnedRevision,
    summary: 'Created',
  });
}

/** Reads an exported set back into a team: the same items (ids included), title, tags and revision. */
export async function importSet(ctx: ActorContext, input: SetImportInput & { teamId: string }): Promise<ReactionSet> {
  const pinnedRevision = await pinnedColumn(ctx, input.set.revision, ['set', 'revision']);
  return insertSet(ctx, {
    teamId: input.teamId,
    state: {
      title: input.set.title,
      description: input.set.description,
      tags: dedupe(input.set.tags),
      items: withIds(input.set.items),
    },
    pinnedRevision,
    summary: 'Imported from a JSON export',
  });
}

function dedupe(tags: string[]): string[] {
  return [...new Set(tags)];
}

function conflict(current: ReactionSetRow, sent: number): AppError {
  return errors.conflict(
    `This set was changed by ${current.updatedByName} (version ${current.version}) after the version ${sent} you edited. Reload it, or apply your edit again on top.`,
    { currentVersion: current.version, current: toReactionSet(current) },
  );
}

/**
 * Saves a new state when `version` is still the current one; the row is locked for the check, so
 * of two saves of the same version exactly one wins and the other gets 409 with the set as the
 * winner left it. A save that changes nothing makes no new version.
 */
async function saveState(
  ctx: ActorContext,
  ref: { teamId: string; setId: string; version: number },
  // Runs inside the transaction: reads go through `tx`, never the outer db (PGlite has one connection).
  next: (
    row: ReactionSetRow,
    tx: Tx,
  ) => Promise<{ state: SetState; summary?: string }> | { state: SetState; summary?: string },
): Promise<ReactionSet> {
  const by = who(ctx);
  return ctx.db.transaction(async (tx) => {
    const row = await findSet(tx, ref.teamId, ref.setId, true);
    if (row.version !== ref.version) throw conflict(row, ref.version);
    const { state, summary } = await next(row, tx);
    const diff = diffSetStates(stateOf(row), state);
    if (diff.fields.length === 0 && diff.items.length === 0 && !diff.reordered) return toReactionSet(row);
    const [updated] = await tx
      .update(reactionSets)
      .set({
        title: state.title,
        description: state.description,
        tags: state.tags,
        items: state.items,
        pinnedRevision: state.revision === 'latest' ? null : state.revision,
        version: sql`${reactionSets.version} + 1`,
        updatedById: by.id,
        updatedByName: by.name,
        updatedAt: new Date(),
      })
      .where(and(eq(reactionSets.id, row.id), eq(reactionSets.version, row.version)))
      .returning();
    // The row lock makes this unreachable; kept so a lost race can never pass as a success.
    if (!updated) throw conflict(await findSet(tx, ref.teamId, ref.setId), ref.version);
    await insertVersion(tx, updated, summary ?? summarizeDiff(diff), by);
    return toReactionSet(updated);
  });
}

export async function updateSet(
  ctx: ActorContext,
  input: UpdateSetInput & { teamId: string; setId: string },
): Promise<ReactionSet> {
  const pinned = input.revision === undefined ? undefined : await pinnedColumn(ctx, input.revision, ['revision']);
  return saveState(ctx, input, (row) => {
    const current = stateOf(row);
    return {
      state: {
        title: input.title ?? current.title,
        description: input.description ?? current.description,
        tags: input.tags ? dedupe(input.tags) : current.tags,
        items: input.items ? withIds(input.items) : current.items,
        revision: pinned === undefined ? current.revision : (pinned ?? 'latest'),
      },
    };
  });
}

export async function getSet(ctx: ServiceContext, input: { teamId: string; setId: string }): Promise<ReactionSet> {
  return toReactionSet(await findSet(ctx.db, input.teamId, input.setId));
}

export async function deleteSet(ctx: ActorContext, input: { teamId: string; setId: string }): Promise<void> {
  const [row] = await ctx.db
    .delete(reactionSets)
    .where(and(eq(reactionSets.id, input.setId), eq(reactionSets.teamId, input.teamId)))
    .returning({ id: reactionSets.id });
  if (!row) throw errors.notFound('The reaction set');
}

const compareBy: Record<SetListQuery['sort'], (a: SetSummary, b: SetSummary) => number> = {
  title: (a, b) => a.title.localeCompare(b.title) || a.id.localeCompare(b.id),
  owner: (a, b) => a.owner.localeCompare(b.owner) || a.title.localeCompare(b.title),
  updated: (a, b) => a.updatedAt.localeCompare(b.updatedAt) || a.id.localeCompare(b.id),
};

/** The team's sets as summaries: searched, filtered by tag, sorted and paged. */
export async function listSets(ctx: ServiceContext, input: SetListQuery & { teamId: string }): Promise<SetList> {
  const rows = await ctx.db
    .select({
      id: reactionSets.id,
      title: reactionSets.title,
      description: reactionSets.description,
      tags: reactionSets.tags,
      itemCount: sql<number>`jsonb_array_length(${reactionSets.items})`,
      pinnedRevision: reactionSets.pinnedRevision,
      version: reactionSets.version,
      owner: reactionSets.ownerName,
      updatedBy: reactionSets.updatedByName,
      updatedAt: reactionSets.updatedAt,
    })
    .from(reactionSets)
    .where(eq(reactionSets.teamId, input.teamId))
    .orderBy(desc(reactionSets.updatedAt));
  const words = (input.q ?? '').toLowerCase().split(/\s+/).filter(Boolean);
  const tag = input.tag?.toLowerCase();
  let items: SetSummary[] = rows
    .map((r) => ({
      id: r.id,
      title: r.title,
      description: r.description,
      tags: r.tags,
      itemCount: Number(r.itemCount),
      revision: r.pinnedRevision ?? ('latest' as const),
      version: r.version,
      owner: r.owner,
      updatedBy: r.updatedBy,
      updatedAt: r.updatedAt.toISOString(),
    }))
    .filter((s) => {
      if (tag && !s.tags.some((t) => t.toLowerCase() === tag)) return false;
      const text = `${s.title} ${s.description} ${s.tags.join(' ')}`.toLowerCase();
      return words.every((w) => text.includes(w));
    })
    .sort(compareBy[input.sort]);
  const order = input.order ?? (input.sort === 'updated' ? 'desc' : 'asc');
  if (order === 'desc') items.reverse();
  const total = items.length;
  items = items.slice(input.offset, input.offset + input.limit);
  return { items, total };
}

function toVersion(row: typeof reactionSetVersions.$inferSelect): SetVersion {
  return {
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    by: row.byName,
    summary: row.summary,
    state: stateOf(row),
  };
}

export async function listVersions(ctx: ServiceContext, input: { teamId: string; setId: string }) {
  await findSet(ctx.db, input.teamId, input.setId);
  const rows = await ctx.db
    .select({
      version: reactionSetVersions.version,
      createdAt: reactionSetVersions.createdAt,
      by: reactionSetVersions.byName,
      summary: reactionSetVersions.summary,
    })
    .from(reactionSetVersions)
    .where(eq(reactionSetVersions.setId, input.setId))
    .orderBy(desc(reactionSetVersions.version));
  return { items: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })), total: rows.length };
}

async function findVersion(exec: Executor, setId: string, version: number) {
  const [row] = await exec
    .select()
    .from(reactionSetVersions)
    .where(and(eq(reactionSetVersions.setId, setId), eq(reactionSetVersions.version, version)))
    .limit(1);
  if (!row) throw errors.notFound(`Version ${version} of the set`);
  return row;
}

export async function getVersion(
  ctx: ServiceContext,
  input: { teamId: string; setId: string; version: number },
): Promise<SetVersion> {
  await findSet(ctx.db, input.teamId, input.setId);
  return toVersion(await findVersion(ctx.db, input.setId, input.version));
}

export async function diffVersions(
  ctx: ServiceContext,
  input: { teamId: string; setId: string; from: number; to: number },
): Promise<SetDiff & { from: number; to: number }> {
  await findSet(ctx.db, input.teamId, input.setId);
  const [a, b] = await Promise.all([
    findVersion(ctx.db, input.setId, input.from),
    findVersion(ctx.db, input.setId, input.to),
  ]);
  return { from: input.from, to: input.to, ...diffSetStates(stateOf(a), stateOf(b)) };
}

/** Makes an earlier version the current state again, as a new version (history is never rewritten). */
export async function restoreVersion(
  ctx: ActorContext,
  input: { teamId: string; setId: string; restore: number; version: number },
): Promise<ReactionSet> {
  return saveState(ctx, input, async (row, tx) => {
    const old = await findVersion(tx, row.id, input.restore);
    return { state: stateOf(old), summary: `Restored version ${input.restore}` };
  });
}

/** Moves a pinned set to the newest library revision, as a new version. */
export async function moveToLatest(
  ctx: ActorContext,
  input: { teamId: string; setId: string; version: number },
): Promise<ReactionSet> {
  const latest = await ctx.library.latestRevision();
  if (latest === null) throw new AppError('unavailable', 'The library is empty: it has not been seeded yet.');
  return saveState(ctx, input, (row) => {
    if (row.pinnedRevision === null)
      throw new AppError('unprocessable', 'This set follows the newest library revision already.');
    if (row.pinnedRevision === latest)
      throw new AppError('unprocessable', `This set is pinned to revision ${latest}, the newest one.`);
    return {
      state: { ...stateOf(row), revision: latest },
      summary: `Moved from library revision ${row.pinnedRevision} to ${latest}`,
    };
  });
}
