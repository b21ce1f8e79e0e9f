import { and, asc, count, desc, eq, inArray, isNotNull, ne, or, sql, type SQL } from 'drizzle-orm';
import {
  amendmentEntrySchema,
  amendmentStates,
  type AmendmentAction,
  type AmendmentCounts,
  type AmendmentDetail,
  type AmendmentEntry,
  type AmendmentInput,
  type AmendmentList,
  type AmendmentListQuery,
  type AmendmentReasonInput,
  type AmendmentState,
} from '@shared/schemas/amendments';
import type { ActorContext, ServiceContext } from '../context';
import { recordAudit } from '../db/queries/audit';
import type { Executor } from '../db/client';
import {
  amendmentComments,
  amendmentEntries,
  amendmentEvents,
  amendments,
  libraryRevisions,
  teamDerivedValues,
  teams,
  type AmendmentOrigin,
} from '../db/tables/index';
import { AppError, errors } from '../errors';
import { amendmentChanged, type AmendmentNotice } from '../amendments/events';
import {
  planEntries,
  problemsFromApplier,
  type AmendmentPlan,
  type EntryProblem,
  type TeamValueRow,
} from '../amendments/plan';
import { conflictsWith, presentComment, presentEvent, presentSummary } from '../amendments/present';
import { inverseEntries } from '../amendments/revert';
import { finalStates, mayTake, nextState, refusal, type Reviewer, type transitions } from '../amendments/states';
import { applyLibraryChanges, SetConflictError } from '../library/apply-set';
import { currentRevision, revisionsAfter, setRevisionDetail, withNewRevision } from '../library/revisions';
import { computeImpact } from './amendment-impact.service';
import { evidenceRows, presentEvidence } from './amendment-files.service';
import { isProposer, teamRolesOf } from './membership.service';
import { snapshotFor } from './library.service';

/**
 * Amendments: proposing library changes, reviewing them, and applying an accepted one as a new
 * revision. Every change to the library goes through here (apply-set.ts does the writing).
 *
 * Who sees what: any signed-in user reads amendments that are not drafts; a draft is seen by its
 * author only (others get 404). Members (or team admins) of a team and curators propose; curators
 * review, never their own amendment.
 */

type AmendmentRow = typeof amendments.$inferSelect;

/** Thrown inside the accept transaction when another revision landed since the plan was made. */
class StaleSnapshot extends Error {}

const ENTRY_CHUNK = 500;

function actorOf(ctx: ActorContext) {
  return { id: ctx.actor.user.id, name: ctx.actor.user.displayName, email: ctx.actor.user.email };
}

function isCurator(ctx: ServiceContext): boolean {
  return ctx.actor?.user.siteRoles.includes('curator') ?? false;
}

async function reviewerOf(ctx: ServiceContext, row: AmendmentRow): Promise<Reviewer> {
  return {
    isAuthor: ctx.actor !== null && row.authorId === ctx.actor.user.id,
    isCurator: isCurator(ctx),
    isProposer: await isProposer(ctx),
  };
}

function visible(ctx: ServiceContext, row: AmendmentRow): boolean {
  return row.state !== 'draft' || (ctx.actor !== null && row.authorId === ctx.actor.user.id);
}

/** The amendment if the caller may see it, else 404 (a draft of someone else does not exist for them). */
async function loadVisible(
  ctx: ServiceContext,
  db: Executor,
  amendmentId: string,
  lock = false,
): Promise<AmendmentRow> {
  const query = db.select().from(amendments).where(eq(amendments.id, amendmentId));
  const [row] = lock ? await query.for('update') : await query;
  if (!row || !visible(ctx, row)) throw errors.notFound('The amendment');
  return row;
}

/** 404, then 403, then 409 (naming the state): the order every action checks in. */
async function checkAction(
  ctx: ServiceContext,
  amendmentId: string,
  action: keyof typeof transitions,
): Promise<{ row: AmendmentRow; to: AmendmentState }> {
  const row = await loadVisible(ctx, ctx.db, amendmentId);
  const who = await reviewerOf(ctx, row);
  if (!mayTake(action, who)) throw refusal(action, who);
  return { row, to: nextState(row.state, action) };
}

