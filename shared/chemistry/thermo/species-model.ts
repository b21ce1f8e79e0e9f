import { JOINT_JUMP_THRESHOLD, REFERENCE_TEMPERATURE, TOLERATED_RANGE_START } from './constants';
import { TemperatureOutOfRangeError, ThermoInputError, type FieldPath } from './errors';
import { assertThermoModel } from './model-check';
import { segmentsOf, type Segment } from './segments';
import type { SpeciesThermoModel, StatedTransition, ThermoScale, ValidRange } from './types';

/*
 * Evaluation of a species' heat-capacity model: its forms in order of temperature, each split
 * into smooth pieces. Conventions for every function here:
 * - T in K, Cp° and S° in J/(mol K), H° in kJ/mol; standard pressure p° = 1 bar.
 * - At a boundary between two forms or two ranges, the lower one applies: H(T_trs) is the lower
 *   form's value, and a transition counts as crossed only when the path goes past it.
 * - A transition enthalpy is stated in the heating direction (ΔtrsH > 0 for melting).
 */

const PREPARED: unique symbol = Symbol('prepared heat-capacity model');

interface PlacedSegment extends Segment {
  readonly form: number;
}

/** The name of a form, for reports: its short label (α, β…; null for a single form) and the source's label. */
export interface FormName {
  index: number;
  form: string | null;
  label: string;
}

/**
 * A validated species model with its pieces built once, for evaluating it many times (plots,
 * benchmarks). A snapshot: prepare again after changing the model. Every function of this
 * module accepts either a `SpeciesThermoModel` or a prepared one.
 */
export interface PreparedThermoModel {
  readonly [PREPARED]: true;
  readonly species: string;
  readonly scale: ThermoScale;
  readonly range: ValidRange;
  readonly forms: readonly (FormName & { transition: StatedTransition | undefined })[];
  readonly segments: readonly PlacedSegment[];
}

/** Either form accepted by the evaluation functions. */
export type ThermoModelInput = SpeciesThermoModel | PreparedThermoModel;

/**
 * Validates a species model (throws `ThermoModelError` naming each bad field) and builds its
 * pieces. The range is the stated one, except that a lowest range starting at exactly 300 K is
 * used from 298.15 K (the convention NASA TM-4513 users accept; see `TOLERATED_RANGE_START`).
 */
export function prepareThermoModel(model: ThermoModelInput): PreparedThermoModel {
  if (isPreparedThermoModel(model)) return model;
  assertThermoModel(model);
  const segments: PlacedSegment[] = [];
  model.forms.forEach((f, form) => {
    for (const s of segmentsOf(f.model)) segments.push(Object.assign(s, { form }));
  });
  const statedMin = segments[0]!.min;
  const extendedToReference = statedMin === TOLERATED_RANGE_START;
  return {
    [PREPARED]: true,
    species: model.species,
    scale: model.scale,
    range: {
      min: extendedToReference ? REFERENCE_TEMPERATURE : statedMin,
      max: segments[segments.length - 1]!.max,
      statedMin,
      extendedToReference,
    },
    forms: model.forms.map((f, index) => ({ index, form: f.form, label: f.label, transition: f.transition })),
    segments,
  };
}

/** True for a model made by `prepareThermoModel`. */
export function isPreparedThermoModel(model: ThermoModelInput): model is PreparedThermoModel {
  return (model as Partial<PreparedThermoModel>)[PREPARED] === true;
}

/**
 * Checks a temperature argument: finite and above 0 K.
 * @throws ThermoInputError naming `path` otherwise.
 */
export function assertTemperature(t: number, path: FieldPath = ['temperature']): void {
  if (typeof t !== 'number' || !Number.isFinite(t) || t <= 0)
    throw new ThermoInputError(`${path.join('.')} must be a finite temperature above 0 K (got ${String(t)})`, path);
}

function locate(p: PreparedThermoModel, t: number, path: FieldPath): number {
  assertTemperature(t, path);
  if (t < p.range.min || t > p.range.max)
    throw new TemperatureOutOfRangeError({ species: p.species, temperature: t, range: { ...p.range } });
  for (let i = 0; i < p.segments.length; i++) if (t <= p.segments[i]!.max) return i;
  return p.segments.length - 1;
}

/** The temperatures (K) where the model may be evaluated; see `ValidRange`. */
export function validRange(model: ThermoModelInput): ValidRange {
  return { ...prepareThermoModel(model).range };
}

/** True when T (K) lies inside the model's valid range (T must be a finite temperature above 0 K). */
export function coversTemperature(model: ThermoModelInput, t: number): boolean {
  assertTemperature(t);
  const { range } = prepareThermoModel(model);
  return t >= range.min && t <= range.max;
}

/**
 * The form the species is in at T (K); at a shared boundary, the lower form.
 * @throws TemperatureOutOfRangeError outside the valid range.
 */
export function formAt(model: ThermoModelInput, t: number): FormName {
  const p = prepareThermoModel(model);
  const f = p.forms[p.segments[locate(p, t, ['temperature'])]!.form]!;
  return { index: f.index, form: f.form, label: f.label };
}

