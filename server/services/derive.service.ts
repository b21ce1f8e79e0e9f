import Fraction from 'fraction.js';
import {
  balanceEquation,
  ChemistryError,
  EquationParseError,
  formatEquation,
  parseEquation,
} from '@shared/chemistry/index';
import {
  buildHessNetwork,
  deriveEnthalpyAsync,
  ENOUGH_ROUTES_PER_ROUTE_ASKED,
  extendHessNetwork,
  type Derivation,
  type HessNetwork,
  type InputInfo,
  type KnownReaction,
  type NetworkSpecies,
  type SignedTerm,
} from '@shared/chemistry/hess/index';
import { reactionPropertiesAt } from '@shared/chemistry/thermo/index';
import { resolveSpecies } from '@shared/library/resolve-species';
import type { DeriveInput, DeriveResult, GivenReaction } from '@shared/schemas/derive';
import { AppError } from '../errors';
import { fractionOf } from '../library/read-reaction';
import { keyOfSpecies } from '../library/seed-set';
import { exact, libraryNetworkOf, type ExcludedReaction } from '../library/network';
import { hillKey, selectedModel, selectedValue, type LibrarySnapshot } from '../library/snapshot';
import type { ServiceContext } from '../context';
import { teamValuesAsReactions } from '../library/team-values';
import { teamValues } from './team-values.service';
import { snapshotFor } from './library.service';
import { preparedModel, temperatureOf } from './reaction-enthalpy.service';

/** Bounds of the route search (configurable through the app's configuration). */
export interface DeriveLimits {
  maxSteps: number;
  maxExamined: number;
  timeBudgetMs: number;
  /** Routes with every uncertainty stated, per route asked, after which longer routes are not searched. */
  enoughRoutesPerRouteAsked: number;
}

export const defaultDeriveLimits: DeriveLimits = {
  maxSteps: 6,
  maxExamined: 20_000,
  timeBudgetMs: 2_000,
  enoughRoutesPerRouteAsked: ENOUGH_ROUTES_PER_ROUTE_ASKED,
};

/** Why the search stopped early, in words (null when it ran to the end). */
export function searchStopWarning(search: Derivation['search'], maxRoutes: number): Warning | null {
  const { stoppedBy, examined, found, completeUpTo } = search;
  if (!stoppedBy) return null;
  const reactions = (k: number) => `${k} measured or given reaction${k === 1 ? '' : 's'}`;
  if (stoppedBy === 'routes')
    return {
      code: 'search_stopped',
      message: `The search stopped after ${found} route(s) of up to ${reactions(completeUpTo)} each (enough to rank the ${maxRoutes} asked for): longer routes were not examined, so there may be more routes than shown.`,
    };
  const bound = stoppedBy === 'time' ? 'time budget' : 'examination limit';
  const covered = completeUpTo >= 1 ? ` Every route of up to ${reactions(completeUpTo)} was examined.` : '';
  return {
    code: 'search_stopped',
    message: `The search stopped after examining ${examined} combinations (${bound}) with ${found} route(s) found: there may be more routes than shown.${covered}`,
  };
}

type Warning = DeriveResult['warnings'][number];

/** Which of the library's measured reactions stay out of Hess sums and why, in words. */
export function excludedReactionsMessage(excluded: ExcludedReaction[]): string {
  const restating = excluded.filter((e) => e.cause === 'restates').length;
  const uncorrectable = excluded.length - restating;
  const parts: string[] = [];
  if (restating > 0)
    parts.push(
      `${restating} restate${restating === 1 ? 's' : ''} values the library already holds (not independent measurements)`,
    );
  if (uncorrectable > 0)
    parts.push(
      `${uncorrectable} ${uncorrectable === 1 ? 'was' : 'were'} measured away from 298.15 K where a species lacks a heat-capacity model`,
    );
  return `${excluded.length} measured reaction${excluded.length === 1 ? '' : 's'} of the library ${excluded.length === 1 ? 'is' : 'are'} left out of Hess sums: ${parts.join('; ')}.`;
}

/** A species written in a target or given reaction, matched to the library where it is there. */
export interface ReadSpecies {
  key: string;
  charge: number;
  phase: string | null;
  inLibrary: boolean;
}

