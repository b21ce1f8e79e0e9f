import Fraction from 'fraction.js';
import { GAS_CONSTANT, REFERENCE_TEMPERATURE } from './constants';
import { ReactionThermoDataError, ThermoInputError, ThermoModelError, type ReactionDataProblem } from './errors';
import {
  absoluteEnthalpy,
  absoluteEntropy,
  assertTemperature,
  crossingsBetween,
  enthalpyIncrement,
  entropyChange,
  heatCapacity,
  isPreparedThermoModel,
  prepareThermoModel,
  type PreparedThermoModel,
  type ThermoCrossing,
  type ThermoModelInput,
} from './species-model';

/** ΔfH°(298.15 K) of a species in kJ/mol with its standard uncertainty u (kJ/mol), null when the source states none. */
export interface FormationEnthalpyInput {
  value: number;
  standardUncertainty: number | null;
}

/**
 * One term of a reaction for the temperature correction. Standard state p° = 1 bar; the
 * reference temperature is 298.15 K.
 */
export interface ReactionThermoTerm {
  /** Exact stoichiometric coefficient, signed: < 0 for a reactant, > 0 for a product. */
  coefficient: Fraction;
  /** Species label (the library's species key, e.g. `H2O(g)`), used in results and messages. */
  species: string;
  /** Phase label (`g`, `l`, `cr`, `aq`…); `g` counts towards Δn(gas). */
  phase: string | null;
  /** ΔfH°(298.15 K), or null when the library has none. */
  formationEnthalpy: FormationEnthalpyInput | null;
  /** S°(298.15 K) in J/(mol K), or null. */
  entropy: number | null;
  /** Heat-capacity model, or null. */
  model: ThermoModelInput | null;
}

/** How ΔrH°(T) is obtained: by integrating each species' model (default), or the constant-Cp estimate. */
export type KirchhoffMethod = 'integrated' | 'constant-cp';

/** What to compute: the temperature and, optionally, the method. */
export interface ReactionThermoOptions {
  /** T in K, finite and above 0 K. */
  temperature: number;
  /**
   * `constant-cp` only on request: Cp°(298.15 K) of each species held constant from 298.15 K to
   * T, transitions ignored; the result is flagged `estimate: true`.
   */
  method?: KirchhoffMethod;
}

/**
 * Where a species' H°(T) came from: `value` (ΔfH°(298.15 K) at 298.15 K), `value+increment`
 * (ΔfH° plus H(T) − H(298.15 K) from the model), `model-absolute` (H°(T) of a formation-scale
 * model, for a species without a 298.15 K value or whose model does not reach 298.15 K),
 * `value+constant-cp` (ΔfH° + Cp°(298.15 K)·(T − 298.15 K)).
 */
export type EnthalpyBasis = 'value' | 'value+increment' | 'model-absolute' | 'value+constant-cp';

/** Where a species' S°(T) came from; the same words as `EnthalpyBasis`, `value+model` for S° + [S(T) − S(298.15 K)]. */
export type EntropyBasis =
  'value' | 'value+model' | 'model-absolute' | 'value+constant-cp' | 'model-absolute+constant-cp';

/** One species of the reaction after merging its terms. */
export interface SpeciesAtTemperature {
  species: string;
  phase: string | null;
  /** Net coefficient (signed, exact) after merging terms of the same species. */
  coefficient: Fraction;
  enthalpyBasis: EnthalpyBasis;
  /** H°(T) of the species on the formation scale (elements in reference states at 298.15 K = 0), kJ/mol. */
  enthalpy: number;
  /** H°(T) − H°(298.15 K) in kJ/mol, transitions included; null on the `model-absolute` basis. */
  increment: number | null;
  /** S°(T) in J/(mol K), or null when there is none. */
  entropy: number | null;
  entropyBasis: EntropyBasis | null;
  /** Cp°(298.15 K) in J/(mol K) used by the constant-Cp estimate; null otherwise. */
  heatCapacity298: number | null;
  /**
   * Transitions and discontinuous joints between 298.15 K and T (heating-direction enthalpies).
   * In a constant-Cp estimate they are listed but not included; null when the model does not
   * reach T there, and [] on the `model-absolute` basis.
   */
  crossings: ThermoCrossing[] | null;
}

/** One species' share of the uncertainty of ΔrH°. */
export interface UncertaintyContribution {
  species: string;
  phase: string | null;
  /** Net coefficient ν. */
  coefficient: Fraction;
  /** Standard uncertainty u of ΔfH°(298.15 K), kJ/mol. */
  standardUncertainty: number;
  /** ν·u in kJ/mol. */
  contribution: number;
  /** (ν·u)² / Σ(ν·u)², 0…1 (0 when the total is 0). */
  varianceShare: number;
}

