/**
 * Set items built from what a page shows ("save to a set"), and the way back: the page that opens
 * an item with its inputs. Pure, so both directions are tested without Vue.
 */
import type { RouteLocationRaw } from 'vue-router';
import type { CalorimetryRunInput } from '@shared/schemas/calorimetry-runs';
import type { GivenReaction } from '@shared/schemas/derive';
import type { AmountInputs, RouteChoice, SetItemInput } from '@shared/schemas/reaction-sets';
import type { TemperatureInput } from '@shared/schemas/reaction-enthalpy';

/** The workbench's reaction at its temperature, plus its batch quantities when amounts were typed. */
export function workbenchItems(input: {
  equation: string;
  temperature: TemperatureInput | null;
  amounts?: AmountInputs;
}): SetItemInput[] {
  const temperature =
    input.temperature && !(input.temperature.unit === 'K' && input.temperature.value === 298.15)
      ? { temperature: input.temperature }
      : {};
  const items: SetItemInput[] = [{ kind: 'reaction', equation: input.equation, ...temperature }];
  if (input.amounts && input.amounts.length > 0)
    items.push({ kind: 'quantities', equation: input.equation, amounts: input.amounts, ...temperature });
  return items;
}

/** A derivation as the derive page shows it: the target, what it derives from and the chosen route. */
export function derivationItem(input: {
  target: string;
  using?: 'library' | 'given' | 'both';
  reactions?: GivenReaction[];
  route?: RouteChoice | null;
  label?: string;
}): SetItemInput {
  return {
    kind: 'derivation',
    target: input.target,
    ...(input.label ? { label: input.label } : {}),
    ...(input.using ? { using: input.using } : {}),
    ...(input.reactions && input.reactions.length > 0 ? { reactions: input.reactions } : {}),
    ...(input.route !== undefined ? { route: input.route } : {}),
  };
}

/** A run as the calorimetry page holds it: the label is optional (one kind at a time, so `inputs` stays typed). */
export type CalorimetryRunDraft = CalorimetryRunInput extends infer R
  ? R extends CalorimetryRunInput
    ? Omit<R, 'label'> & { label?: string | undefined }
    : never
  : never;

/**
 * A calorimetry run as a set item: its inputs and readings file, and the team run it was saved as
 * (if it was). Never its result: the server reduces the inputs again when the set is evaluated.
 */
export function calorimetryRunItem(run: CalorimetryRunDraft, fromRun: string | null = null): SetItemInput {
  const meta = {
    kind: 'calorimetry-run' as const,
    ...(run.label?.trim() ? { label: run.label.trim() } : {}),
    ...(run.note ? { note: run.note } : {}),
    evidence: run.evidence ?? null,
    fromRun,
  };
  return run.kind === 'bomb'
    ? { ...meta, runKind: 'bomb', inputs: run.inputs }
    : { ...meta, runKind: 'constant-pressure', inputs: run.inputs };
}

/** The page an item opens in, for the link's words. */
export function itemOpenPage(item: SetItemInput): 'the workbench' | 'calorimetry' {
  return item.kind === 'calorimetry-run' ? 'calorimetry' : 'the workbench';
}

/**
 * Where an item opens again with its inputs; null for items no page edits (notes). A calorimetry
 * run is too large for an address: the calorimetry page reads it from the set (`where`), by id.
 */
export function itemOpenLink(item: SetItemInput, where?: { teamId: string; setId: string }): RouteLocationRaw | null {
  switch (item.kind) {
    case 'calorimetry-run':
      return where && item.id
        ? { name: 'calorimetry', query: { team: where.teamId, set: where.setId, item: item.id } }
        : null;
    case 'reaction':
    case 'quantities':
    case 'given-reaction': {
      if (!item.equation.trim()) return null;
      const query: Record<string, string> = { equation: item.equation };
      if (item.temperature) query.temperature = `${item.temperature.value} ${item.temperature.unit}`;
      return { name: 'workbench', query };
    }
    default:
      return null;
  }
}

/** Reads the workbench's `?equation=…&temperature=298.15 K` back (what {@link itemOpenLink} wrote). */
export function workbenchQuery(
  query: Record<string, unknown>,
): { equation: string; temperature: TemperatureInput | null } | null {
  const equation = typeof query.equation === 'string' ? query.equation.trim() : '';
  if (!equation) return null;
  const match = typeof query.temperature === 'string' ? /^(-?\d+(?:\.\d+)?) (K|C|F)$/.exec(query.temperature) : null;
  return {
    equation,
    temperature: match ? { value: Number(match[1]), unit: match[2] as TemperatureInput['unit'] } : null,
  };
}

/** Reads the calorimetry page's `?team=…&set=…&item=…` back (what {@link itemOpenLink} wrote). */
export function calorimetryQuery(
  query: Record<string, unknown>,
): { teamId: string; setId: string; itemId: string } | null {
  const { team, set, item } = query;
  return typeof team === 'string' && typeof set === 'string' && typeof item === 'string' && team && set && item
    ? { teamId: team, setId: set, itemId: item }
    : null;
}
