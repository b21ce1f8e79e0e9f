/**
 * Heat-capacity models of species, as the library stores them (seeds/library/FORMAT.md,
 * `models-*.jsonl`). Pure data, no behaviour.
 *
 * Units: temperatures in K; Cp° and S° in J/(mol K); H° in kJ/mol. Standard pressure p° = 1 bar.
 */

/** NASA 7-coefficient polynomials (McBride, Gordon & Reno, NASA TM-4513, 1993). */
export interface Nasa7Model {
  kind: 'nasa7';
  /** Breakpoints T0 < T1 < … < Tn in K. */
  ranges: number[];
  /** n arrays of a1…a7, `coefficients[i]` for `ranges[i]`–`ranges[i+1]`. */
  coefficients: number[][];
}

/** NASA 9-coefficient polynomials (McBride, Zehe & Gordon, NASA/TP-2002-211556). */
export interface Nasa9Model {
  kind: 'nasa9';
  ranges: number[];
  /** n arrays of a1…a9. */
  coefficients: number[][];
}

/**
 * Shomate equation: Cp° = A + Bt + Ct² + Dt³ + E/t², t = T/(1000 K), Cp° in J/(mol K);
 * H° − H°(298.15 K) = At + Bt²/2 + Ct³/3 + Dt⁴/4 − E/t + F − H in kJ/mol;
 * S° = A ln t + Bt + Ct²/2 + Dt³/3 − E/(2t²) + G in J/(mol K).
 */
export interface ShomateModel {
  kind: 'shomate';
  ranges: number[];
  /** n arrays of A, B, C, D, E, F, G, H. */
  coefficients: number[][];
}

/** Tabulated Cp°: `points` [[T in K, Cp° in J/(mol K)], …], T strictly increasing, interpolated by monotone cubic (PCHIP). */
export interface CpTableModel {
  kind: 'cp-table';
  points: [number, number][];
}

/** A constant Cp° in J/(mol K) over `range` [Tmin, Tmax] in K. */
export interface ConstantCpModel {
  kind: 'constant';
  cp: number;
  range: [number, number];
}

/** One of the heat-capacity model kinds of FORMAT.md. */
export type HeatCapacityModel = Nasa7Model | Nasa9Model | ShomateModel | CpTableModel | ConstantCpModel;

/** The kind names of `HeatCapacityModel`. */
export type HeatCapacityModelKind = HeatCapacityModel['kind'];

/**
 * `formation`: H from the model is on the scale where the elements in their reference states
 * have H°(298.15 K) = 0, so H(298.15 K) of a compound is its ΔfH°(298.15 K) (NASA polynomials;
 * a Shomate set whose F is on that scale). `relative`: only H(T) − H(298.15 K) is defined, from
 * the model's Cp° and the stated transition enthalpies.
 */
export type ThermoScale = 'formation' | 'relative';

/** A phase transition stated on the relative scale: at `temperature` (K), enthalpy in kJ/mol (heating direction). */
export interface StatedTransition {
  temperature: number;
  enthalpy: number;
}

/** One form (polymorph, liquid, gas) of a species with its own heat-capacity model. */
export interface ThermoForm {
  /** Short label (α, β, I, II…), or null for a single form. */
  form: string | null;
  /** The source's own label (kept for traceability, never shown as a name). */
  label: string;
  model: HeatCapacityModel;
  /** Relative scale only, on every form after the first: the transition into this form. */
  transition?: StatedTransition | undefined;
}

/**
 * A species' heat-capacity model: the forms it passes through as T rises, in order;
 * consecutive forms share their boundary temperature.
 */
export interface SpeciesThermoModel {
  /** The species key (`KOH(cr)`), used in messages. */
  species: string;
  scale: ThermoScale;
  forms: ThermoForm[];
}

/**
 * Where a species model may be evaluated, in K. `min` is `statedMin` except for a model whose
 * lowest range starts at exactly 300 K, which is used from 298.15 K (`extendedToReference`).
 */
export interface ValidRange {
  min: number;
  max: number;
  statedMin: number;
  extendedToReference: boolean;
}
