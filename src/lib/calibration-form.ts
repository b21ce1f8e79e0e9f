/**
 * The constant-pressure form's calibration rows and the API's calibration runs, both ways: a row
 * becomes one run of `calibration.runs` in POST /calorimetry/constant-pressure (an electrical
 * heater run or a hot/cold water mixing run), and a stored run fills a row again (a saved run or a
 * set item opened in /calorimetry). Pure, no Vue.
 */
import type { CalibrationRunInput } from '@shared/schemas/calorimetry';
import { times } from './bomb-form';

/** Water's specific heat near 25 °C, J/(g K): the form's default for contents and mixing water. */
export const WATER_SPECIFIC_HEAT = 4.184;

type Scale = 'K' | 'C' | 'F';

/** One calibration run as the form holds it; masses in g, the mixing temperatures on `scale`. */
export interface CalibrationRow {
  kind: 'electrical' | 'mixing';
  current: number | null;
  currentU: number | null;
  voltage: number | null;
  voltageU: number | null;
  duration: number | null;
  durationU: number | null;
  /** K */
  deltaT: number | null;
  deltaTU: number | null;
  contentsMass: number | null;
  contentsMassU: number | null;
  contentsSpecificHeat: number | null;
  contentsSpecificHeatU: number | null;
  hotMass: number | null;
  hotMassU: number | null;
  hotTemperature: number | null;
  hotTemperatureU: number | null;
  coldMass: number | null;
  coldMassU: number | null;
  coldTemperature: number | null;
  coldTemperatureU: number | null;
  finalTemperature: number | null;
  finalTemperatureU: number | null;
  /** Empty: the server takes water's 4.184 J/(g K). */
  specificHeat: number | null;
  specificHeatU: number | null;
  scale: Scale;
}

export function emptyCalibrationRow(kind: CalibrationRow['kind'] = 'electrical'): CalibrationRow {
  return {
    kind,
    current: null,
    currentU: null,
    voltage: null,
    voltageU: null,
    duration: null,
    durationU: null,
    deltaT: null,
    deltaTU: null,
    contentsMass: null,
    contentsMassU: null,
    contentsSpecificHeat: WATER_SPECIFIC_HEAT,
    contentsSpecificHeatU: null,
    hotMass: null,
    hotMassU: null,
    hotTemperature: null,
    hotTemperatureU: null,
    coldMass: null,
    coldMassU: null,
    coldTemperature: null,
    coldTemperatureU: null,
    finalTemperature: null,
    finalTemperatureU: null,
    specificHeat: WATER_SPECIFIC_HEAT,
    specificHeatU: null,
    scale: 'C',
  };
}

// An empty field is sent as NaN so the server names it (the schema's "finite number" check).
const stated = <U extends string>(value: number | null, unit: U, u: number | null) => ({
  value: value ?? Number.NaN,
  unit,
  ...(u !== null ? { uncertainty: u } : {}),
});

/** One calibration run as the API takes it. */
export function calibrationRunInput(row: CalibrationRow): CalibrationRunInput {
  if (row.kind === 'electrical')
    return {
      kind: 'electrical',
      current: stated(row.current, 'A', row.currentU),
      voltage: stated(row.voltage, 'V', row.voltageU),
      duration: stated(row.duration, 's', row.durationU),
      deltaT: stated(row.deltaT, 'K', row.deltaTU),
      contents: {
        mass: stated(row.contentsMass, 'g', row.contentsMassU),
        specificHeat: stated(row.contentsSpecificHeat, 'J/(g K)', row.contentsSpecificHeatU),
      },
    };
  return {
    kind: 'mixing',
    hot: {
      mass: stated(row.hotMass, 'g', row.hotMassU),
      temperature: stated(row.hotTemperature, row.scale, row.hotTemperatureU),
    },
    cold: {
      mass: stated(row.coldMass, 'g', row.coldMassU),
      temperature: stated(row.coldTemperature, row.scale, row.coldTemperatureU),
    },
    finalTemperature: stated(row.finalTemperature, row.scale, row.finalTemperatureU),
    ...(row.specificHeat !== null ? { specificHeat: stated(row.specificHeat, 'J/(g K)', row.specificHeatU) } : {}),
  };
}

type Quantity = { value: number; unit: string; uncertainty?: number | null | undefined };

const grams = (q: Quantity): [number, number | null] => {
  const by = q.unit === 'kg' ? 1000 : 1;
  return [q.value * by, times(q.uncertainty, by)];
};
const plain = (q: Quantity): [number, number | null] => [q.value, q.uncertainty ?? null];

/** A temperature in kelvin (an uncertainty scales by the degree's size only). */
function kelvin(q: { value: number; unit: Scale; uncertainty?: number | null | undefined }): [number, number | null] {
  if (q.unit === 'C') return [q.value + 273.15, q.uncertainty ?? null];
  if (q.unit === 'F') return [((q.value - 32) * 5) / 9 + 273.15, times(q.uncertainty, 5 / 9)];
  return plain(q);
}

/** A stored calibration run as a form row, masses in g; mixing temperatures on their own scale, or in K when they mix scales. */
export function calibrationRow(run: CalibrationRunInput): CalibrationRow {
  const row = emptyCalibrationRow(run.kind);
  if (run.kind === 'electrical') {
    [row.current, row.currentU] = plain(run.current);
    [row.voltage, row.voltageU] = plain(run.voltage);
    [row.duration, row.durationU] = plain(run.duration);
    [row.deltaT, row.deltaTU] = plain(run.deltaT);
    [row.contentsMass, row.contentsMassU] = grams(run.contents.mass);
    [row.contentsSpecificHeat, row.contentsSpecificHeatU] = plain(run.contents.specificHeat);
    return row;
  }
  const temperatures = [run.hot.temperature, run.cold.temperature, run.finalTemperature];
  const oneScale = temperatures.every((t) => t.unit === run.hot.temperature.unit);
  row.scale = oneScale ? run.hot.temperature.unit : 'K';
  const onScale = oneScale ? plain : kelvin;
  [row.hotMass, row.hotMassU] = grams(run.hot.mass);
  [row.hotTemperature, row.hotTemperatureU] = onScale(run.hot.temperature);
  [row.coldMass, row.coldMassU] = grams(run.cold.mass);
  [row.coldTemperature, row.coldTemperatureU] = onScale(run.cold.temperature);
  [row.finalTemperature, row.finalTemperatureU] = onScale(run.finalTemperature);
  [row.specificHeat, row.specificHeatU] = run.specificHeat ? plain(run.specificHeat) : [null, null];
  return row;
}
