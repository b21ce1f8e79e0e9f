/**
 * First-order propagation of uncertainty through a measurement model y = f(x₁, …, xₙ) with
 * independent inputs (GUM, JCGM 100:2008, 5.1.2): u²(y) = Σ cᵢ² u²(xᵢ), cᵢ = ∂f/∂xᵢ, and the
 * contribution of each input |cᵢ|·u(xᵢ) with its share of the variance (the "uncertainty budget").
 * Sensitivity coefficients are found by central differences with a step of a thousandth of u(xᵢ),
 * exact for models linear in xᵢ and far below the stated uncertainties otherwise.
 */

/** One input of a measurement model. */
export interface ModelInput {
  /** Stable name, e.g. `solution.volume` (the request field it comes from). */
  id: string;
  /** Words for people, e.g. "Volume of the solution". */
  label: string;
  value: number;
  /** Standard uncertainty in `unit`; null when not stated. */
  u: number | null;
  unit: string;
}

/** What one input adds to the uncertainty of the result. */
export interface InputContribution {
  id: string;
  label: string;
  value: number;
  unit: string;
  u: number | null;
  /** Sensitivity coefficient ∂y/∂x, in (unit of y) per (unit of x). */
  sensitivity: number;
  /** |∂y/∂x|·u(x), in the unit of y; null when u(x) is not stated. */
  contribution: number | null;
  /** Share of u²(y), 0–1; null when u(x) is not stated (or u(y) is 0). */
  varianceShare: number | null;
}

/** A result with its propagated standard uncertainty and its budget. */
export interface Propagation {
  value: number;
  /** Standard uncertainty from the inputs whose uncertainty is stated. */
  u: number;
  contributions: InputContribution[];
  /** Ids of inputs without a stated uncertainty: when not empty, `u` is incomplete. */
  missing: string[];
}

/** How every propagated uncertainty here is combined, in words. */
export const PROPAGATION_METHOD =
  'first-order propagation with independent inputs, u²(y) = Σ (∂y/∂xᵢ)² u²(xᵢ) (GUM, JCGM 100:2008, 5.1.2)';

function step(input: ModelInput): number {
  if (input.u !== null && input.u > 0) return input.u * 1e-3;
  const scale = Math.abs(input.value);
  return scale > 0 ? scale * 1e-6 : 1e-6;
}

/**
 * Evaluates `model` at the inputs' values and propagates their standard uncertainties.
 * @throws Error when the model gives a non-finite value at the inputs (a caller's bug: inputs are
 * checked before).
 */
export function propagate(
  inputs: readonly ModelInput[],
  model: (x: Readonly<Record<string, number>>) => number,
): Propagation {
  const x: Record<string, number> = {};
  for (const input of inputs) x[input.id] = input.value;
  const value = model(x);
  if (!Number.isFinite(value)) throw new Error('measurement model gave a non-finite value');
  const sensitivities = inputs.map((input) => {
    const h = step(input);
    const up = model({ ...x, [input.id]: input.value + h });
    const down = model({ ...x, [input.id]: input.value - h });
    return (up - down) / (2 * h);
  });
  let variance = 0;
  const parts = inputs.map((input, i) => {
    const c = sensitivities[i]!;
    const part = input.u === null ? null : Math.abs(c) * input.u;
    if (part !== null) variance += part * part;
    return { input, c, part };
  });
  return {
    value,
    u: Math.sqrt(variance),
    contributions: parts.map(({ input, c, part }) => ({
      id: input.id,
      label: input.label,
      value: input.value,
      unit: input.unit,
      u: input.u,
      sensitivity: c,
      contribution: part,
      varianceShare: part === null || variance === 0 ? null : (part * part) / variance,
    })),
    missing: inputs.filter((input) => input.u === null).map((input) => input.id),
  };
}

/** √(Σ uᵢ²): independent standard uncertainties combined in quadrature. */
export function inQuadrature(...parts: readonly number[]): number {
  return Math.sqrt(parts.reduce((sum, p) => sum + p * p, 0));
}
