import { index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { teams } from './teams';
import { users } from './users';

/**
 * A team's calorimeter runs: the request as the reduction API takes it (the raw readings
 * included, as the evidence of the result), the reduction the server made of it, and the library
 * revision a bomb run's ΔfH° used. Team-scoped; proposing a value to the library copies from here.
 */
export const calorimetryRuns = pgTable(
  'calorimetry_runs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    authorName: text('author_name').notNull(),
    /** "constant-pressure" or "bomb". */
    kind: text('kind').notNull(),
    label: text('label').notNull(),
    note: text('note'),
    /** The reduction request (readings, amounts, corrections), as POST /calorimetry/<kind> takes it. */
    inputs: jsonb('inputs').$type<Record<string, unknown>>().notNull(),
    /** The uploaded readings file as it came (CSV text) and its name, or null. */
    evidence: jsonb('evidence').$type<{ fileName: string; text: string } | null>(),
    /** The server's reduction of `inputs` (the API's reply). */
    result: jsonb('result').$type<Record<string, unknown>>().notNull(),
    libraryRevision: integer('library_revision'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('calorimetry_runs_team_idx').on(t.teamId, t.updatedAt)],
);
