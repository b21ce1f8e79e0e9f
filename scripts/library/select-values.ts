/**
 * Writes seeds/library/selections.csv and seeds/library/disagreements.csv: which value the library
 * uses where a species has several candidates for one property, and where the candidates disagree.
 *
 *   npm run library:select
 *
 * Reads every values-*.csv and models-*.jsonl of seeds/library/. Deterministic: the same files give
 * the same bytes. A row with provenance `superseded` is never a candidate. A source the rules below
 * do not rank stops the script before anything is written, so a new source needs a rule first.
 *
 * Rules for ΔfH° and S° (`dfH298`, `S298`), applied to every (species, property) with more than one
 * candidate value:
 *
 * 1. The NASA file (`nasa-tm4513`, a published file, provenance `entered` or `checked`) has the value:
 *    a candidate with a stated uncertainty — CODATA 1989 first, then Pedley 1986 — is selected when
 *    it agrees with the NASA value within its own ± as the source states it (the interval U of
 *    CODATA, the 2σ of Pedley; |difference| ≤ ±, computed on the decimals as written). Otherwise the
 *    NASA value stays selected; when a stated candidate differs beyond its ±, the reason names the
 *    difference and the row is flagged for a curator. Candidates without a stated ± (NBS 1982, CRC)
 *    never displace the NASA value.
 * 2. The NASA file lacks the value: a value with a stated uncertainty (CODATA 1989, then Pedley
 *    1986), then NBS 1982, then the CRC Handbook, then a value derived inside the project
 *    (provenance `derived`, e.g. from Odian's polymerization enthalpies).
 *
 * Rule for heat-capacity models (`cp`), applied to every species with more than one model: a model
 * whose range covers 298.15 K (its first form starts at or below 300 K, as for the NASA values, and
 * it ends above 298.15 K) before one that does not; among those, a formation-scale model (NASA
 * polynomials, wide ranges) before relative-scale estimates (constant Cp); then the widest range;
 * then the source key, so ties are decided the same way every time.
 *
 * Disagreements (disagreements.csv, and "flagged for a curator" in the reason): after selecting,
 * every other candidate that states a ± is compared with the selected value; when its ± does not
 * reach the selected value, the pair is a disagreement. `difference` is the other value minus the
 * selected one, exact on the decimals as written; `stated_uncertainty` is the other value's ±. The
 * reason of a value selected for its stated ± also names candidates without a ± (NBS, CRC) that lie
 * outside that ±, without flagging them: the rules prefer the stated ±.
 */
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { LATEST_FIT_START_K, T_REF } from './nasa-polynomials';
import { toCsv } from './seed-csv';

export const SELECTIONS_HEADER = ['species', 'property', 'source', 'reason'] as const;
export const DISAGREEMENTS_HEADER = [
  'species',
  'property',
  'selected_source',
  'other_source',
  'difference',
  'stated_uncertainty',
] as const;

const NASA_SOURCE = 'nasa-tm4513';
/** Sources whose stated ± can displace the NASA value, in order of preference. */
const STATED_SOURCES = ['codata-1989', 'pedley-1986'] as const;
/** Sources without a stated ±, in order of preference where the NASA file lacks the value. */
const UNSTATED_SOURCES = ['nbs-1982', 'crc-handbook-97'] as const;

/** How a source is named in a reason. */
const SOURCE_WORDS: Readonly<Record<string, string>> = {
  'nasa-tm4513': 'NASA TM-4513',
  'codata-1989': 'CODATA 1989',
  'pedley-1986': 'Pedley 1986',
  'nbs-1982': 'NBS 1982',
  'crc-handbook-97': 'CRC Handbook (97th ed.)',
  'odian-2004': 'Odian 2004',
};
const PROVENANCE_WORDS: Readonly<Record<string, string>> = {
  entered: 'published file, entered',
  checked: 'checked by a curator',
  memory: 'typed from memory',
  derived: 'derived',
};

export type ValueProperty = 'dfH298' | 'S298';

/** One candidate value, as a values-*.csv row gives it. */
export interface ValueCandidate {
  species: string;
  property: ValueProperty;
  /** Decimal text as written in the file. */
  value: string;
  uncertaintyKind: string;
  /** Decimal text, empty when none is stated. */
  uncertainty: string;
  source: string;
  provenance: string;
}