/** Standard uncertainty of ΔrH°, root-sum-square over species taken as independent. */
export interface ReactionUncertainty {
  /** u(ΔrH°) in kJ/mol from the stated uncertainties (partial when `uncertaintyComplete` is false). */
  standardUncertainty: number;
  /** How it was combined, in words, for display beside the figure. */
  method: string;
  contributions: UncertaintyContribution[];
}

/** ΔrH°, ΔrU°, ΔrS°, ΔrG° and K at one temperature, per mole of reaction as written. */
export interface ReactionThermoResult {
  /** K */
  temperature: number;
  method: KirchhoffMethod;
  /** True for the constant-Cp estimate. */
  estimate: boolean;
  /** ΔrH°(T) in kJ/mol; < 0 exothermic. */
  enthalpy: number;
  /** ΔrH°(298.15 K) = Σ ν ΔfH° in kJ/mol when every species has ΔfH°(298.15 K), else null. */
  referenceEnthalpy: number | null;
  /** ΔrU°(T) = ΔrH°(T) − Δn(gas)·R·T, kJ/mol (ideal gases, condensed volumes neglected). */
  internalEnergy: number;
  /** Δn(gas) = Σ ν over gaseous species, exact. */
  gasAmountChange: Fraction;
  /** ΔrS°(T) in J/(mol K), null when a species has no S°. */
  entropy: number | null;
  /** ΔrG°(T) = ΔrH°(T) − T·ΔrS°(T) in kJ/mol, or null. */
  gibbsEnergy: number | null;
  /** ln K = −ΔrG°/(RT), or null. */
  lnK: number | null;
  log10K: number | null;
  /** K = exp(−ΔrG°/(RT)) (standard state p° = 1 bar), null when not representable as a number (use log10K) or without ΔrG°. */
  equilibriumConstant: number | null;
  /** Species without S° (so no ΔrS°, ΔrG°, K). */
  entropyMissing: string[];
  uncertainty: ReactionUncertainty;
  /** False when a species' ΔfH° has no stated uncertainty, or its H° comes from a model alone. */
  uncertaintyComplete: boolean;
  /** The species whose uncertainty is unknown (never counted as zero). */
  uncertaintyMissing: string[];
  species: SpeciesAtTemperature[];
  /** Species whose terms cancel (net coefficient 0); they take no part. */
  cancelled: string[];
  /** Remarks for display (estimate, bases used, K not representable…). */
  notes: string[];
}

/** Uncertainty method as shown with the result. */
export const RSS_METHOD_TEXT =
  'root-sum-square of ν·u over species taken as independent (GUM, JCGM 100:2008, 5.1); correlations between values that share auxiliary data are not included, and heat-capacity models carry no stated uncertainty';

const REFERENCE_EPSILON = 1e-9;
const ZERO = new Fraction(0);

interface MergedTerm {
  species: string;
  phase: string | null;
  coefficient: Fraction;
  /** The coefficient as a number, converted once (fraction.js arithmetic is slow on BigInt). */
  nu: number;
  formationEnthalpy: FormationEnthalpyInput | null;
  entropy: number | null;
  model: PreparedThermoModel | null;
  firstIndex: number;
}

function checkTerm(term: ReactionThermoTerm, i: number): void {
  const path = (...rest: (string | number)[]) => ['terms', i, ...rest];
  if (!(term.coefficient instanceof Fraction))
    throw new ThermoInputError(`terms.${i}.coefficient must be an exact fraction`, path('coefficient'));
  if (term.coefficient.n === 0n)
    throw new ThermoInputError(`terms.${i}.coefficient must not be zero`, path('coefficient'));
  if (typeof term.species !== 'string' || term.species.trim() === '')
    throw new ThermoInputError(`terms.${i}.species must name the species`, path('species'));
  const h = term.formationEnthalpy;
  if (h !== null) {
    if (typeof h.value !== 'number' || !Number.isFinite(h.value))
      throw new ThermoInputError(
        `${term.species}: ΔfH°(298.15 K) must be a finite value in kJ/mol`,
        path('formationEnthalpy', 'value'),
      );
    if (h.standardUncertainty !== null && (!Number.isFinite(h.standardUncertainty) || h.standardUncertainty < 0))
      throw new ThermoInputError(
        `${term.species}: the standard uncertainty must be a finite value ≥ 0 kJ/mol, or null`,
        path('formationEnthalpy', 'standardUncertainty'),
      );
  }
  if (term.entropy !== null && (typeof term.entropy !== 'number' || !Number.isFinite(term.entropy)))
    throw new ThermoInputError(
      `${term.species}: S°(298.15 K) must be a finite value in J/(mol K), or null`,
      path('entropy'),
    );
}