function fieldError(path: (string | number)[], message: string): AppError {
  return new AppError('validation_failed', `${path.join('.')}: ${message}`, {
    issues: [{ path: ['body', ...path], message }],
  });
}

/**
 * Reads an equation for the combiner: every species with its phase; library species take their
 * library key (so their ΔfH° and reactions apply), others keep the key as written (a new
 * compound). Ambiguous species are refused like in the library evaluation.
 */
function readSpeciesTerms(
  snapshot: LibrarySnapshot,
  text: string,
  field: (string | number)[],
  balance: 'as-written' | 'balance-first',
  warnings: Warning[],
): { terms: { species: ReadSpecies; coefficient: Fraction }[]; equation: string } {
  let parsed: ReturnType<typeof parseEquation>;
  try {
    parsed = parseEquation(text);
  } catch (error) {
    if (error instanceof EquationParseError && field[0] !== 'target')
      throw new AppError('parse_error', `${field.join('.')}: ${error.message}`, {
        ...error.position,
        field: field.join('.'),
      });
    throw error;
  }
  const where = field.join('.');
  const unphased = parsed.terms.filter((t) => !t.species.phase).map((t) => t.species.formula);
  if (unphased.length > 0)
    throw new ChemistryError(
      'unprocessable',
      `${where}: every species needs its phase label for a Hess sum — ${unphased.join(', ')} has none.`,
      { field: where, species: unphased },
    );
  const result = balanceEquation(parsed, {});
  const balancedText = formatEquation({ ...result.equation, enthalpy: null }, 'text');
  let coefficients = parsed.terms.map((t) => fractionOf(t.coefficient));
  if (!result.asGiven) {
    if (balance === 'as-written' || result.status !== 'balanced')
      throw new ChemistryError(
        'unprocessable',
        result.status === 'balanced'
          ? `${where} does not balance as written, so its ΔH is not defined; balanced it would read ${balancedText}.`
          : `${where} cannot be balanced: ${result.impossible?.message ?? 'several balancings exist'}.`,
        { field: where },
      );
    coefficients = result.equation.terms.map((t) => fractionOf(t.coefficient));
    warnings.push({ code: 'balanced_first', message: `The target was balanced first: ${balancedText}.` });
  }
  const problems: string[] = [];
  const terms = parsed.terms.map((t, i) => {
    const entries = snapshot.speciesByHill.get(hillKey(t.species.hill, t.species.charge)) ?? [];
    const written = {
      formula: t.species.formula,
      hill: t.species.hill,
      charge: t.species.charge,
      phase: t.species.phase,
      descriptor: t.species.descriptor,
      elements: Object.keys(t.species.composition),
    };
    const resolution = resolveSpecies(written, entries);
    const coefficient = t.side === 'reactant' ? coefficients[i]!.neg() : coefficients[i]!;
    if (resolution.ok) {
      if (resolution.warning) warnings.push({ code: 'species_resolved', message: `${where}: ${resolution.warning}` });
      const e = resolution.entry;
      return { species: { key: e.key, charge: e.charge, phase: e.phase, inLibrary: true }, coefficient };
    }
    // Ambiguous species are refused; a species the library lacks (in that phase) is a new one.
    if (resolution.reason !== 'missing') problems.push(resolution.message);
    const key = keyOfSpecies(t.species);
    return {
      species: {
        key,
        charge: t.species.charge,
        phase: t.species.phase === 's' ? 'cr' : t.species.phase,
        inLibrary: false,
      },
      coefficient,
    };
  });
  if (problems.length > 0)
    throw new ChemistryError('unprocessable', `${where}: ${problems.join(' ')}`, { field: where });
  return { terms, equation: field[0] === 'target' && !result.asGiven ? balancedText : text };
}

const KCAL = new Fraction(4184, 1000);

