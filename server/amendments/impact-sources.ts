import { loadDemoReactions } from '../../seeds/demo/demo-seed';
import type { ServiceContext } from '../context';

/**
 * The reactions whose ΔrH° the impact of an amendment is shown on. Each source lists reactions
 * for a caller; the impact evaluates each on the library before and after the amendment and
 * keeps those whose species it changes.
 *
 * Today: the invented demo scenario (seeds/demo/reactions.json). Saved reaction sets (another
 * issue) add a source that returns the reactions of the caller's teams' sets, with
 * `origin.kind = 'saved-set'`, to `impactReactionSources`.
 */
export interface ImpactReaction {
  /** Stable id within its source ("kestrel-esterification", a set's reaction id). */
  id: string;
  label: string;
  /** Written as chemists write it; evaluated like POST /reaction-enthalpy at 298.15 K. */
  equation: string;
  origin: { kind: 'demo-scenario' | 'saved-set'; team: string | null };
}

export interface ImpactReactionSource {
  reactionsFor(ctx: ServiceContext): Promise<ImpactReaction[]>;
}

/** The demo scenario's reactions (the same for every caller). */
export const demoScenarioReactions: ImpactReactionSource = {
  reactionsFor: () =>
    Promise.resolve(
      loadDemoReactions().map((r) => ({
        id: r.id,
        label: r.label,
        equation: r.equation,
        origin: { kind: 'demo-scenario' as const, team: r.team },
      })),
    ),
};

/** Every source of reactions the impact evaluates. */
export const impactReactionSources: ImpactReactionSource[] = [demoScenarioReactions];
