import { CalorimetryInputError, requireNumber, type FieldPath } from './errors';
import { propagate, type InputContribution, type ModelInput } from './propagation';

/*
 * Temperature–time curves of a calorimeter with heat exchange (Newton's law plus stirring): the
 * fore-period (before the reaction starts) and the after-period (once it is over) drift along
 * straight lines; the main period in between holds the rise. The corrected rise ΔT is the rise
 * the calorimeter would show without heat exchange with its surroundings.
 *
 * Units: time in s, temperature in K (a temperature difference in K equals one in °C).
 * Sign: ΔT > 0 for a rise (exothermic process in the calorimeter), < 0 for a fall.
 */

/** One reading: time in s, temperature in K. */
export type SeriesPoint = readonly [time: number, temperature: number];

/**
 * How the exchange correction is made:
 * - `dickinson`: both drift lines are extrapolated to the time t_m at which the areas between
 *   the curve and the two lines are equal; ΔT = L_after(t_m) − L_fore(t_m) (Dickinson,
 *   Bull. Bur. Stand. 11 (1915) 189; from memory).
 * - `regnault-pfaundler`: the exchange rate is taken as linear in the calorimeter temperature,
 *   g(T) = g_fore + (g_after − g_fore)(T − T̄_fore)/(T̄_after − T̄_fore), fitted to the two
 *   drifts at the periods' mean temperatures, and its integral over the main period is
 *   subtracted from the observed rise (Coops, Jessup & van Nes, ch. 3 in Experimental
 *   Thermochemistry, Rossini ed., 1956; from memory).
 */
export type DriftMethod = 'dickinson' | 'regnault-pfaundler';

export interface DriftOptions {
  method: DriftMethod;
  /** s: end of the fore-period and start of the main period (the moment the reaction was started). */
  mixingTime: number;
  /** s: start of the after-period; when omitted it is found from the readings. */
  afterPeriodStart?: number | null;
  /** K: standard uncertainty of one reading (e.g. the thermometer's resolution), or null. */
  readingUncertainty?: number | null;
}

/**
 * A drift line: its slope fitted by least squares to the period's readings, drawn through the
 * reading at the boundary of the main period (`anchor`), as the correction uses it.
 */
export interface DriftLine {
  /** K/s */
  slope: number;
  /** The point the line passes through: the (interpolated) reading at the start or end of the main period. */
  anchor: { time: number; temperature: number };
  /** K: the line's value at `center`, which is the mean temperature of the period's readings. */
  level: number;
  /** s: mean time of the period's readings. */
  center: number;
  /** s: first and last reading of the period. */
  from: number;
  to: number;
  points: number;
  /** K: standard deviation of the readings about the line (n − 2 degrees of freedom); null with 2 readings. */
  residualSd: number | null;
}

/** The corrected temperature change of one run, with how it was found. */
export interface DriftCorrection {
  method: DriftMethod;
  fore: DriftLine;
  after: DriftLine;
  /** s: the main period, from the mixing time to the start of the after-period. */
  mainPeriod: { start: number; end: number };
  /** True when the after-period start was found from the readings rather than given. */
  afterPeriodFound: boolean;
  /** K: readings (interpolated) at the start and end of the main period. */
  startTemperature: number;
  endTemperature: number;
  /** K: end − start, without correction. */
  observedDeltaT: number;
  /** K: the rise without heat exchange. */
  correctedDeltaT: number;
  /** K: standard uncertainty of `correctedDeltaT` from the scatter of the readings; null when it cannot be judged. */
  u: number | null;
  /** What each fitted quantity adds to `u` (line levels and slopes, the area under the main period). */
  budget: InputContribution[];
  /** K: the standard deviation of one reading used for `u` (the larger of the scatter and the stated value). */
  readingSd: number | null;
  /** s: Dickinson's t_m (null for Regnault–Pfaundler). */
  tMid: number | null;
  /** Fraction of the observed rise reached at t_m (null for Regnault–Pfaundler). */
  riseFractionAtTMid: number | null;
  /**
   * The exchange law dT/dt = k (T∞ − T) read from the two drifts (Regnault–Pfaundler's, given for
   * either method): k in 1/s (> 0 when the calorimeter loses heat as it warms) and the
   * convergence temperature T∞ in K (null when k = 0); null when both periods have the same mean.
   */
  exchange: { coolingConstant: number; convergenceTemperature: number | null } | null;
  /** Remarks in words (after-period found automatically, few readings…). */
  notes: string[];
}

/** The value of a drift line at time t (s), in K. */
export function lineAt(line: Pick<DriftLine, 'slope' | 'anchor'>, time: number): number {
  return line.anchor.temperature + line.slope * (time - line.anchor.time);
}