async function loadEntries(db: Executor, amendmentId: string): Promise<AmendmentEntry[]> {
  const rows = await db
    .select({ payload: amendmentEntries.payload })
    .from(amendmentEntries)
    .where(eq(amendmentEntries.amendmentId, amendmentId))
    .orderBy(asc(amendmentEntries.position));
  return rows.map((r) => r.payload as AmendmentEntry);
}

/**
 * The team derived values that team-value entries name, with their team's name. With `caller`,
 * only values of teams where the caller is a member or team admin (proposing); without, any
 * (reviewing and applying what an author could propose).
 */
async function teamValuesFor(
  ctx: ServiceContext,
  entries: readonly AmendmentEntry[],
  caller: 'caller' | 'any',
): Promise<Map<string, TeamValueRow>> {
  const ids = [...new Set(entries.flatMap((e) => (e.kind === 'team-value' ? [e.derivedValueId] : [])))];
  if (ids.length === 0) return new Map();
  const rows = await ctx.db
    .select({ value: teamDerivedValues, teamName: teams.name })
    .from(teamDerivedValues)
    .innerJoin(teams, eq(teams.id, teamDerivedValues.teamId))
    .where(inArray(teamDerivedValues.id, ids));
  const roles = caller === 'caller' ? await teamRolesOf(ctx) : null;
  const out = new Map<string, TeamValueRow>();
  for (const { value, teamName } of rows) {
    const role = roles?.get(value.teamId);
    if (roles && role !== 'member' && role !== 'team_admin') continue;
    out.set(value.id, { ...value, teamName });
  }
  return out;
}

function problemText(p: EntryProblem): string {
  if (p.entry === null) return p.message;
  const field = p.field.length > 0 ? `.${p.field.join('.')}` : '';
  return `entries.${p.entry}${field}: ${p.message}`;
}

/** Entry problems as one error: 400 for bad input, 409 when the library moved under an amendment. */
function entryProblems(problems: readonly EntryProblem[], code: 'validation_failed' | 'conflict', lead: string) {
  const shown = problems.slice(0, 200);
  return new AppError(
    code,
    `${lead}: ${problems
      .slice(0, 3)
      .map(problemText)
      .join('; ')}${problems.length > 3 ? ` (and ${problems.length - 3} more)` : ''}.`,
    {
      issues: shown.map((p) => ({
        path: p.entry === null ? ['body', 'entries'] : ['body', 'entries', p.entry, ...p.field],
        message: p.message,
      })),
      problems: shown,
      total: problems.length,
    },
  );
}

async function insertEntries(
  tx: Executor,
  amendmentId: string,
  entries: readonly AmendmentEntry[],
  plan: AmendmentPlan,
) {
  const rows = entries.map((entry, position) => ({
    amendmentId,
    position,
    kind: entry.kind,
    payload: entry as Record<string, unknown>,
    speciesKey: plan.entrySpecies[position]?.key ?? null,
    speciesId: plan.entrySpecies[position]?.id ?? null,
  }));
  for (let i = 0; i < rows.length; i += ENTRY_CHUNK)
    await tx.insert(amendmentEntries).values(rows.slice(i, i + ENTRY_CHUNK));
}

async function recordEvent(
  tx: Executor,
  row: Pick<AmendmentRow, 'id'>,
  event: {
    action: AmendmentAction;
    from: AmendmentState | null;
    to: AmendmentState;
    actor: { id: string; name: string };
    reason?: string | null;
    detail?: Record<string, unknown>;
  },
): Promise<void> {
  await tx.insert(amendmentEvents).values({
    amendmentId: row.id,
    action: event.action,
    fromState: event.from,
    toState: event.to,
    actorId: event.actor.id,
    actorName: event.actor.name,
    reason: event.reason ?? null,
    detail: event.detail ?? {},
  });
}

function notice(
  row: AmendmentRow,
  ctx: ActorContext,
  rest: Omit<AmendmentNotice, 'amendmentId' | 'title' | 'actor' | 'authorId'>,
) {
  amendmentChanged(ctx, {
    amendmentId: row.id,
    title: row.title,
    actor: actorOf(ctx),
    authorId: row.authorId,
    ...rest,
  });
}

/** Plans entries against a revision for review; bad entries are a 400 naming entry and field. */
async function planForReview(
  ctx: ServiceContext,
  input: { title: string; entries: readonly AmendmentEntry[] },
  revision: number | undefined,
  teamAccess: 'caller' | 'any',
): Promise<AmendmentPlan> {
  const snapshot = await snapshotFor(ctx.library, revision);
  const teamValues = await teamValuesFor(ctx, input.entries, teamAccess);
  return planEntries({ snapshot, entries: input.entries, title: input.title, teamValues, mode: 'review' });
}