function prepareTermModel(term: ReactionThermoTerm, i: number): PreparedThermoModel | null {
  if (term.model === null) return null;
  try {
    return prepareThermoModel(term.model);
  } catch (err) {
    if (err instanceof ThermoModelError)
      throw new ThermoModelError(
        err.species,
        err.issues.map((issue) => ({ ...issue, path: ['terms', i, 'model', ...issue.path] })),
      );
    throw err;
  }
}

function sameEnthalpy(a: FormationEnthalpyInput | null, b: FormationEnthalpyInput | null): boolean {
  return (
    a === b || (a !== null && b !== null && a.value === b.value && a.standardUncertainty === b.standardUncertainty)
  );
}

function sameModel(a: ThermoModelInput | null, b: ThermoModelInput | null): boolean {
  // The same library entry usually arrives as one object; copies of it compare by content.
  if (a === b) return true;
  if (a === null || b === null || isPreparedThermoModel(a) || isPreparedThermoModel(b)) return false;
  return JSON.stringify(a) === JSON.stringify(b);
}

/** Merges terms of the same species and phase, so each species is counted once with its net coefficient. */
function mergeTerms(terms: readonly ReactionThermoTerm[]): MergedTerm[] {
  const byKey = new Map<string, MergedTerm>();
  const models = new Map<string, ThermoModelInput | null>();
  terms.forEach((term, i) => {
    checkTerm(term, i);
    const key = `${term.species}\u0000${term.phase ?? ''}`;
    const seen = byKey.get(key);
    if (!seen) {
      byKey.set(key, {
        species: term.species,
        phase: term.phase,
        coefficient: term.coefficient,
        nu: 0,
        formationEnthalpy: term.formationEnthalpy,
        entropy: term.entropy,
        model: prepareTermModel(term, i),
        firstIndex: i,
      });
      models.set(key, term.model);
      return;
    }
    const conflict =
      !sameEnthalpy(seen.formationEnthalpy, term.formationEnthalpy) ||
      seen.entropy !== term.entropy ||
      !sameModel(models.get(key) ?? null, term.model);
    if (conflict)
      throw new ThermoInputError(
        `${term.species} appears in terms ${seen.firstIndex} and ${i} with different data; give each species one ΔfH°, S° and model`,
        ['terms', i],
      );
    seen.coefficient = seen.coefficient.add(term.coefficient);
  });
  const merged = [...byKey.values()];
  for (const m of merged) m.nu = m.coefficient.valueOf();
  return merged;
}

const covers = (p: PreparedThermoModel, t: number) => t >= p.range.min && t <= p.range.max;

/**
 * Standard reaction enthalpy at temperature T by Kirchhoff's law, with ΔrU°, ΔrS°, ΔrG° and K,
 * per mole of reaction as written (ΔrH° < 0: exothermic; p° = 1 bar; elements in their reference
 * states have H°(298.15 K) = 0).
 *
 * ΔrH°(T) = Σ ν [ΔfH°(298.15 K) + H(T) − H(298.15 K)], each increment including the
 * transitions its species crosses; a species without a 298.15 K value but with a formation-scale
 * model valid at T enters as ν·H°(T) of that model. Terms of the same species and phase are
 * merged first. ΔrU° = ΔrH° − Δn(gas)·R·T; ΔrG° = ΔrH° − T·ΔrS°; K = exp(−ΔrG°/RT) when every
 * species has S°. The uncertainty is the root-sum-square of ν·u (species independent); values
 * without a stated uncertainty make `uncertaintyComplete` false and are named.
 *
 * @throws ThermoInputError for bad input (field path given); ThermoModelError for an invalid
 * model; ReactionThermoDataError naming every species whose model does not cover T (with its
 * range), that has no model, or that has no enthalpy at all.
 */