interface Fit {
  line: Omit<DriftLine, 'anchor'>;
  /** Σ residual², K². */
  ssr: number;
  /** Σ (t − t̄)², s². */
  sxx: number;
}

function fitLine(points: readonly SeriesPoint[]): Fit {
  const n = points.length;
  let st = 0;
  let sT = 0;
  for (const [t, T] of points) {
    st += t;
    sT += T;
  }
  const center = st / n;
  const level = sT / n;
  let sxx = 0;
  let sxy = 0;
  for (const [t, T] of points) {
    sxx += (t - center) ** 2;
    sxy += (t - center) * (T - level);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  let ssr = 0;
  for (const [t, T] of points) ssr += (T - (level + slope * (t - center))) ** 2;
  return {
    line: {
      slope,
      level,
      center,
      from: points[0]![0],
      to: points[n - 1]![0],
      points: n,
      residualSd: n > 2 ? Math.sqrt(ssr / (n - 2)) : null,
    },
    ssr,
    sxx,
  };
}

/** σ of one reading from the second differences of evenly or unevenly spaced readings; null with fewer than 3. */
function roughness(points: readonly SeriesPoint[]): number | null {
  if (points.length < 3) return null;
  let sum = 0;
  for (let k = 1; k < points.length - 1; k++) {
    const [t0, T0] = points[k - 1]!;
    const [t1, T1] = points[k]!;
    const [t2, T2] = points[k + 1]!;
    // The middle reading's departure from the chord of its neighbours.
    const d = T1 - (T0 + ((T2 - T0) * (t1 - t0)) / (t2 - t0));
    const a = (t2 - t1) / (t2 - t0);
    sum += (d * d) / (1 + a * a + (1 - a) * (1 - a));
  }
  return Math.sqrt(sum / (points.length - 2));
}

/** Linear interpolation of the readings at t (t within the series). */
function readingAt(series: readonly SeriesPoint[], time: number): number {
  let lo = 0;
  let hi = series.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (series[mid]![0] <= time) lo = mid;
    else hi = mid;
  }
  const [t0, T0] = series[lo]!;
  const [t1, T1] = series[hi]!;
  return t1 === t0 ? T0 : T0 + ((T1 - T0) * (time - t0)) / (t1 - t0);
}

/**
 * Weights w_k with ∫_a^b T(t) dt = Σ w_k T_k for the piecewise-linear curve through the readings
 * (the trapezoidal rule with interpolated end values), as a sparse list.
 */
function areaWeights(series: readonly SeriesPoint[], a: number, b: number): { index: number; weight: number }[] {
  const out: { index: number; weight: number }[] = [];
  for (let k = 0; k < series.length; k++) {
    const tk = series[k]![0];
    let w = 0;
    const prev = series[k - 1]?.[0];
    const next = series[k + 1]?.[0];
    if (prev !== undefined) {
      // Rising half of the hat on [prev, tk].
      const lo = Math.max(a, prev);
      const hi = Math.min(b, tk);
      if (hi > lo) w += ((hi - prev) ** 2 - (lo - prev) ** 2) / (2 * (tk - prev));
    }
    if (next !== undefined) {
      // Falling half on [tk, next].
      const lo = Math.max(a, tk);
      const hi = Math.min(b, next);
      if (hi > lo) w += ((next - lo) ** 2 - (next - hi) ** 2) / (2 * (next - tk));
    }
    if (w > 0) out.push({ index: k, weight: w });
  }
  return out;
}

function checkSeries(series: readonly SeriesPoint[], path: FieldPath): void {
  if (!Array.isArray(series) || series.length < 5)
    throw new CalorimetryInputError(
      `A temperature series needs at least 5 readings (a fore-period, the rise and an after-period); got ${Array.isArray(series) ? series.length : 0}.`,
      path,
    );
  series.forEach((point, i) => {
    requireNumber(point[0], [...path, i, 0], `the time of reading ${i + 1}`);
    requireNumber(point[1], [...path, i, 1], `the temperature of reading ${i + 1}`, 'positive');
    if (i > 0 && !(point[0] > series[i - 1]![0]))
      throw new CalorimetryInputError(
        `Reading ${i + 1} (t = ${point[0]} s) is not later than reading ${i} (t = ${series[i - 1]![0]} s): times must increase.`,
        [...path, i, 0],
      );
  });
}