/** ΔH of a given reaction in kJ/mol, exact from the decimal typed. */
function givenDeltaH(reaction: GivenReaction): { value: Fraction; uncertainty: number | null } {
  const factor =
    reaction.deltaH.unit === 'kcal/mol'
      ? KCAL
      : reaction.deltaH.unit === 'J/mol'
        ? new Fraction(1, 1000)
        : new Fraction(1);
  const value = exact(reaction.deltaH.value).mul(factor);
  const u = reaction.deltaH.uncertainty;
  return { value, uncertainty: u === undefined ? null : u * factor.valueOf() };
}

/**
 * Brings a given reaction measured at T to 298.15 K by Kirchhoff with the library's models:
 * ΔH(298.15) = ΔH(T) − Σ ν [H(T) − H(298.15 K)]. Refused (422) when a species has no model at T.
 */
function toReferenceTemperature(
  snapshot: LibrarySnapshot,
  terms: { species: ReadSpecies; coefficient: Fraction }[],
  deltaH: Fraction,
  temperature: number,
  field: string,
): Fraction {
  const missing: string[] = [];
  const thermoTerms = terms.map((t) => {
    const entry = snapshot.speciesByKey.get(t.species.key);
    const model = entry ? selectedModel(snapshot, entry.id) : null;
    if (!entry || !model) missing.push(t.species.key);
    const value = entry ? selectedValue(snapshot, entry.id, 'dfH298') : null;
    return {
      coefficient: t.coefficient,
      species: t.species.key,
      phase: t.species.phase,
      // Only the increments matter here: a stand-in ΔfH° of 0 keeps species without one usable.
      formationEnthalpy: { value: value?.value ?? 0, standardUncertainty: null },
      entropy: null,
      model: entry && model ? preparedModel(entry, model) : null,
    };
  });
  if (missing.length > 0)
    throw new ChemistryError(
      'unprocessable',
      `${field} is given at ${temperature} K; bringing it to 298.15 K needs heat-capacity models, and the library has none for ${missing.join(', ')}. Give the reaction's ΔH at 298.15 K instead.`,
      { field, species: missing },
    );
  try {
    const at = reactionPropertiesAt(thermoTerms, { temperature });
    const increment = at.enthalpy - (at.referenceEnthalpy ?? 0);
    return deltaH.sub(exact(increment.toPrecision(15)));
  } catch (error) {
    if (error instanceof ChemistryError)
      throw new ChemistryError('unprocessable', `${field}: ${error.message}`, { field, ...error.details });
    throw error;
  }
}

/** Every species that is neither in the library's network nor given: a charge and phase record. */
function speciesInfo(terms: { species: ReadSpecies }[]): Map<string, NetworkSpecies> {
  return new Map(terms.map((t) => [t.species.key, { charge: t.species.charge, phase: t.species.phase }]));
}

function suggestionFor(species: string[]): string {
  const words = species.map((s) => {
    if (s.includes('(aq')) return `an enthalpy of solution of a salt giving ${s}, or its ΔfH°`;
    if (s.includes('(g') || s.includes('(l')) return `the enthalpy of vaporisation or combustion of ${s}, or its ΔfH°`;
    return `a combustion or formation enthalpy of ${s}`;
  });
  return `No known reaction reaches ${species.join(', ')}. A measurement that would close the cycle: ${words.join('; ')}.`;
}

/**
 * Derives ΔH of a target by Hess's law from the library's formation reactions and measured
 * reactions, a given list, or both; ranks routes, tests their agreement with the covariance of
 * shared inputs, and combines them.
 */
export async function deriveReactionEnthalpy(ctx: ServiceContext, input: DeriveInput): Promise<DeriveResult> {
  return (await runDerivation(ctx, input)).result;
}

/** A derivation with what saving it needs: the target's species, the combiner's answer, the inputs. */
export interface DerivationRun {
  result: DeriveResult;
  derivation: Derivation;
  targetTerms: { species: ReadSpecies; coefficient: Fraction }[];
  referenceKeys: ReadonlySet<string>;
  inputs: ReadonlyMap<string, InputInfo>;
  snapshot: LibrarySnapshot;
}