/**
 * Standard molar heat capacity Cp°(T) in J/(mol K) at p° = 1 bar; at a boundary, the lower
 * form's or range's value.
 * @throws TemperatureOutOfRangeError outside the valid range (never extrapolated).
 */
export function heatCapacity(model: ThermoModelInput, t: number): number {
  const p = prepareThermoModel(model);
  return p.segments[locate(p, t, ['temperature'])]!.heatCapacity(t);
}

/**
 * H° of a formation-scale model in kJ/mol at T (K): on the scale where the elements in their
 * reference states have H°(298.15 K) = 0, so for a compound H°(298.15 K) = ΔfH°(298.15 K).
 * Works for forms whose range starts above 298.15 K (a liquid metal from its melting point),
 * inside their range.
 * @throws ThermoInputError for a relative-scale model; TemperatureOutOfRangeError outside the range.
 */
export function absoluteEnthalpy(model: ThermoModelInput, t: number): number {
  const p = prepareThermoModel(model);
  if (p.scale !== 'formation')
    throw new ThermoInputError(
      `${p.species}: a relative-scale model gives only H(T) − H(298.15 K), not an absolute enthalpy`,
      ['model', 'scale'],
    );
  return p.segments[locate(p, t, ['temperature'])]!.enthalpy(t);
}

/**
 * Absolute S° of a formation-scale model in J/(mol K) at T (K) and p° = 1 bar, from the fit's
 * own constant (a7 / a9 / G).
 * @throws ThermoInputError for a relative-scale model; TemperatureOutOfRangeError outside the range.
 */
export function absoluteEntropy(model: ThermoModelInput, t: number): number {
  const p = prepareThermoModel(model);
  if (p.scale !== 'formation')
    throw new ThermoInputError(
      `${p.species}: a relative-scale model gives only S(T) − S(298.15 K); supply S°(298.15 K)`,
      ['model', 'scale'],
    );
  return p.segments[locate(p, t, ['temperature'])]!.entropy(t);
}

type Quantity = 'enthalpy' | 'entropy';

/** Change of H (kJ/mol) or S (J/(mol K)) from a to b, a ≤ b, both in range. */
function change(p: PreparedThermoModel, a: number, b: number, quantity: Quantity): number {
  const ia = locate(p, a, ['from']);
  const ib = locate(p, b, ['to']);
  // Formation scale: every piece carries its absolute level, so jumps at joints and transitions are in the values.
  if (p.scale === 'formation') return p.segments[ib]![quantity](b) - p.segments[ia]![quantity](a);
  // Relative scale: integrate Cp (or Cp/T) piece by piece and add each stated transition crossed.
  let total = 0;
  let from = a;
  for (let i = ia; ; i++) {
    const s = p.segments[i]!;
    const to = i === ib ? b : s.max;
    total += s[quantity](to) - s[quantity](from);
    if (i === ib) return total;
    const next = p.segments[i + 1]!;
    if (next.form !== s.form) {
      const trs = p.forms[next.form]!.transition!;
      total += quantity === 'enthalpy' ? trs.enthalpy : (trs.enthalpy * 1000) / trs.temperature;
    }
    from = next.min;
  }
}

function signedChange(model: ThermoModelInput, t1: number, t2: number, quantity: Quantity): number {
  const p = prepareThermoModel(model);
  return t1 <= t2 ? change(p, t1, t2, quantity) : -change(p, t2, t1, quantity);
}

/**
 * H°(t2) − H°(t1) in kJ/mol, every transition between included (on the formation scale the jump
 * of H between forms, and any jump at a joint inside a form; on the relative scale the stated
 * transition enthalpies). Negative when t2 < t1 for an ordinary species.
 * @throws TemperatureOutOfRangeError when either temperature is outside the valid range.
 */
export function enthalpyChange(model: ThermoModelInput, t1: number, t2: number): number {
  return signedChange(model, t1, t2, 'enthalpy');
}

/**
 * H°(T) − H°(298.15 K) in kJ/mol, the increment Kirchhoff's law adds to ΔfH°(298.15 K), with
 * every transition between 298.15 K and T included (see `enthalpyChange`).
 * @throws TemperatureOutOfRangeError when T or 298.15 K is outside the valid range (e.g. a liquid
 * whose fit starts at its melting point: use `absoluteEnthalpy`).
 */
export function enthalpyIncrement(model: ThermoModelInput, t: number): number {
  assertTemperature(t);
  return signedChange(model, REFERENCE_TEMPERATURE, t, 'enthalpy');
}

/**
 * S°(t2) − S°(t1) in J/(mol K) at p° = 1 bar, including ΔtrsH/Ttrs for every transition crossed.
 * @throws TemperatureOutOfRangeError when either temperature is outside the valid range.
 */
export function entropyChange(model: ThermoModelInput, t1: number, t2: number): number {
  return signedChange(model, t1, t2, 'entropy');
}

/**
 * S°(T) in J/(mol K) at p° = 1 bar. With `s298` (the caller's S°(298.15 K), e.g. a library
 * value): s298 + [S(T) − S(298.15 K)] from the model. Without it: the model's absolute S° on the
 * formation scale (valid also for forms starting above 298.15 K).
 * @throws ThermoInputError when `s298` is missing for a relative-scale model;
 * TemperatureOutOfRangeError outside the range.
 */
