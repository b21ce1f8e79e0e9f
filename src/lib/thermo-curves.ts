/**
 * Points of a species' Cp°(T) and H°(T) curves for plots, computed in the browser from the
 * library's heat-capacity model with the thermo core. T in K, Cp° in J/(mol K), H° in kJ/mol.
 *
 * The enthalpy curve is H°(T) − H°(298.15 K) when the model reaches 298.15 K. A formation-scale
 * model that starts above 298.15 K (a liquid fitted from its melting point) is plotted as H°(T)
 * on the formation scale itself; a relative-scale one as H°(T) − H°(T_min). Each case says so.
 */
import {
  REFERENCE_TEMPERATURE,
  absoluteEnthalpy,
  crossingsBetween,
  enthalpyChange,
  enthalpyIncrement,
  heatCapacity,
  prepareThermoModel,
  type PreparedThermoModel,
} from '@shared/chemistry/thermo/index';
import type { LibraryModel } from '@shared/schemas/library';
import { formatSignificant, formatTemperature } from './uncertainty-rounding';

/** [T in K, value] or a break in the line. */
export type CurvePoint = [number, number] | [number, null];

/** A phase change or a jump at a joint, for marking on the plots. */
export interface CurveMark {
  temperature: number;
  kind: 'transition' | 'joint';
  /** "α → β" or "joint in β". */
  label: string;
  /** kJ/mol, heating direction. */
  enthalpy: number;
}

export type EnthalpyScale = 'increment' | 'formation' | 'from-range-start';

export interface SpeciesCurves {
  range: { min: number; max: number; extendedToReference: boolean };
  cp: CurvePoint[];
  enthalpy: CurvePoint[];
  /** What the enthalpy axis shows. */
  enthalpyScale: EnthalpyScale;
  enthalpyLabel: string;
  /** Said beside the plot when the enthalpy is not H(T) − H(298.15 K). */
  enthalpyNote: string | null;
  marks: CurveMark[];
}

/** Temperatures from min to max (both included), evenly spaced, plus both sides of each mark. */
export function sampleTemperatures(min: number, max: number, count: number, marks: readonly number[]): number[] {
  const out = new Set<number>();
  for (let i = 0; i < count; i++) out.add(min + ((max - min) * i) / (count - 1));
  for (const t of marks) if (t > min && t < max) out.add(t);
  return [...out].sort((a, b) => a - b);
}

function markLabel(from: string | null, to: string | null, kind: 'transition' | 'joint'): string {
  if (kind === 'joint') return `joint${to ? ` in ${to}` : ''}`;
  return `${from ?? 'lower form'} → ${to ?? 'upper form'}`;
}

/**
 * The curves of one library model. At a mark the lower form applies at T itself, so each mark
 * gets a second point just above it: the enthalpy line rises vertically by ΔtrsH there and the
 * Cp line breaks.
 */