export async function runDerivation(ctx: ServiceContext, input: DeriveInput): Promise<DerivationRun> {
  const limits = defaultDeriveLimits;
  const snapshot = await snapshotFor(ctx.library, input.revision);
  const warnings: Warning[] = [];
  const team = input.teamId
    ? teamValuesAsReactions(await teamValues(ctx, input.teamId, snapshot, warnings), warnings)
    : null;
  const given = input.reactions ?? [];
  const using = input.using ?? (given.length > 0 ? 'both' : 'library');
  if (using === 'given' && given.length === 0)
    throw fieldError(['reactions'], 'Give at least one reaction with its ΔH to derive from.');
  const base = libraryNetworkOf(snapshot);
  const target = readSpeciesTerms(snapshot, input.target, ['target'], 'balance-first', warnings);

  const givenReactions: KnownReaction[] = [];
  const inputs = new Map<string, InputInfo>(using === 'given' ? [] : base.inputs);
  const extraSpecies = speciesInfo(target.terms);
  given.forEach((reaction, index) => {
    const field = `reactions.${index}`;
    const read = readSpeciesTerms(
      snapshot,
      reaction.equation,
      ['reactions', index, 'equation'],
      'as-written',
      warnings,
    );
    const stated = givenDeltaH(reaction);
    const uncertainty = stated.uncertainty;
    let value = stated.value;
    if (reaction.temperature) {
      const kelvin = temperatureOf(reaction.temperature, `${field}.temperature`);
      if (Math.abs(kelvin - 298.15) > 0.005) {
        value = toReferenceTemperature(snapshot, read.terms, value, kelvin, field);
        warnings.push({
          code: 'kirchhoff_correction',
          message: `${field} was given at ${Number(kelvin.toFixed(2))} K and brought to 298.15 K with the library's heat-capacity models (Kirchhoff); its uncertainty is kept as given.`,
        });
      }
    }
    const id = `given:${index}`;
    for (const [key, info] of speciesInfo(read.terms)) extraSpecies.set(key, info);
    givenReactions.push({
      id,
      kind: 'given',
      refIndex: index,
      equation: reaction.equation,
      terms: read.terms
        .filter((t) => !base.referenceKeys.has(t.species.key))
        .map((t) => ({ species: t.species.key, coefficient: t.coefficient })),
      deltaH: value,
      uncertainty,
      source: 'given with the request',
    });
    inputs.set(id, { id, label: `reaction ${index} (${reaction.equation})`, uncertainty });
    if (uncertainty === null)
      warnings.push({
        code: 'uncertainty_not_stated',
        message: `${field} has no stated uncertainty: routes through it have an incomplete uncertainty.`,
      });
  });

  let network: HessNetwork;
  const teamReactions = using === 'given' ? [] : (team?.reactions ?? []);
  if (team && using !== 'given') for (const [id, info] of team.inputs) inputs.set(id, info);
  if (using === 'given') network = buildHessNetwork(givenReactions, extraSpecies);
  else if (using === 'library' && teamReactions.length === 0) network = base.network;
  else network = extendHessNetwork(base.network, [...teamReactions, ...givenReactions], extraSpecies);
  if (using !== 'given' && base.excluded.length > 0)
    warnings.push({ code: 'reactions_excluded', message: excludedReactionsMessage(base.excluded) });

  // Elements in their reference states balance by construction and have ΔfH° = 0: left out.
  const targetTerms: SignedTerm[] = target.terms
    .filter((t) => !base.referenceKeys.has(t.species.key))
    .map((t) => ({ species: t.species.key, coefficient: t.coefficient }));
  if (targetTerms.length === 0)
    throw new ChemistryError(
      'unprocessable',
      'The target holds only elements in their reference states: its ΔH is 0 by convention.',
    );

  const maxRoutes = input.maxRoutes ?? 5;
  const started = Date.now();
  // The search runs in slices with a pause between them, so other requests are answered meanwhile.
  const derivation = await deriveEnthalpyAsync(
    network,
    targetTerms,
    inputs,
    {
      maxSteps: limits.maxSteps,
      maxRoutes,
      maxExamined: limits.maxExamined,
      enoughRoutes: limits.enoughRoutesPerRouteAsked * maxRoutes,
      outOfTime: () => Date.now() - started > limits.timeBudgetMs,
    },
    () => new Promise<void>((resolve) => setImmediate(resolve)),
  );
  const stopWarning = searchStopWarning(derivation.search, maxRoutes);
  if (stopWarning) warnings.push(stopWarning);
  if (derivation.search.rejectedMixedConventions > 0)
    warnings.push({
      code: 'mixed_conventions',
      message: `${derivation.search.rejectedMixedConventions} combination(s) were left out because they would mix the aqueous-ion and gaseous-ion conventions.`,
    });
  return {
    result: present(snapshot, target.equation, derivation, warnings),
    derivation,
    targetTerms: target.terms,
    referenceKeys: base.referenceKeys,
    inputs,
    snapshot,
  };
}