/** One heat-capacity model, reduced to what the rule needs. */
export interface ModelCandidate {
  species: string;
  source: string;
  provenance: string;
  scale: 'formation' | 'relative';
  /** Lowest and highest temperature the model's forms cover, K. */
  start: number;
  end: number;
  /** Model kinds of the forms, for the reason (nasa7, constant…). */
  kinds: readonly string[];
}

export interface Selection {
  species: string;
  property: ValueProperty | 'cp';
  source: string;
  reason: string;
  rule: SelectionRule;
}

export interface Disagreement {
  species: string;
  property: ValueProperty;
  selectedSource: string;
  otherSource: string;
  /** Other minus selected, as exact decimal text. */
  difference: string;
  /** The ± the difference was judged by, as written. */
  statedUncertainty: string;
}

export type SelectionRule =
  | 'nasa-present: stated value agrees, selected'
  | 'nasa-present: stated value disagrees, NASA kept'
  | 'nasa-present: no stated value, NASA kept'
  | 'nasa-absent: CODATA 1989'
  | 'nasa-absent: Pedley 1986'
  | 'nasa-absent: NBS 1982'
  | 'nasa-absent: CRC Handbook'
  | 'nasa-absent: derived'
  | 'cp: NASA model covers 298.15 K'
  | 'cp: other model covers 298.15 K'
  | 'cp: no model covers 298.15 K';

export interface SelectionResult {
  selections: Selection[];
  disagreements: Disagreement[];
}

/** The input does not fit the rules; the message names species, property and source. */
export class SelectionError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SelectionError';
  }
}

// ---- exact decimals: values are compared as written, never through binary floating point ------

const SCALE_DIGITS = 6;
const SCALE = 10n ** BigInt(SCALE_DIGITS);

function decimalsOf(text: string): number {
  const dot = text.indexOf('.');
  return dot < 0 ? 0 : text.length - dot - 1;
}

function toScaled(text: string, where: string): bigint {
  const m = /^(-?)(\d+)(?:\.(\d+))?$/.exec(text);
  if (!m) throw new SelectionError(`${where}: '${text}' is not a decimal number`);
  const fraction = m[3] ?? '';
  if (fraction.length > SCALE_DIGITS) throw new SelectionError(`${where}: '${text}' has more than 6 decimals`);
  const magnitude = BigInt(m[2]!) * SCALE + BigInt(fraction.padEnd(SCALE_DIGITS, '0'));
  return m[1] === '-' ? -magnitude : magnitude;
}

const abs = (x: bigint): bigint => (x < 0n ? -x : x);

/** A scaled decimal written with `decimals` places, rounded half away from zero. */
function scaledText(x: bigint, decimals: number): string {
  const step = 10n ** BigInt(SCALE_DIGITS - decimals);
  const negative = x < 0n;
  const rounded = (abs(x) + step / 2n) / step;
  const whole = rounded / 10n ** BigInt(decimals);
  const part = rounded % 10n ** BigInt(decimals);
  const body = decimals === 0 ? `${whole}` : `${whole}.${part.toString().padStart(decimals, '0')}`;
  return negative && rounded !== 0n ? `-${body}` : body;
}

/** |difference| for a reason: as many places as its ± (at least 2), more when rounding would hide that it exceeds it. */
function differenceWords(difference: bigint, uncertainty: string): string {
  const u = toScaled(uncertainty, 'uncertainty');
  let places = Math.max(2, decimalsOf(uncertainty));
  while (places < SCALE_DIGITS && abs(difference) > u && toScaled(scaledText(abs(difference), places), '') <= u) {
    places++;
  }
  return scaledText(abs(difference), places);
}

// ---- words ----------------------------------------------------------------------------------

function sourceWords(source: string): string {
  const words = SOURCE_WORDS[source];
  if (words === undefined) throw new SelectionError(`source '${source}' has no name in select-values.ts`);
  return words;
}

function unitOf(property: ValueProperty): string {
  return property === 'dfH298' ? 'kJ/mol' : 'J/(mol K)';
}

