import { GAS_CONSTANT } from './constants';

/*
 * The NASA polynomial equations of McBride, Gordon & Reno, NASA TM-4513 (1993) (7 coefficients)
 * and McBride, Zehe & Gordon, NASA/TP-2002-211556 (9 coefficients), for one temperature range.
 * H is on the formation scale (elements in their reference states: H°(298.15 K) = 0); S is
 * absolute at p° = 1 bar. The caller checks the range.
 */

/** Cp° in J/(mol K) from NASA-7 a1…a7 at T in K: Cp°/R = a1 + a2T + a3T² + a4T³ + a5T⁴. */
export function nasa7HeatCapacity(a: readonly number[], t: number): number {
  const [a1, a2, a3, a4, a5] = a as [number, number, number, number, number];
  return GAS_CONSTANT * (a1 + t * (a2 + t * (a3 + t * (a4 + t * a5))));
}

/** H° in kJ/mol (formation scale) from NASA-7: H°/(RT) = a1 + a2T/2 + a3T²/3 + a4T³/4 + a5T⁴/5 + a6/T. */
export function nasa7Enthalpy(a: readonly number[], t: number): number {
  const [a1, a2, a3, a4, a5, a6] = a as [number, number, number, number, number, number];
  return (GAS_CONSTANT * (t * (a1 + t * (a2 / 2 + t * (a3 / 3 + t * (a4 / 4 + t * (a5 / 5))))) + a6)) / 1000;
}

/** S° in J/(mol K) from NASA-7: S°/R = a1 ln T + a2T + a3T²/2 + a4T³/3 + a5T⁴/4 + a7. */
export function nasa7Entropy(a: readonly number[], t: number): number {
  const [a1, a2, a3, a4, a5, , a7] = a as [number, number, number, number, number, number, number];
  return GAS_CONSTANT * (a1 * Math.log(t) + t * (a2 + t * (a3 / 2 + t * (a4 / 3 + t * (a5 / 4)))) + a7);
}

/** Cp° in J/(mol K) from NASA-9 a1…a9: Cp°/R = a1T⁻² + a2T⁻¹ + a3 + a4T + a5T² + a6T³ + a7T⁴. */
export function nasa9HeatCapacity(a: readonly number[], t: number): number {
  const [a1, a2, a3, a4, a5, a6, a7] = a as [number, number, number, number, number, number, number];
  return GAS_CONSTANT * (a1 / (t * t) + a2 / t + a3 + t * (a4 + t * (a5 + t * (a6 + t * a7))));
}

/**
 * H° in kJ/mol (formation scale) from NASA-9:
 * H°/(RT) = −a1T⁻² + a2 ln(T)/T + a3 + a4T/2 + a5T²/3 + a6T³/4 + a7T⁴/5 + a8/T.
 */
export function nasa9Enthalpy(a: readonly number[], t: number): number {
  const [a1, a2, a3, a4, a5, a6, a7, a8] = a as [number, number, number, number, number, number, number, number];
  return (
    (GAS_CONSTANT *
      (-a1 / t + a2 * Math.log(t) + t * (a3 + t * (a4 / 2 + t * (a5 / 3 + t * (a6 / 4 + t * (a7 / 5))))) + a8)) /
    1000
  );
}

/** S° in J/(mol K) from NASA-9: S°/R = −a1T⁻²/2 − a2T⁻¹ + a3 ln T + a4T + a5T²/2 + a6T³/3 + a7T⁴/4 + a9. */
export function nasa9Entropy(a: readonly number[], t: number): number {
  const [a1, a2, a3, a4, a5, a6, a7, , a9] = a as [
    number,
    number,
    number,
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  return (
    GAS_CONSTANT *
    (-a1 / (2 * t * t) - a2 / t + a3 * Math.log(t) + t * (a4 + t * (a5 / 2 + t * (a6 / 3 + t * (a7 / 4)))) + a9)
  );
}
