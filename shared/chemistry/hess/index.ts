/**
 * The Hess-cycle combiner: exact combinations of known reactions (formation reactions of
 * species with a ΔfH°, measured reactions, reactions the user gives) that add up to a target,
 * their uncertainties with the covariance of shared inputs, their agreement, and the consistency
 * fit of redundant measurements. Pure; kJ/mol at 298.15 K and 1 bar; exact fractions for
 * multipliers and sums.
 */
export type {
  KnownReactionKind,
  SignedTerm,
  KnownReaction,
  InputWeight,
  InputInfo,
  RouteStep,
  Route,
  RouteSearchOptions,
  SearchStop,
  RouteSearchResult,
} from './types';
export { buildHessNetwork, extendHessNetwork } from './network';
export type { HessNetwork, NetworkSpecies } from './network';
export { findRoutes, findRoutesAsync, compareRoutes, ENOUGH_ROUTES_PER_ROUTE_ASKED } from './routes';
export { routeWeights, routeUncertainty, routeCovariance } from './covariance';
export { combineRoutes, AGREEMENT_SIGNIFICANCE, ROUTE_FLAG_SIGMAS } from './combine';
export type { RouteCombination } from './combine';
export { deriveEnthalpy, deriveEnthalpyAsync } from './derive';
export type { Derivation } from './derive';
export { consistencyFit, UndeterminedFitError, FLAG_SIGMAS } from './consistency';
export type {
  ConsistencyMeasurement,
  HeldValue,
  FittedValue,
  MeasurementResidual,
  ConsistencyResult,
} from './consistency';