export function speciesCurves(speciesKey: string, model: LibraryModel, count = 160): SpeciesCurves {
  const prepared: PreparedThermoModel = prepareThermoModel({
    species: speciesKey,
    scale: model.scale,
    forms: model.forms,
  });
  const { min, max, extendedToReference } = prepared.range;
  const crossings = crossingsBetween(prepared, min, max);
  const marks: CurveMark[] = crossings.map((c) =>
    c.kind === 'transition'
      ? {
          temperature: c.temperature,
          kind: c.kind,
          label: markLabel(c.from.form, c.to.form, 'transition'),
          enthalpy: c.enthalpy,
        }
      : {
          temperature: c.temperature,
          kind: c.kind,
          label: markLabel(null, c.form.form, 'joint'),
          enthalpy: c.enthalpyJump,
        },
  );

  let enthalpyScale: EnthalpyScale;
  if (min <= REFERENCE_TEMPERATURE && max >= REFERENCE_TEMPERATURE) enthalpyScale = 'increment';
  else if (prepared.scale === 'formation') enthalpyScale = 'formation';
  else enthalpyScale = 'from-range-start';
  const enthalpyAt = (t: number): number => {
    if (enthalpyScale === 'increment') return enthalpyIncrement(prepared, t);
    if (enthalpyScale === 'formation') return absoluteEnthalpy(prepared, t);
    return enthalpyChange(prepared, min, t);
  };

  const temperatures = sampleTemperatures(
    min,
    max,
    count,
    marks.map((m) => m.temperature),
  );
  const markAt = new Set(marks.map((m) => m.temperature));
  // Just above a mark: far enough to land in the upper piece, close enough to look vertical.
  const above = (t: number) => t + Math.max(1e-6, (max - min) * 1e-9);
  const cp: CurvePoint[] = [];
  const enthalpy: CurvePoint[] = [];
  for (const t of temperatures) {
    cp.push([t, heatCapacity(prepared, t)]);
    enthalpy.push([t, enthalpyAt(t)]);
    if (markAt.has(t) && t < max) {
      cp.push([t, null]);
      cp.push([above(t), heatCapacity(prepared, above(t))]);
      enthalpy.push([above(t), enthalpyAt(above(t))]);
    }
  }

  const startText = formatTemperature(min);
  const enthalpyLabel =
    enthalpyScale === 'increment'
      ? 'H°(T) − H°(298.15 K), kJ/mol'
      : enthalpyScale === 'formation'
        ? 'H°(T), kJ/mol (formation scale)'
        : `H°(T) − H°(${startText} K), kJ/mol`;
  const enthalpyNote =
    enthalpyScale === 'increment'
      ? null
      : enthalpyScale === 'formation'
        ? `This model starts at ${startText} K, above 298.15 K, so H°(T) is plotted on its own formation scale (elements in their reference states have H° = 0 at 298.15 K), not as H°(T) − H°(298.15 K).`
        : `This model starts at ${startText} K, above 298.15 K, and gives no absolute enthalpy: the curve is H°(T) − H°(${startText} K).`;

  return { range: { min, max, extendedToReference }, cp, enthalpy, enthalpyScale, enthalpyLabel, enthalpyNote, marks };
}

function extremes(points: readonly CurvePoint[]): { lo: [number, number]; hi: [number, number] } | null {
  let lo: [number, number] | null = null;
  let hi: [number, number] | null = null;
  for (const [t, v] of points) {
    if (v === null) continue;
    if (!lo || v < lo[1]) lo = [t, v];
    if (!hi || v > hi[1]) hi = [t, v];
  }
  return lo && hi ? { lo, hi } : null;
}

/** The plots in words, for screen readers and for anyone who cannot see the picture. */
export function describeCurves(curves: SpeciesCurves): { cp: string; enthalpy: string } {
  const range = `from ${formatTemperature(curves.range.min)} K to ${formatTemperature(curves.range.max)} K`;
  const marks =
    curves.marks.length === 0
      ? 'No phase change or jump inside the range.'
      : `Marked: ${curves.marks
          .map(
            (m) =>
              `${m.kind === 'transition' ? 'phase change' : 'jump at a joint'} ${m.label} at ${formatTemperature(m.temperature)} K (${formatSignificant(m.enthalpy, 3)} kJ/mol)`,
          )
          .join('; ')}.`;
  const cp = extremes(curves.cp);
  const h = extremes(curves.enthalpy);
  const first = curves.cp.find((p) => p[1] !== null);
  const last = [...curves.cp].reverse().find((p) => p[1] !== null);
  return {
    cp:
      cp && first && last
        ? `Heat capacity Cp° ${range}: ${formatSignificant(first[1]!, 4)} J/(mol K) at the start, ${formatSignificant(last[1]!, 4)} at the end; lowest ${formatSignificant(cp.lo[1], 4)} at ${formatTemperature(cp.lo[0])} K, highest ${formatSignificant(cp.hi[1], 4)} at ${formatTemperature(cp.hi[0])} K. ${marks}`
        : `Heat capacity ${range}: no values.`,
    enthalpy: h
      ? `${curves.enthalpyLabel} ${range}: from ${formatSignificant(h.lo[1], 4)} to ${formatSignificant(h.hi[1], 4)} kJ/mol. ${marks}`
      : `${curves.enthalpyLabel}: no values.`,
  };
}
