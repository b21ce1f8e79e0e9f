/*
 * The Shomate equation (Shomate, J. Phys. Chem. 58 (1954) 368) in the form of the NIST-JANAF fits,
 * t = T/(1000 K), coefficients A…H of one temperature range. The caller checks the range.
 */

/** Cp° in J/(mol K): A + Bt + Ct² + Dt³ + E/t². */
export function shomateHeatCapacity(c: readonly number[], temperature: number): number {
  const [A, B, C, D, E] = c as [number, number, number, number, number];
  const t = temperature / 1000;
  return A + t * (B + t * (C + t * D)) + E / (t * t);
}

/**
 * H° in kJ/mol: At + Bt²/2 + Ct³/3 + Dt⁴/4 − E/t + F. With H = ΔfH°(298.15 K) (as in the NIST
 * fits) this is H° on the formation scale; subtracting H gives H°(T) − H°(298.15 K).
 */
export function shomateEnthalpy(c: readonly number[], temperature: number): number {
  const [A, B, C, D, E, F] = c as [number, number, number, number, number, number];
  const t = temperature / 1000;
  return t * (A + t * (B / 2 + t * (C / 3 + t * (D / 4)))) - E / t + F;
}

/** S° in J/(mol K): A ln t + Bt + Ct²/2 + Dt³/3 − E/(2t²) + G. */
export function shomateEntropy(c: readonly number[], temperature: number): number {
  const [A, B, C, D, E, , G] = c as [number, number, number, number, number, number, number];
  const t = temperature / 1000;
  return A * Math.log(t) + t * (B + t * (C / 2 + t * (D / 3))) - E / (2 * t * t) + G;
}