/** "± 0.3 kJ/mol (2σ)" — the ± as the source states it; a zero ± is a convention (reference states, H⁺(aq)). */
function plusMinusWords(c: ValueCandidate): string {
  if (toScaled(c.uncertainty, where(c)) === 0n) return '± 0 (exact by convention)';
  const kind =
    c.uncertaintyKind === 'two-sigma'
      ? ' (2σ)'
      : c.uncertaintyKind === 'standard'
        ? ' (standard uncertainty)'
        : c.uncertaintyKind === 'expanded'
          ? ' (expanded)'
          : '';
  return `± ${c.uncertainty} ${unitOf(c.property)}${kind}`;
}

/** "CODATA 1989 value (typed from memory)". */
function valueWords(c: ValueCandidate): string {
  const kind = c.source === 'codata-1989' ? 'Key Value' : 'value';
  const provenance = PROVENANCE_WORDS[c.provenance] ?? c.provenance;
  return `${sourceWords(c.source)} ${kind} (${provenance})`;
}

function hasStatedUncertainty(c: ValueCandidate): boolean {
  return c.uncertaintyKind !== 'none' && c.uncertainty !== '';
}

// ---- values ---------------------------------------------------------------------------------

function where(c: Pick<ValueCandidate, 'species' | 'property' | 'source'>): string {
  return `${c.property} of ${c.species} from ${c.source}`;
}

/** The rule named when a source's value is selected without a NASA value. */
const RULE_WITHOUT_NASA: Readonly<Record<string, SelectionRule>> = {
  'codata-1989': 'nasa-absent: CODATA 1989',
  'pedley-1986': 'nasa-absent: Pedley 1986',
  'nbs-1982': 'nasa-absent: NBS 1982',
  'crc-handbook-97': 'nasa-absent: CRC Handbook',
};

/** Rank where the NASA file lacks the value (lower is preferred): stated ±, then unstated, then derived. */
function rankWithoutNasa(c: ValueCandidate): { rank: number; rule: SelectionRule } {
  const stated = (STATED_SOURCES as readonly string[]).indexOf(c.source);
  if (stated >= 0 && hasStatedUncertainty(c)) return { rank: stated, rule: RULE_WITHOUT_NASA[c.source]! };
  const unstated = (UNSTATED_SOURCES as readonly string[]).indexOf(c.source);
  if (unstated >= 0) return { rank: STATED_SOURCES.length + unstated, rule: RULE_WITHOUT_NASA[c.source]! };
  if (c.provenance === 'derived')
    return { rank: STATED_SOURCES.length + UNSTATED_SOURCES.length, rule: 'nasa-absent: derived' };
  throw new SelectionError(`${where(c)}: the selection rules do not rank this source; add a rule first`);
}

interface Judged {
  other: ValueCandidate;
  /** Other minus selected, scaled. */
  difference: bigint;
  /** The selected value states a ± and the other lies outside it. */
  outsideSelected: boolean;
  /** The other states a ± and it does not reach the selected value: flagged for a curator. */
  flagged: boolean;
}

/** Compares every other candidate with the selected one (see the header: Disagreements). */
function judgeOthers(selected: ValueCandidate, others: readonly ValueCandidate[]): Judged[] {
  const selectedValue = toScaled(selected.value, where(selected));
  const beyond = (d: bigint, c: ValueCandidate) =>
    hasStatedUncertainty(c) && abs(d) > toScaled(c.uncertainty, where(c));
  return others.map((other) => {
    const difference = toScaled(other.value, where(other)) - selectedValue;
    return { other, difference, outsideSelected: beyond(difference, selected), flagged: beyond(difference, other) };
  });
}

function valueKindWords(c: ValueCandidate): string {
  return `${sourceWords(c.source)} ${c.source === 'codata-1989' ? 'Key Value' : 'value'}`;
}

/** "CODATA 1989 Key Value differs by 0.75 kJ/mol, beyond its ± 0.70" for each flagged candidate. */
function flaggedWords(judged: readonly Judged[]): string {
  return judged
    .filter((j) => j.flagged)
    .map((j) => {
      const u = j.other.uncertainty;
      return `${valueKindWords(j.other)} differs by ${differenceWords(j.difference, u)} ${unitOf(j.other.property)}, beyond its ± ${u}`;
    })
    .join('; ');
}

/**
 * The reason's tail for a selected value with a stated ±: flagged candidates, then (not flagged,
 * since the rules prefer a stated ±) candidates without one that lie outside the selected ±.
 */
