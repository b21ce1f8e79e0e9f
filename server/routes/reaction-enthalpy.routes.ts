import {
  reactionEnthalpyInputSchema,
  reactionEnthalpyResultSchema,
  reactionHeatInputSchema,
  reactionHeatResultSchema,
} from '@shared/schemas/reaction-enthalpy';
import { evaluateReactionEnthalpy, evaluateReactionHeat } from '../services/reaction-enthalpy.service';
import { defineRoute } from './registry';

const limits =
  'Work limits: the equation obeys the balance API limits (terms, distinct species, size); at most 40 amounts.';

/** Evaluating reactions against the library: public and stable. */
export const reactionEnthalpyRoutes = [
  defineRoute({
    method: 'post',
    path: '/reaction-enthalpy',
    summary: 'ΔrH° (and ΔrU°, ΔrS°, ΔrG°, K) of an equation from the library, at 298.15 K or any T',
    description: `kJ/mol per mole of reaction as written in the returned equation; standard uncertainties (k = 1), null when not stated. An unbalanced equation is balanced first when that is unique. Species missing from the library, ambiguous, or without a model at T → 422 naming them. ${limits}`,
    tags: ['calculations', 'library'],
    access: 'public',
    rateLimit: 'calc',
    request: { body: reactionEnthalpyInputSchema },
    responses: { 200: reactionEnthalpyResultSchema },
    handler: ({ ctx, body }) => evaluateReactionEnthalpy(ctx, body),
  }),
  defineRoute({
    method: 'post',
    path: '/reaction-heat',
    summary: 'Heat for real quantities: extent, limiting reactant, heat released or absorbed, adiabatic rise',
    description: `Heat in kJ with the sign of ΔH (negative: released). The adiabatic rise is a screening estimate only. ${limits}`,
    tags: ['calculations', 'library'],
    access: 'public',
    rateLimit: 'calc',
    request: { body: reactionHeatInputSchema },
    responses: { 200: reactionHeatResultSchema },
    handler: ({ ctx, body }) => evaluateReactionHeat(ctx, body),
  }),
];
