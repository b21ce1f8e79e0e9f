import {
  reactionEnthalpyResultSchema,
  reactionHeatResultSchema,
  type ReactionEnthalpyInput,
  type ReactionEnthalpyResult,
  type ReactionHeatInput,
  type ReactionHeatResult,
} from '@shared/schemas/reaction-enthalpy';
import { http } from './http';

/** ΔrH° (and ΔrU°, ΔrS°, ΔrG°, K, a ΔrH°(T) curve) of an equation from the library (public). */
export function evaluateReactionEnthalpy(
  input: ReactionEnthalpyInput,
  signal?: AbortSignal,
): Promise<ReactionEnthalpyResult> {
  return http.post('/reaction-enthalpy', input, {
    schema: reactionEnthalpyResultSchema,
    ...(signal ? { signal } : {}),
  });
}

/** Heat for real quantities: extent, limiting reactant, heat released or absorbed, adiabatic rise (public). */
export function evaluateReactionHeat(input: ReactionHeatInput, signal?: AbortSignal): Promise<ReactionHeatResult> {
  return http.post('/reaction-heat', input, { schema: reactionHeatResultSchema, ...(signal ? { signal } : {}) });
}