export function reactionPropertiesAt(
  terms: readonly ReactionThermoTerm[],
  options: ReactionThermoOptions,
): ReactionThermoResult {
  if (typeof options !== 'object' || options === null)
    throw new ThermoInputError('options with a temperature in K are required', ['temperature']);
  const t = options.temperature;
  assertTemperature(t, ['temperature']);
  const method: KirchhoffMethod = options.method ?? 'integrated';
  if (method !== 'integrated' && method !== 'constant-cp')
    throw new ThermoInputError(`unknown method '${String(method)}'`, ['method']);
  if (!Array.isArray(terms) || terms.length === 0)
    throw new ThermoInputError('a reaction needs at least one term', ['terms']);

  const merged = mergeTerms(terms);
  const active = merged.filter((m) => m.coefficient.n !== 0n);
  const cancelled = merged.filter((m) => m.coefficient.n === 0n).map((m) => m.species);
  const atReference = Math.abs(t - REFERENCE_TEMPERATURE) < REFERENCE_EPSILON;
  const notes: string[] = [];

  const problems: ReactionDataProblem[] = [];
  const evaluated: [MergedTerm, SpeciesAtTemperature][] = [];
  for (const m of active) {
    const s = atReference
      ? atReferenceTemperature(m, problems)
      : method === 'integrated'
        ? integrated(m, t, problems, notes)
        : constantCp(m, t, problems);
    if (s) evaluated.push([m, s]);
  }
  if (problems.length > 0) throw new ReactionThermoDataError(t, problems);
  const species = evaluated.map(([, s]) => s);

  const enthalpy = evaluated.reduce((sum, [m, s]) => sum + m.nu * s.enthalpy, 0);
  const referenceEnthalpy = active.every((m) => m.formationEnthalpy !== null)
    ? active.reduce((sum, m) => sum + m.nu * m.formationEnthalpy!.value, 0)
    : null;
  const gasAmountChange = active.filter((m) => m.phase === 'g').reduce((sum, m) => sum.add(m.coefficient), ZERO);
  const internalEnergy = enthalpy - (gasAmountChange.valueOf() * GAS_CONSTANT * t) / 1000;

  const entropyMissing = species.filter((s) => s.entropy === null).map((s) => s.species);
  const entropy = entropyMissing.length === 0 ? evaluated.reduce((sum, [m, s]) => sum + m.nu * s.entropy!, 0) : null;
  const gibbsEnergy = entropy === null ? null : enthalpy - (t * entropy) / 1000;
  const lnK = gibbsEnergy === null ? null : (-gibbsEnergy * 1000) / (GAS_CONSTANT * t);
  const k = lnK === null ? null : Math.exp(lnK);
  const equilibriumConstant = k !== null && Number.isFinite(k) && k > 0 ? k : null;
  if (lnK !== null && equilibriumConstant === null)
    notes.push('K is beyond the range of ordinary numbers; use log10 K.');

  const contributions: UncertaintyContribution[] = [];
  const uncertaintyMissing: string[] = [];
  for (const [m, s] of evaluated) {
    const u = s.enthalpyBasis === 'model-absolute' ? null : (m.formationEnthalpy?.standardUncertainty ?? null);
    if (u === null) uncertaintyMissing.push(s.species);
    else
      contributions.push({
        species: s.species,
        phase: s.phase,
        coefficient: s.coefficient,
        standardUncertainty: u,
        contribution: m.nu * u,
        varianceShare: 0,
      });
  }
  const variance = contributions.reduce((sum, c) => sum + c.contribution ** 2, 0);
  for (const c of contributions) c.varianceShare = variance > 0 ? c.contribution ** 2 / variance : 0;

  if (method === 'constant-cp' && !atReference)
    notes.unshift(
      'Constant-Cp estimate: each species’ Cp°(298.15 K) is held constant from 298.15 K to T; the temperature dependence of Cp° and any phase transitions are ignored.',
    );
  if (uncertaintyMissing.length > 0)
    notes.push(`Uncertainty incomplete: no stated uncertainty for ${uncertaintyMissing.join(', ')}.`);

  return {
    temperature: t,
    method,
    estimate: method === 'constant-cp' && !atReference,
    enthalpy,
    referenceEnthalpy,
    internalEnergy,
    gasAmountChange,
    entropy,
    gibbsEnergy,
    lnK,
    log10K: lnK === null ? null : lnK / Math.LN10,
    equilibriumConstant,
    entropyMissing,
    uncertainty: { standardUncertainty: Math.sqrt(variance), method: RSS_METHOD_TEXT, contributions },
    uncertaintyComplete: uncertaintyMissing.length === 0,
    uncertaintyMissing,
    species,
    cancelled,
    notes,
  };
}

function outOfRange(m: MergedTerm, temperature: number): ReactionDataProblem {
  return { kind: 'out-of-range', species: m.species, phase: m.phase, temperature, range: { ...m.model!.range } };
}

const missing = (kind: 'no-model' | 'no-enthalpy', m: MergedTerm): ReactionDataProblem => ({
  kind,
  species: m.species,
  phase: m.phase,
});

interface EntropyValue {
  value: number | null;
  basis: EntropyBasis | null;
}
const NO_ENTROPY: EntropyValue = { value: null, basis: null };

