import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import { migrate as migrateNodePg } from 'drizzle-orm/node-postgres/migrator';
import { drizzle as drizzleNodePg } from 'drizzle-orm/node-postgres';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import type { OpenDatabase } from './client';

/** Folder of drizzle-kit's generated SQL migrations. */
export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** Arbitrary constant key for the advisory lock that serialises migrations across servers. */
const MIGRATION_LOCK_KEY = 7_314_905_221;

/** Applies every pending migration from ./drizzle. */
export async function runMigrations(open: OpenDatabase): Promise<void> {
  if (open.kind === 'pglite' && open.pglite) {
    await migratePglite(drizzlePglite({ client: open.pglite }), { migrationsFolder });
    return;
  }
  if (!open.pool) throw new Error('runMigrations: no database connection');
  // Several servers may start at once; the advisory lock is per connection, so hold one client.
  const client = await open.pool.connect();
  try {
    await client.query('select pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    try {
      await migrateNodePg(drizzleNodePg({ client }), { migrationsFolder });
    } finally {
      await client.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]);
    }
  } finally {
    client.release();
  }
}
