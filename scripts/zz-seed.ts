import { openDatabase } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
import { readLibraryFolder, seedLibrary } from '../server/library/seed-library';
import { LibraryCache } from '../server/library/snapshot';
const open = await openDatabase({ kind: 'pglite', dataDir: 'memory://' });
await runMigrations(open);
let t = Date.now();
const files = readLibraryFolder().map((f) => ({
  ...f,
  text: f.text
    .split('\n')
    .filter((l) => !l.includes('CdSO4·8/3H2O') && !l.includes('CaSO4·1/2H2O'))
    .join('\n')
    .replaceAll('"note":', '"provenanceNote":'),
}));
const rev = await seedLibrary(open.db, files);
console.log('seeded revision', rev, Date.now() - t, 'ms');
t = Date.now();
const cache = new LibraryCache(open.db);
const snap = await cache.at(1);
console.log('snapshot', Date.now() - t, 'ms', snap.species.size, [...snap.values.values()].flat().length, snap.selections.size);
console.log(process.memoryUsage().heapUsed / 1e6, 'MB heap');
await open.close();
