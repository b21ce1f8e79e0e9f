import { and, desc, eq, lt, or, isNull } from 'drizzle-orm';
import { teamRoleAtLeast } from '@shared/schemas/roles';
import type { CreateLinkInput, LinkCreated, ReactionSet, ShareLink, SharedSet } from '@shared/schemas/reaction-sets';
import type { ActorContext, ServiceContext } from '../context';
import { reactionSetLinks, reactionSets, type ReactionSetLinkRow, type ReactionSetRow } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { newShareToken, readShareToken, verifierMatches } from '../lib/share-tokens';
import { setLinkMail } from '../mail/messages';
import { teamRoleOf } from './membership.service';
import { evaluationOfSet, revisionOf } from './reaction-sets-evaluate.service';
import { findSet, insertSet, stateOf } from './reaction-sets.service';

/**
 * Read-only share links to one set. A link opens that set and nothing else: no team, no
 * members, no other set, no write. Revoked, expired and wrong tokens all get the same 404.
 */

/** Last use is written at most this often per link, so a busy link does not write on every open. */
const LAST_USE_RESOLUTION_MS = 60_000;

function linkState(row: ReactionSetLinkRow, now = Date.now()): ShareLink['state'] {
  if (row.revokedAt) return 'revoked';
  if (row.expiresAt && row.expiresAt.getTime() <= now) return 'expired';
  return 'active';
}

function toShareLink(row: ReactionSetLinkRow): ShareLink {
  return {
    id: row.id,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdByName,
    expiresAt: row.expiresAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    emailedTo: row.emailedTo,
    state: linkState(row),
  };
}

export function shareUrl(ctx: ServiceContext, token: string): string {
  return `${ctx.config.publicUrl}/shared/${token}`;
}

/**
 * Creates a link (the token is in the reply only; the database keeps its hashes) and, with an
 * address, e-mails it while the request waits: if the e-mail cannot be sent the link is deleted
 * again and the caller gets 503, so no link exists that nobody received.
 */
export async function createLink(
  ctx: ActorContext,
  input: CreateLinkInput & { teamId: string; setId: string },
): Promise<LinkCreated> {
  const set = await findSet(ctx.db, input.teamId, input.setId);
  const { token, selectorHash, verifierHash } = newShareToken();
  const expiresAt = input.expiresAt ? new Date(input.expiresAt) : null;
  const [row] = await ctx.db
    .insert(reactionSetLinks)
    .values({
      setId: set.id,
      selectorHash,
      verifierHash,
      createdById: ctx.actor.user.id,
      createdByName: ctx.actor.user.displayName,
      expiresAt,
      emailedTo: input.email ?? null,
    })
    .returning();
  const url = shareUrl(ctx, token);
  if (input.email) {
    try {
      await ctx.mailer.send(
        setLinkMail({
          to: input.email,
          senderName: ctx.actor.user.displayName,
          setTitle: set.title,
          link: url,
          expiresAt,
        }),
      );
    } catch (err) {
      ctx.log.error({ err, requestId: ctx.meta.requestId }, 'share-link e-mail could not be sent');
      await ctx.db.delete(reactionSetLinks).where(eq(reactionSetLinks.id, row!.id));
      throw new AppError(
        'unavailable',
        'The e-mail with the link could not be sent, so no link was made. Try again later, or make a link without e-mail and send it yourself.',
        undefined,
        { 'Retry-After': '60' },
      );
    }
  }
  return { id: row!.id, url, token, expiresAt: expiresAt?.toISOString() ?? null, emailedTo: input.email ?? null };
}

export async function listLinks(
  ctx: ServiceContext,
  input: { teamId: string; setId: string },
): Promise<{ items: ShareLink[] }> {
  await findSet(ctx.db, input.teamId, input.setId);
  const rows = await ctx.db
    .select()
    .from(reactionSetLinks)
    .where(eq(reactionSetLinks.setId, input.setId))
    .orderBy(desc(reactionSetLinks.createdAt));
  return { items: rows.map(toShareLink) };
}

