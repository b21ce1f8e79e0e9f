import { readFileSync } from 'node:fs';
import type { SpeciesThermoModel } from '@shared/chemistry/thermo';

/**
 * Entries of the NASA TM-4513 polynomial file (McBride, Gordon & Reno, 1993), a verbatim copy of
 * a few lines in tests/fixtures/nasa-tm4513/sample.jsonl (see SOURCE.md there).
 */
export interface NasaEntry {
  name: string;
  model: 'NASA7' | 'NASA9';
  ranges: number[];
  coefficients: number[][];
  note: string;
}

const text = readFileSync(new URL('../../../fixtures/nasa-tm4513/sample.jsonl', import.meta.url), 'utf8');
export const nasaEntries: Record<string, NasaEntry> = Object.fromEntries(
  text
    .split('\n')
    .filter((l) => l.trim() !== '')
    .map((l) => JSON.parse(l) as NasaEntry)
    .map((e) => [e.name, e]),
);

export function entry(name: string): NasaEntry {
  const e = nasaEntries[name];
  if (!e) throw new Error(`fixture has no entry ${name}`);
  return e;
}

/** A formation-scale species model from one or more consecutive NASA entries (the library's shape). */
export function nasaModel(species: string, forms: [form: string | null, label: string][]): SpeciesThermoModel {
  return {
    species,
    scale: 'formation',
    forms: forms.map(([form, label]) => {
      const e = entry(label);
      return {
        form,
        label,
        model: {
          kind: e.model === 'NASA7' ? 'nasa7' : 'nasa9',
          ranges: [...e.ranges],
          coefficients: e.coefficients.map((c) => [...c]),
        },
      };
    }),
  };
}

// Independent straight-line evaluation of the equations printed in NASA TM-4513 (and in
// shared/data/nasa-tm4513/SOURCE.md), written apart from the code under test: powers with
// Math.pow, range chosen by the first range containing T, values in SI before any unit change.
const R = 8.314462618;
function pick(e: NasaEntry, t: number): number[] {
  for (let i = 0; i < e.coefficients.length; i++) if (t <= e.ranges[i + 1]!) return e.coefficients[i]!;
  throw new Error('outside');
}
export function refCp(e: NasaEntry, t: number): number {
  const a = pick(e, t);
  if (e.model === 'NASA7')
    return R * (a[0]! + a[1]! * t + a[2]! * Math.pow(t, 2) + a[3]! * Math.pow(t, 3) + a[4]! * Math.pow(t, 4));
  return (
    R *
    (a[0]! * Math.pow(t, -2) +
      a[1]! / t +
      a[2]! +
      a[3]! * t +
      a[4]! * Math.pow(t, 2) +
      a[5]! * Math.pow(t, 3) +
      a[6]! * Math.pow(t, 4))
  );
}
/** H in kJ/mol. */
export function refH(e: NasaEntry, t: number): number {
  const a = pick(e, t);
  let hOverRT: number;
  if (e.model === 'NASA7')
    hOverRT =
      a[0]! +
      (a[1]! * t) / 2 +
      (a[2]! * Math.pow(t, 2)) / 3 +
      (a[3]! * Math.pow(t, 3)) / 4 +
      (a[4]! * Math.pow(t, 4)) / 5 +
      a[5]! / t;
  else
    hOverRT =
      -a[0]! * Math.pow(t, -2) +
      (a[1]! * Math.log(t)) / t +
      a[2]! +
      (a[3]! * t) / 2 +
      (a[4]! * Math.pow(t, 2)) / 3 +
      (a[5]! * Math.pow(t, 3)) / 4 +
      (a[6]! * Math.pow(t, 4)) / 5 +
      a[7]! / t;
  return (hOverRT * R * t) / 1000;
}
export function refS(e: NasaEntry, t: number): number {
  const a = pick(e, t);
  if (e.model === 'NASA7')
    return (
      R *
      (a[0]! * Math.log(t) +
        a[1]! * t +
        (a[2]! * Math.pow(t, 2)) / 2 +
        (a[3]! * Math.pow(t, 3)) / 3 +
        (a[4]! * Math.pow(t, 4)) / 4 +
        a[6]!)
    );
  return (
    R *
    ((-a[0]! * Math.pow(t, -2)) / 2 -
      a[1]! / t +
      a[2]! * Math.log(t) +
      a[3]! * t +
      (a[4]! * Math.pow(t, 2)) / 2 +
      (a[5]! * Math.pow(t, 3)) / 3 +
      (a[6]! * Math.pow(t, 4)) / 4 +
      a[8]!)
  );
}
/** H and S of one specific range i at T (for joints). */
export function refRangeH(e: NasaEntry, i: number, t: number): number {
  return refH({ ...e, ranges: [0, Infinity], coefficients: [e.coefficients[i]!] }, t);
}
export function refRangeCp(e: NasaEntry, i: number, t: number): number {
  return refCp({ ...e, ranges: [0, Infinity], coefficients: [e.coefficients[i]!] }, t);
}
export function refRangeS(e: NasaEntry, i: number, t: number): number {
  return refS({ ...e, ranges: [0, Infinity], coefficients: [e.coefficients[i]!] }, t);
}