// ——— Reading ———

/** Species keys and comment counts of a page of amendments. */
async function listExtras(db: Executor, ids: string[]) {
  if (ids.length === 0) return { species: new Map<string, string[]>(), comments: new Map<string, number>() };
  const [speciesRows, commentRows] = await Promise.all([
    db
      .selectDistinct({ amendmentId: amendmentEntries.amendmentId, key: amendmentEntries.speciesKey })
      .from(amendmentEntries)
      .where(and(inArray(amendmentEntries.amendmentId, ids), isNotNull(amendmentEntries.speciesKey))),
    db
      .select({ amendmentId: amendmentComments.amendmentId, n: count() })
      .from(amendmentComments)
      .where(inArray(amendmentComments.amendmentId, ids))
      .groupBy(amendmentComments.amendmentId),
  ]);
  const species = new Map<string, string[]>();
  for (const r of speciesRows) {
    const list = species.get(r.amendmentId) ?? [];
    list.push(r.key!);
    species.set(r.amendmentId, list);
  }
  for (const list of species.values()) list.sort();
  return { species, comments: new Map(commentRows.map((r) => [r.amendmentId, Number(r.n)])) };
}

/** The review queue and everyone's list: filtered by state, author, species and age; sorted; paged. */
export async function listAmendments(ctx: ActorContext, query: AmendmentListQuery): Promise<AmendmentList> {
  const me = ctx.actor.user.id;
  const conditions: SQL[] = [or(ne(amendments.state, 'draft'), eq(amendments.authorId, me))!];
  if (query.state) conditions.push(inArray(amendments.state, query.state));
  if (query.author) conditions.push(eq(amendments.authorId, query.author === 'me' ? me : query.author));
  if (query.species) {
    const byId = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(query.species);
    const column = byId ? amendmentEntries.speciesId : amendmentEntries.speciesKey;
    conditions.push(
      sql`exists (select 1 from ${amendmentEntries} where ${amendmentEntries.amendmentId} = ${amendments.id} and ${column} = ${query.species})`,
    );
  }
  const waitingSince = sql`coalesce(${amendments.openedAt}, ${amendments.createdAt})`;
  if (query.olderThanDays !== undefined) {
    const cutoff = new Date(Date.now() - query.olderThanDays * 86_400_000).toISOString();
    conditions.push(sql`${waitingSince} < ${cutoff}`);
  }
  const where = and(...conditions);
  const order = {
    newest: [desc(amendments.createdAt), desc(amendments.id)],
    oldest: [asc(waitingSince), asc(amendments.id)],
    updated: [desc(amendments.updatedAt), desc(amendments.id)],
    title: [asc(amendments.title), asc(amendments.id)],
  }[query.sort];
  const [rows, [total]] = await Promise.all([
    ctx.db
      .select()
      .from(amendments)
      .where(where)
      .orderBy(...order)
      .limit(query.limit)
      .offset(query.offset),
    ctx.db.select({ n: count() }).from(amendments).where(where),
  ]);
  const extras = await listExtras(
    ctx.db,
    rows.map((r) => r.id),
  );
  return {
    items: rows.map((r) =>
      presentSummary(r, { species: extras.species.get(r.id) ?? [], commentCount: extras.comments.get(r.id) ?? 0 }),
    ),
    total: Number(total?.n ?? 0),
  };
}

/** Counts for the navigation: by state (drafts: the caller's own), awaiting review, needing the caller. */
export async function amendmentCounts(ctx: ActorContext, _input: Record<string, never> = {}): Promise<AmendmentCounts> {
  const me = ctx.actor.user.id;
  // One parameter per expression: the same value bound twice is not the same GROUP BY expression to PostgreSQL.
  const rows = await ctx.db
    .select({
      state: amendments.state,
      n: count(),
      mine: sql<number>`count(*) filter (where ${amendments.authorId} = ${me})`.mapWith(Number),
    })
    .from(amendments)
    .where(or(ne(amendments.state, 'draft'), eq(amendments.authorId, me)))
    .groupBy(amendments.state);
  const byState = Object.fromEntries(amendmentStates.map((s) => [s, 0])) as AmendmentCounts['byState'];
  let awaiting = 0;
  let needsMyAction = 0;
  for (const r of rows) {
    const n = Number(r.n);
    byState[r.state] += n;
    if (r.state === 'open') awaiting += n - r.mine;
    if (r.state === 'draft' || r.state === 'returned') needsMyAction += r.mine;
  }
  return { byState, awaitingReview: isCurator(ctx) ? awaiting : null, needsMyAction };
}

