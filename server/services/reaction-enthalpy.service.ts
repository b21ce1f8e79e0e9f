import { ChemistryError } from '@shared/chemistry/index';
import {
  batchScreening,
  BATCH_SCREENING_CAUTIONS,
  fuelHeatingValues,
  extentOfReaction,
  limitingReactant,
  prepareThermoModel,
  reactionHeat,
  reactionPropertiesAt,
  ReactionThermoDataError,
  ThermoInputError,
  toKelvin,
  validRange,
  type PreparedThermoModel,
  type QuantityInput,
  type ReactionThermoResult,
  type ReactionThermoTerm,
} from '@shared/chemistry/thermo/index';
import { resolveSpecies } from '@shared/library/resolve-species';
import type {
  ReactionEnthalpyInput,
  ReactionEnthalpyResult,
  ReactionHeatInput,
  ReactionHeatResult,
  TemperatureInput,
} from '@shared/schemas/reaction-enthalpy';
import { AppError } from '../errors';
import { sourceOf, sourceRef } from '../library/present';
import { readBalancedReaction, type ReactionTerm } from '../library/read-reaction';
import {
  hillKey,
  selectedModel,
  selectedValue,
  type LibrarySnapshot,
  type ModelEntry,
  type SpeciesEntry,
  type ValueEntry,
} from '../library/snapshot';
import type { TeamValue } from '../library/team-values';
import { teamValues } from './team-values.service';
import { snapshotFor } from './library.service';
import type { ServiceContext } from '../context';

/** A term of the reaction with the library entry it resolved to and the values used. */
interface ResolvedTerm extends ReactionTerm {
  species: SpeciesEntry;
  dfH: ValueEntry | null;
  s298: ValueEntry | null;
  model: ModelEntry | null;
}

const prepared = new WeakMap<ModelEntry, PreparedThermoModel>();

/** A model checked and built once per snapshot entry (evaluation then costs microseconds). */
export function preparedModel(species: SpeciesEntry, model: ModelEntry): PreparedThermoModel {
  let p = prepared.get(model);
  if (!p) {
    p = prepareThermoModel({ species: species.key, scale: model.scale, forms: model.forms });
    prepared.set(model, p);
  }
  return p;
}

const unitWords = { K: 'K', C: '°C', F: '°F' } as const;

/** Temperature in K from the request (298.15 K when none is given). */
export function temperatureOf(input: TemperatureInput | undefined, field = 'temperature'): number {
  if (!input) return 298.15;
  const path = ['body', ...field.split('.'), 'value'];
  try {
    return toKelvin(input.value, unitWords[input.unit]);
  } catch (error) {
    if (!(error instanceof ThermoInputError)) throw error;
    const message = `${input.value} ${unitWords[input.unit]} is not a temperature above absolute zero.`;
    throw new AppError('validation_failed', `${field}: ${message}`, { issues: [{ path, message }] });
  }
}

/** Resolves every term against the library; all problems are reported together (422). */
function resolveTerms(
  snapshot: LibrarySnapshot,
  terms: ReactionTerm[],
  team: readonly TeamValue[] = [],
): {
  resolved: ResolvedTerm[];
  warnings: ReactionEnthalpyResult['warnings'];
} {
  const warnings: ReactionEnthalpyResult['warnings'] = [];
  const problems: { term: number; species: string; reason: string; message: string; candidates: string[] }[] = [];
  const resolved: ResolvedTerm[] = [];
  for (const term of terms) {
    const entries = snapshot.speciesByHill.get(hillKey(term.hill, term.charge)) ?? [];
    const r = resolveSpecies(term, entries);
    // A team's derived value stands in for a species the library lacks or has no ΔfH° for.
    const teamValue =
      !r.ok || !selectedValue(snapshot, r.entry.id, 'dfH298')
        ? matchTeamValue(term, team, r.ok ? r.entry : null)
        : null;
    if (teamValue) {
      warnings.push({
        code: 'team_derived_value',
        message: `${teamValue.key}: the team's derived ΔfH° (${teamValue.deltaHText} kJ/mol, derived by Hess's law) is used.`,
        term: term.index,
      });
      resolved.push(teamTerm(snapshot, term, teamValue));
      continue;
    }
    if (!r.ok) {
      problems.push({
        term: term.index,
        species: term.formula,
        reason: r.reason,
        message: r.message,
        candidates: r.candidates.map((c) => c.key),
      });
      continue;
    }
    if (r.warning) warnings.push({ code: 'species_resolved', message: r.warning, term: term.index });
    resolved.push({
      ...term,
      species: r.entry,
      dfH: selectedValue(snapshot, r.entry.id, 'dfH298'),
      s298: selectedValue(snapshot, r.entry.id, 'S298'),
      model: selectedModel(snapshot, r.entry.id),
    });
  }
  if (problems.length > 0) {
    throw new ChemistryError(
      'unprocessable',
      problems.length === 1
        ? problems[0]!.message
        : `${problems.length} species cannot be matched to the library: ${problems.map((p) => p.message).join(' ')}`,
      { species: problems, libraryRevision: snapshot.revision },
    );
  }
  return { resolved, warnings };
}

