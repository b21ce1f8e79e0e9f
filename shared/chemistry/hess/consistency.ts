import {
  backSolve,
  cholesky,
  forwardSolve,
  forwardSolveMany,
  inverseFromCholesky,
  NotPositiveDefiniteError,
} from './linear';
import type { SignedTerm } from './types';

/**
 * Consistency of redundant measurements: a generalised least-squares fit of the ΔfH° of a group
 * of species to every measured reaction that involves them.
 *
 * Each measurement i reads bᵢ = Σⱼ νᵢⱼ xⱼ + Σₖ νᵢₖ fₖ + εᵢ, with xⱼ the fitted ΔfH° and fₖ the other
 * species held at their library values. Moving the held values to the left, b′ = b − F f, the
 * measurements are correlated through the held values they share:
 * C = diag(u²) + F diag(u_f²) Fᵀ. Then x̂ = (AᵀC⁻¹A)⁻¹AᵀC⁻¹b′, cov(x̂) = (AᵀC⁻¹A)⁻¹,
 * χ² = rᵀC⁻¹r with r = b′ − A x̂ on n − p degrees of freedom, and the Birge ratio √(χ²/(n − p))
 * (Birge, Phys. Rev. 40 (1932) 207; the network practice of the CODATA Key Values, Cox, Wagman &
 * Medvedev 1989 — from memory). A residual beyond two of its standard deviations √Cᵢᵢ is flagged.
 * Units: kJ/mol.
 */

export interface ConsistencyMeasurement {
  id: string;
  label: string;
  /** Signed terms in the space without the elements' reference states (as in the route search). */
  terms: SignedTerm[];
  /** ΔrH, kJ/mol, and its standard uncertainty (> 0). */
  deltaH: number;
  uncertainty: number;
}

export interface HeldValue {
  value: number;
  /** Standard uncertainty; null when the library states none (then taken as exact, and listed). */
  uncertainty: number | null;
}

export interface FittedValue {
  species: string;
  value: number;
  uncertainty: number;
}

export interface MeasurementResidual {
  id: string;
  label: string;
  /** b′ − A x̂, kJ/mol. */
  residual: number;
  /** √Cᵢᵢ: the measurement's own u and the held values' u combined, kJ/mol. */
  uncertainty: number;
  normalized: number;
  flagged: boolean;
}

export interface ConsistencyResult {
  fitted: FittedValue[];
  /** Correlation-free view: covariance of the fitted values, kJ²/mol², in `fitted` order. */
  covariance: number[][];
  residuals: MeasurementResidual[];
  chiSquare: number;
  degreesOfFreedom: number;
  /** √(χ²/ν), or null without redundancy (ν = 0). */
  birgeRatio: number | null;
  /** Held species whose value has no stated uncertainty (taken as exact). */
  heldWithoutUncertainty: string[];
}

/** Thrown when the measurements do not determine every fitted species. */
export class UndeterminedFitError extends Error {
  constructor(readonly species: string[]) {
    super(`the measurements do not determine ${species.join(', ')}`);
  }
}

export const FLAG_SIGMAS = 2;

/**
 * Fits `fitted` species' ΔfH° to the measurements that involve them (others are ignored).
 * @throws UndeterminedFitError when some fitted species is not determined by the measurements;
 *   RangeError when a measurement names a species that is neither fitted nor held.
 */
