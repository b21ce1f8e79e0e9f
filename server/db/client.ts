import { mkdirSync, rmSync, existsSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import { drizzle as drizzleNodePg } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './tables/index';

export { schema };
export type Schema = typeof schema;

/** The query API shared by the PGlite and the node-postgres drivers. */
export type Db = PgDatabase<PgQueryResultHKT, Schema>;
/** A transaction handle, as passed to `db.transaction(async (tx) => …)`. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Either the database or an open transaction. */
export type Executor = Db | Tx;

/** An open database and how to close it. */
export interface OpenDatabase {
  db: Db;
  kind: 'pglite' | 'postgres';
  /** The PGlite instance, when that driver is used (for migrations and dumps). */
  pglite?: PGlite;
  /** The node-postgres pool, when that driver is used. */
  pool?: pg.Pool;
  close(): Promise<void>;
}

export type DatabaseTarget =
  | {
      kind: 'pglite';
      dataDir: string | 'memory://';
      /** A data-directory dump to start from (in-memory only; tests start from a seeded one). */
      loadDataDir?: Blob;
    }
  | { kind: 'postgres'; url: string };

/**
 * Opens PGlite (persisted in `dataDir`, or in memory) or a PostgreSQL server pool, both behind
 * the same drizzle schema. The caller must hold the data-directory lock for a persisted PGlite.
 */
export async function openDatabase(target: DatabaseTarget): Promise<OpenDatabase> {
  if (target.kind === 'postgres') {
    const pool = new pg.Pool({ connectionString: target.url, max: 10 });
    // A failing idle client must not crash the process; the next query reports the problem.
    pool.on('error', (err) => console.error('[db] idle client error:', err.message));
    const db = drizzleNodePg({ client: pool, schema }) as unknown as Db;
    return { db, kind: 'postgres', pool, close: () => pool.end() };
  }
  let dataDir: string | undefined;
  if (target.dataDir !== 'memory://') {
    dataDir = path.resolve(target.dataDir, 'pglite');
    mkdirSync(dataDir, { recursive: true });
    // A crash can leave postmaster.pid behind, which makes PGlite abort; we hold the lock, so it is stale.
    const pidFile = path.join(dataDir, 'postmaster.pid');
    if (existsSync(pidFile)) rmSync(pidFile);
  }
  const pglite = new PGlite({
    ...(dataDir ? { dataDir } : {}),
    ...(target.loadDataDir ? { loadDataDir: target.loadDataDir } : {}),
  });
  await pglite.waitReady;
  const db = drizzlePglite({ client: pglite, schema }) as unknown as Db;
  return { db, kind: 'pglite', pglite, close: () => pglite.close() };
}