function remarks(judged: readonly Judged[], selected: ValueCandidate): string {
  const flagged = flaggedWords(judged);
  const outside = judged
    .filter((j) => j.outsideSelected && !j.flagged)
    .map((j) => {
      const amount = `${differenceWords(j.difference, selected.uncertainty)} ${unitOf(selected.property)}`;
      return `the ${sourceWords(j.other.source)} value lies ${amount} away, outside this ±`;
    })
    .join('; ');
  return `${outside ? ` (${outside})` : ''}${flagged ? `; ${flagged}: flagged for a curator` : ''}`;
}

function listWords(candidates: readonly ValueCandidate[]): string {
  return candidates.map((c) => sourceWords(c.source)).join(', ');
}

function selectValue(candidates: readonly ValueCandidate[]): {
  selected: ValueCandidate;
  reason: string;
  rule: SelectionRule;
} {
  const nasa = candidates.find((c) => c.source === NASA_SOURCE);
  if (nasa) {
    if (nasa.provenance !== 'entered' && nasa.provenance !== 'checked') {
      throw new SelectionError(`${where(nasa)}: provenance '${nasa.provenance}', expected entered or checked`);
    }
    const nasaValue = toScaled(nasa.value, where(nasa));
    const stated = STATED_SOURCES.map((s) => candidates.find((c) => c.source === s)).filter(
      (c): c is ValueCandidate => c !== undefined && hasStatedUncertainty(c),
    );
    const agreeing = stated.find(
      (c) => abs(toScaled(c.value, where(c)) - nasaValue) <= toScaled(c.uncertainty, where(c)),
    );
    if (agreeing) {
      const others = candidates.filter((c) => c !== agreeing);
      return {
        selected: agreeing,
        rule: 'nasa-present: stated value agrees, selected',
        reason:
          `${valueWords(agreeing)}, agrees with NASA TM-4513 within its ${plusMinusWords(agreeing)}: ` +
          `selected for its stated uncertainty${remarks(judgeOthers(agreeing, others), agreeing)}`,
      };
    }
    const others = candidates.filter((c) => c !== nasa);
    const kept = valueWords(nasa);
    if (stated.length > 0) {
      return {
        selected: nasa,
        rule: 'nasa-present: stated value disagrees, NASA kept',
        reason: `${kept}: ${flaggedWords(judgeOthers(nasa, others))}: the published file's value is kept; flagged for a curator`,
      };
    }
    return {
      selected: nasa,
      rule: 'nasa-present: no stated value, NASA kept',
      reason: `${kept}: no other candidate (${listWords(others)}) states an uncertainty, so the published file's value is kept`,
    };
  }

  const ranked = candidates
    .map((c) => ({ c, ...rankWithoutNasa(c) }))
    .sort((a, b) => a.rank - b.rank || (a.c.source < b.c.source ? -1 : a.c.source > b.c.source ? 1 : 0));
  const best = ranked[0]!;
  if (ranked[1] && ranked[1].rank === best.rank) {
    throw new SelectionError(`${where(best.c)}: ties with ${ranked[1].c.source}; the rules cannot choose`);
  }
  const selected = best.c;
  const others = ranked.slice(1).map((r) => r.c);
  const why = hasStatedUncertainty(selected)
    ? `preferred for its stated ${plusMinusWords(selected)} over ${listWords(others)}`
    : selected.provenance === 'derived'
      ? `no published value is preferred over it`
      : `no candidate states an uncertainty; ${sourceWords(selected.source)} is preferred over ${listWords(others)}`;
  return {
    selected,
    rule: best.rule,
    reason: `${valueWords(selected)}: the NASA file lacks this value; ${why}${remarks(judgeOthers(selected, others), selected)}`,
  };
}

// ---- models ---------------------------------------------------------------------------------

function coversReference(m: ModelCandidate): boolean {
  return m.start <= LATEST_FIT_START_K && m.end > T_REF;
}

function modelWords(m: ModelCandidate): string {
  const what = m.scale === 'formation' ? 'polynomial (formation scale)' : `${m.kinds.join('/')} Cp model`;
  return `${sourceWords(m.source)} ${what}, ${m.start}–${m.end} K`;
}