/**
 * The start of the after-period, found from the readings. The exchange law (drift rate linear in
 * the temperature) is fitted to the fore-period and the last quarter of the readings; the rate of
 * change over a sliding window of 5 readings, less the rate that law predicts at the window's
 * temperature, is the rate at which the process still releases heat. The after-period starts at
 * the first window after the steepest rise where that excess rate stays below 1/5000 of its peak
 * (or below what the readings' scatter can resolve) for three windows running.
 */
function findAfterPeriod(
  series: readonly SeriesPoint[],
  mixingTime: number,
  fore: Fit,
  sigma: number | null,
  path: FieldPath,
): number {
  const w = 5;
  const first = series.findIndex(([t]) => t > mixingTime);
  const failure = () =>
    new CalorimetryInputError(
      'The readings stop before the temperature settles into a steady drift: record a longer after-period (10 or more readings after the rise), or give afterPeriodStart.',
      path,
      'unprocessable',
    );
  const tailLength = Math.max(w, Math.ceil(0.25 * (series.length - first)));
  if (first < 0 || series.length - first < tailLength + 2 * w) throw failure();
  const tail = fitLine(series.slice(series.length - tailLength)).line;
  const span = tail.level - fore.line.level;
  const law = (T: number) =>
    span === 0 ? fore.line.slope : fore.line.slope + ((tail.slope - fore.line.slope) * (T - fore.line.level)) / span;
  const excess: { rate: number; noise: number }[] = [];
  for (let k = first - 1; k + w <= series.length; k++) {
    const f = fitLine(series.slice(k, k + w));
    excess[k] = {
      rate: f.line.slope - law(f.line.level),
      noise: sigma === null || f.sxx === 0 ? 0 : (4 * sigma) / Math.sqrt(f.sxx),
    };
  }
  let steepest = -1;
  let peak = 0;
  excess.forEach((e, k) => {
    if (Math.abs(e.rate) > peak) {
      peak = Math.abs(e.rate);
      steepest = k;
    }
  });
  const settled = (k: number) => {
    const e = excess[k];
    return e !== undefined && Math.abs(e.rate) <= Math.max(2e-4 * peak, e.noise);
  };
  for (let k = steepest + 1; k + 2 + w <= series.length; k++) {
    if (settled(k) && settled(k + 1) && settled(k + 2)) return series[k]![0];
  }
  throw failure();
}

/**
 * Corrects the temperature change of a run for heat exchange, from its time–temperature series.
 * The fore-period is every reading at or before `mixingTime` (t_i), the after-period every
 * reading at or after `afterPeriodStart` (t_f; found from the readings when not given). The drift
 * rates g_i and g_f are the least-squares slopes of the two periods; the drift lines pass through
 * the readings T_i and T_f at t_i and t_f (interpolated), so the correction has the form
 * ΔT = T_f − T_i − g_i(t_m − t_i) − g_f(t_f − t_m) for Dickinson (domain notes §5) and
 * ΔT = T_f − T_i − ∫ g(T) dt for Regnault–Pfaundler.
 *
 * Uncertainty: from the standard deviation σ of one reading — the larger of the readings' scatter
 * about the drift lines (pooled, n − 2 degrees of freedom per period) and the stated reading
 * uncertainty — through T_i, T_f (σ each), the slopes (σ/√Σ(t − t̄)²), the periods' mean
 * temperatures (σ/√n) and the area under the main period (σ·√Σw²), taken as independent (a
 * boundary reading shared by two of them makes a small correlation, neglected).
 * @throws CalorimetryInputError naming the field (under `path`) for unusable readings or periods.
 */
