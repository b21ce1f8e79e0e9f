import { nasa7Enthalpy, nasa7Entropy, nasa7HeatCapacity, nasa9Enthalpy, nasa9Entropy, nasa9HeatCapacity } from './nasa';
import { evaluateMonotoneCubic, integrateMonotoneCubic, integrateMonotoneCubicOverT, monotoneCubic } from './pchip';
import { shomateEnthalpy, shomateEntropy, shomateHeatCapacity } from './shomate';
import type { HeatCapacityModel } from './types';

/**
 * One smooth piece of a heat-capacity model between `min` and `max` (K): a range of a NASA or
 * Shomate fit, a whole Cp table, or a constant Cp. `enthalpy` is an antiderivative of Cp/1000
 * (kJ/mol) and `entropy` one of Cp/T (J/(mol K)); for NASA and Shomate fits they carry the fit's
 * absolute levels, for tables and constants they start from 0 at `min`.
 */
export interface Segment {
  readonly min: number;
  readonly max: number;
  heatCapacity(t: number): number;
  enthalpy(t: number): number;
  entropy(t: number): number;
}

/** Splits a (validated) heat-capacity model into its smooth pieces, in order of temperature. */
export function segmentsOf(model: HeatCapacityModel): Segment[] {
  switch (model.kind) {
    case 'nasa7':
      return model.coefficients.map((a, i) => ({
        min: model.ranges[i]!,
        max: model.ranges[i + 1]!,
        heatCapacity: (t) => nasa7HeatCapacity(a, t),
        enthalpy: (t) => nasa7Enthalpy(a, t),
        entropy: (t) => nasa7Entropy(a, t),
      }));
    case 'nasa9':
      return model.coefficients.map((a, i) => ({
        min: model.ranges[i]!,
        max: model.ranges[i + 1]!,
        heatCapacity: (t) => nasa9HeatCapacity(a, t),
        enthalpy: (t) => nasa9Enthalpy(a, t),
        entropy: (t) => nasa9Entropy(a, t),
      }));
    case 'shomate':
      return model.coefficients.map((c, i) => ({
        min: model.ranges[i]!,
        max: model.ranges[i + 1]!,
        heatCapacity: (t) => shomateHeatCapacity(c, t),
        enthalpy: (t) => shomateEnthalpy(c, t),
        entropy: (t) => shomateEntropy(c, t),
      }));
    case 'cp-table': {
      const spline = monotoneCubic(
        model.points.map((p) => p[0]),
        model.points.map((p) => p[1]),
      );
      const first = model.points[0]![0];
      return [
        {
          min: first,
          max: model.points[model.points.length - 1]![0],
          heatCapacity: (t) => evaluateMonotoneCubic(spline, t),
          enthalpy: (t) => integrateMonotoneCubic(spline, t) / 1000,
          entropy: (t) => integrateMonotoneCubicOverT(spline, first, t),
        },
      ];
    }
    case 'constant': {
      const [min, max] = model.range;
      return [
        {
          min,
          max,
          heatCapacity: () => model.cp,
          enthalpy: (t) => (model.cp * (t - min)) / 1000,
          entropy: (t) => model.cp * Math.log(t / min),
        },
      ];
    }
  }
}