function selectModel(models: readonly ModelCandidate[]): {
  selected: ModelCandidate;
  reason: string;
  rule: SelectionRule;
} {
  const ordered = [...models].sort(
    (a, b) =>
      Number(coversReference(b)) - Number(coversReference(a)) ||
      Number(b.scale === 'formation') - Number(a.scale === 'formation') ||
      b.end - b.start - (a.end - a.start) ||
      (a.source < b.source ? -1 : a.source > b.source ? 1 : 0),
  );
  const selected = ordered[0]!;
  const others = ordered.slice(1);
  const othersText = others.map(modelWords).join('; ');
  if (!coversReference(selected)) {
    return {
      selected,
      rule: 'cp: no model covers 298.15 K',
      reason: `${modelWords(selected)}: no model covers 298.15 K; the widest range is preferred over ${othersText}`,
    };
  }
  if (selected.source === NASA_SOURCE) {
    return {
      selected,
      rule: 'cp: NASA model covers 298.15 K',
      reason: `${modelWords(selected)}: covers 298.15 K and is preferred over ${othersText}`,
    };
  }
  const nasa = others.find((m) => m.source === NASA_SOURCE);
  const because = nasa
    ? `the NASA TM-4513 model (${nasa.start}–${nasa.end} K) does not cover 298.15 K`
    : 'widest range';
  return {
    selected,
    rule: 'cp: other model covers 298.15 K',
    reason: `${modelWords(selected)}: covers 298.15 K; preferred over ${othersText} (${because})`,
  };
}

// ---- the whole set ----------------------------------------------------------------------------

function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * Applies the rules of this file's header to every multi-candidate property and multi-model species.
 * @throws SelectionError when a candidate does not fit the rules (unknown source, unreadable decimal,
 *   the same source twice for one property).
 */
export function selectValues(values: readonly ValueCandidate[], models: readonly ModelCandidate[]): SelectionResult {
  const selections: Selection[] = [];
  const disagreements: Disagreement[] = [];

  const groups = new Map<string, ValueCandidate[]>();
  for (const v of values) {
    if (v.provenance === 'superseded') continue;
    const id = `${v.species}\u0000${v.property}`;
    const group = groups.get(id) ?? [];
    if (group.some((g) => g.source === v.source)) throw new SelectionError(`${where(v)}: given twice`);
    group.push(v);
    groups.set(id, group);
  }
  for (const group of groups.values()) {
    if (group.length < 2) continue;
    const { selected, reason, rule } = selectValue(group);
    selections.push({ species: selected.species, property: selected.property, source: selected.source, reason, rule });
    const others = group.filter((c) => c !== selected);
    for (const j of judgeOthers(selected, others)) {
      if (!j.flagged) continue;
      const places = Math.max(decimalsOf(selected.value), decimalsOf(j.other.value));
      disagreements.push({
        species: selected.species,
        property: selected.property,
        selectedSource: selected.source,
        otherSource: j.other.source,
        difference: scaledText(j.difference, places),
        statedUncertainty: j.other.uncertainty,
      });
    }
  }

  const modelGroups = new Map<string, ModelCandidate[]>();
  for (const m of models) {
    if (m.provenance === 'superseded') continue;
    const group = modelGroups.get(m.species) ?? [];
    if (group.some((g) => g.source === m.source))
      throw new SelectionError(`cp of ${m.species} from ${m.source}: given twice`);
    group.push(m);
    modelGroups.set(m.species, group);
  }
  for (const group of modelGroups.values()) {
    if (group.length < 2) continue;
    const { selected, reason, rule } = selectModel(group);
    selections.push({ species: selected.species, property: 'cp', source: selected.source, reason, rule });
  }

  selections.sort((a, b) => compareText(a.species, b.species) || compareText(a.property, b.property));
  disagreements.sort(
    (a, b) =>
      compareText(a.species, b.species) ||
      compareText(a.property, b.property) ||
      compareText(a.otherSource, b.otherSource),
  );
  return { selections, disagreements };
}

/** The text of selections.csv. */
export function selectionsCsv(result: SelectionResult): string {
  return toCsv(
    SELECTIONS_HEADER,
    result.selections.map((s) => [s.species, s.property, s.source, s.reason]),
  );
}

