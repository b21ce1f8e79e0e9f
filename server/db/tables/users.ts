import { sql } from 'drizzle-orm';
import { boolean, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import type { SiteRole } from '../../../shared/schemas/roles';

/** People who can sign in. E-mail is stored lower-cased and is unique. */
export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  email: text('email').notNull().unique(),
  displayName: text('display_name').notNull(),
  /** argon2id encoded hash. */
  passwordHash: text('password_hash').notNull(),
  siteRoles: text('site_roles')
    .array()
    .$type<SiteRole[]>()
    .notNull()
    .default(sql`'{}'::text[]`),
  disabled: boolean('disabled').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});
export type UserRow = typeof users.$inferSelect;
