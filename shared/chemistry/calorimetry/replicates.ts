import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import { CalorimetryInputError, requireNumber, type FieldPath } from './errors';

/*
 * Statistics of replicate runs of one experiment: mean, sample standard deviation s, the
 * standard uncertainty of the mean u = s/√n (GUM, JCGM 100:2008, 4.2.3, a Type A evaluation)
 * and an expanded uncertainty U = t·u with Student's t for n − 1 degrees of freedom at the stated
 * confidence (GUM, annex G.3). Thermochemists have often quoted 2·u instead (Rossini 1956;
 * Olofsson 1979; see the domain notes): both are given.
 *
 * A suspect value is flagged with Grubbs' test, never removed: the statistics keep every value,
 * and the statistics without the flagged one are given beside them for the reader to judge.
 */

/** Grubbs' test for one outlier, two-sided (Grubbs, Technometrics 11 (1969) 1–21; ISO 5725-2:1994, 7.3.4; from memory). */
export interface OutlierCheck {
  test: 'grubbs';
  /** False for fewer than 3 values (or all values equal): nothing could be tested. */
  applicable: boolean;
  /** Significance level α of the two-sided test. */
  significance: number;
  /** G = max |xᵢ − x̄| / s, or null when not applicable. */
  statistic: number | null;
  /** The critical value for n and α, or null when not applicable. */
  critical: number | null;
  /** Index of the value farthest from the mean (the candidate), or null. */
  candidate: number | null;
  /** True when G exceeds the critical value: the candidate is flagged as a suspected outlier. */
  flagged: boolean;
  /** The rule in words. */
  rule: string;
}

/** Summary statistics of n replicate values (all in the unit of the values). */
export interface ReplicateSummary {
  n: number;
  mean: number;
  /** Sample standard deviation s (n − 1 in the denominator); null for n = 1. */
  standardDeviation: number | null;
  /** Standard uncertainty of the mean s/√n; null for n = 1. */
  standardUncertainty: number | null;
  degreesOfFreedom: number;
  /** Two-sided confidence level of the expanded uncertainty, e.g. 0.95. */
  confidence: number;
  /** Student's t for n − 1 degrees of freedom at that confidence; null for n = 1. */
  coverageFactor: number | null;
  /** U = t·s/√n; null for n = 1. */
  expandedUncertainty: number | null;
  /** 2·s/√n, the thermochemists' customary ± (twice the standard deviation of the mean); null for n = 1. */
  twiceStandardDeviationOfMean: number | null;
}

export interface ReplicateStatistics extends ReplicateSummary {
  outlier: OutlierCheck;
  /** The same statistics without the flagged value (null when nothing is flagged). */
  withoutFlagged: ReplicateSummary | null;
}

export interface ReplicateOptions {
  /** Two-sided confidence level of U, between 0.5 and 0.999 (default 0.95). */
  confidence?: number;
  /** Significance level α of Grubbs' test, between 0.001 and 0.2 (default 0.05). */
  outlierSignificance?: number;
}

/**
 * Student's t coverage factor for a two-sided interval at `confidence` with `degreesOfFreedom`:
 * the (1 + p)/2 quantile of the t distribution (e.g. 2.776 for p = 0.95, ν = 4).
 * @throws CalorimetryInputError (field `confidence`) outside 0 < p < 1 or for ν < 1.
 */
export function studentCoverageFactor(confidence: number, degreesOfFreedom: number): number {
  if (!(confidence > 0 && confidence < 1))
    throw new CalorimetryInputError(`The confidence level must lie between 0 and 1 (got ${confidence}).`, [
      'confidence',
    ]);
  if (!(Number.isInteger(degreesOfFreedom) && degreesOfFreedom >= 1))
    throw new CalorimetryInputError(`Degrees of freedom must be a whole number ≥ 1 (got ${degreesOfFreedom}).`, [
      'degreesOfFreedom',
    ]);
  return tQuantile((1 + confidence) / 2, degreesOfFreedom);
}

