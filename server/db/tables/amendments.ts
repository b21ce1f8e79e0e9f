import {
  bigserial,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uuid,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import type { AmendmentAction, AmendmentState, DiffItem } from '../../../shared/schemas/amendments';
import { libraryRevisions } from './library';
import { users } from './users';

/*
 * Amendments: proposed changes to the library. An amendment is written against a base revision
 * and holds its entries (amendment_entries, in order), the diff against that base, and the
 * identities it targets (to detect a later revision that changed the same things). Its state
 * history (amendment_events) and comment thread (amendment_comments) hang off it. Accepting it
 * makes one library revision (library_revisions.amendment_id).
 */

/** Where an amendment came from: the editor (the API), an import of files, or a revert. */
export interface AmendmentOrigin {
  kind: 'editor' | 'import' | 'revert';
  [detail: string]: unknown;
}

export const amendments = pgTable(
  'amendments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    title: text('title').notNull(),
    rationale: text('rationale').notNull(),
    state: text('state').$type<AmendmentState>().notNull(),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    /** The author's display name, kept when the account is removed. */
    authorName: text('author_name').notNull(),
    baseRevision: integer('base_revision')
      .notNull()
      .references(() => libraryRevisions.number),
    resultRevision: integer('result_revision').references(() => libraryRevisions.number),
    revertOf: uuid('revert_of').references((): AnyPgColumn => amendments.id, { onDelete: 'set null' }),
    origin: jsonb('origin').$type<AmendmentOrigin>().notNull().default({ kind: 'editor' }),
    /** Per entry, against the library at base_revision (recomputed on edit and rebase). */
    diff: jsonb('diff').$type<DiffItem[]>().notNull(),
    /** Identities the entries change ("value:CO2(g)|dfH298|codata-1989", …). */
    targets: jsonb('targets').$type<string[]>().notNull(),
    entryCount: integer('entry_count').notNull(),
    /** Bumped by every change; keys cached dry runs (the impact). */
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    openedAt: timestamp('opened_at', { withTimezone: true }),
    closedAt: timestamp('closed_at', { withTimezone: true }),
  },
  (t) => [
    index('amendments_state').on(t.state, t.updatedAt),
    index('amendments_author').on(t.authorId),
    index('amendments_revert_of').on(t.revertOf),
  ],
);

/** The entries of an amendment, in order; the payload is the entry as proposed (shared schema). */
export const amendmentEntries = pgTable(
  'amendment_entries',
  {
    amendmentId: uuid('amendment_id')
      .notNull()
      .references(() => amendments.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    kind: text('kind').notNull(),
    payload: jsonb('payload').$type<Record<string, unknown>>().notNull(),
    /** The species the entry is about, for the queue's species filter (null for sources). */
    speciesKey: text('species_key'),
    speciesId: uuid('species_id'),
  },
  (t) => [
    primaryKey({ columns: [t.amendmentId, t.position] }),
    index('amendment_entries_species_key').on(t.speciesKey),
    index('amendment_entries_species_id').on(t.speciesId),
  ],
);

/** The state history: every transition and edit, who, when, from, to and why. Append-only. */
export const amendmentEvents = pgTable(
  'amendment_events',
  {
    /** Serial: a notification job can pick up events after the last one it handled. */
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    amendmentId: uuid('amendment_id')
      .notNull()
      .references(() => amendments.id, { onDelete: 'cascade' }),
    action: text('action').$type<AmendmentAction>().notNull(),
    fromState: text('from_state').$type<AmendmentState>(),
    toState: text('to_state').$type<AmendmentState>().notNull(),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    actorName: text('actor_name'),
    reason: text('reason'),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('amendment_events_amendment').on(t.amendmentId, t.id)],
);

/** The comment thread of an amendment (its author and curators). */
export const amendmentComments = pgTable(
  'amendment_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    amendmentId: uuid('amendment_id')
      .notNull()
      .references(() => amendments.id, { onDelete: 'cascade' }),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    authorName: text('author_name').notNull(),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('amendment_comments_amendment').on(t.amendmentId, t.createdAt)],
);

/**
 * Evidence files of an amendment. The bytes live in the evidence directory under `stored_name`
 * (random, never derived from the upload); this row keeps what the uploader called it and the
 * type read from its content.
 */
export const amendmentFiles = pgTable(
  'amendment_files',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    amendmentId: uuid('amendment_id')
      .notNull()
      .references(() => amendments.id, { onDelete: 'cascade' }),
    storedName: text('stored_name').notNull().unique(),
    originalName: text('original_name').notNull(),
    /** Detected from the content (file-type, or the text check), never the client's claim. */
    mediaType: text('media_type').notNull(),
    size: integer('size').notNull(),
    sha256: text('sha256').notNull(),
    uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    uploadedByName: text('uploaded_by_name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('amendment_files_amendment').on(t.amendmentId, t.createdAt)],
);
