/**
 * Imports the NASA TM-4513 polynomials (McBride, Gordon & Reno, 1993) into the library seed files.
 *
 *   npm run library:import-nasa
 *
 * Reads seeds/source-data/nasa-tm4513/{gas,condensed}.jsonl and scripts/library/nasa-labels.ts;
 * writes seeds/library/species-nasa.csv, values-nasa.csv, models-nasa.jsonl and the `nasa-tm4513`
 * row of sources.csv (other rows are kept as they are). Deterministic: running it twice gives the
 * same bytes. Any mismatch between the label table and the source stops it before anything is
 * written.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { NASA_EXCLUDED, NASA_LABELS } from './nasa-labels';
import {
  buildNasaSeed,
  NasaImportError,
  readSourceJsonl,
  SOURCES_HEADER,
  type NasaSeed,
  type NasaSourceEntry,
} from './nasa-seed';
import { upsertCsvRecord } from './seed-csv';

const root = fileURLToPath(new URL('../../', import.meta.url));
export const NASA_SOURCE_DIR = `${root}seeds/source-data/nasa-tm4513/`;
export const LIBRARY_DIR = `${root}seeds/library/`;

/** The entries of the copied source files, each file in its own order (a bad line stops it). */
export function readNasaSource(dir = NASA_SOURCE_DIR): { gas: NasaSourceEntry[]; condensed: NasaSourceEntry[] } {
  return {
    gas: readSourceJsonl(readFileSync(`${dir}gas.jsonl`, 'utf8'), 'gas.jsonl'),
    condensed: readSourceJsonl(readFileSync(`${dir}condensed.jsonl`, 'utf8'), 'condensed.jsonl'),
  };
}

/** Runs the import on the copied source files (no writing). */
export function runNasaImport(): NasaSeed {
  const { gas, condensed } = readNasaSource();
  return buildNasaSeed(gas, condensed, NASA_LABELS, NASA_EXCLUDED);
}

function main(): void {
  let seed: NasaSeed;
  try {
    seed = runNasaImport();
  } catch (err) {
    if (err instanceof NasaImportError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const sourcesPath = `${LIBRARY_DIR}sources.csv`;
  const sources = upsertCsvRecord(
    existsSync(sourcesPath) ? readFileSync(sourcesPath, 'utf8') : null,
    SOURCES_HEADER,
    seed.sourceRecord,
  );
  writeFileSync(`${LIBRARY_DIR}species-nasa.csv`, seed.speciesCsv);
  writeFileSync(`${LIBRARY_DIR}values-nasa.csv`, seed.valuesCsv);
  writeFileSync(`${LIBRARY_DIR}models-nasa.jsonl`, seed.modelsJsonl);
  writeFileSync(sourcesPath, sources);
  const c = seed.counts;
  console.log(
    `NASA TM-4513: ${c.species} species, ${c.values} values, ${c.models} models written; ${c.excluded} labels excluded.`,
  );
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) main();
