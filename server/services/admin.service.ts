import { asc, count, eq } from 'drizzle-orm';
import type { AdminTeam, AdminUser, CreateTeamInput, OutboxMessage, UpdateUserInput } from '@shared/schemas/admin';
import type { AppDeps, Principal, RequestMeta } from '../context';
import type { Db } from '../db/client';
import { memberships, teams, users } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { recordAudit } from './audit.service';
import { insertInvitation, mailInvitation } from './invitations.service';
import { endUserSessions } from './session.service';
import { uniqueSlug } from './teams.service';

/** Every user with their teams, by e-mail. */
export async function listUsers(db: Db): Promise<AdminUser[]> {
  const rows = await db.select().from(users).orderBy(asc(users.email));
  const teamRows = await db
    .select({ userId: memberships.userId, id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .orderBy(asc(teams.name));
  return rows.map((u) => ({
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    siteRoles: [...u.siteRoles].sort(),
    disabled: u.disabled,
    createdAt: u.createdAt.toISOString(),
    teams: teamRows.filter((t) => t.userId === u.id).map(({ id, name, role }) => ({ id, name, role })),
  }));
}

/**
 * Changes a user's site roles and/or disables them. A site admin cannot take away their own
 * site_admin role or disable themselves (409), so the installation keeps an administrator.
 */
export async function updateUser(
  db: Db,
  actor: Principal,
  userId: string,
  input: UpdateUserInput,
  meta: RequestMeta,
): Promise<AdminUser> {
  const self = actor.user.id === userId;
  if (self && input.siteRoles && !input.siteRoles.includes('site_admin')) {
    throw new AppError('conflict', 'You cannot remove your own site admin role. Ask another site admin.');
  }
  if (self && input.disabled === true) throw new AppError('conflict', 'You cannot disable your own account.');
  await db.transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, userId)).limit(1).for('update');
    if (!before) throw errors.notFound('The user');
    const siteRoles = input.siteRoles ? [...new Set(input.siteRoles)].sort() : before.siteRoles;
    const disabled = input.disabled ?? before.disabled;
    await tx.update(users).set({ siteRoles, disabled, updatedAt: new Date() }).where(eq(users.id, userId));
    const target = { userId, email: before.email };
    if (input.siteRoles && [...before.siteRoles].sort().join() !== siteRoles.join()) {
      await recordAudit(tx, {
        action: 'user.site_roles_changed',
        actor: actor.user,
        meta,
        detail: { ...target, from: before.siteRoles, to: siteRoles },
      });
    }
    if (disabled !== before.disabled) {
      if (disabled) await endUserSessions(tx, userId);
      await recordAudit(tx, {
        action: disabled ? 'user.disabled' : 'user.enabled',
        actor: actor.user,
        meta,
        detail: target,
      });
    }
  });
  const updated = (await listUsers(db)).find((u) => u.id === userId);
  if (!updated) throw errors.notFound('The user');
  return updated;
}

/** Every team with its member count, by name. */
export async function listTeams(db: Db): Promise<AdminTeam[]> {
  const rows = await db
    .select({
      id: teams.id,
      name: teams.name,
      slug: teams.slug,
      createdAt: teams.createdAt,
      memberCount: count(memberships.userId),
    })
    .from(teams)
    .leftJoin(memberships, eq(memberships.teamId, teams.id))
    .groupBy(teams.id)
    .orderBy(asc(teams.name), asc(teams.slug));
  return rows.map((r) => ({ ...r, memberCount: Number(r.memberCount), createdAt: r.createdAt.toISOString() }));
}

/** Creates a team and e-mails its first team admin an invitation. */
export async function createTeam(
  deps: AppDeps,
  actor: Principal,
  input: CreateTeamInput,
  meta: RequestMeta,
): Promise<AdminTeam> {
  const made = await deps.db.transaction(async (tx) => {
    const slug = await uniqueSlug(tx, input.name);
    const [team] = await tx.insert(teams).values({ name: input.name, slug }).returning();
    const invitation = await insertInvitation(tx, {
      teamId: team!.id,
      email: input.adminEmail,
      role: 'team_admin',
      invitedBy: { id: actor.user.id, name: actor.user.displayName },
    });
    await recordAudit(tx, { action: 'team.created', actor: actor.user, meta, detail: { teamId: team!.id, slug } });
    await recordAudit(tx, {
      action: 'invitation.created',
      actor: actor.user,
      meta,
      detail: { teamId: team!.id, invitationId: invitation.row.id, email: input.adminEmail, role: 'team_admin' },
    });
    return { team: team!, ...invitation };
  });
  try {
    await mailInvitation(deps, {
      row: made.row,
      secret: made.secret,
      teamName: made.team.name,
      inviterName: actor.user.displayName,
    });
  } catch (err) {
    // Without its admin's invitation the new team is unreachable: take it back.
    await deps.db.delete(teams).where(eq(teams.id, made.team.id));
    throw err;
  }
  return {
    id: made.team.id,
    name: made.team.name,
    slug: made.team.slug,
    memberCount: 0,
    createdAt: made.team.createdAt.toISOString(),
  };
}

/** The development outbox, newest first. */
export function readOutbox(deps: AppDeps): { enabled: boolean; messages: OutboxMessage[] } {
  if (!deps.mailer.outbox) return { enabled: false, messages: [] };
  return { enabled: true, messages: deps.mailer.outbox.list().reverse() };
}