/** One amendment with its entries, diff, comments, state history, conflicts and (optionally) impact. */
export async function getAmendment(
  ctx: ActorContext,
  { amendmentId, impact = true }: { amendmentId: string; impact?: boolean },
): Promise<AmendmentDetail> {
  const row = await loadVisible(ctx, ctx.db, amendmentId);
  const [entries, comments, events, extras, latest, who, files] = await Promise.all([
    loadEntries(ctx.db, row.id),
    ctx.db
      .select()
      .from(amendmentComments)
      .where(eq(amendmentComments.amendmentId, row.id))
      .orderBy(asc(amendmentComments.createdAt), asc(amendmentComments.id)),
    ctx.db
      .select()
      .from(amendmentEvents)
      .where(eq(amendmentEvents.amendmentId, row.id))
      .orderBy(asc(amendmentEvents.id)),
    listExtras(ctx.db, [row.id]),
    currentRevision(ctx.db),
    reviewerOf(ctx, row),
    evidenceRows(ctx, row.id),
  ]);
  const current = latest ?? row.baseRevision;
  const open = !finalStates.includes(row.state);
  const conflicts = open ? conflictsWith(row.targets, await revisionsAfter(ctx.db, row.baseRevision)) : [];
  const sources = new Map<string, AmendmentDetail['sources'][number]>();
  for (const item of row.diff) {
    for (const s of [item.old?.source, item.new?.source, item.selection?.to.source]) {
      if (s && !sources.has(s.key)) sources.set(s.key, { ...s, isNew: s.id === null });
    }
  }
  const allowed = {
    edit: mayTake('edit', who) && ['draft', 'returned'].includes(row.state),
    open: mayTake('open', who) && ['draft', 'returned'].includes(row.state),
    withdraw: mayTake('withdraw', who) && open,
    accept: mayTake('accept', who) && row.state === 'open',
    return: mayTake('return', who) && row.state === 'open',
    decline: mayTake('decline', who) && row.state === 'open',
    rebase: mayTake('rebase', who) && open && row.baseRevision !== current,
    revert: mayTake('revert', who) && row.state === 'accepted',
    comment: mayTake('comment', who),
  };
  return {
    ...presentSummary(row, {
      species: extras.species.get(row.id) ?? [],
      commentCount: comments.length,
    }),
    rationale: row.rationale,
    entries: entries.map((e) => amendmentEntrySchema.parse(e)),
    diff: row.diff,
    sources: [...sources.values()],
    comments: comments.map(presentComment),
    files: files.map(presentEvidence),
    history: events.map(presentEvent),
    currentRevision: current,
    conflicts,
    impact:
      impact && open
        ? await computeImpact(ctx, { row, entries, teamValues: await teamValuesFor(ctx, entries, 'any') })
        : null,
    allowed,
  };
}

// ——— Proposing ———

/**
 * A new draft. `origin` says where the entries came from (the editor, an import of files, a
 * revert); an import calls this with entries it has read. The plan runs against the current
 * revision (or `baseRevision`, for a revert), and any problem is a 400 naming entry and field.
 */
export async function createAmendment(
  ctx: ActorContext,
  input: AmendmentInput & { origin?: AmendmentOrigin; revertOf?: string; baseRevision?: number },
): Promise<AmendmentDetail> {
  const plan = await planForReview(ctx, input, input.baseRevision, input.revertOf ? 'any' : 'caller');
  if (plan.problems.length > 0) throw entryProblems(plan.problems, 'validation_failed', 'The amendment was not saved');
  const actor = actorOf(ctx);
  const baseRevision = input.baseRevision ?? (await currentRevision(ctx.db))!;
  const row = await ctx.db.transaction(async (tx) => {
    const [created] = await tx
      .insert(amendments)
      .values({
        title: input.title,
        rationale: input.rationale,
        state: 'draft',
        authorId: actor.id,
        authorName: actor.name,
        baseRevision,
        revertOf: input.revertOf ?? null,
        origin: input.origin ?? { kind: 'editor' },
        diff: plan.diff,
        targets: plan.targets,
        entryCount: input.entries.length,
      })
      .returning();
    await insertEntries(tx, created!.id, input.entries, plan);
    await recordEvent(tx, created!, {
      action: 'create',
      from: null,
      to: 'draft',
      actor,
      detail: { baseRevision, origin: input.origin?.kind ?? 'editor' },
    });
    return created!;
  });
  notice(row, ctx, { action: 'create', from: null, to: 'draft' });
  return getAmendment(ctx, { amendmentId: row.id, impact: false });
}

