import { index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { SetItem } from '../../../shared/schemas/reaction-sets';
import { teams } from './teams';
import { users } from './users';

/**
 * A team's reaction set: its current state and version. Every save writes the next version into
 * `reaction_set_versions` in the same transaction, so the history is complete and the current
 * state is always the newest version.
 */
export const reactionSets = pgTable(
  'reaction_sets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    title: text('title').notNull(),
    description: text('description').notNull().default(''),
    tags: jsonb('tags').$type<string[]>().notNull().default([]),
    items: jsonb('items').$type<SetItem[]>().notNull().default([]),
    /** The pinned library revision; null while the set follows the newest one. */
    pinnedRevision: integer('pinned_revision'),
    /** Optimistic concurrency: a save names the version it edited and succeeds only if it is still current. */
    version: integer('version').notNull().default(1),
    ownerId: uuid('owner_id').references(() => users.id, { onDelete: 'set null' }),
    ownerName: text('owner_name').notNull(),
    updatedById: uuid('updated_by_id').references(() => users.id, { onDelete: 'set null' }),
    updatedByName: text('updated_by_name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('reaction_sets_team_idx').on(t.teamId, t.updatedAt)],
);
export type ReactionSetRow = typeof reactionSets.$inferSelect;

/** Every version of every set, as it was saved: who, when, what (in words), and the whole state. */
export const reactionSetVersions = pgTable(
  'reaction_set_versions',
  {
    setId: uuid('set_id')
      .notNull()
      .references(() => reactionSets.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    title: text('title').notNull(),
    description: text('description').notNull(),
    tags: jsonb('tags').$type<string[]>().notNull(),
    items: jsonb('items').$type<SetItem[]>().notNull(),
    pinnedRevision: integer('pinned_revision'),
    summary: text('summary').notNull(),
    byId: uuid('by_id').references(() => users.id, { onDelete: 'set null' }),
    byName: text('by_name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.setId, t.version] })],
);
export type ReactionSetVersionRow = typeof reactionSetVersions.$inferSelect;

/**
 * Read-only links to one set. The token is `selector + verifier`; only SHA-256 hashes of both are
 * kept: the selector's finds the row, the verifier's is compared in constant time.
 */
export const reactionSetLinks = pgTable(
  'reaction_set_links',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    setId: uuid('set_id')
      .notNull()
      .references(() => reactionSets.id, { onDelete: 'cascade' }),
    selectorHash: text('selector_hash').notNull(),
    verifierHash: text('verifier_hash').notNull(),
    createdById: uuid('created_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdByName: text('created_by_name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    lastUsedAt: timestamp('last_used_at', { withTimezone: true }),
    emailedTo: text('emailed_to'),
  },
  (t) => [
    uniqueIndex('reaction_set_links_selector_idx').on(t.selectorHash),
    index('reaction_set_links_set_idx').on(t.setId),
  ],
);
export type ReactionSetLinkRow = typeof reactionSetLinks.$inferSelect;
