import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { teamRoleEnum } from './roles';
import { teams } from './teams';
import { users } from './users';

/** An e-mailed invitation to join a team. Only the SHA-256 of the link token is stored. */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: teamRoleEnum('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    /** Null when the installation (a site admin creating a team) invited. */
    invitedById: uuid('invited_by_id').references(() => users.id, { onDelete: 'set null' }),
    invitedByName: text('invited_by_name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
  },
  (t) => [index('invitations_team_idx').on(t.teamId)],
);
export type InvitationRow = typeof invitations.$inferSelect;