/** The team value a written species means: same Hill formula, charge and phase (and descriptor). */
function matchTeamValue(term: ReactionTerm, team: readonly TeamValue[], entry: SpeciesEntry | null): TeamValue | null {
  if (entry) return team.find((v) => v.key === entry.key) ?? null;
  const phase = term.phase === 's' ? 'cr' : term.phase;
  const matches = team.filter(
    (v) =>
      v.hill === term.hill &&
      v.charge === term.charge &&
      (phase === null || v.phase === phase) &&
      (term.descriptor === null || v.descriptor === term.descriptor),
  );
  return matches.length === 1 ? matches[0]! : null;
}

/** Source id that marks a team's derived value (not a library source). */
const teamSourceId = (valueId: string) => `team:${valueId}`;

/** A resolved term for a team value: a species entry and a derived ΔfH° of its own. */
function teamTerm(snapshot: LibrarySnapshot, term: ReactionTerm, v: TeamValue): ResolvedTerm {
  const library = snapshot.speciesByKey.get(v.key);
  const species: SpeciesEntry = library ?? {
    id: v.id,
    key: v.key,
    formula: v.formula,
    hill: v.hill,
    charge: v.charge,
    phase: v.phase as SpeciesEntry['phase'],
    descriptor: v.descriptor,
    name: `${v.key} (team's derived value)`,
    synonyms: [],
    cas: null,
    inchi: null,
    inchikey: null,
    referenceState: null,
    molarMass: v.molarMass,
    note: null,
    validFrom: snapshot.revision,
  };
  return {
    ...term,
    species,
    dfH: {
      id: v.id,
      speciesId: species.id,
      property: 'dfH298',
      value: v.deltaH,
      valueText: v.deltaHText,
      uncertaintyKind: v.uncertainty === null ? 'none' : 'standard',
      uncertaintyStated: v.uncertainty,
      coverageK: null,
      standardUncertainty: v.uncertainty,
      uncertaintyRule: "derived by Hess's law in Thermoledger: the route's standard uncertainty",
      sourceId: teamSourceId(v.id),
      tableRef: null,
      entryNote: null,
      provenance: 'derived',
      provenanceNote: "the team's derived value",
      pressureBar: 1,
      ionConvention: null,
      derivation: null,
      validFrom: snapshot.revision,
    },
    s298: library ? selectedValue(snapshot, library.id, 'S298') : null,
    model: library ? selectedModel(snapshot, library.id) : null,
  };
}

/** The source a value cites: a library source, or the team's derived value. */
function sourceRefFor(snapshot: LibrarySnapshot, sourceId: string) {
  if (sourceId.startsWith('team:'))
    return {
      id: sourceId.slice(5),
      key: 'team-derived',
      citation: "The team's derived value (Hess's law, Thermoledger)",
    };
  return sourceRef(sourceOf(snapshot, sourceId));
}

function thermoTerms(resolved: ResolvedTerm[]): ReactionThermoTerm[] {
  return resolved.map((t) => ({
    coefficient: t.side === 'reactant' ? t.coefficient.neg() : t.coefficient,
    species: t.species.key,
    phase: t.species.phase,
    formationEnthalpy: t.dfH ? { value: t.dfH.value, standardUncertainty: t.dfH.standardUncertainty } : null,
    entropy: t.s298?.value ?? null,
    model: t.model ? preparedModel(t.species, t.model) : null,
  }));
}

/**
 * Adds to a thermo-data error what the library holds for each formula at T, so the message says
 * which phase to use instead ("H2O(l) ends at 500 K; at 600 K the library has H2O(g)").
 */