/** The author's edit of a draft or returned amendment: title, rationale and entries, against its base revision. */
export async function updateAmendment(
  ctx: ActorContext,
  input: AmendmentInput & { amendmentId: string },
): Promise<AmendmentDetail> {
  const { row } = await checkAction(ctx, input.amendmentId, 'edit');
  const plan = await planForReview(ctx, input, row.baseRevision, 'caller');
  if (plan.problems.length > 0)
    throw entryProblems(
      plan.problems,
      'validation_failed',
      `The amendment was not saved (checked against its base revision ${row.baseRevision}; rebase it to check against the current library)`,
    );
  const actor = actorOf(ctx);
  await ctx.db.transaction(async (tx) => {
    const locked = await loadVisible(ctx, tx, row.id, true);
    nextState(locked.state, 'edit');
    await tx
      .update(amendments)
      .set({
        title: input.title,
        rationale: input.rationale,
        diff: plan.diff,
        targets: plan.targets,
        entryCount: input.entries.length,
        version: locked.version + 1,
        updatedAt: new Date(),
      })
      .where(eq(amendments.id, row.id));
    await tx.delete(amendmentEntries).where(eq(amendmentEntries.amendmentId, row.id));
    await insertEntries(tx, row.id, input.entries, plan);
    await recordEvent(tx, row, { action: 'edit', from: locked.state, to: locked.state, actor });
  });
  notice(row, ctx, { action: 'edit', from: row.state, to: row.state });
  return getAmendment(ctx, { amendmentId: row.id, impact: false });
}

/**
 * A plain state change (open, return, decline, withdraw): checked again under the row lock, so
 * two callers racing on one amendment cannot both move it.
 */
async function moveState(
  ctx: ActorContext,
  amendmentId: string,
  action: 'open' | 'return' | 'decline' | 'withdraw',
  reason: string | null,
): Promise<AmendmentDetail> {
  const { row } = await checkAction(ctx, amendmentId, action);
  const actor = actorOf(ctx);
  const moved = await ctx.db.transaction(async (tx) => {
    const locked = await loadVisible(ctx, tx, row.id, true);
    const to = nextState(locked.state, action);
    const now = new Date();
    await tx
      .update(amendments)
      .set({
        state: to,
        version: locked.version + 1,
        updatedAt: now,
        ...(to === 'open' ? { openedAt: now } : {}),
        ...(finalStates.includes(to) ? { closedAt: now } : {}),
      })
      .where(eq(amendments.id, row.id));
    await recordEvent(tx, row, { action, from: locked.state, to, actor, reason });
    return { from: locked.state, to };
  });
  notice(row, ctx, { action, ...moved, reason });
  return getAmendment(ctx, { amendmentId: row.id, impact: false });
}

export function openAmendment(ctx: ActorContext, { amendmentId }: { amendmentId: string }) {
  return moveState(ctx, amendmentId, 'open', null);
}

export function withdrawAmendment(ctx: ActorContext, { amendmentId }: { amendmentId: string }) {
  return moveState(ctx, amendmentId, 'withdraw', null);
}

export function returnAmendment(ctx: ActorContext, input: AmendmentReasonInput & { amendmentId: string }) {
  return moveState(ctx, input.amendmentId, 'return', input.reason);
}

export function declineAmendment(ctx: ActorContext, input: AmendmentReasonInput & { amendmentId: string }) {
  return moveState(ctx, input.amendmentId, 'decline', input.reason);
}

// ——— Accepting ———

