import { sql } from 'drizzle-orm';
import {
  bigserial,
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  numeric,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import type {
  HeatCapacityForm,
  LibraryPhase,
  LibraryProperty,
  ModelScale,
  Provenance,
  RevisionKind,
  SourceKind,
  UncertaintyKind,
} from '../../../shared/schemas/library-core';

/*
 * The library is temporal: every versioned row carries the revision it appeared in (`valid_from`)
 * and the revision that replaced or removed it (`valid_to`, null while current). The library at
 * revision r is every row with valid_from <= r and (valid_to is null or valid_to > r), so any past
 * revision reads back exactly. Rows are never updated except to close them; a change closes the
 * old row and inserts a new one with the same stable `id`.
 */

const validity = {
  validFrom: integer('valid_from')
    .notNull()
    .references((): AnyPgColumn => libraryRevisions.number),
  validTo: integer('valid_to').references((): AnyPgColumn => libraryRevisions.number),
};

/** One numbered state of the whole library. Revision 1 is the seed. */
export const libraryRevisions = pgTable('library_revisions', {
  number: integer('number').primaryKey(),
  kind: text('kind').$type<RevisionKind>().notNull(),
  summary: text('summary').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  // No foreign key: the library's history outlives accounts (and test resets of them); the e-mail stays.
  createdBy: uuid('created_by'),
  /** The e-mail of the person, kept when the account is removed. */
  createdByEmail: text('created_by_email'),
  /** The amendment whose acceptance made this revision, once amendments exist. */
  amendmentId: uuid('amendment_id'),
  /** What the change held (counts per kind, file name of an import…). */
  detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
});

/** Published sources values come from. */
export const librarySources = pgTable(
  'library_sources',
  {
    rowId: bigserial('row_id', { mode: 'number' }).primaryKey(),
    id: uuid('id').notNull(),
    key: text('key').notNull(),
    kind: text('kind').$type<SourceKind>().notNull(),
    authors: text('authors').notNull(),
    title: text('title').notNull(),
    publication: text('publication'),
    year: integer('year'),
    volume: text('volume'),
    pages: text('pages'),
    doi: text('doi'),
    isbn: text('isbn'),
    url: text('url'),
    note: text('note'),
    ...validity,
  },
  (t) => [
    uniqueIndex('library_sources_current_id')
      .on(t.id)
      .where(sql`${t.validTo} is null`),
    uniqueIndex('library_sources_current_key')
      .on(t.key)
      .where(sql`${t.validTo} is null`),
    index('library_sources_validity').on(t.validFrom, t.validTo),
  ],
);

/** Species: one formula, charge, phase and (optional) descriptor; polymorphs of a solid are one species. */
export const librarySpecies = pgTable(
  'library_species',
  {
    rowId: bigserial('row_id', { mode: 'number' }).primaryKey(),
    id: uuid('id').notNull(),
    /** The species in the equation language, e.g. "C(cr, graphite)", "SO4^2-(aq)". */
    key: text('key').notNull(),
    formula: text('formula').notNull(),
    hill: text('hill').notNull(),
    charge: integer('charge').notNull(),
    phase: text('phase').$type<LibraryPhase>().notNull(),
    descriptor: text('descriptor'),
    name: text('name').notNull(),
    synonyms: jsonb('synonyms').$type<string[]>().notNull().default([]),
    cas: text('cas'),
    inchi: text('inchi'),
    inchikey: text('inchikey'),
    /** Element symbol when this species is that element's reference state. */
    referenceState: text('reference_state'),
    /** g/mol from the formula and the standard atomic weights. */
    molarMass: doublePrecision('molar_mass').notNull(),
    note: text('note'),
    ...validity,
  },
  (t) => [
    uniqueIndex('library_species_current_id')
      .on(t.id)
      .where(sql`${t.validTo} is null`),
    uniqueIndex('library_species_current_key')
      .on(t.key)
      .where(sql`${t.validTo} is null`),
    index('library_species_validity').on(t.validFrom, t.validTo),
    index('library_species_hill').on(t.hill),
  ],
);

/** ΔfH°(298.15 K) and S°(298.15 K) values, each from one source, with its uncertainty as stated. */
export const libraryValues = pgTable(
  'library_values',
  {
    rowId: bigserial('row_id', { mode: 'number' }).primaryKey(),
    id: uuid('id').notNull(),
    speciesId: uuid('species_id').notNull(),
    property: text('property').$type<LibraryProperty>().notNull(),
    /** kJ/mol for dfH298, J/(mol K) for S298; numeric keeps the source's digits. */
    value: numeric('value').notNull(),
    uncertaintyKind: text('uncertainty_kind').$type<UncertaintyKind>().notNull(),
    /** The ± as the source states it (same unit as the value). */
    uncertaintyStated: numeric('uncertainty_stated'),
    coverageK: doublePrecision('coverage_k'),
    /** Standard uncertainty (k = 1) derived from the stated one, and the rule used. */
    standardUncertainty: doublePrecision('standard_uncertainty'),
    uncertaintyRule: text('uncertainty_rule').notNull(),
    sourceId: uuid('source_id').notNull(),
    tableRef: text('table_ref'),
    entryNote: text('entry_note'),
    provenance: text('provenance').$type<Provenance>().notNull(),
    provenanceNote: text('provenance_note'),
    pressureBar: doublePrecision('pressure_bar').notNull().default(1),
    ionConvention: text('ion_convention'),
    /** For derived values: the derivation (steps, multipliers, revision). */
    derivation: jsonb('derivation').$type<Record<string, unknown>>(),
    ...validity,
  },
  (t) => [
    uniqueIndex('library_values_current_id')
      .on(t.id)
      .where(sql`${t.validTo} is null`),
    index('library_values_species').on(t.speciesId),
    index('library_values_validity').on(t.validFrom, t.validTo),
  ],
);

/** Heat-capacity models: the forms a species passes through, each with its fitted model. */
export const libraryModels = pgTable(
  'library_models',
  {
    rowId: bigserial('row_id', { mode: 'number' }).primaryKey(),
    id: uuid('id').notNull(),
    speciesId: uuid('species_id').notNull(),
    sourceId: uuid('source_id').notNull(),
    scale: text('scale').$type<ModelScale>().notNull(),
    forms: jsonb('forms').$type<HeatCapacityForm[]>().notNull(),
    tMin: doublePrecision('t_min').notNull(),
    tMax: doublePrecision('t_max').notNull(),
    entryNote: text('entry_note'),
    provenance: text('provenance').$type<Provenance>().notNull(),
    provenanceNote: text('provenance_note'),
    ...validity,
  },
  (t) => [
    uniqueIndex('library_models_current_id')
      .on(t.id)
      .where(sql`${t.validTo} is null`),
    index('library_models_species').on(t.speciesId),
    index('library_models_validity').on(t.validFrom, t.validTo),
  ],
);

/** Which value (or model) of a species is used for a property, and why. */
export const librarySelections = pgTable(
  'library_selections',
  {
    rowId: bigserial('row_id', { mode: 'number' }).primaryKey(),
    speciesId: uuid('species_id').notNull(),
    /** dfH298, S298 or cp (the heat-capacity model). */
    property: text('property').$type<LibraryProperty | 'cp'>().notNull(),
    /** id of a library_values row, or of a library_models row for cp. */
    valueId: uuid('value_id').notNull(),
    reason: text('reason').notNull(),
    // No foreign key, as for revisions: the library's history outlives accounts.
    selectedBy: uuid('selected_by'),
    ...validity,
  },
  (t) => [
    uniqueIndex('library_selections_current')
      .on(t.speciesId, t.property)
      .where(sql`${t.validTo} is null`),
    index('library_selections_validity').on(t.validFrom, t.validTo),
  ],
);

/** One species of a measured reaction: a library species, or a finite-concentration solute. */
export interface ReactionTermRow {
  /** Library species id, or null for a species that exists only in reactions (`NaCl(aq, 0.1 mol/kg)`). */
  speciesId: string | null;
  /** The species key as written in the equation language. */
  key: string;
  /** Signed exact coefficient as fraction text: products positive, reactants negative. */
  coefficient: string;
}

/** Measured reactions: ΔrH of a reaction as a source reports it. */
export const libraryReactions = pgTable(
  'library_reactions',
  {
    rowId: bigserial('row_id', { mode: 'number' }).primaryKey(),
    id: uuid('id').notNull(),
    key: text('key').notNull(),
    equation: text('equation').notNull(),
    terms: jsonb('terms').$type<ReactionTermRow[]>().notNull(),
    /** kJ/mol per mole of reaction as written, at `temperature`. */
    deltaH: numeric('delta_h').notNull(),
    uncertaintyKind: text('uncertainty_kind').$type<UncertaintyKind>().notNull(),
    uncertaintyStated: numeric('uncertainty_stated'),
    coverageK: doublePrecision('coverage_k'),
    standardUncertainty: doublePrecision('standard_uncertainty'),
    uncertaintyRule: text('uncertainty_rule').notNull(),
    /** K. */
    temperature: doublePrecision('temperature').notNull(),
    method: text('method').notNull(),
    /** mol/kg for a solution or dilution enthalpy at finite concentration; null at infinite dilution. */
    molality: doublePrecision('molality'),
    sourceId: uuid('source_id').notNull(),
    tableRef: text('table_ref'),
    /** False when the value restates library values: kept for reference, left out of Hess sums. */
    independent: boolean('independent').notNull().default(true),
    provenance: text('provenance').$type<Provenance>().notNull(),
    provenanceNote: text('provenance_note'),
    ...validity,
  },
  (t) => [
    uniqueIndex('library_reactions_current_id')
      .on(t.id)
      .where(sql`${t.validTo} is null`),
    uniqueIndex('library_reactions_current_key')
      .on(t.key)
      .where(sql`${t.validTo} is null`),
    index('library_reactions_validity').on(t.validFrom, t.validTo),
  ],
);