function explainRange(snapshot: LibrarySnapshot, resolved: ResolvedTerm[], error: ReactionThermoDataError): never {
  const t = error.temperature;
  const hints: string[] = [];
  const alternatives: Record<string, string[]> = {};
  for (const problem of error.problems) {
    const term = resolved.find((r) => r.species.key === problem.species);
    if (!term) continue;
    const others = (snapshot.speciesByHill.get(hillKey(term.species.hill, term.species.charge)) ?? []).filter((s) => {
      if (s.id === term.species.id) return false;
      const model = selectedModel(snapshot, s.id);
      if (!model) return false;
      const range = validRange({ species: s.key, scale: model.scale, forms: model.forms });
      return t >= range.min && t <= range.max;
    });
    alternatives[problem.species] = others.map((s) => s.key);
    hints.push(
      others.length > 0
        ? `At ${Number(t.toFixed(2))} K the library holds ${term.species.formula} as ${others.map((s) => s.key).join(', ')}; a change of phase is never made silently — write the phase you mean.`
        : `The library holds no form of ${term.species.formula} with a model at ${Number(t.toFixed(2))} K.`,
    );
  }
  const terms = error.problems.flatMap((p) =>
    resolved
      .filter((r) => r.species.key === p.species)
      .map((r) => ({ term: r.index, species: p.species, kind: p.kind })),
  );
  throw new ChemistryError('unprocessable', `${error.message} ${hints.join(' ')}`.trim(), {
    ...error.details,
    terms,
    alternatives,
    libraryRevision: snapshot.revision,
  });
}

function evaluate(snapshot: LibrarySnapshot, resolved: ResolvedTerm[], temperature: number, constantCp: boolean) {
  try {
    return reactionPropertiesAt(thermoTerms(resolved), {
      temperature,
      method: constantCp ? 'constant-cp' : 'integrated',
    });
  } catch (error) {
    if (error instanceof ReactionThermoDataError) explainRange(snapshot, resolved, error);
    throw error;
  }
}

function energy(value: number, uncertainty: number | null) {
  return { value, uncertainty, unit: 'kJ/mol' as const };
}

/** The library evaluation of a balanced equation, as the API returns it. */
function present(
  snapshot: LibrarySnapshot,
  equation: string,
  resolved: ResolvedTerm[],
  result: ReactionThermoResult,
  warnings: ReactionEnthalpyResult['warnings'],
): Omit<ReactionEnthalpyResult, 'heatingValues' | 'curve'> {
  const u = result.uncertainty.standardUncertainty;
  const byKey = new Map(resolved.map((t) => [t.species.key, t]));
  const contributionOf = new Map(result.uncertainty.contributions.map((c) => [c.species, c]));
  const sources = new Map<string, ReturnType<typeof sourceRef>>();
  for (const t of resolved) {
    for (const item of [t.dfH, t.s298, t.model]) {
      if (item) {
        const source = sourceRefFor(snapshot, item.sourceId);
        sources.set(source.id, source);
      }
    }
  }
  const missingKeys = new Set(result.uncertaintyMissing);
  for (const key of missingKeys) {
    warnings.push({
      code: 'uncertainty_incomplete',
      message: `${key}: its ${byKey.get(key)?.dfH ? 'ΔfH° has no stated uncertainty' : 'enthalpy comes from its heat-capacity model alone, with no stated uncertainty'}, so the uncertainty shown covers the other species only.`,
    });
  }
  if (result.estimate)
    warnings.push({
      code: 'constant_cp_estimate',
      message:
        'Constant-Cp estimate (Cp at 298.15 K held constant, phase changes ignored), as asked: it can be several kJ/mol off at high temperature.',
    });
  for (const note of result.notes) {
    // The incomplete uncertainty is said once, above, with the species named.
    if (missingKeys.size > 0 && /uncertaint/i.test(note) && [...missingKeys].some((k) => note.includes(k))) continue;
    warnings.push({ code: 'note', message: note });
  }
  const transitions = result.species.flatMap((s) =>
    (s.crossings ?? []).map((c) => {
      const term = byKey.get(s.species)!;
      return c.kind === 'transition'
        ? {
            speciesId: term.species.id,
            key: s.species,
            kind: c.kind,
            from: c.from.form,
            to: c.to.form,
            temperature: c.temperature,
            enthalpy: c.enthalpy,
          }
        : {
            speciesId: term.species.id,
            key: s.species,
            kind: c.kind,
            from: c.form.form,
            to: c.form.form,
            temperature: c.temperature,
            enthalpy: c.enthalpyJump,
          };
    }),
  );
  const hasEntropy = result.entropy !== null;
  return {
    equation,
    deltaH: energy(result.enthalpy, u),
    deltaU: energy(result.internalEnergy, u),
    temperature: { value: result.temperature, unit: 'K' },
    deltaH298: result.referenceEnthalpy === null ? null : energy(result.referenceEnthalpy, u),
    terms: resolved.map((t) => ({
      formula: t.formula,
      phase: t.species.phase,
      descriptor: t.species.descriptor,
      coefficient: t.coefficient.toFraction(),
      side: t.side,
      speciesId: t.species.id,
      key: t.species.key,
      name: t.species.name,
      deltaFH: t.dfH ? { value: t.dfH.value, uncertainty: t.dfH.standardUncertainty } : null,
      source: t.dfH ? sourceRefFor(snapshot, t.dfH.sourceId) : null,
      provenance: t.dfH?.provenance ?? null,
      molarMass: t.species.molarMass,
      modelRange: t.model ? ([t.model.tMin, t.model.tMax] as [number, number]) : null,
    })),
    contributions: result.species.map((s) => {
      const c = contributionOf.get(s.species);
      return {
        speciesId: byKey.get(s.species)!.species.id,
        key: s.species,
        coefficient: s.coefficient.toFraction(),
        contribution: s.coefficient.valueOf() * s.enthalpy,
        uncertainty: c ? Math.abs(c.contribution) : null,
        varianceShare: c ? c.varianceShare : null,
      };
    }),
    uncertaintyComplete: result.uncertaintyComplete,
    uncertaintyMissing: result.uncertaintyMissing,
    uncertaintyMethod: result.uncertainty.method,
    deltaS: hasEntropy ? { value: result.entropy!, unit: 'J/(mol K)' } : null,
    deltaG: result.gibbsEnergy === null ? null : energy(result.gibbsEnergy, null),
    K: result.equilibriumConstant,
    deltaNGas: result.gasAmountChange.toFraction(),
    transitions,
    constantCpEstimate: result.estimate,
    libraryRevision: snapshot.revision,
    sources: [...sources.values()],
    warnings,
  };
}

