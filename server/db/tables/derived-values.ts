import { doublePrecision, index, integer, jsonb, numeric, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { teams } from './teams';
import { users } from './users';

/**
 * A team's own formation enthalpies, derived by Hess's law for species the library has no ΔfH°
 * for. Team-scoped and outside the shared library; the derivation itself is the provenance.
 */
export const teamDerivedValues = pgTable(
  'team_derived_values',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    /** The species key in the equation language, e.g. "C9H10O2(l, benzyl acetate)". */
    speciesKey: text('species_key').notNull(),
    formula: text('formula').notNull(),
    hill: text('hill').notNull(),
    charge: integer('charge').notNull(),
    phase: text('phase').notNull(),
    descriptor: text('descriptor'),
    /** The library species, when the library holds it (without a ΔfH°). */
    librarySpeciesId: uuid('library_species_id'),
    /** ΔfH°(298.15 K), kJ/mol, and its standard uncertainty (null when incomplete). */
    deltaH: numeric('delta_h').notNull(),
    uncertainty: doublePrecision('uncertainty'),
    uncertaintyMissing: jsonb('uncertainty_missing').$type<string[]>().notNull().default([]),
    /** The derivation: the request, the steps with their multipliers, and the inputs it rests on. */
    derivation: jsonb('derivation').$type<Record<string, unknown>>().notNull(),
    libraryRevision: integer('library_revision').notNull(),
    note: text('note'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdByName: text('created_by_name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('team_derived_values_team').on(t.teamId, t.speciesKey)],
);
