import {
  consistencyInputSchema,
  consistencyResultSchema,
  deriveInputSchema,
  deriveResultSchema,
} from '@shared/schemas/derive';
import { checkConsistency } from '../services/consistency.service';
import { deriveReactionEnthalpy } from '../services/derive.service';
import { defineRoute } from './registry';

/** The Hess-cycle combiner: public and stable, like the other calculations. */
export const deriveRoutes = [
  defineRoute({
    method: 'post',
    path: '/derive',
    summary: "Derive ΔH of a target reaction by Hess's law",
    description:
      "Searches exact-fraction combinations of known reactions (the library's formation reactions and measured reactions, reactions given with the request, or both) that add up to the target species by species and phase by phase. Routes are minimal, ranked by uncertainty, compared with the covariance of the inputs they share (χ² test), and combined by generalised least squares when they agree. Work limits: target ≤ 2,000 characters, ≤ 100 given reactions, ≤ 20 routes, route length, combinations examined and a time budget. The search goes by number of reactions per route, shortest first, and does not go on to longer routes once it holds 4 × maxRoutes routes with stated uncertainties; a search stopped early (search.stoppedBy: examined, time or routes) says so in its warnings. Bad target text → 400 parse_error; an unreadable given reaction → 400 naming reactions.N; a given reaction that does not balance or lacks phases → 422 naming it.",
    tags: ['calculations', 'library'],
    access: 'public',
    rateLimit: 'calc',
    request: { body: deriveInputSchema },
    responses: { 200: deriveResultSchema },
    handler: ({ ctx, body }) => deriveReactionEnthalpy(ctx, body),
  }),

  defineRoute({
    method: 'post',
    path: '/library/consistency',
    summary: 'Consistency check: fit a group of species to the measured reactions that link them',
    description:
      'Curators only. Generalised least squares over every independent measured reaction involving the group, the other species held at their library values with their uncertainties in the covariance; residuals over 2σ flagged; Birge ratio. At most 200 species and 2,000 measurements.',
    tags: ['library'],
    access: { site: 'curator' },
    request: { body: consistencyInputSchema },
    responses: { 200: consistencyResultSchema },
    handler: ({ ctx, body }) => checkConsistency(ctx, body),
  }),
];
