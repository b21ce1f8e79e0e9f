import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Db } from '../db/client';
import { applyLibrarySet, libraryIsEmpty } from './apply-set';
import { currentRevision, setRevisionDetail, withNewRevision } from './revisions';
import { fileKind, readLibrarySet, type LibraryFile, type SetProblem } from './seed-set';

/** The folder of the library's seed files (seeds/library). */
export const librarySeedDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../seeds/library');

/** Every library file in a folder, in name order (README-type files are skipped). */
export function readLibraryFolder(dir: string = librarySeedDir): LibraryFile[] {
  return readdirSync(dir)
    .filter((name) => fileKind(name) !== null)
    .sort()
    .map((name) => ({ name, text: readFileSync(path.join(dir, name), 'utf8') }));
}

/** The seed files do not read cleanly: nothing was written. */
export class LibrarySeedError extends Error {
  constructor(readonly problems: SetProblem[]) {
    const shown = problems
      .slice(0, 20)
      .map((p) => `  ${p.file}:${p.line}${p.column ? ` (${p.column})` : ''}: ${p.message}`);
    const more = problems.length > 20 ? `\n  … and ${problems.length - 20} more` : '';
    super(`The library seed files have ${problems.length} problem(s):\n${shown.join('\n')}${more}`);
  }
}

/**
 * Loads seeds/library as revision 1 when the library is empty; otherwise does nothing. The
 * library seed is not demo data: it runs on every installation, production included.
 * @returns the revision made, or null when the library already had one.
 */
export async function seedLibrary(db: Db, files: LibraryFile[] = readLibraryFolder()): Promise<number | null> {
  if ((await currentRevision(db)) !== null) return null;
  const { set, problems } = readLibrarySet(files);
  if (problems.length > 0) throw new LibrarySeedError(problems);
  const { number } = await withNewRevision(
    db,
    { kind: 'seed', summary: 'Seed library: published sources and values typed from memory (see seeds/library)' },
    async (tx, number) => {
      // Another server may have seeded while we read the files; the lock makes this check final.
      if (number !== 1 || !(await libraryIsEmpty(tx))) throw new AlreadySeeded();
      const counts = await applyLibrarySet(tx, set, number);
      await setRevisionDetail(tx, number, { counts, files: files.map((f) => f.name) });
    },
  ).catch((error: unknown) => {
    if (error instanceof AlreadySeeded) return { number: null };
    throw error;
  });
  return number;
}

class AlreadySeeded extends Error {}
