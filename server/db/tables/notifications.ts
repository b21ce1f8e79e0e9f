import { index, pgTable, primaryKey, text, timestamp, uuid, bigserial } from 'drizzle-orm/pg-core';
import type { NotificationKind, NotificationMode } from '../../../shared/schemas/notifications';
import { users } from './users';

/** Each user's choice per kind of e-mail (no row: the default, at once). */
export const notificationSettings = pgTable(
  'notification_settings',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text('kind').$type<NotificationKind>().notNull(),
    mode: text('mode').$type<NotificationMode>().notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);

/** News waiting for a user's daily digest; `sent_at` is set when the digest went out. */
export const digestItems = pgTable(
  'digest_items',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text('kind').$type<NotificationKind>().notNull(),
    /** One line of the digest, and the link it points to. */
    line: text('line').notNull(),
    link: text('link').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [index('digest_items_pending').on(t.userId, t.sentAt)],
);
