import { asc, count, eq } from 'drizzle-orm';
import type { AdminTeam, AdminUser, CreateTeamInput, OutboxMessage, UpdateUserInput } from '@shared/schemas/admin';
import type { ActorContext, ServiceContext } from '../context';
import { recordAudit } from '../db/queries/audit';
import { endUserSessions } from '../db/queries/credentials';
import { insertInvitation } from '../db/queries/invitations';
import { uniqueSlug } from '../db/queries/teams';
import { findUserByEmail } from '../db/queries/users';
import { memberships, teams, users } from '../db/tables/index';
import { AppError, errors } from '../errors';
import { hashPassword } from '../lib/secrets';
import { deliverInvitation } from './invitations.service';

/** Every user with their teams, by e-mail. */
export async function listUsers(ctx: ServiceContext, _input: object = {}): Promise<{ users: AdminUser[] }> {
  const rows = await ctx.db.select().from(users).orderBy(asc(users.email));
  const teamRows = await ctx.db
    .select({ userId: memberships.userId, id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .orderBy(asc(teams.name));
  return {
    users: rows.map((u) => ({
      id: u.id,
      email: u.email,
      displayName: u.displayName,
      siteRoles: [...u.siteRoles].sort(),
      disabled: u.disabled,
      createdAt: u.createdAt.toISOString(),
      teams: teamRows.filter((t) => t.userId === u.id).map(({ id, name, role }) => ({ id, name, role })),
    })),
  };
}

/**
 * Changes a user's site roles and/or disables them. A site admin cannot take away their own
 * site_admin role or disable themselves (409), so the installation keeps an administrator.
 */
export async function updateUser(ctx: ActorContext, input: UpdateUserInput & { userId: string }): Promise<AdminUser> {
  const { actor, meta } = ctx;
  const { userId } = input;
  const self = actor.user.id === userId;
  if (self && input.siteRoles && !input.siteRoles.includes('site_admin')) {
    throw new AppError('conflict', 'You cannot remove your own site admin role. Ask another site admin.');
  }
  if (self && input.disabled === true) throw new AppError('conflict', 'You cannot disable your own account.');
  await ctx.db.transaction(async (tx) => {
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
  const updated = (await listUsers(ctx)).users.find((u) => u.id === userId);
  if (!updated) throw errors.notFound('The user');
  return updated;
}

/** Every team with its member count, by name. */
export async function listTeams(ctx: ServiceContext, _input: object = {}): Promise<{ teams: AdminTeam[] }> {
  const rows = await ctx.db
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
  return {
    teams: rows.map((r) => ({ ...r, memberCount: Number(r.memberCount), createdAt: r.createdAt.toISOString() })),
  };
}

/**
 * Creates a team and e-mails its first team admin an invitation. Without that invitation the new
 * team would be unreachable, so when the e-mail cannot be sent the team is taken back (503).
 */
export async function createTeam(ctx: ActorContext, input: CreateTeamInput): Promise<AdminTeam> {
  const { db, actor, meta } = ctx;
  const made = await db.transaction(async (tx) => {
    const slug = await uniqueSlug(tx, input.name);
    const [team] = await tx.insert(teams).values({ name: input.name, slug }).returning();
    const invitation = await insertInvitation(tx, {
      teamId: team!.id,
      email: input.adminEmail,
      role: 'team_admin',
      invitedBy: { id: actor.user.id, name: actor.user.displayName },
    });
    return { team: team!, ...invitation };
  });
  try {
    await deliverInvitation(ctx, {
      invitation: made.row,
      secret: made.secret,
      teamName: made.team.name,
      teamCreated: true,
    });
  } catch (err) {
    await db.delete(teams).where(eq(teams.id, made.team.id));
    throw err;
  }
  await recordAudit(db, {
    action: 'team.created',
    actor: actor.user,
    meta,
    detail: { teamId: made.team.id, slug: made.team.slug },
  });
  return {
    id: made.team.id,
    name: made.team.name,
    slug: made.team.slug,
    memberCount: 0,
    createdAt: made.team.createdAt.toISOString(),
  };
}

/** The development outbox, newest first. */
export async function readOutbox(
  ctx: ServiceContext,
  _input: object = {},
): Promise<{ enabled: boolean; messages: OutboxMessage[] }> {
  if (!ctx.mailer.outbox) return { enabled: false, messages: [] };
  return { enabled: true, messages: ctx.mailer.outbox.list().reverse() };
}

/**
 * Creates a site admin account (the first administrator of a real installation, made by
 * `npm run create-admin`). 409 when the e-mail already has an account.
 */
export async function createSiteAdmin(
  ctx: ServiceContext,
  input: { email: string; displayName: string; password: string },
): Promise<{ id: string; email: string }> {
  if (await findUserByEmail(ctx.db, input.email)) {
    throw errors.conflict(
      `${input.email} already has an account. A site admin can give it the site admin role under Admin → Users.`,
    );
  }
  const passwordHash = await hashPassword(input.password);
  return ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(users)
      .values({ email: input.email, displayName: input.displayName, passwordHash, siteRoles: ['site_admin'] })
      .onConflictDoNothing({ target: users.email })
      .returning({ id: users.id, email: users.email });
    if (!row) throw errors.conflict(`${input.email} already has an account.`);
    await recordAudit(tx, {
      action: 'user.created',
      actorEmail: 'create-admin',
      meta: ctx.meta,
      detail: { userId: row.id, email: row.email, siteRoles: ['site_admin'] },
    });
    return row;
  });
}
