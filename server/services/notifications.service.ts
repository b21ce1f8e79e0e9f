import { and, arrayContains, asc, eq, inArray, isNull, ne, sql } from 'drizzle-orm';
import {
  DEFAULT_NOTIFICATION_MODE,
  notificationKinds,
  type NotificationKind,
  type NotificationMode,
  type NotificationSettings,
  type NotificationSettingsInput,
} from '@shared/schemas/notifications';
import type { ActorContext, AppDeps } from '../context';
import { digestItems, notificationSettings, users } from '../db/tables/index';
import { amendmentDigestMail, amendmentNewsLine, amendmentNewsMail, type AmendmentNewsArgs } from '../mail/messages';

/**
 * E-mail about amendments. Who gets what: curators when an amendment enters the review queue;
 * the author when someone else comments on it or decides it. Each recipient chooses per kind:
 * at once, in the daily digest (digest_items, sent by `sendDailyDigests`), or never. Nobody is
 * told about their own action.
 */

/** The caller's choice for every kind (the default where none was made). */
export async function getNotificationSettings(
  ctx: ActorContext,
  _input: Record<string, never> = {},
): Promise<NotificationSettings> {
  const rows = await ctx.db
    .select({ kind: notificationSettings.kind, mode: notificationSettings.mode })
    .from(notificationSettings)
    .where(eq(notificationSettings.userId, ctx.actor.user.id));
  const chosen = new Map(rows.map((r) => [r.kind, r.mode]));
  return {
    settings: Object.fromEntries(
      notificationKinds.map((kind) => [kind, chosen.get(kind) ?? DEFAULT_NOTIFICATION_MODE]),
    ) as NotificationSettings['settings'],
  };
}

/** Changes the caller's choice for the kinds given; the others stay. */
export async function updateNotificationSettings(
  ctx: ActorContext,
  input: NotificationSettingsInput,
): Promise<NotificationSettings> {
  const changes = Object.entries(input.settings) as [NotificationKind, NotificationMode][];
  if (changes.length > 0)
    await ctx.db
      .insert(notificationSettings)
      .values(changes.map(([kind, mode]) => ({ userId: ctx.actor.user.id, kind, mode })))
      .onConflictDoUpdate({
        target: [notificationSettings.userId, notificationSettings.kind],
        set: { mode: sqlExcludedMode, updatedAt: new Date() },
      });
  return getNotificationSettings(ctx, {});
}

// drizzle has no helper for EXCLUDED; the column name is ours.
const sqlExcludedMode = sql.raw('excluded.mode');

/** A piece of news for some users: what happened, and the kind that decides how each hears of it. */
export interface AmendmentNews {
  kind: NotificationKind;
  amendmentId: string;
  news: Omit<AmendmentNewsArgs, 'to' | 'link'>;
  /** Explicit recipients (user ids), or every curator. */
  recipients: string[] | 'curators';
  /** Who caused it (never told). */
  actorId: string;
}

/** The link into the app for an amendment. */
export function amendmentLink(deps: Pick<AppDeps, 'config'>, amendmentId: string): string {
  return `${deps.config.publicUrl}/amendments/${amendmentId}`;
}

/**
 * Sends (or queues for the digest) one piece of news to each recipient according to their
 * setting. Runs after the change has committed, as a background job: a mail failure is logged and
 * never undoes or delays the change.
 */
export async function deliverAmendmentNews(deps: AppDeps, item: AmendmentNews): Promise<void> {
  const who = and(
    eq(users.disabled, false),
    ne(users.id, item.actorId),
    item.recipients === 'curators'
      ? arrayContains(users.siteRoles, ['curator'])
      : inArray(users.id, item.recipients.length > 0 ? item.recipients : ['00000000-0000-0000-0000-000000000000']),
  );
  const rows = await deps.db
    .select({ id: users.id, email: users.email, mode: notificationSettings.mode })
    .from(users)
    .leftJoin(
      notificationSettings,
      and(eq(notificationSettings.userId, users.id), eq(notificationSettings.kind, item.kind)),
    )
    .where(who);
  const link = amendmentLink(deps, item.amendmentId);
  const daily = rows.filter((r) => (r.mode ?? DEFAULT_NOTIFICATION_MODE) === 'daily');
  if (daily.length > 0)
    await deps.db
      .insert(digestItems)
      .values(daily.map((r) => ({ userId: r.id, kind: item.kind, line: amendmentNewsLine(item.news), link })));
  for (const r of rows) {
    if ((r.mode ?? DEFAULT_NOTIFICATION_MODE) !== 'immediate') continue;
    try {
      await deps.mailer.send(amendmentNewsMail({ ...item.news, to: r.email, link }));
    } catch (err) {
      deps.log.error({ err, amendment: item.amendmentId, kind: item.kind }, 'amendment e-mail could not be sent');
    }
  }
}

/**
 * Sends every user their waiting digest items as one e-mail and marks them sent. Safe to call at
 * any time and more than once (a timer calls it daily; tests call it directly): items are marked
 * only after their e-mail went out, so a failed send is retried by the next call.
 */
export async function sendDailyDigests(deps: AppDeps): Promise<{ sent: number; failed: number }> {
  const pending = await deps.db
    .select({
      id: digestItems.id,
      userId: digestItems.userId,
      line: digestItems.line,
      link: digestItems.link,
      email: users.email,
    })
    .from(digestItems)
    .innerJoin(users, eq(users.id, digestItems.userId))
    .where(isNull(digestItems.sentAt))
    .orderBy(asc(digestItems.userId), asc(digestItems.id));
  const byUser = new Map<string, typeof pending>();
  for (const row of pending) byUser.set(row.userId, [...(byUser.get(row.userId) ?? []), row]);
  let sent = 0;
  let failed = 0;
  for (const items of byUser.values()) {
    try {
      await deps.mailer.send(
        amendmentDigestMail({
          to: items[0]!.email,
          items: items.map((i) => ({ line: i.line, link: i.link })),
          settingsLink: `${deps.config.publicUrl}/account`,
        }),
      );
      await deps.db
        .update(digestItems)
        .set({ sentAt: new Date() })
        .where(
          inArray(
            digestItems.id,
            items.map((i) => i.id),
          ),
        );
      sent++;
    } catch (err) {
      failed++;
      deps.log.error({ err, user: items[0]!.userId }, 'digest e-mail could not be sent');
    }
  }
  return { sent, failed };
}

/** Milliseconds from `now` to the next `hour`:00 UTC. */
export function msUntilHourUtc(now: Date, hour: number): number {
  const next = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), hour));
  if (next.getTime() <= now.getTime()) next.setUTCDate(next.getUTCDate() + 1);
  return next.getTime() - now.getTime();
}

/** Sends the digest every day at the configured hour (UTC); returns a function that stops it. */
export function scheduleDailyDigests(deps: AppDeps): () => void {
  let timer: NodeJS.Timeout | undefined;
  const plan = () => {
    timer = setTimeout(
      () => {
        sendDailyDigests(deps)
          .catch((err: unknown) => deps.log.error({ err }, 'daily digest failed'))
          .finally(plan);
      },
      msUntilHourUtc(new Date(), deps.config.digestHourUtc),
    );
    timer.unref();
  };
  plan();
  return () => clearTimeout(timer);
}