/**
 * Critical value of Grubbs' two-sided test for one outlier among n values at significance α:
 * G_crit = ((n − 1)/√n)·√(t²/(n − 2 + t²)), t the upper α/(2n) quantile of Student's t with
 * n − 2 degrees of freedom (Grubbs 1969; from memory). n ≥ 3.
 */
export function grubbsCritical(n: number, significance: number): number {
  if (!(Number.isInteger(n) && n >= 3)) throw new RangeError(`Grubbs' test needs n ≥ 3 (got ${n})`);
  const t = tQuantile(1 - significance / (2 * n), n - 2);
  return ((n - 1) / Math.sqrt(n)) * Math.sqrt((t * t) / (n - 2 + t * t));
}

function summarize(values: readonly number[], confidence: number): ReplicateSummary {
  const n = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / n;
  if (n < 2)
    return {
      n,
      mean,
      standardDeviation: null,
      standardUncertainty: null,
      degreesOfFreedom: 0,
      confidence,
      coverageFactor: null,
      expandedUncertainty: null,
      twiceStandardDeviationOfMean: null,
    };
  const s = Math.sqrt(values.reduce((sum, x) => sum + (x - mean) ** 2, 0) / (n - 1));
  const u = s / Math.sqrt(n);
  const t = studentCoverageFactor(confidence, n - 1);
  return {
    n,
    mean,
    standardDeviation: s,
    standardUncertainty: u,
    degreesOfFreedom: n - 1,
    confidence,
    coverageFactor: t,
    expandedUncertainty: t * u,
    twiceStandardDeviationOfMean: 2 * u,
  };
}

/**
 * Mean, s, u = s/√n and U = t·u of replicate values, with Grubbs' test for one outlier.
 * @throws CalorimetryInputError naming the field (under `path`) for no values, a non-finite
 * value or an option out of range.
 */
export function replicateStatistics(
  values: readonly number[],
  options: ReplicateOptions = {},
  path: FieldPath = ['values'],
): ReplicateStatistics {
  const confidence = options.confidence ?? 0.95;
  const alpha = options.outlierSignificance ?? 0.05;
  if (!(confidence >= 0.5 && confidence <= 0.999))
    throw new CalorimetryInputError(`The confidence level must lie between 0.5 and 0.999 (got ${confidence}).`, [
      'confidence',
    ]);
  if (!(alpha >= 0.001 && alpha <= 0.2))
    throw new CalorimetryInputError(
      `The significance of the outlier test must lie between 0.001 and 0.2 (got ${alpha}).`,
      ['outlierSignificance'],
    );
  if (!Array.isArray(values) || values.length === 0) throw new CalorimetryInputError('Give at least one value.', path);
  values.forEach((v, i) => requireNumber(v, [...path, i], `value ${i + 1}`));
  const all = summarize(values, confidence);
  const rule = `Grubbs' two-sided test for one outlier at α = ${alpha} (Grubbs, Technometrics 11 (1969) 1; ISO 5725-2:1994, 7.3.4): flagged when G = max|xᵢ − x̄|/s exceeds G_crit(n, α). A flagged value is shown, never dropped.`;
  const s = all.standardDeviation;
  if (values.length < 3 || s === null || s === 0) {
    return {
      ...all,
      outlier: {
        test: 'grubbs',
        applicable: false,
        significance: alpha,
        statistic: null,
        critical: null,
        candidate: null,
        flagged: false,
        rule:
          values.length < 3
            ? `${rule} It needs at least 3 values; ${values.length} given, so nothing was tested.`
            : `${rule} All values are equal, so nothing was tested.`,
      },
      withoutFlagged: null,
    };
  }
  let candidate = 0;
  values.forEach((v, i) => {
    if (Math.abs(v - all.mean) > Math.abs(values[candidate]! - all.mean)) candidate = i;
  });
  const statistic = Math.abs(values[candidate]! - all.mean) / s;
  const critical = grubbsCritical(values.length, alpha);
  const flagged = statistic > critical;
  return {
    ...all,
    outlier: { test: 'grubbs', applicable: true, significance: alpha, statistic, critical, candidate, flagged, rule },
    withoutFlagged: flagged
      ? summarize(
          values.filter((_, i) => i !== candidate),
          confidence,
        )
      : null,
  };
}