const energy = (value: number, uncertainty: number | null) => ({ value, uncertainty, unit: 'kJ/mol' as const });

function present(snapshot: LibrarySnapshot, target: string, derivation: Derivation, warnings: Warning[]): DeriveResult {
  const combination = derivation.combination;
  const complete = derivation.routes.filter((r) => r.missing.length === 0);
  const residualOf = new Map(complete.map((r, i) => [r, combination?.normalizedResiduals[i] ?? null]));
  const routes = derivation.routes.map((route, i) => ({
    steps: route.steps.map((step) => {
      const r = step.reaction;
      const u = r.uncertainty;
      const speciesKey = r.kind === 'formation' ? (r.terms[0]?.species ?? null) : null;
      return {
        equation: r.equation,
        multiplier: step.multiplier.toFraction(),
        deltaH: energy(step.deltaH.valueOf(), u === null ? null : Math.abs(step.multiplier.valueOf()) * u),
        ref:
          r.kind === 'given'
            ? { kind: 'given' as const, index: r.refIndex! }
            : {
                kind:
                  r.id.startsWith('derived:') || (r.kind === 'formation' && r.basis) ? ('derived' as const) : r.kind,
                id: r.refId!,
              },
        reactionDeltaH: energy(r.deltaH.valueOf(), u),
        source: r.source ?? null,
        species: speciesKey,
      };
    }),
    deltaH: energy(route.deltaH.valueOf(), route.uncertainty),
    agrees: derivation.agrees[i] ?? true,
    uncertaintyComplete: route.missing.length === 0,
    missing: route.missing,
    normalizedResidual: residualOf.get(route) ?? null,
  }));
  if (derivation.status === 'derived' && derivation.basis === 'best-route' && !derivation.consistent)
    warnings.push({
      code: 'routes_disagree',
      message: `The routes do not agree within their uncertainties (χ² = ${combination!.chiSquare.toFixed(2)} on ${combination!.degreesOfFreedom} degree(s) of freedom, p = ${combination!.pValue?.toPrecision(2)}): the headline is the best-ranked route's value, not a combination. Check the flagged routes.`,
    });
  if (derivation.missing.length > 0)
    warnings.push({
      code: 'uncertainty_incomplete',
      message: `No stated uncertainty for ${derivation.missing.join(', ')}: the uncertainty shown covers the other inputs only.`,
    });
  const result: DeriveResult = {
    status: derivation.status,
    target,
    deltaH: derivation.deltaH === null ? null : energy(derivation.deltaH, derivation.uncertainty),
    basis: derivation.basis,
    uncertaintyComplete: derivation.status === 'derived' && derivation.missing.length === 0,
    uncertaintyMissing: derivation.missing,
    routes,
    consistent: derivation.consistent,
    agreement: combination
      ? {
          chiSquare: combination.chiSquare,
          degreesOfFreedom: combination.degreesOfFreedom,
          pValue: combination.pValue,
        }
      : null,
    search: {
      examined: derivation.search.examined,
      found: derivation.search.found,
      stoppedBy: derivation.search.stoppedBy,
    },
    libraryRevision: snapshot.revision,
    warnings,
  };
  if (derivation.status === 'unreachable') {
    const unreachable = derivation.search.unreachable;
    result.unreachable = unreachable;
    result.suggestion = unreachable.length
      ? suggestionFor(unreachable)
      : derivation.search.stoppedBy
        ? 'The search stopped before finding a route: give more reactions or a narrower target.'
        : `No combination of at most ${defaultDeriveLimits.maxSteps} known reactions adds up to the target.`;
  }
  return result;
}