export function entropy(model: ThermoModelInput, t: number, s298: number | null = null): number {
  if (s298 === null) return absoluteEntropy(model, t);
  if (!Number.isFinite(s298)) throw new ThermoInputError('s298 must be a finite entropy in J/(mol K)', ['s298']);
  assertTemperature(t);
  return s298 + signedChange(model, REFERENCE_TEMPERATURE, t, 'entropy');
}

/** A phase transition between two consecutive forms. */
export interface PhaseTransition {
  /** K */
  temperature: number;
  from: FormName;
  to: FormName;
  /** ΔtrsH in kJ/mol, heating direction (H of the upper form minus H of the lower form). */
  enthalpy: number;
  /** ΔtrsS = ΔtrsH/Ttrs in J/(mol K). */
  entropy: number;
}

/** A joint inside one form where H jumps (formation scale only; relative-scale pieces are integrated, so continuous). */
export interface DiscontinuousJoint {
  /** K */
  temperature: number;
  form: FormName;
  /** H of the upper range minus H of the lower range at the joint, kJ/mol. */
  enthalpyJump: number;
  /** S of the upper range minus S of the lower range at the joint, J/(mol K). */
  entropyJump: number;
}

/** An event met on a path in temperature, in the order met. */
export type ThermoCrossing = ({ kind: 'transition' } & PhaseTransition) | ({ kind: 'joint' } & DiscontinuousJoint);

function formName(p: PreparedThermoModel, index: number): FormName {
  const f = p.forms[index]!;
  return { index, form: f.form, label: f.label };
}

/** Every boundary between two pieces, as a transition or a joint (with its jump, however small). */
function boundaries(p: PreparedThermoModel): ThermoCrossing[] {
  const out: ThermoCrossing[] = [];
  for (let i = 0; i + 1 < p.segments.length; i++) {
    const lower = p.segments[i]!;
    const upper = p.segments[i + 1]!;
    const t = lower.max;
    if (upper.form !== lower.form) {
      const enthalpy =
        p.scale === 'formation'
          ? upper.enthalpy(upper.min) - lower.enthalpy(t)
          : p.forms[upper.form]!.transition!.enthalpy;
      out.push({
        kind: 'transition',
        temperature: t,
        from: formName(p, lower.form),
        to: formName(p, upper.form),
        enthalpy,
        entropy: (enthalpy * 1000) / t,
      });
    } else if (p.scale === 'formation') {
      out.push({
        kind: 'joint',
        temperature: t,
        form: formName(p, lower.form),
        enthalpyJump: upper.enthalpy(upper.min) - lower.enthalpy(t),
        entropyJump: upper.entropy(upper.min) - lower.entropy(t),
      });
    }
  }
  return out;
}

/** The model's phase transitions in order of temperature, with ΔtrsH (kJ/mol) and ΔtrsS (J/(mol K)). */
export function phaseTransitions(model: ThermoModelInput): PhaseTransition[] {
  return boundaries(prepareThermoModel(model))
    .filter((b): b is { kind: 'transition' } & PhaseTransition => b.kind === 'transition')
    .map(({ kind: _kind, ...t }) => t);
}

/**
 * Joints inside one form where H jumps by more than `threshold` kJ/mol (default 0.1), with the
 * size of the jump. In the NASA TM-4513 file: ZnSO4(a) at 540 K and Li2O(s) at 1000 K.
 */
export function discontinuousJoints(
  model: ThermoModelInput,
  threshold: number = JOINT_JUMP_THRESHOLD,
): DiscontinuousJoint[] {
  return boundaries(prepareThermoModel(model))
    .filter(
      (b): b is { kind: 'joint' } & DiscontinuousJoint => b.kind === 'joint' && Math.abs(b.enthalpyJump) > threshold,
    )
    .map(({ kind: _kind, ...j }) => j);
}

/**
 * The transitions and discontinuous joints (jump > 0.1 kJ/mol) met going from t1 to t2 (K), in
 * the order met (descending when t2 < t1). Enthalpies are always in the heating direction; the
 * path from t1 to t2 adds them with the sign of (t2 − t1). A boundary counts as crossed when the
 * path goes past it, or starts on it and goes up (at a boundary the lower form applies).
 * @throws TemperatureOutOfRangeError when either temperature is outside the valid range.
 */
export function crossingsBetween(model: ThermoModelInput, t1: number, t2: number): ThermoCrossing[] {
  const p = prepareThermoModel(model);
  locate(p, t1, ['from']);
  locate(p, t2, ['to']);
  const lo = Math.min(t1, t2);
  const hi = Math.max(t1, t2);
  const crossed = boundaries(p).filter(
    (b) =>
      b.temperature >= lo &&
      b.temperature < hi &&
      (b.kind === 'transition' || Math.abs(b.enthalpyJump) > JOINT_JUMP_THRESHOLD),
  );
  return t2 >= t1 ? crossed : crossed.reverse();
}
