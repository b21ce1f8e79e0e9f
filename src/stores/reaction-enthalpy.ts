import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import type { Provenance } from '@shared/schemas/library-core';
import type {
  ReactionEnthalpyInput,
  ReactionEnthalpyResult,
  ReactionHeatInput,
  ReactionHeatResult,
} from '@shared/schemas/reaction-enthalpy';
import * as enthalpyApi from '@/api/reaction-enthalpy';
import { isApiError } from '@/api/api-error';
import { apiErrorText } from '@/lib/api-error-words';
import { enthalpyProblems, type EnthalpyProblem } from '@/lib/enthalpy-problems';
import { kelvinFrom, type ApiTemperatureUnit } from '@/lib/reaction-units';
import { curveRange, type CurveRange } from '@/lib/enthalpy-curve';
import type { SpeciesIdentity } from '@/lib/species-suggestions';
import { useLibraryStore } from './library';

/** What the panel needs of each library species beyond the enthalpy reply. */
export interface SpeciesFacts {
  molarMass: number;
  /** Provenance of the selected ΔfH°, null when the species has none. */
  provenance: Provenance | null;
  /** Valid range of the selected heat-capacity model (K), null without a model. */
  modelRange: [number, number] | null;
}

export type AmountUnit = 'g' | 'kg' | 'lb' | 'mol' | 'L';

/** An amount as typed for one term (value null: not given). */
export interface AmountEntry {
  value: number | null;
  unit: AmountUnit;
  temperature: number | null;
  temperatureUnit: ApiTemperatureUnit;
  pressure: number | null;
  pressureUnit: 'Pa' | 'kPa' | 'bar' | 'atm';
}

export interface PanelError {
  message: string;
  problems: EnthalpyProblem[];
}

export function emptyAmount(): AmountEntry {
  return { value: null, unit: 'g', temperature: 25, temperatureUnit: 'C', pressure: 1, pressureUnit: 'bar' };
}

const isAborted = (error: unknown) => isApiError(error) && error.details.aborted === true;

function panelError(error: unknown, sentTerms: readonly SpeciesIdentity[]): PanelError {
  return {
    message: apiErrorText(error),
    problems: isApiError(error) && error.code === 'unprocessable' ? enthalpyProblems(error.details, sentTerms) : [],
  };
}

/**
 * The workbench's enthalpy and quantities panels: their inputs (kept while the user visits other
 * pages) and the replies. Requests are numbered so a late reply to an older input is dropped.
 */
