/**
 * The bomb form's rows and the API's run objects, both ways: a row becomes one run of
 * POST /calorimetry/bomb (a typed rise or a readings series, fuse, nitric acid as an energy or by
 * titration, buoyancy from the sample's density), and a stored run fills a row again (a set item
 * opened in /calorimetry). Pure, no Vue.
 */
import type { BombRunInput } from '@shared/schemas/calorimetry';

/** One run as the form holds it. */
export interface BombRunSeries {
  series: [number, number][];
  unit: 'K' | 'C' | 'F';
  mixingTime: number | null;
  method: 'dickinson' | 'regnault-pfaundler';
  evidence: { fileName: string; text: string } | null;
}

export interface BombRunRow {
  mass: number | null;
  massU: number | null;
  rise: number | null;
  riseU: number | null;
  fuse: number | null;
  fuseU: number | null;
  nitricAcid: number | null;
  nitricAcidU: number | null;
  titrantVolume: number | null;
  titrantVolumeU: number | null;
  titrantConcentration: number | null;
  titrantConcentrationU: number | null;
  /** g/cm³: the buoyancy correction is applied when given. */
  sampleDensity: number | null;
  /** When set, the corrected rise comes from these readings. */
  readings?: BombRunSeries | null;
}

export function emptyBombRow(): BombRunRow {
  return {
    mass: null,
    massU: null,
    rise: null,
    riseU: null,
    fuse: null,
    fuseU: null,
    nitricAcid: null,
    nitricAcidU: null,
    titrantVolume: null,
    titrantVolumeU: null,
    titrantConcentration: null,
    titrantConcentrationU: null,
    sampleDensity: null,
    readings: null,
  };
}

const num = (x: number | null) => x ?? Number.NaN;
const withU = (u: number | null) => (u !== null ? { uncertainty: u } : {});

/** One run as the API takes it; a row with a titrant volume sends the titration, else the energy typed. */
export function bombRunInput(row: BombRunRow): BombRunInput {
  const titration = row.titrantVolume !== null || row.titrantConcentration !== null;
  return {
    mass: { value: num(row.mass), unit: 'g', ...withU(row.massU) },
    ...(row.sampleDensity !== null ? { buoyancy: { sampleDensity: row.sampleDensity } } : {}),
    temperature: row.readings
      ? {
          series: row.readings.series,
          unit: row.readings.unit,
          mixingTime: num(row.readings.mixingTime),
          method: row.readings.method,
        }
      : { rise: { value: num(row.rise), unit: 'K', ...withU(row.riseU) } },
    ...(row.fuse !== null ? { fuse: { energy: { value: row.fuse, unit: 'J', ...withU(row.fuseU) } } } : {}),
    ...(titration
      ? {
          nitricAcid: {
            titrantVolume: { value: num(row.titrantVolume), unit: 'mL', ...withU(row.titrantVolumeU) },
            titrantConcentration: {
              value: num(row.titrantConcentration),
              unit: 'mol/L',
              ...withU(row.titrantConcentrationU),
            },
          },
        }
      : row.nitricAcid !== null
        ? { nitricAcid: { energy: { value: row.nitricAcid, unit: 'J', ...withU(row.nitricAcidU) } } }
        : {}),
  };
}

/** An optional uncertainty in another unit (null stays null). */
export const times = (u: number | null | undefined, by: number): number | null =>
  u === null || u === undefined ? null : u * by;

const JOULES = { J: 1, kJ: 1000, cal: 4.184 } as const;
const KELVIN_PER_DEGREE = { K: 1, C: 1, F: 5 / 9 } as const;

function scaled(
  q: { value: number; uncertainty?: number | null | undefined } | undefined,
  by: number,
): [number | null, number | null] {
  if (!q) return [null, null];
  return [q.value * by, times(q.uncertainty, by)];
}

/**
 * A stored run as a form row, in the form's units (g, K, J, mL, mol/L). What the form cannot show
 * (a fuse given by length, auxiliary or ignition energies) is returned in `unshown`, so the page
 * can say so instead of losing it silently.
 */
export function bombRow(
  run: BombRunInput,
  evidence: { fileName: string; text: string } | null = null,
): { row: BombRunRow; unshown: string[] } {
  const row = emptyBombRow();
  const unshown: string[] = [];
  [row.mass, row.massU] = scaled(run.mass, run.mass.unit === 'mg' ? 0.001 : 1);
  const t = run.temperature;
  if (t.series && t.unit && t.method)
    row.readings = { series: t.series, unit: t.unit, mixingTime: t.mixingTime ?? null, method: t.method, evidence };
  else if (t.rise) [row.rise, row.riseU] = scaled(t.rise, KELVIN_PER_DEGREE[t.rise.unit]);
  if (run.fuse?.energy) [row.fuse, row.fuseU] = scaled(run.fuse.energy, JOULES[run.fuse.energy.unit]);
  else if (run.fuse) unshown.push('a fuse given by its length');
  const n = run.nitricAcid;
  if (n?.energy) [row.nitricAcid, row.nitricAcidU] = scaled(n.energy, JOULES[n.energy.unit]);
  else if (n) {
    [row.titrantVolume, row.titrantVolumeU] = scaled(n.titrantVolume, 1);
    [row.titrantConcentration, row.titrantConcentrationU] = scaled(n.titrantConcentration, 1);
    if (n.molarEnergy) unshown.push('a molar energy of nitric acid other than the default');
  }
  if (run.buoyancy) {
    row.sampleDensity = run.buoyancy.sampleDensity;
    if (run.buoyancy.airDensity !== undefined || run.buoyancy.weightsDensity !== undefined)
      unshown.push('air or weights densities');
  }
  if (run.auxiliary) unshown.push('an auxiliary substance energy');
  if (run.ignition) unshown.push('an ignition energy');
  return { row, unshown };
}