/** The text of disagreements.csv. */
export function disagreementsCsv(result: SelectionResult): string {
  return toCsv(
    DISAGREEMENTS_HEADER,
    result.disagreements.map((d) => [
      d.species,
      d.property,
      d.selectedSource,
      d.otherSource,
      d.difference,
      d.statedUncertainty,
    ]),
  );
}

// ---- reading the seed files ---------------------------------------------------------------------

export const LIBRARY_DIR = fileURLToPath(new URL('../../seeds/library/', import.meta.url));

interface ModelLine {
  species: string;
  source: string;
  provenance: string;
  scale: 'formation' | 'relative';
  forms: { model: { kind: string; ranges?: number[]; range?: [number, number]; points?: [number, number][] } }[];
}

function formSpan(model: ModelLine['forms'][number]['model'], where: string): [number, number] {
  const temps = model.ranges ?? model.range ?? model.points?.map((p) => p[0]);
  if (!temps || temps.length < 2)
    throw new SelectionError(`${where}: a ${model.kind} form without a temperature range`);
  return [temps[0]!, temps[temps.length - 1]!];
}

/** Every values-*.csv row and models-*.jsonl line of a library folder, files in name order. */
export function readLibraryCandidates(dir = LIBRARY_DIR): { values: ValueCandidate[]; models: ModelCandidate[] } {
  const files = readdirSync(dir).sort();
  const values: ValueCandidate[] = [];
  for (const file of files.filter((f) => /^values-.*\.csv$/.test(f))) {
    const parsed = Papa.parse<Record<string, string>>(readFileSync(`${dir}${file}`, 'utf8'), {
      header: true,
      skipEmptyLines: true,
    });
    if (parsed.errors.length > 0) {
      const e = parsed.errors[0]!;
      throw new SelectionError(`${file} line ${(e.row ?? 0) + 2}: ${e.message}`);
    }
    parsed.data.forEach((r, i) => {
      if (r.property !== 'dfH298' && r.property !== 'S298') {
        throw new SelectionError(`${file} line ${i + 2}: property '${r.property}'`);
      }
      values.push({
        species: r.species ?? '',
        property: r.property,
        value: r.value ?? '',
        uncertaintyKind: r.uncertainty_kind ?? '',
        uncertainty: r.uncertainty ?? '',
        source: r.source ?? '',
        provenance: r.provenance ?? '',
      });
    });
  }
  const models: ModelCandidate[] = [];
  for (const file of files.filter((f) => /^models-.*\.jsonl$/.test(f))) {
    readFileSync(`${dir}${file}`, 'utf8')
      .split('\n')
      .forEach((line, i) => {
        if (line.trim() === '') return;
        const m = JSON.parse(line) as ModelLine;
        const spans = m.forms.map((f) => formSpan(f.model, `${file} line ${i + 1}`));
        models.push({
          species: m.species,
          source: m.source,
          provenance: m.provenance,
          scale: m.scale,
          start: spans[0]![0],
          end: spans[spans.length - 1]![1],
          kinds: [...new Set(m.forms.map((f) => f.model.kind))],
        });
      });
  }
  return { values, models };
}

function main(): void {
  let result: SelectionResult;
  try {
    const { values, models } = readLibraryCandidates();
    result = selectValues(values, models);
  } catch (err) {
    if (err instanceof SelectionError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  writeFileSync(`${LIBRARY_DIR}selections.csv`, selectionsCsv(result));
  writeFileSync(`${LIBRARY_DIR}disagreements.csv`, disagreementsCsv(result));
  const counts = new Map<SelectionRule, number>();
  for (const s of result.selections) counts.set(s.rule, (counts.get(s.rule) ?? 0) + 1);
  console.log(`${result.selections.length} selections written to seeds/library/selections.csv:`);
  for (const [rule, n] of [...counts].sort((a, b) => compareText(a[0], b[0])))
    console.log(`  ${String(n).padStart(4)}  ${rule}`);
  console.log(`\n${result.disagreements.length} disagreements written to seeds/library/disagreements.csv:`);
  for (const d of result.disagreements) {
    console.log(
      `  ${d.species} ${d.property}: ${d.otherSource} − ${d.selectedSource} (selected) = ${d.difference}, judged by ± ${d.statedUncertainty}`,
    );
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) main();
