/**
 * The library page's search state as an API query, and back from the address bar. Pure, so the
 * rules (element symbols, paging, which filters are sent) are tested without Vue.
 */
import { isElementSymbol } from '@shared/chemistry/index';
import { libraryPhases, provenances, type LibraryPhase, type Provenance } from '@shared/schemas/library-core';
import type { speciesSortSchema } from '@shared/schemas/library';
import type { z } from 'zod';

export type SpeciesSort = z.infer<typeof speciesSortSchema>;

export interface LibrarySearchState {
  q: string;
  phase: LibraryPhase | null;
  /** Element symbols as typed ("c o", "C,O"). */
  elements: string;
  source: string | null;
  provenance: Provenance | null;
  sort: SpeciesSort;
  order: 'asc' | 'desc';
  limit: number;
  offset: number;
  revision: number | null;
}

export const defaultSearchState: LibrarySearchState = {
  q: '',
  phase: null,
  elements: '',
  source: null,
  provenance: null,
  sort: 'relevance',
  order: 'asc',
  limit: 25,
  offset: 0,
  revision: null,
};

export const pageSizes = [25, 50, 100, 200] as const;

/** Phases in words, for filters and headings. */
export const phaseLabels: Record<LibraryPhase, string> = {
  g: 'gas',
  l: 'liquid',
  cr: 'crystalline solid',
  am: 'amorphous solid',
  aq: 'aqueous (1 mol/kg)',
};

/**
 * Element symbols from free text ("c o", "C,O", "cl, Na"): each written with its first letter
 * capital. Returns the comma list the API wants, or the words that are not element symbols.
 */
export function readElements(text: string): { ok: true; value: string | undefined } | { ok: false; unknown: string[] } {
  const words = text
    .split(/[\s,;]+/)
    .map((w) => w.trim())
    .filter((w) => w !== '');
  if (words.length === 0) return { ok: true, value: undefined };
  const symbols = words.map((w) => w.charAt(0).toUpperCase() + w.slice(1).toLowerCase());
  const unknown = symbols.filter((s) => !/^[A-Z][a-z]?$/.test(s) || !isElementSymbol(s));
  if (unknown.length > 0) return { ok: false, unknown };
  return { ok: true, value: [...new Set(symbols)].join(',') };
}

export type SpeciesQueryParams = Record<string, string | number | undefined>;

/** The GET /api/v1/species query for a state; empty filters are left out. */
export function speciesQueryParams(state: LibrarySearchState): SpeciesQueryParams {
  const elements = readElements(state.elements);
  const q = state.q.trim();
  return {
    q: q === '' ? undefined : q,
    phase: state.phase ?? undefined,
    element: elements.ok ? elements.value : undefined,
    source: state.source ?? undefined,
    provenance: state.provenance ?? undefined,
    sort: state.sort === 'relevance' ? undefined : state.sort,
    order: state.sort === 'relevance' ? undefined : state.order,
    limit: state.limit,
    offset: state.offset,
    revision: state.revision ?? undefined,
  };
}

/** The state as address-bar query (only what differs from the defaults), so a search can be shared. */
export function stateToRouteQuery(state: LibrarySearchState): Record<string, string> {
  const out: Record<string, string> = {};
  if (state.q.trim() !== '') out.q = state.q.trim();
  if (state.phase) out.phase = state.phase;
  if (state.elements.trim() !== '') out.element = state.elements.trim();
  if (state.source) out.source = state.source;
  if (state.provenance) out.provenance = state.provenance;
  if (state.sort !== 'relevance') {
    out.sort = state.sort;
    out.order = state.order;
  }
  if (state.limit !== defaultSearchState.limit) out.limit = String(state.limit);
  if (state.offset > 0) out.offset = String(state.offset);
  if (state.revision !== null) out.revision = String(state.revision);
  return out;
}

const sorts: readonly SpeciesSort[] = ['relevance', 'name', 'formula', 'phase', 'deltaFH', 'molarMass'];

function one(v: unknown): string | undefined {
  if (Array.isArray(v)) return typeof v[0] === 'string' ? v[0] : undefined;
  return typeof v === 'string' ? v : undefined;
}

function wholeNumber(text: string | undefined, min: number): number | null {
  if (text === undefined || !/^\d+$/.test(text)) return null;
  const n = Number(text);
  return n >= min ? n : null;
}

/** Reads the address-bar query back; anything unreadable falls back to the default. */
export function stateFromRouteQuery(query: Record<string, unknown>): LibrarySearchState {
  const phase = one(query.phase);
  const provenance = one(query.provenance);
  const sort = one(query.sort);
  const limit = wholeNumber(one(query.limit), 1);
  return {
    q: one(query.q) ?? '',
    phase: phase && (libraryPhases as readonly string[]).includes(phase) ? (phase as LibraryPhase) : null,
    elements: one(query.element) ?? '',
    source: one(query.source) ?? null,
    provenance:
      provenance && (provenances as readonly string[]).includes(provenance) ? (provenance as Provenance) : null,
    sort: sort && (sorts as readonly string[]).includes(sort) ? (sort as SpeciesSort) : 'relevance',
    order: one(query.order) === 'desc' ? 'desc' : 'asc',
    limit: limit !== null && (pageSizes as readonly number[]).includes(limit) ? limit : defaultSearchState.limit,
    offset: wholeNumber(one(query.offset), 0) ?? 0,
    revision: wholeNumber(one(query.revision), 1),
  };
}

/** "Showing 26–50 of 1318". */
export function pageSummary(offset: number, shown: number, total: number): string {
  if (total === 0 || shown === 0) return 'No species match';
  return `Showing ${offset + 1}–${offset + shown} of ${total}`;
}

/** "co" reads as CO or Co: the sentence above the table. */
export function readingsSentence(query: string, readings: readonly string[] | undefined): string | null {
  if (!readings || readings.length < 2) return null;
  const list =
    readings.length === 2
      ? `${readings[0]} or ${readings[1]}`
      : `${readings.slice(0, -1).join(', ')} or ${readings[readings.length - 1]}`;
  return `“${query.trim()}” can be read as ${list}: species of each reading are listed.`;
}
