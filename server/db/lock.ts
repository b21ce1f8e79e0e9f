import { linkSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** Thrown when another live server holds the data directory. */
export class DataDirLockedError extends Error {}

/** Name of the lock file inside the data directory. */
export const LOCK_FILE = 'thermoledger.lock';

/** What the lock file records about its owner. */
export interface LockOwner {
  pid: number;
  /** Start time of the process (clock ticks since boot, from /proc); null where /proc is missing. */
  startTime: string | null;
}

/**
 * Start time of a process from /proc/<pid>/stat (field 22), or null when it cannot be read
 * (no such process, or no /proc on this system). A pid can be reused after a crash; the pair
 * (pid, start time) cannot, which is what tells our own server from an unrelated process.
 */
export function processStartTime(pid: number): string | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (field 2) is in parentheses and may contain spaces: count fields after it.
    const afterName = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return afterName[19] ?? null;
  } catch {
    return null;
  }
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: the process exists but belongs to someone else.
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function readOwner(file: string): LockOwner | null {
  let text: string;
  try {
    text = readFileSync(file, 'utf8').trim();
  } catch {
    return null;
  }
  try {
    const parsed = JSON.parse(text) as Partial<LockOwner>;
    if (typeof parsed.pid === 'number') return { pid: parsed.pid, startTime: parsed.startTime ?? null };
  } catch {
    // Older servers wrote the bare pid.
  }
  const pid = Number(text);
  return Number.isInteger(pid) && pid > 0 ? { pid, startTime: null } : null;
}

/** True when the recorded owner is this very process, still running: the lock is really held. */
function ownerRunning(owner: LockOwner): boolean {
  if (owner.pid === process.pid || !processAlive(owner.pid)) return false;
  const now = processStartTime(owner.pid);
  // Without a start time on either side all we can tell is that the pid is alive.
  if (owner.startTime === null || now === null) return true;
  return now === owner.startTime;
}

/**
 * Takes an exclusive lock file in `dataDir` so a second server (or drizzle-kit studio) cannot open
 * the same PGlite files, which would corrupt them. The file names the owner's pid and start
 * time; a lock whose owner is gone — or whose pid now belongs to another process — is stale and
 * taken over, so a crash never needs a person to clean up. Returns the function that releases it.
 */
export function lockDataDir(dataDir: string): () => void {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, LOCK_FILE);
  const me: LockOwner = { pid: process.pid, startTime: processStartTime(process.pid) };
  for (let attempt = 0; attempt < 3; attempt++) {
    // Written aside and linked into place, so the lock file never exists without its content.
    const draft = `${file}.${process.pid}.tmp`;
    writeFileSync(draft, JSON.stringify(me));
    try {
      linkSync(draft, file);
      rmSync(draft, { force: true });
      let released = false;
      return () => {
        if (released) return;
        released = true;
        // Only remove the file if it is still ours.
        if (readOwner(file)?.pid === me.pid) rmSync(file, { force: true });
      };
    } catch (err) {
      rmSync(draft, { force: true });
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
      const owner = readOwner(file);
      if (owner && ownerRunning(owner)) {
        throw new DataDirLockedError(
          `The data directory ${dataDir} is in use by another Thermoledger server (process ${owner.pid}). Stop it first, or set DATA_DIR to another folder.`,
        );
      }
      rmSync(file, { force: true });
    }
  }
  throw new DataDirLockedError(`Could not lock the data directory ${dataDir}.`);
}