function conflictError(row: AmendmentRow, current: number, conflicts: ReturnType<typeof conflictsWith>): AppError {
  const words = conflicts
    .slice(0, 3)
    .map((c) => `revision ${c.revision} (“${c.title}”) changed ${c.targets.map((t) => t.label).join(', ')}`)
    .join('; ');
  return new AppError(
    'conflict',
    `Since this amendment's base revision ${row.baseRevision}, ${words}. Nothing was applied: rebase the amendment on revision ${current} (POST /api/v1/amendments/${row.id}/rebase) and review its new diff.`,
    {
      state: row.state,
      reason: 'stale_base',
      baseRevision: row.baseRevision,
      currentRevision: current,
      conflicts,
      rebase: `/api/v1/amendments/${row.id}/rebase`,
    },
  );
}

/**
 * Accepts an open amendment: all its entries are applied in one transaction as one new revision
 * (kind `amendment`), or nothing is. A later revision that touched what it changes is a 409
 * offering a rebase; entries that no longer apply are a 409 naming them.
 */
export async function acceptAmendment(ctx: ActorContext, { amendmentId }: { amendmentId: string }) {
  const actor = actorOf(ctx);
  for (let attempt = 0; ; attempt++) {
    const { row } = await checkAction(ctx, amendmentId, 'accept');
    const latest = (await currentRevision(ctx.db))!;
    const snapshot = await ctx.library.at(latest);
    const entries = await loadEntries(ctx.db, row.id);
    const teamValues = await teamValuesFor(ctx, entries, 'any');
    const plan = planEntries({ snapshot, entries, title: row.title, teamValues, mode: 'apply' });
    if (plan.problems.length > 0)
      throw entryProblems(
        plan.problems,
        'conflict',
        `The amendment no longer applies to the library at revision ${latest}`,
      );
    try {
      const { number } = await withNewRevision(
        ctx.db,
        { kind: 'amendment', summary: row.title, actor: { id: actor.id, email: actor.email }, amendmentId: row.id },
        async (tx, number) => {
          // Another revision landed since the plan was made: plan again on the newer snapshot.
          if (number !== latest + 1) throw new StaleSnapshot();
          const locked = await loadVisible(ctx, tx, row.id, true);
          nextState(locked.state, 'accept');
          if (locked.version !== row.version) throw new StaleSnapshot();
          const later = (await revisionsAfter(tx, locked.baseRevision)).filter((r) => r.number < number);
          const declared = conflictsWith(plan.targets, later);
          if (declared.length > 0) throw conflictError(locked, latest, declared);
          const result = await applyLibraryChanges(tx, plan.set, number, {
            unselected: (species, property) => {
              const message = `the ${property} of ${species} is left with several candidates and none selected: add a select-value entry.`;
              const cause = plan.set.deprecations?.find(
                (d) =>
                  d.key === species &&
                  (property === 'cp' ? d.target === 'model' : d.target === 'value' && d.property === property),
              );
              return cause ? { ...cause.origin, message } : { file: 'amendment', line: 0, message };
            },
          });
          const written = conflictsWith(result.touched, later);
          if (written.length > 0) throw conflictError(locked, latest, written);
          if (result.touched.length === 0)
            throw new AppError(
              'conflict',
              `The amendment changes nothing in the library at revision ${latest} (its changes are already there): withdraw or decline it.`,
              { state: locked.state, reason: 'no_change', currentRevision: latest },
            );
          await setRevisionDetail(
            tx,
            number,
            { counts: result.counts, amendment: { id: row.id, title: row.title, author: row.authorName } },
            result.touched,
          );
          const now = new Date();
          await tx
            .update(amendments)
            .set({
              state: 'accepted',
              resultRevision: number,
              version: locked.version + 1,
              updatedAt: now,
              closedAt: now,
            })
            .where(eq(amendments.id, row.id));
          await recordEvent(tx, row, {
            action: 'accept',
            from: locked.state,
            to: 'accepted',
            actor,
            detail: { revision: number, counts: result.counts },
          });
          await recordAudit(tx, {
            action: 'library.amendment_accepted',
            actor: { id: actor.id, email: actor.email },
            meta: ctx.meta,
            detail: { amendmentId: row.id, revision: number, counts: result.counts },
          });
        },
      );
      notice(row, ctx, { action: 'accept', from: 'open', to: 'accepted', revision: number });
      return getAmendment(ctx, { amendmentId: row.id, impact: false });
    } catch (error) {
      if (error instanceof StaleSnapshot && attempt < 10) continue;
      if (error instanceof SetConflictError)
        throw entryProblems(
          problemsFromApplier(error.problems),
          'conflict',
          `The amendment does not apply to the library at revision ${latest}; nothing was applied`,
        );
      throw error;
    }
  }
}