// Built with every property spelled out: object spread here was the main cost of a call.
function speciesResult(
  m: MergedTerm,
  enthalpyBasis: EnthalpyBasis,
  enthalpy: number,
  increment: number | null,
  entropy: EntropyValue,
  heatCapacity298: number | null,
  crossings: ThermoCrossing[] | null,
): SpeciesAtTemperature {
  return {
    species: m.species,
    phase: m.phase,
    coefficient: m.coefficient,
    enthalpyBasis,
    enthalpy,
    increment,
    entropy: entropy.value,
    entropyBasis: entropy.basis,
    heatCapacity298,
    crossings,
  };
}

function atReferenceTemperature(m: MergedTerm, problems: ReactionDataProblem[]): SpeciesAtTemperature | null {
  const t = REFERENCE_TEMPERATURE;
  const formationModel = m.model?.scale === 'formation' && covers(m.model, t) ? m.model : null;
  const entropy: EntropyValue =
    m.entropy !== null
      ? { value: m.entropy, basis: 'value' }
      : formationModel
        ? { value: absoluteEntropy(formationModel, t), basis: 'model-absolute' }
        : NO_ENTROPY;
  if (m.formationEnthalpy) return speciesResult(m, 'value', m.formationEnthalpy.value, 0, entropy, null, []);
  if (formationModel)
    return speciesResult(m, 'model-absolute', absoluteEnthalpy(formationModel, t), null, entropy, null, []);
  problems.push(m.model?.scale === 'formation' ? outOfRange(m, t) : missing('no-enthalpy', m));
  return null;
}

function integrated(
  m: MergedTerm,
  t: number,
  problems: ReactionDataProblem[],
  notes: string[],
): SpeciesAtTemperature | null {
  const p = m.model;
  if (!p) {
    problems.push(missing(m.formationEnthalpy ? 'no-model' : 'no-enthalpy', m));
    return null;
  }
  if (!covers(p, t)) {
    problems.push(outOfRange(m, t));
    return null;
  }
  if (m.formationEnthalpy && covers(p, REFERENCE_TEMPERATURE)) {
    const increment = enthalpyIncrement(p, t);
    const entropy: EntropyValue =
      m.entropy !== null
        ? { value: m.entropy + entropyChange(p, REFERENCE_TEMPERATURE, t), basis: 'value+model' }
        : p.scale === 'formation'
          ? { value: absoluteEntropy(p, t), basis: 'model-absolute' }
          : NO_ENTROPY;
    return speciesResult(
      m,
      'value+increment',
      m.formationEnthalpy.value + increment,
      increment,
      entropy,
      null,
      crossingsBetween(p, REFERENCE_TEMPERATURE, t),
    );
  }
  if (p.scale === 'formation') {
    if (m.formationEnthalpy)
      notes.push(
        `${m.species}: its model does not reach 298.15 K, so H°(T) comes from the model alone and its ΔfH°(298.15 K) is not used.`,
      );
    return speciesResult(
      m,
      'model-absolute',
      absoluteEnthalpy(p, t),
      null,
      { value: absoluteEntropy(p, t), basis: 'model-absolute' },
      null,
      [],
    );
  }
  problems.push(m.formationEnthalpy ? outOfRange(m, REFERENCE_TEMPERATURE) : missing('no-enthalpy', m));
  return null;
}

function constantCp(m: MergedTerm, t: number, problems: ReactionDataProblem[]): SpeciesAtTemperature | null {
  const p = m.model;
  if (!m.formationEnthalpy || !p) {
    problems.push(missing(m.formationEnthalpy ? 'no-model' : 'no-enthalpy', m));
    return null;
  }
  if (!covers(p, REFERENCE_TEMPERATURE)) {
    problems.push(outOfRange(m, REFERENCE_TEMPERATURE));
    return null;
  }
  const cp = heatCapacity(p, REFERENCE_TEMPERATURE);
  const logRatio = Math.log(t / REFERENCE_TEMPERATURE);
  const entropy: EntropyValue =
    m.entropy !== null
      ? { value: m.entropy + cp * logRatio, basis: 'value+constant-cp' }
      : p.scale === 'formation'
        ? { value: absoluteEntropy(p, REFERENCE_TEMPERATURE) + cp * logRatio, basis: 'model-absolute+constant-cp' }
        : NO_ENTROPY;
  const increment = (cp * (t - REFERENCE_TEMPERATURE)) / 1000;
  return speciesResult(
    m,
    'value+constant-cp',
    m.formationEnthalpy.value + increment,
    increment,
    entropy,
    cp,
    covers(p, t) ? crossingsBetween(p, REFERENCE_TEMPERATURE, t) : null,
  );
}
