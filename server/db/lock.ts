import { closeSync, mkdirSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import path from 'node:path';

/** Thrown when another live process holds the data directory. */
export class DataDirLockedError extends Error {}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: the process exists but belongs to someone else.
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Takes an exclusive lock file in `dataDir` so a second server (or drizzle-kit studio) cannot open
 * the same PGlite files, which would corrupt them. A lock left by a dead process is taken over.
 * Returns the function that releases it.
 */
export function lockDataDir(dataDir: string): () => void {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, 'thermoledger.lock');
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      const fd = openSync(file, 'wx');
      writeSync(fd, String(process.pid));
      closeSync(fd);
      let released = false;
      return () => {
        if (released) return;
        released = true;
        rmSync(file, { force: true });
      };
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
      const pid = Number(readFileSync(file, 'utf8').trim());
      if (Number.isInteger(pid) && pid > 0 && pid !== process.pid && processAlive(pid)) {
        throw new DataDirLockedError(
          `The data directory ${dataDir} is in use by process ${pid}. Stop it first, or set DATA_DIR to another folder.`,
        );
      }
      rmSync(file, { force: true });
    }
  }
  throw new DataDirLockedError(`Could not lock the data directory ${dataDir}.`);
}
