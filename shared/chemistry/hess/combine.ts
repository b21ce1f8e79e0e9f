import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { Matrix, pseudoInverse, SingularValueDecomposition } from 'ml-matrix';

/** Significance level of the agreement test: routes disagree when p < 0.05 (common practice, no source). */
export const AGREEMENT_SIGNIFICANCE = 0.05;

/** A route is flagged when it lies more than this many standard deviations from the combination. */
export const ROUTE_FLAG_SIGMAS = 2;

export interface RouteCombination {
  /** Generalised least-squares (minimum-variance) estimate, kJ/mol. */
  value: number;
  /** Its standard uncertainty, kJ/mol. */
  uncertainty: number;
  /** χ² of the routes' differences with their full covariance, its degrees of freedom and p-value. */
  chiSquare: number;
  degreesOfFreedom: number;
  pValue: number | null;
  /** No disagreement at the 5 % level (true when there is nothing to compare). */
  consistent: boolean;
  /** Per route: (yᵢ − ŷ) / √(Vᵢᵢ − var ŷ), and whether it is within ±2. */
  normalizedResiduals: number[];
  agrees: boolean[];
  /** The weights λ of the combination, ŷ = Σ λᵢ yᵢ (they sum to 1). */
  weights: number[];
}

/**
 * Combines estimates of one quantity that share inputs (covariance V, kJ²/mol²): the GLS mean
 * ŷ = 1ᵀV⁺y / 1ᵀV⁺1 with var ŷ = 1/(1ᵀV⁺1) (Aitken's generalised least squares; V⁺ the
 * Moore–Penrose inverse, since routes that share all their inputs make V singular), and the χ²
 * test of agreement (y − ŷ1)ᵀV⁺(y − ŷ1) on rank(V) − 1 degrees of freedom.
 * @throws RangeError for no estimates, a size mismatch or a covariance without any variance.
 */
export function combineRoutes(values: readonly number[], covariance: readonly (readonly number[])[]): RouteCombination {
  const m = values.length;
  if (m === 0 || covariance.length !== m || covariance.some((row) => row.length !== m))
    throw new RangeError('combineRoutes: one covariance row and column per value');
  if (m === 1) {
    const u = Math.sqrt(Math.max(covariance[0]![0]!, 0));
    return {
      value: values[0]!,
      uncertainty: u,
      chiSquare: 0,
      degreesOfFreedom: 0,
      pValue: null,
      consistent: true,
      normalizedResiduals: [0],
      agrees: [true],
      weights: [1],
    };
  }
  const V = new Matrix(covariance.map((row) => [...row]));
  const scale = Math.max(...covariance.map((row, i) => Math.abs(row[i]!)));
  if (!(scale > 0)) throw new RangeError('combineRoutes: the routes carry no variance');
  const svd = new SingularValueDecomposition(V, { autoTranspose: true });
  const threshold = scale * m * 1e-12;
  const rank = svd.diagonal.filter((s) => s > threshold).length;
  const Vplus = pseudoInverse(V, threshold);
  const ones = Matrix.ones(m, 1);
  const y = Matrix.columnVector([...values]);
  const weights = Vplus.mmul(ones); // V⁺1
  const information = ones.transpose().mmul(weights).get(0, 0); // 1ᵀV⁺1
  const value = weights.transpose().mmul(y).get(0, 0) / information;
  const variance = 1 / information;
  const residual = y.clone().sub(Matrix.ones(m, 1).mul(value));
  const chiSquare = Math.max(residual.transpose().mmul(Vplus).mmul(residual).get(0, 0), 0);
  const degreesOfFreedom = Math.max(rank - 1, 0);
  const pValue = degreesOfFreedom > 0 ? 1 - chisquareCdf(chiSquare, degreesOfFreedom) : null;
  const normalizedResiduals = values.map((v, i) => {
    const spread = covariance[i]![i]! - variance;
    const difference = v - value;
    if (spread <= scale * 1e-12) return Math.abs(difference) <= 1e-9 * Math.max(1, Math.abs(value)) ? 0 : Infinity;
    return difference / Math.sqrt(spread);
  });
  return {
    value,
    uncertainty: Math.sqrt(variance),
    chiSquare,
    degreesOfFreedom,
    pValue,
    consistent: pValue === null || pValue >= AGREEMENT_SIGNIFICANCE,
    normalizedResiduals,
    agrees: normalizedResiduals.map((z) => Math.abs(z) <= ROUTE_FLAG_SIGMAS),
    weights: weights.to1DArray().map((w) => w / information),
  };
}
