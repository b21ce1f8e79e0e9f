/**
 * Reads the NASA TM-4513 polynomial files (McBride, Gordon & Reno, 1993; JSON Lines converted from
 * Cantera's nasa_gas.yaml / nasa_condensed.yaml, see SOURCE.md beside them) and evaluates H° and S°
 * at 298.15 K. Used by the memory-value comparison script and the reference-value tests: it only
 * reads the published file, it is not product code.
 *
 * Units: H° in kJ/mol on the scale where elements in their reference states have H°(298.15 K) = 0,
 * so H°(298.15 K) of a compound is its ΔfH°(298.15 K) on the report's data; S° in J/(mol K) at
 * p° = 1 bar.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

/** Gas constant used by the report's conversion notes (SOURCE.md), J/(mol K). */
export const R = 8.314462618;
export const T_REF = 298.15;

/** One entry of the file: a gas, or one phase (polymorph, liquid) of a condensed species. */
export interface NasaEntry {
  name: string;
  composition: Record<string, number>;
  model: 'NASA7' | 'NASA9';
  ranges: number[];
  coefficients: number[][];
  note: string;
  file: 'gas' | 'condensed';
}

/**
 * How far below an entry's first range a 298.15 K evaluation may reach. 427 gases and most solids
 * start at 300 K; practice accepts the 1.85 K extrapolation (SOURCE.md).
 */
export const MAX_EXTRAPOLATION_K = 2;

/** The folder holding gas.jsonl and condensed.jsonl: the project copy if present, else the shared one. */
export function nasaDataDir(projectRoot = process.cwd()): string {
  const candidates = [
    process.env.NASA_TM4513_DIR,
    join(projectRoot, 'seeds/source-data/nasa-tm4513'),
    '/work/shared/data/nasa-tm4513',
  ].filter((p): p is string => typeof p === 'string' && p.length > 0);
  for (const dir of candidates) {
    if (existsSync(join(dir, 'gas.jsonl')) && existsSync(join(dir, 'condensed.jsonl'))) return resolve(dir);
  }
  throw new Error(`NASA TM-4513 data not found; looked in: ${candidates.join(', ')}`);
}

/** All entries of both files, by the report's own label. */
export function loadNasaEntries(dir = nasaDataDir()): Map<string, NasaEntry> {
  const entries = new Map<string, NasaEntry>();
  for (const file of ['gas', 'condensed'] as const) {
    const lines = readFileSync(join(dir, `${file}.jsonl`), 'utf8').split('\n');
    lines.forEach((line, i) => {
      if (line.trim() === '') return;
      const entry = { ...(JSON.parse(line) as Omit<NasaEntry, 'file'>), file };
      if (entries.has(entry.name)) throw new Error(`${file}.jsonl line ${i + 1}: duplicate label ${entry.name}`);
      entries.set(entry.name, entry);
    });
  }
  return entries;
}

function segmentIndex(entry: NasaEntry, t: number): number {
  const { ranges } = entry;
  const first = ranges[0]!;
  const last = ranges[ranges.length - 1]!;
  if (t < first - MAX_EXTRAPOLATION_K || t > last) {
    throw new RangeError(`${entry.name} covers ${first}–${last} K, not ${t} K`);
  }
  for (let i = 0; i < ranges.length - 1; i++) {
    if (t <= ranges[i + 1]!) return i;
  }
  return ranges.length - 2;
}

/** H°(T) in kJ/mol and S°(T) in J/(mol K) from one entry's polynomial (equations of SOURCE.md). */
export function evaluateEntry(entry: NasaEntry, t = T_REF): { h: number; s: number } {
  const a = entry.coefficients[segmentIndex(entry, t)]!;
  const c = (i: number) => a[i] ?? 0;
  if (entry.model === 'NASA7') {
    const hOverRT = c(0) + (c(1) * t) / 2 + (c(2) * t ** 2) / 3 + (c(3) * t ** 3) / 4 + (c(4) * t ** 4) / 5 + c(5) / t;
    const sOverR =
      c(0) * Math.log(t) + c(1) * t + (c(2) * t ** 2) / 2 + (c(3) * t ** 3) / 3 + (c(4) * t ** 4) / 4 + c(6);
    return { h: (hOverRT * R * t) / 1000, s: sOverR * R };
  }
  const hOverRT =
    -c(0) / t ** 2 +
    (c(1) * Math.log(t)) / t +
    c(2) +
    (c(3) * t) / 2 +
    (c(4) * t ** 2) / 3 +
    (c(5) * t ** 3) / 4 +
    (c(6) * t ** 4) / 5 +
    c(7) / t;
  const sOverR =
    -c(0) / (2 * t ** 2) -
    c(1) / t +
    c(2) * Math.log(t) +
    c(3) * t +
    (c(4) * t ** 2) / 2 +
    (c(5) * t ** 3) / 3 +
    (c(6) * t ** 4) / 4 +
    c(8);
  return { h: (hOverRT * R * t) / 1000, s: sOverR * R };
}