export function consistencyFit(
  fitted: readonly string[],
  measurements: readonly ConsistencyMeasurement[],
  held: ReadonlyMap<string, HeldValue>,
): ConsistencyResult {
  const column = new Map(fitted.map((s, j) => [s, j]));
  const used = measurements.filter((m) => m.terms.some((t) => column.has(t.species) && !t.coefficient.equals(0)));
  const n = used.length;
  const p = fitted.length;
  const heldIndex = new Map<string, number>();
  const heldList: string[] = [];
  for (const m of used)
    for (const t of m.terms) {
      if (column.has(t.species)) continue;
      if (!held.has(t.species))
        throw new RangeError(`${m.label}: ${t.species} is neither fitted nor held at a library value`);
      if (!heldIndex.has(t.species)) {
        heldIndex.set(t.species, heldList.length);
        heldList.push(t.species);
      }
    }
  const A = new Float64Array(n * p);
  const b = new Float64Array(n);
  // F (n × q), sparse: per row, the held species and their coefficients.
  const rowsF: { k: number; nu: number }[][] = [];
  used.forEach((m, i) => {
    let bi = m.deltaH;
    const rowF: { k: number; nu: number }[] = [];
    for (const t of m.terms) {
      const nu = t.coefficient.valueOf();
      const j = column.get(t.species);
      if (j !== undefined) A[i * p + j]! += nu;
      else {
        bi -= nu * held.get(t.species)!.value;
        rowF.push({ k: heldIndex.get(t.species)!, nu });
      }
    }
    b[i] = bi;
    rowsF.push(rowF);
  });
  const heldU = heldList.map((s) => held.get(s)!.uncertainty ?? 0);
  // C = diag(u²) + F diag(u_f²) Fᵀ: sparse rows, so only pairs of rows that share a held species add.
  const C = new Float64Array(n * n);
  const rowsOfHeld: { i: number; nu: number }[][] = heldList.map(() => []);
  rowsF.forEach((row, i) => row.forEach(({ k, nu }) => rowsOfHeld[k]!.push({ i, nu })));
  used.forEach((m, i) => (C[i * n + i] = m.uncertainty * m.uncertainty));
  rowsOfHeld.forEach((rows, k) => {
    const u2 = heldU[k]! * heldU[k]!;
    if (u2 === 0) return;
    for (const a of rows) for (const c of rows) C[a.i * n + c.i]! += a.nu * c.nu * u2;
  });
  const diagonal = Array.from({ length: n }, (_, i) => C[i * n + i]!);
  cholesky(C, n);
  // Whitened design and data: Ã = L⁻¹A, b̃ = L⁻¹b′.
  const whitenedA = Float64Array.from(A);
  forwardSolveMany(C, n, whitenedA, p);
  const At = new Float64Array(p * n); // column j of Ã stored as row j
  for (let i = 0; i < n; i++) for (let j = 0; j < p; j++) At[j * n + i] = whitenedA[i * p + j]!;
  const bw = Float64Array.from(b);
  forwardSolve(C, n, bw);
  const N = new Float64Array(p * p);
  const rhs = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const aj = j * n;
    for (let k = 0; k <= j; k++) {
      const ak = k * n;
      let s = 0;
      for (let i = 0; i < n; i++) s += At[aj + i]! * At[ak + i]!;
      N[j * p + k] = s;
      N[k * p + j] = s;
    }
    let r = 0;
    for (let i = 0; i < n; i++) r += At[aj + i]! * bw[i]!;
    rhs[j] = r;
  }
  try {
    cholesky(N, p);
  } catch (error) {
    if (!(error instanceof NotPositiveDefiniteError)) throw error;
    const undetermined = fitted.filter((_, j) => used.every((_m, i) => A[i * p + j] === 0));
    throw new UndeterminedFitError(undetermined.length > 0 ? undetermined : [...fitted]);
  }
  const x = Float64Array.from(rhs);
  forwardSolve(N, p, x);
  backSolve(N, p, x);
  const covarianceFlat = inverseFromCholesky(N, p);
  const residual = Float64Array.from(b);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < p; j++) s += A[i * p + j]! * x[j]!;
    residual[i]! -= s;
  }
  const whitened = Float64Array.from(residual);
  forwardSolve(C, n, whitened);
  const chiSquare = whitened.reduce((s, v) => s + v * v, 0);
  const degreesOfFreedom = n - p;
  return {
    fitted: fitted.map((species, j) => ({
      species,
      value: x[j]!,
      uncertainty: Math.sqrt(covarianceFlat[j * p + j]!),
    })),
    covariance: Array.from({ length: p }, (_, j) => Array.from(covarianceFlat.subarray(j * p, (j + 1) * p))),
    residuals: used.map((m, i) => {
      const uncertainty = Math.sqrt(diagonal[i]!);
      const normalized = residual[i]! / uncertainty;
      return {
        id: m.id,
        label: m.label,
        residual: residual[i]!,
        uncertainty,
        normalized,
        flagged: Math.abs(normalized) > FLAG_SIGMAS,
      };
    }),
    chiSquare,
    degreesOfFreedom,
    birgeRatio: degreesOfFreedom > 0 ? Math.sqrt(chiSquare / degreesOfFreedom) : null,
    heldWithoutUncertainty: heldList.filter((s) => held.get(s)!.uncertainty === null),
  };
}
