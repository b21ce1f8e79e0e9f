import { openDatabase } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
import { seedLibrary } from '../server/library/seed-library';
import { LibraryCache } from '../server/library/snapshot';
import { deriveReactionEnthalpy } from '../server/services/derive.service';
const open = await openDatabase({ kind: 'pglite', dataDir: 'memory://' });
await runMigrations(open);
let t = Date.now();
console.log(await seedLibrary(open.db), Date.now() - t, 'ms');
const ctx = { library: new LibraryCache(open.db), db: open.db } as never;
for (const target of ['C(cr, graphite) + 1/2 O2(g) -> CO(g)', 'C(cr, graphite) + 2 H2(g) -> CH4(g)', 'NaCl(cr) -> Na^+(aq) + Cl^-(aq)', '2 C(cr, graphite) + 3 H2(g) + 1/2 O2(g) -> C2H6O(l)']) {
  t = Date.now();
  try {
    const r = await deriveReactionEnthalpy(ctx, { target });
    console.log(target, Date.now() - t, 'ms', r.status, r.deltaH, r.basis, r.consistent, r.routes.length, r.routes.map((x) => [x.deltaH.value.toFixed(3), x.agrees, x.steps.length]), r.warnings.map((w) => w.code));
  } catch (e) { console.log(target, e); }
}
await open.close();