export const useReactionEnthalpyStore = defineStore('reaction-enthalpy', () => {
  const library = useLibraryStore();

  // Inputs.
  const temperature = ref<{ value: number | null; unit: ApiTemperatureUnit }>({ value: 298.15, unit: 'K' });
  const constantCp = ref(false);
  /** How energies are shown: kJ/mol, kcal/mol, or kJ per kg of the species `perKgSpecies` (an id). */
  const displayUnit = ref<'kJ/mol' | 'kcal/mol' | 'kJ/kg'>('kJ/mol');
  const perKgSpecies = ref<string | null>(null);
  const revision = ref<number | null>(null);
  const curveOverride = ref<{ from: number | null; to: number | null }>({ from: null, to: null });
  const amounts = ref<Record<number, AmountEntry>>({});
  const batch = ref<{ mass: number | null; massUnit: 'g' | 'kg' | 'lb'; cp: number | null }>({
    mass: null,
    massUnit: 'kg',
    cp: null,
  });

  // The equation evaluated and the replies.
  const equation = ref<string | null>(null);
  const sentTerms = shallowRef<SpeciesIdentity[]>([]);
  const result = shallowRef<ReactionEnthalpyResult | null>(null);
  const error = shallowRef<PanelError | null>(null);
  const loading = ref(false);
  const facts = ref<Record<string, SpeciesFacts>>({});
  const curve = shallowRef<ReactionEnthalpyResult['curve']>(null);
  const curveError = ref<string | null>(null);
  const curveLoading = ref(false);
  const heat = shallowRef<ReactionHeatResult | null>(null);
  const heatError = shallowRef<PanelError | null>(null);
  const heatLoading = ref(false);

  const kelvin = computed(() => kelvinFrom(temperature.value.value, temperature.value.unit));

  let sequence = 0;
  let controller: AbortController | null = null;
  let heatSequence = 0;
  let heatController: AbortController | null = null;

  /** The options common to every request. */
  function baseInput(text: string): ReactionEnthalpyInput {
    const input: ReactionEnthalpyInput = { equation: text };
    if (temperature.value.value !== null)
      input.temperature = { value: temperature.value.value, unit: temperature.value.unit };
    if (revision.value !== null) input.revision = revision.value;
    if (constantCp.value) input.constantCpEstimate = true;
    return input;
  }

  /** Forgets the replies (the panel hides them at once when the equation goes). */
  function clear(): void {
    sequence++;
    heatSequence++;
    controller?.abort();
    heatController?.abort();
    equation.value = null;
    result.value = null;
    error.value = null;
    curve.value = null;
    curveError.value = null;
    heat.value = null;
    heatError.value = null;
    loading.value = false;
    heatLoading.value = false;
    curveLoading.value = false;
  }

  /**
   * Sets the equation to evaluate (the balanced equation as shown). Amounts typed for another
   * equation refer to other terms, so they go.
   */
  function setEquation(text: string, terms: SpeciesIdentity[]): void {
    if (text === equation.value) return;
    const sameTerms = JSON.stringify(terms) === JSON.stringify(sentTerms.value);
    equation.value = text;
    sentTerms.value = terms;
    if (!sameTerms) {
      amounts.value = {};
      heat.value = null;
      heatError.value = null;
    }
  }

  async function loadFacts(reply: ReactionEnthalpyResult, mine: number): Promise<void> {
    const ids = [...new Set(reply.terms.map((t) => t.speciesId))];
    const entries = await Promise.all(
      ids.map(async (id) => {
        try {
          const d = await library.speciesDetail(id, reply.libraryRevision);
          const fact: SpeciesFacts = {
            molarMass: d.molarMass,
            provenance: d.deltaFH?.provenance ?? null,
            modelRange: d.modelRange,
          };
          return [id, fact] as const;
        } catch {
          return null;
        }
      }),
    );
    if (mine !== sequence) return;
    const next: Record<string, SpeciesFacts> = {};
    for (const e of entries) if (e) next[e[0]] = e[1];
    facts.value = next;
  }

  /** ΔrH° and the rest at T; then the species' facts and the ΔrH°(T) curve. */
  async function evaluate(): Promise<void> {
    const text = equation.value;
    if (text === null) return;
    const mine = ++sequence;
    controller?.abort();
    controller = new AbortController();
    const signal = controller.signal;
    loading.value = true;
    try {
      const reply = await enthalpyApi.evaluateReactionEnthalpy(baseInput(text), signal);
      if (mine !== sequence) return;
      result.value = reply;
      error.value = null;
      loading.value = false;
      await loadFacts(reply, mine);
      if (mine !== sequence) return;
      await evaluateCurve(text, reply, mine, signal);
    } catch (e) {
      if (mine !== sequence || isAborted(e)) return;
      result.value = null;
      curve.value = null;
      error.value = panelError(e, sentTerms.value);
    } finally {
      if (mine === sequence) loading.value = false;
    }
  }

  /** The range the curve is asked for: the user's, or one around the models' common range. */
  const plannedCurve = computed<CurveRange | null>(() => {
    if (!result.value) return null;
    const ranges = [...new Set(result.value.terms.map((t) => t.speciesId))].map(
      (id) => facts.value[id]?.modelRange ?? null,
    );
    return curveRange(ranges, curveOverride.value);
  });

  async function evaluateCurve(
    text: string,
    reply: ReactionEnthalpyResult,
    mine: number,
    signal: AbortSignal,
  ): Promise<void> {
    const plan = plannedCurve.value;
    if (!plan || plan.kind !== 'range') {
      curve.value = null;
      curveError.value = plan?.kind === 'none' ? plan.reason : null;
      return;
    }
    curveLoading.value = true;
    try {
      const input = baseInput(text);
      delete input.temperature;
      input.revision = reply.libraryRevision;
      input.curve = { from: plan.from, to: plan.to, points: plan.points };
      const withCurve = await enthalpyApi.evaluateReactionEnthalpy(input, signal);
      if (mine !== sequence) return;
      curve.value = withCurve.curve;
      curveError.value = null;
    } catch (e) {
      if (mine !== sequence || isAborted(e)) return;
      curve.value = null;
      curveError.value = apiErrorText(e);
    } finally {
      if (mine === sequence) curveLoading.value = false;
    }
  }

  /** The heat request for the amounts given, or null when no amount is complete. */
  const heatInput = computed<ReactionHeatInput | null>(() => {
    const text = equation.value;
    if (text === null) return null;
    const given: ReactionHeatInput['amounts'] = [];
    for (const [term, a] of Object.entries(amounts.value)) {
      if (a.value === null || !(a.value > 0)) continue;
      const entry: ReactionHeatInput['amounts'][number] = { term: Number(term), value: a.value, unit: a.unit };
      if (a.unit === 'L') {
        if (a.temperature === null || a.pressure === null || !(a.pressure > 0)) continue;
        entry.temperature = { value: a.temperature, unit: a.temperatureUnit };
        entry.pressure = { value: a.pressure, unit: a.pressureUnit };
      }
      given.push(entry);
    }
    if (given.length === 0) return null;
    const input: ReactionHeatInput = { ...baseInput(text), amounts: given };
    if (batch.value.mass !== null && batch.value.mass > 0 && batch.value.cp !== null && batch.value.cp > 0)
      input.batch = {
        mass: { value: batch.value.mass, unit: batch.value.massUnit },
        cp: { value: batch.value.cp, unit: 'J/(g K)' },
      };
    return input;
  });

  async function evaluateHeat(): Promise<void> {
    const input = heatInput.value;
    const mine = ++heatSequence;
    heatController?.abort();
    if (!input) {
      heat.value = null;
      heatError.value = null;
      heatLoading.value = false;
      return;
    }
    heatController = new AbortController();
    heatLoading.value = true;
    try {
      const reply = await enthalpyApi.evaluateReactionHeat(input, heatController.signal);
      if (mine !== heatSequence) return;
      heat.value = reply;
      heatError.value = null;
    } catch (e) {
      if (mine !== heatSequence || isAborted(e)) return;
      heat.value = null;
      heatError.value = panelError(e, sentTerms.value);
    } finally {
      if (mine === heatSequence) heatLoading.value = false;
    }
  }

  function setAmount(term: number, patch: Partial<AmountEntry>): void {
    amounts.value = { ...amounts.value, [term]: { ...(amounts.value[term] ?? emptyAmount()), ...patch } };
  }

  return {
    temperature,
    kelvin,
    constantCp,
    displayUnit,
    perKgSpecies,
    revision,
    curveOverride,
    amounts,
    batch,
    equation,
    sentTerms,
    result,
    error,
    loading,
    facts,
    curve,
    curveError,
    curveLoading,
    plannedCurve,
    heat,
    heatError,
    heatLoading,
    heatInput,
    clear,
    setEquation,
    evaluate,
    evaluateHeat,
    setAmount,
  };
});
