import type Fraction from 'fraction.js';

/**
 * Types of the Hess-cycle combiner. Pure data.
 *
 * Conventions: ΔH in kJ/mol per mole of reaction as written, at 298.15 K and p° = 1 bar; ΔH < 0
 * exothermic. Coefficients are exact fractions, signed: products positive, reactants negative.
 * Species are identified by their key in the equation language (`CO2(g)`, `C(cr, graphite)`,
 * `NaCl(aq, 0.1 mol/kg)`), so a phase or a concentration makes a different species.
 */

/** Where a known reaction comes from. */
export type KnownReactionKind = 'formation' | 'measured' | 'given';

/** One species of a reaction with its signed exact coefficient (products > 0, reactants < 0). */
export interface SignedTerm {
  species: string;
  coefficient: Fraction;
}

/**
 * A reaction whose ΔH is known: the formation reaction of a species with a ΔfH°, a measured
 * reaction of the library, or a reaction the user gave with its ΔH.
 */
export interface KnownReaction {
  /** Unique within a network: `formation:<species>`, `measured:<id>`, `given:<index>`. */
  id: string;
  kind: KnownReactionKind;
  /** Library id (species id for formation, reaction id for measured) or the given reaction's index. */
  refId?: string;
  refIndex?: number;
  /** The reaction as text, for display. */
  equation: string;
  /**
   * Signed terms. For a formation reaction only the species itself (+1): the elements in their
   * reference states have ΔfH° = 0 and balance by construction, so they are left out of the
   * combiner's space (see `isReferenceSpecies` in network.ts).
   */
  terms: SignedTerm[];
  /** Exact ΔH, kJ/mol (decimal inputs read as exact rationals). */
  deltaH: Fraction;
  /** Standard uncertainty u(ΔH), kJ/mol; null when none is stated. */
  uncertainty: number | null;
  /**
   * The independent inputs this ΔH rests on, as exact weights (default: itself alone). A library
   * ΔfH° derived from measured reactions rests on those measurements, so routes that use both
   * count them once (the covariance follows from shared inputs).
   */
  basis?: InputWeight[];
  /** Who and what to cite: source key or citation, shown with the step. */
  source?: string;
}

/** One independent input (a measurement or a primary value) with its weight in a derived value. */
export interface InputWeight {
  input: string;
  weight: Fraction;
}

/** An independent input's standard uncertainty (null when not stated) and a label for messages. */
export interface InputInfo {
  id: string;
  label: string;
  uncertainty: number | null;
}

/** One step of a route: a known reaction taken `multiplier` times. */
export interface RouteStep {
  reaction: KnownReaction;
  multiplier: Fraction;
  /** multiplier × ΔH, exact. */
  deltaH: Fraction;
}

/** A minimal combination of known reactions that adds up to the target. */
export interface Route {
  steps: RouteStep[];
  /** Σ multiplier × ΔH, exact, kJ/mol. */
  deltaH: Fraction;
  /** ΔH as a weighted sum of independent inputs (for variances and covariances). */
  weights: Map<string, Fraction>;
  /** Standard uncertainty from the stated inputs, kJ/mol. */
  uncertainty: number;
  /** Inputs without a stated uncertainty: when not empty, `uncertainty` is incomplete. */
  missing: string[];
}

/** Bounds of the route search. */
export interface RouteSearchOptions {
  /** Measured or given reactions per route (formation steps not counted). */
  maxSteps: number;
  /** Routes to return (the best-ranked). */
  maxRoutes: number;
  /** Combinations examined before the search stops. */
  maxExamined: number;
  /**
   * Enough routes: the search runs by number of measured or given reactions per route, and once
   * it has examined every combination of k reactions and holds at least this many routes whose
   * every uncertainty is stated, it does not go on to k + 1 (stoppedBy 'routes'). Default
   * `ENOUGH_ROUTES_PER_ROUTE_ASKED` × `maxRoutes`; `Infinity` searches up to the other bounds.
   */
  enoughRoutes?: number;
  /** Returns true when the time budget is spent. */
  outOfTime: () => boolean;
}

/** Why a search stopped early, if it did. */
export type SearchStop = 'examined' | 'time' | 'routes' | null;

export interface RouteSearchResult {
  routes: Route[];
  /** Combinations examined. */
  examined: number;
  /** Routes found before ranking and truncation to `maxRoutes`. */
  found: number;
  /**
   * Set when the search stopped early: a bound ('examined', 'time'), or enough routes in hand
   * ('routes'; longer routes not examined). Either way there may be more routes than shown.
   */
  stoppedBy: SearchStop;
  /**
   * Every combination of up to this many measured or given reactions was examined (−1 when not
   * even the target's own tabulated closure was); `maxSteps` when the search is complete.
   */
  completeUpTo: number;
  /**
   * Species that no known reaction reaches (no ΔfH° and in no usable reaction), when no route
   * was found.
   */
  unreachable: string[];
  /** Routes rejected because they would mix ion conventions (aqueous with gaseous charge). */
  rejectedMixedConventions: number;
}
