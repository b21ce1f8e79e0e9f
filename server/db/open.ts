import path from 'node:path';
import type { Env } from '../env';
import { openDatabase, type OpenDatabase } from './client';
import { lockDataDir } from './lock';

/** Opens the database the environment names, taking the data-directory lock for PGlite. */
export async function openConfiguredDatabase(env: Env): Promise<{ open: OpenDatabase; release: () => void }> {
  if (env.DATABASE_URL)
    return { open: await openDatabase({ kind: 'postgres', url: env.DATABASE_URL }), release: () => {} };
  const dataDir = path.resolve(env.DATA_DIR);
  const release = lockDataDir(dataDir);
  try {
    return { open: await openDatabase({ kind: 'pglite', dataDir }), release };
  } catch (err) {
    release();
    throw err;
  }
}