/**
 * ΔrH° at 298.15 K of an equation on a given snapshot, with the species keys it resolved to: the
 * impact of an amendment compares the current library with the one it would make.
 * @throws the same errors as evaluateReactionEnthalpy (unreadable, unbalanced, unknown species).
 */
export function enthalpyOnSnapshot(
  snapshot: LibrarySnapshot,
  equation: string,
): { equation: string; deltaH: number; uncertainty: number; species: string[] } {
  const reaction = readBalancedReaction(equation);
  const { resolved } = resolveTerms(snapshot, reaction.terms);
  const result = evaluate(snapshot, resolved, 298.15, false);
  return {
    equation: reaction.equation,
    deltaH: result.enthalpy,
    uncertainty: result.uncertainty.standardUncertainty,
    species: resolved.map((t) => t.species.key),
  };
}

/**
 * ΔrH° of an equation from the library at 298.15 K or at T (Kirchhoff), with ΔrU°, and ΔrS°,
 * ΔrG° and K where every species has S°. Per mole of reaction as written in the returned equation.
 */
export async function evaluateReactionEnthalpy(
  ctx: ServiceContext,
  input: ReactionEnthalpyInput,
): Promise<ReactionEnthalpyResult> {
  const snapshot = await snapshotFor(ctx.library, input.revision);
  const reaction = readBalancedReaction(input.equation);
  const temperature = temperatureOf(input.temperature);
  const teamWarnings: ReactionEnthalpyResult['warnings'] = [];
  const team = input.teamId ? await teamValues(ctx, input.teamId, snapshot, teamWarnings) : [];
  const resolution = resolveTerms(snapshot, reaction.terms, team);
  const resolved = resolution.resolved;
  const warnings = [...teamWarnings, ...resolution.warnings];
  const constantCp = input.constantCpEstimate ?? false;
  const result = evaluate(snapshot, resolved, temperature, constantCp);
  const reply = present(snapshot, reaction.equation, resolved, result, [...reaction.warnings, ...warnings]);
  const reference = temperature === 298.15 || constantCp ? result : evaluate(snapshot, resolved, 298.15, false);
  return {
    ...reply,
    heatingValues: heatingValuesOf(snapshot, resolved, reference),
    curve: input.curve ? curveOf(resolved, input.curve, constantCp) : null,
  };
}