export function driftCorrection(
  series: readonly SeriesPoint[],
  options: DriftOptions,
  path: FieldPath = [],
): DriftCorrection {
  const seriesPath = [...path, 'series'];
  checkSeries(series, seriesPath);
  const { method, mixingTime } = options;
  if (method !== 'dickinson' && method !== 'regnault-pfaundler')
    throw new CalorimetryInputError(`Unknown drift method '${String(method)}': use dickinson or regnault-pfaundler.`, [
      ...path,
      'method',
    ]);
  requireNumber(mixingTime, [...path, 'mixingTime'], 'the mixing time');
  const stated = options.readingUncertainty ?? null;
  if (stated !== null)
    requireNumber(stated, [...path, 'readingUncertainty'], 'the reading uncertainty', 'non-negative');
  const forePoints = series.filter(([t]) => t <= mixingTime);
  if (forePoints.length < 2)
    throw new CalorimetryInputError(
      `The fore-period needs at least 2 readings at or before the mixing time (${mixingTime} s); ${forePoints.length} found. Five or more give a steadier drift line.`,
      [...path, 'mixingTime'],
    );
  const last = series[series.length - 1]![0];
  if (!(mixingTime < last))
    throw new CalorimetryInputError(
      `The mixing time (${mixingTime} s) must come before the last reading (${last} s).`,
      [...path, 'mixingTime'],
    );
  const fore = fitLine(forePoints);
  const givenAfter = options.afterPeriodStart ?? null;
  let afterStart: number;
  if (givenAfter !== null) {
    requireNumber(givenAfter, [...path, 'afterPeriodStart'], 'the start of the after-period');
    if (!(givenAfter > mixingTime))
      throw new CalorimetryInputError(
        `The after-period must start after the mixing time (${mixingTime} s); got ${givenAfter} s.`,
        [...path, 'afterPeriodStart'],
      );
    afterStart = givenAfter;
  } else {
    // Reading noise from second differences (var = 6σ² for white noise), which a slow curve barely touches.
    const rough = roughness(forePoints);
    const sigma = rough === null && stated === null ? null : Math.max(rough ?? 0, stated ?? 0);
    afterStart = findAfterPeriod(series, mixingTime, fore, sigma, seriesPath);
  }
  const afterPoints = series.filter(([t]) => t >= afterStart);
  if (afterPoints.length < 2)
    throw new CalorimetryInputError(
      `The after-period needs at least 2 readings from ${afterStart} s on; ${afterPoints.length} found.`,
      [...path, givenAfter !== null ? 'afterPeriodStart' : 'series'],
      givenAfter !== null ? 'validation_failed' : 'unprocessable',
    );

  const after = fitLine(afterPoints);
  const ti = mixingTime;
  const tf = afterStart;
  const weights = areaWeights(series, ti, tf);
  const area = weights.reduce((sum, w) => sum + w.weight * series[w.index]![1], 0);
  const startTemperature = readingAt(series, ti);
  const endTemperature = readingAt(series, tf);

  const dof = fore.line.points - 2 + (after.line.points - 2);
  const pooled = dof > 0 ? Math.sqrt((fore.ssr + after.ssr) / dof) : null;
  const sigma = pooled === null && stated === null ? null : Math.max(pooled ?? 0, stated ?? 0);

  // The correction as a function of the quantities read off the curve, so their uncertainties propagate.
  const evaluate = (p: Readonly<Record<string, number>>): { deltaT: number; tMid: number | null } => {
    const Ti = p['startTemperature']!;
    const Tf = p['endTemperature']!;
    const gi = p['foreSlope']!;
    const gf = p['afterSlope']!;
    if (method === 'dickinson') {
      const Li = (t: number) => Ti + gi * (t - ti);
      const Lf = (t: number) => Tf + gf * (t - tf);
      const tMid = equalAreaTime(Li, Lf, ti, tf, p['area']!, seriesPath);
      return { deltaT: Lf(tMid) - Li(tMid), tMid };
    }
    const span = p['afterLevel']! - p['foreLevel']!;
    if (span === 0)
      throw new CalorimetryInputError(
        'The fore- and after-periods have the same mean temperature, so the Regnault–Pfaundler exchange law cannot be fitted; use the Dickinson method.',
        seriesPath,
        'unprocessable',
      );
    const exchanged = gi * (tf - ti) + ((gf - gi) / span) * (p['area']! - p['foreLevel']! * (tf - ti));
    return { deltaT: Tf - Ti - exchanged, tMid: null };
  };
  const areaSpread = Math.sqrt(weights.reduce((sum, w) => sum + w.weight * w.weight, 0));
  const u = (scale: number | null) => (sigma === null || scale === null ? null : sigma * scale);
  const slopeScale = (sxx: number) => (sxx > 0 ? 1 / Math.sqrt(sxx) : null);
  const inputs: ModelInput[] = [
    { id: 'startTemperature', label: 'Reading at the mixing time', unit: 'K', value: startTemperature, u: u(1) },
    {
      id: 'endTemperature',
      label: 'Reading at the start of the after-period',
      unit: 'K',
      value: endTemperature,
      u: u(1),
    },
    {
      id: 'foreSlope',
      label: 'Fore-period drift rate',
      unit: 'K/s',
      value: fore.line.slope,
      u: u(slopeScale(fore.sxx)),
    },
    {
      id: 'afterSlope',
      label: 'After-period drift rate',
      unit: 'K/s',
      value: after.line.slope,
      u: u(slopeScale(after.sxx)),
    },
    { id: 'area', label: 'Area under the main period', unit: 'K s', value: area, u: u(areaSpread) },
  ];
  if (method === 'regnault-pfaundler')
    inputs.push(
      {
        id: 'foreLevel',
        label: 'Mean temperature of the fore-period',
        unit: 'K',
        value: fore.line.level,
        u: u(1 / Math.sqrt(fore.line.points)),
      },
      {
        id: 'afterLevel',
        label: 'Mean temperature of the after-period',
        unit: 'K',
        value: after.line.level,
        u: u(1 / Math.sqrt(after.line.points)),
      },
    );
  const central = evaluate(Object.fromEntries(inputs.map((i) => [i.id, i.value])));
  const propagated = propagate(inputs, (p) => evaluate(p).deltaT);

  const notes: string[] = [];
  if (givenAfter === null)
    notes.push(
      `The after-period was taken from ${formatSeconds(afterStart)} on, where the temperature has settled into its final drift; give afterPeriodStart to choose it yourself.`,
    );
  if (fore.line.points < 5 || after.line.points < 5)
    notes.push(
      `Few readings in the ${fore.line.points < 5 ? 'fore' : 'after'}-period (${Math.min(fore.line.points, after.line.points)}): its drift line is poorly defined; 10 or more readings per period are usual.`,
    );
  if (sigma === null)
    notes.push(
      'With 2 readings per period and no stated reading uncertainty, the scatter of the readings cannot be judged: ΔT has no uncertainty.',
    );

  let riseFractionAtTMid: number | null = null;
  if (central.tMid !== null && endTemperature !== startTemperature)
    riseFractionAtTMid = (readingAt(series, central.tMid) - startTemperature) / (endTemperature - startTemperature);
  const span = after.line.level - fore.line.level;
  const k = span !== 0 ? (fore.line.slope - after.line.slope) / span : null;
  const longest = Math.max(fore.line.to - fore.line.from, after.line.to - after.line.from);
  if (method === 'dickinson' && k !== null && Math.abs(k) * longest > 0.1)
    notes.push(
      `The drift rate changes markedly through the periods (exchange constant ${Number(k.toPrecision(2))} s⁻¹ over periods up to ${formatSeconds(longest)} long): Dickinson's method assumes steady drifts; shorten the periods or use Regnault–Pfaundler.`,
    );

  return {
    method,
    fore: { ...fore.line, anchor: { time: ti, temperature: startTemperature } },
    after: { ...after.line, anchor: { time: tf, temperature: endTemperature } },
    mainPeriod: { start: ti, end: tf },
    afterPeriodFound: givenAfter === null,
    startTemperature,
    endTemperature,
    observedDeltaT: endTemperature - startTemperature,
    correctedDeltaT: central.deltaT,
    u: sigma === null ? null : propagated.u,
    budget: propagated.contributions,
    readingSd: sigma,
    tMid: central.tMid,
    riseFractionAtTMid,
    exchange:
      k === null
        ? null
        : { coolingConstant: k, convergenceTemperature: k === 0 ? null : fore.line.level + fore.line.slope / k },
    notes,
  };
}

