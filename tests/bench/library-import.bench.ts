// Importing a 10,000-row values CSV into one draft amendment: the whole request over HTTP on
// in-memory PGlite (multipart upload, content type check, CSV parse, row conversion in chunks,
// the plan against the current snapshot, the draft with 10,000 entries), waiting for the job to
// end (wait=true). Rows: 1,000 species × ΔfH° and S° × 5 of the library's sources.
import Papa from 'papaparse';
import { afterAll, bench, describe } from 'vitest';
import { openTestDatabase, startTestApp } from '../server/helpers';
import { currentRevision } from '../../server/library/revisions';
import { seedLibrary } from '../../server/library/seed-library';

const ITERATIONS = 3;

const open = await openTestDatabase();
if ((await currentRevision(open.db)) === null) await seedLibrary(open.db);
const t = await startTestApp({ open });
afterAll(async () => t.close());

const member = await t.signIn('member');
const library = (await t.anon().get('/api/v1/library/export.json')).body as {
  species: { key: string; referenceState: string | null }[];
  sources: { key: string }[];
};
const species = library.species.filter((s) => s.referenceState === null).slice(0, 1_000);
const sources = library.sources.slice(0, 5).map((s) => s.key);
const rows: string[][] = [];
for (const source of sources)
  for (const [i, s] of species.entries()) {
    rows.push([
      s.key,
      'dfH298',
      `-${100 + i}.5`,
      'kJ/mol',
      'standard',
      '0.3',
      '',
      source,
      '',
      '',
      'entered',
      '1',
      '',
      '',
    ]);
    rows.push([
      s.key,
      'S298',
      `${50 + i}.25`,
      'J/(mol K)',
      'standard',
      '0.5',
      '',
      source,
      '',
      '',
      'entered',
      '1',
      '',
      '',
    ]);
  }
if (rows.length !== 10_000) throw new Error(`expected 10,000 rows, made ${rows.length}`);
const csv = Buffer.from(
  Papa.unparse({
    fields: [
      'species',
      'property',
      'value',
      'unit',
      'uncertainty_kind',
      'uncertainty',
      'k',
      'source',
      'table',
      'entry_note',
      'provenance',
      'pressure_bar',
      'ion_convention',
      'note',
    ],
    data: rows,
  }),
);

describe('library import', () => {
  bench(
    'POST /api/v1/amendments/imports?wait=true (10,000-row CSV → one draft)',
    async () => {
      const res = await member.post('/api/v1/amendments/imports?wait=true').attach('files', csv, 'values.csv');
      if (res.status !== 201) throw new Error(`import: ${res.status} ${JSON.stringify(res.body).slice(0, 500)}`);
    },
    { iterations: ITERATIONS, time: 0, warmupIterations: 0, warmupTime: 0 },
  );
});