/** Revokes a link of this set (kept in the list as revoked; revoking twice is harmless). */
export async function revokeLink(
  ctx: ActorContext,
  input: { teamId: string; setId: string; linkId: string },
): Promise<void> {
  await findSet(ctx.db, input.teamId, input.setId);
  const [row] = await ctx.db
    .update(reactionSetLinks)
    .set({ revokedAt: new Date() })
    .where(and(eq(reactionSetLinks.id, input.linkId), eq(reactionSetLinks.setId, input.setId)))
    .returning({ id: reactionSetLinks.id });
  if (!row) throw errors.notFound('The link');
}

const notFound = () =>
  new AppError(
    'not_found',
    'This link does not open anything: it may have been revoked, have expired, or be mistyped. Ask whoever sent it for a new one.',
  );

/**
 * The set a token opens, or the one 404 for every failure (malformed, unknown, wrong verifier,
 * revoked, expired). The verifier's hash is compared with crypto.timingSafeEqual.
 */
export async function resolveShareToken(
  ctx: ServiceContext,
  token: string,
): Promise<{ link: ReactionSetLinkRow; set: ReactionSetRow }> {
  const read = readShareToken(token);
  const [found] = read
    ? await ctx.db
        .select({ link: reactionSetLinks, set: reactionSets })
        .from(reactionSetLinks)
        .innerJoin(reactionSets, eq(reactionSets.id, reactionSetLinks.setId))
        .where(eq(reactionSetLinks.selectorHash, read.selectorHash))
        .limit(1)
    : [];
  const matches = verifierMatches(read?.verifierHash ?? '', found?.link.verifierHash ?? null);
  if (!found || !matches || linkState(found.link) !== 'active') throw notFound();
  return found;
}

/** Notes the link's last use (at most once a minute per link). */
async function touch(ctx: ServiceContext, link: ReactionSetLinkRow): Promise<void> {
  const now = new Date();
  if (link.lastUsedAt && now.getTime() - link.lastUsedAt.getTime() < LAST_USE_RESOLUTION_MS) return;
  await ctx.db
    .update(reactionSetLinks)
    .set({ lastUsedAt: now })
    .where(
      and(
        eq(reactionSetLinks.id, link.id),
        or(
          isNull(reactionSetLinks.lastUsedAt),
          lt(reactionSetLinks.lastUsedAt, new Date(now.getTime() - LAST_USE_RESOLUTION_MS)),
        ),
      ),
    );
}

/**
 * Weighs the work of opening a set (its items) against the caller's per-minute budget of the
 * calculation endpoints, as a batch weighs its equation lines (429 beyond).
 */
export async function weighSetWork(ctx: ServiceContext, set: ReactionSetRow): Promise<void> {
  await ctx.limits.takeCalcLines(ctx.meta.ip ?? 'unknown', Math.max(1, set.items.length));
}

/** GET /shared/:token: the set at its revision with every result, source and caution. */
export async function openSharedSet(ctx: ServiceContext, input: { token: string }): Promise<SharedSet> {
  const { link, set } = await resolveShareToken(ctx, input.token);
  await weighSetWork(ctx, set);
  const evaluation = await evaluationOfSet(ctx, set);
  await touch(ctx, link);
  return { ...stateOf(set), version: set.version, updatedAt: set.updatedAt.toISOString(), evaluation };
}

/**
 * A signed-in reader copies a shared set into a team where they are a member or above. The copy
 * is pinned to the revision the link showed, so it starts with the same numbers.
 */
export async function copySharedSet(ctx: ActorContext, input: { token: string; teamId: string }): Promise<ReactionSet> {
  const { set } = await resolveShareToken(ctx, input.token);
  const role = await teamRoleOf(ctx, { teamId: input.teamId });
  if (!role || !teamRoleAtLeast(role, 'member'))
    throw new AppError('forbidden', 'You can copy a set only into a team where you are a member or above.');
  const { revision } = await revisionOf(ctx, set.pinnedRevision);
  const state = stateOf(set);
  return insertSet(ctx, {
    teamId: input.teamId,
    state: { title: state.title, description: state.description, tags: state.tags, items: state.items },
    pinnedRevision: revision,
    summary: 'Copied from a shared link',
  });
}