/** ΔrH°(T) over a range for a plot; temperatures where some model does not reach are gaps. */
function curveOf(
  resolved: ResolvedTerm[],
  curve: NonNullable<ReactionEnthalpyInput['curve']>,
  constantCp: boolean,
): NonNullable<ReactionEnthalpyResult['curve']> {
  const terms = thermoTerms(resolved);
  const points: { temperature: number; deltaH: number }[] = [];
  const gaps: { temperature: number; reason: string }[] = [];
  for (let i = 0; i < curve.points; i++) {
    const t = curve.from + ((curve.to - curve.from) * i) / (curve.points - 1);
    try {
      const r = reactionPropertiesAt(terms, { temperature: t, method: constantCp ? 'constant-cp' : 'integrated' });
      points.push({ temperature: t, deltaH: r.enthalpy });
    } catch (error) {
      if (!(error instanceof ReactionThermoDataError)) throw error;
      gaps.push({ temperature: t, reason: error.message });
    }
  }
  return { points, gaps };
}

/**
 * Higher and lower heating values when the reaction is a combustion: one fuel and O2 as the
 * reactants, water among the products; both water values must be in the library.
 */
function heatingValuesOf(
  snapshot: LibrarySnapshot,
  resolved: ResolvedTerm[],
  reference: ReactionThermoResult,
): ReactionEnthalpyResult['heatingValues'] {
  const reactants = resolved.filter((t) => t.side === 'reactant');
  const oxygen = reactants.filter((t) => t.species.key === 'O2(g)');
  const fuels = reactants.filter((t) => t.species.key !== 'O2(g)');
  const water = resolved.filter((t) => t.side === 'product' && t.species.hill === 'H2O' && t.species.charge === 0);
  if (oxygen.length === 0 || fuels.length !== 1 || water.length !== 1) return null;
  if (reference.referenceEnthalpy === null || !(reference.referenceEnthalpy < 0)) return null;
  const fuel = fuels[0]!;
  const waterEntries = snapshot.speciesByHill.get(hillKey('H2O', 0)) ?? [];
  const liquid = waterEntries.find((s) => s.phase === 'l');
  const gas = waterEntries.find((s) => s.phase === 'g');
  const hl = liquid && selectedValue(snapshot, liquid.id, 'dfH298');
  const hg = gas && selectedValue(snapshot, gas.id, 'dfH298');
  const waterPhase = water[0]!.species.phase;
  if (!hl || !hg || (waterPhase !== 'l' && waterPhase !== 'g')) return null;
  const values = fuelHeatingValues({
    combustionEnthalpy: reference.referenceEnthalpy,
    waterPhase,
    fuelCoefficient: fuel.coefficient,
    waterCoefficient: water[0]!.coefficient,
    fuelMolarMass: fuel.species.molarMass,
    waterVaporizationEnthalpy: hg.value - hl.value,
    standardUncertainty: reference.uncertaintyComplete ? reference.uncertainty.standardUncertainty : null,
  });
  const present = (v: typeof values.higher) => ({
    label: v.label,
    perMole: v.perMole,
    perKilogram: v.perKilogram,
    uncertaintyPerMole: v.standardUncertaintyPerMole,
  });
  return { fuel: fuel.species.key, higher: present(values.higher), lower: present(values.lower) };
}

const pressureUnit = { Pa: 'Pa', kPa: 'kPa', bar: 'bar', atm: 'atm' } as const;

/** The quantity of one term as the thermo core reads it. */
function quantityOf(amount: ReactionHeatInput['amounts'][number], term: ResolvedTerm, index: number): QuantityInput {
  if (amount.unit === 'mol') return { kind: 'amount', value: amount.value, unit: 'mol' };
  if (amount.unit === 'L') {
    if (term.species.phase !== 'g') {
      throw new AppError(
        'validation_failed',
        `amounts.${index}: a volume is read as an ideal gas, but ${term.species.key} is not a gas.`,
        {
          issues: [
            { path: ['body', 'amounts', index, 'unit'], message: 'Give the mass or amount of a condensed species.' },
          ],
        },
      );
    }
    return {
      kind: 'gas-volume',
      value: amount.value,
      unit: 'L',
      temperature: temperatureOf(amount.temperature, `amounts.${index}.temperature`),
      pressure: amount.pressure!.value,
      pressureUnit: pressureUnit[amount.pressure!.unit],
    };
  }
  return { kind: 'mass', value: amount.value, unit: amount.unit, molarMass: term.species.molarMass };
}