/**
 * Moves the amendment's base to the current revision and recomputes its diff. Entries that no
 * longer apply are a 409 naming them (nothing changes; the author edits them first).
 */
export async function rebaseAmendment(ctx: ActorContext, { amendmentId }: { amendmentId: string }) {
  const { row } = await checkAction(ctx, amendmentId, 'rebase');
  const latest = (await currentRevision(ctx.db))!;
  if (latest === row.baseRevision) return getAmendment(ctx, { amendmentId: row.id, impact: false });
  const entries = await loadEntries(ctx.db, row.id);
  const plan = await planForReview(ctx, { title: row.title, entries }, latest, 'any');
  if (plan.problems.length > 0)
    throw entryProblems(
      plan.problems,
      'conflict',
      `The amendment cannot be rebased on revision ${latest}: some entries no longer apply (edit them first)`,
    );
  const actor = actorOf(ctx);
  await ctx.db.transaction(async (tx) => {
    const locked = await loadVisible(ctx, tx, row.id, true);
    nextState(locked.state, 'rebase');
    if (locked.version !== row.version)
      throw errors.conflict('The amendment changed while it was being rebased: try again.', { state: locked.state });
    await tx
      .update(amendments)
      .set({
        baseRevision: latest,
        diff: plan.diff,
        targets: plan.targets,
        version: locked.version + 1,
        updatedAt: new Date(),
      })
      .where(eq(amendments.id, row.id));
    await tx.delete(amendmentEntries).where(eq(amendmentEntries.amendmentId, row.id));
    await insertEntries(tx, row.id, entries, plan);
    await recordEvent(tx, row, {
      action: 'rebase',
      from: locked.state,
      to: locked.state,
      actor,
      detail: { fromRevision: locked.baseRevision, toRevision: latest },
    });
  });
  notice(row, ctx, { action: 'rebase', from: row.state, to: row.state });
  return getAmendment(ctx, { amendmentId: row.id, impact: false });
}

/** A new draft that undoes an accepted amendment: the inverse of what its revision changed. */
export async function revertAmendment(ctx: ActorContext, { amendmentId }: { amendmentId: string }) {
  const row = await loadVisible(ctx, ctx.db, amendmentId);
  const who = await reviewerOf(ctx, row);
  if (!mayTake('revert', who)) throw refusal('revert', who);
  if (row.state !== 'accepted' || row.resultRevision === null)
    throw new AppError('conflict', `The amendment is ${row.state}: only an accepted amendment can be reverted.`, {
      state: row.state,
      action: 'revert',
      allowedFrom: ['accepted'],
    });
  const revision = row.resultRevision;
  const [before, after] = await Promise.all([ctx.library.at(revision - 1), ctx.library.at(revision)]);
  const [made] = await ctx.db
    .select({ touched: libraryRevisions.touched })
    .from(libraryRevisions)
    .where(eq(libraryRevisions.number, revision));
  const entries = inverseEntries(before, after, made?.touched ?? []);
  return createAmendment(ctx, {
    title: `Revert: ${row.title}`.slice(0, 200),
    rationale: `Reverts the amendment “${row.title}” accepted as revision ${revision}: every value, selection, species, source and reaction it changed goes back to revision ${revision - 1}.`,
    entries,
    origin: { kind: 'revert', amendmentId: row.id, revision },
    revertOf: row.id,
    baseRevision: revision,
  });
}

// ——— Discussion ———

/** A comment by the author or a curator (a draft's thread is its author's own notes). */
export async function addComment(ctx: ActorContext, input: { amendmentId: string; body: string }) {
  const row = await loadVisible(ctx, ctx.db, input.amendmentId);
  const who = await reviewerOf(ctx, row);
  if (!mayTake('comment', who)) throw refusal('comment', who);
  const actor = actorOf(ctx);
  const [comment] = await ctx.db
    .insert(amendmentComments)
    .values({ amendmentId: row.id, authorId: actor.id, authorName: actor.name, body: input.body })
    .returning();
  await ctx.db.update(amendments).set({ updatedAt: new Date() }).where(eq(amendments.id, row.id));
  notice(row, ctx, { action: 'comment', from: row.state, to: row.state, comment: input.body });
  return presentComment(comment!);
}