/**
 * Dickinson's t_m: ∫_{ti}^{tm} (T − L_fore) dt = ∫_{tm}^{tf} (L_after − T) dt, which reads
 * ∫_{ti}^{tm} L_fore dt + ∫_{tm}^{tf} L_after dt = ∫_{ti}^{tf} T dt (the area under the curve).
 * The left side is monotonic in tm while the lines do not cross, so bisection finds the one root.
 */
function equalAreaTime(
  fore: (t: number) => number,
  after: (t: number) => number,
  ti: number,
  tf: number,
  area: number,
  path: FieldPath,
): number {
  const lineArea = (L: (t: number) => number, a: number, b: number) => (b - a) * L((a + b) / 2);
  const gap = (t: number) => lineArea(fore, ti, t) + lineArea(after, t, tf) - area;
  let lo = ti;
  let hi = tf;
  let gLo = gap(lo);
  const gHi = gap(hi);
  if (gLo === 0) return lo;
  if (gHi === 0) return hi;
  if (Math.sign(gLo) === Math.sign(gHi))
    throw new CalorimetryInputError(
      'The readings of the main period do not lie between the two drift lines, so no time balances the areas (Dickinson): check the mixing time and the start of the after-period.',
      path,
      'unprocessable',
    );
  for (let i = 0; i < 200 && hi - lo > 1e-12 * Math.max(1, Math.abs(tf)); i++) {
    const mid = (lo + hi) / 2;
    const gMid = gap(mid);
    if (gMid === 0) return mid;
    if (Math.sign(gMid) === Math.sign(gLo)) {
      lo = mid;
      gLo = gMid;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}

function formatSeconds(t: number): string {
  return `${Number(t.toPrecision(6))} s`;
}