/**
 * Heat for real quantities: extent of reaction from the amounts given (the smallest n/|ν| among
 * reactants limits), heat ξ·ΔrH with its sign, what is left of the other reactants, and — with a
 * batch mass and heat capacity — a screening estimate of the adiabatic temperature rise with the
 * usual cautions.
 */
export async function evaluateReactionHeat(ctx: ServiceContext, input: ReactionHeatInput): Promise<ReactionHeatResult> {
  const snapshot = await snapshotFor(ctx.library, input.revision);
  const reaction = readBalancedReaction(input.equation);
  const temperature = temperatureOf(input.temperature);
  const teamWarnings: ReactionEnthalpyResult['warnings'] = [];
  const team = input.teamId ? await teamValues(ctx, input.teamId, snapshot, teamWarnings) : [];
  const resolution = resolveTerms(snapshot, reaction.terms, team);
  const resolved = resolution.resolved;
  const warnings = [...teamWarnings, ...resolution.warnings];
  const fieldError = (path: (string | number)[], message: string) =>
    new AppError('validation_failed', `${path.join('.')}: ${message}`, {
      issues: [{ path: ['body', ...path], message }],
    });
  const seen = new Set<number>();
  const given = input.amounts.map((amount, i) => {
    const term = resolved[amount.term];
    if (!term)
      throw fieldError(
        ['amounts', i, 'term'],
        `There is no term ${amount.term}: the equation has terms 0 to ${resolved.length - 1}.`,
      );
    if (seen.has(amount.term)) throw fieldError(['amounts', i, 'term'], `Term ${amount.term} is given twice.`);
    seen.add(amount.term);
    const extent = extentOfReaction(term.coefficient, quantityOf(amount, term, i));
    return { term, extent };
  });
  const reactants = given.filter((g) => g.term.side === 'reactant');
  let extent: number;
  let limitingTerm: number;
  let excess: ReactionHeatResult['excess'] = [];
  if (reactants.length > 0) {
    const limiting = limitingReactant(
      reactants.map((g) => ({
        species: String(g.term.index),
        coefficient: g.term.coefficient,
        amount: g.extent.amount,
      })),
    );
    extent = limiting.extent;
    limitingTerm = Number(limiting.limiting[0]);
    excess = limiting.reactants
      .filter((r) => !r.limiting)
      .map((r) => {
        const term = resolved[Number(r.species)]!;
        return {
          term: term.index,
          key: term.species.key,
          left: { value: r.remaining, unit: 'mol' as const },
          leftMass: { value: r.remaining * term.species.molarMass, unit: 'g' as const },
        };
      });
    if (given.length > reactants.length)
      warnings.push({
        code: 'product_amount_ignored',
        message: 'Amounts of products are not used when reactant amounts are given: the reactants set the extent.',
      });
  } else {
    // Only products given: the extent that forms that much (the smallest, if several disagree).
    const smallest = given.reduce((a, b) => (b.extent.extent < a.extent.extent ? b : a));
    extent = smallest.extent.extent;
    limitingTerm = smallest.term.index;
  }
  const result = evaluate(snapshot, resolved, temperature, input.constantCpEstimate ?? false);
  const heat = reactionHeat(extent, result.enthalpy, result.uncertainty.standardUncertainty);
  let adiabaticRise: ReactionHeatResult['adiabaticRise'] = null;
  if (input.batch) {
    const screening = batchScreening({
      heat: heat.heat,
      batchMass: input.batch.mass,
      specificHeatCapacity: input.batch.cp.value,
    });
    adiabaticRise = { value: screening.adiabaticTemperatureRise, unit: 'K' };
  }
  return {
    equation: reaction.equation,
    deltaH: energy(result.enthalpy, result.uncertainty.standardUncertainty),
    temperature: { value: temperature, unit: 'K' },
    extent: { value: extent, unit: 'mol' },
    limitingTerm,
    excess,
    heat: { value: heat.heat, uncertainty: heat.standardUncertainty, unit: 'kJ' },
    direction: heat.direction,
    adiabaticRise,
    cautions: [...BATCH_SCREENING_CAUTIONS],
    uncertaintyComplete: result.uncertaintyComplete,
    uncertaintyMissing: result.uncertaintyMissing,
    libraryRevision: snapshot.revision,
    warnings: [...reaction.warnings, ...warnings],
  };
}
