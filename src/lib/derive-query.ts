/**
 * The derive page's inputs in its address, so a derivation can be reopened and sent to a
 * teammate: `t` the target, `from` what to derive from, one `r` per given reaction in the text
 * format of the page (`equation ; ΔH ; u ; unit ; T`), `routes`, `rev` and `team`. Readable and
 * editable by hand; defaults are left out. Pure (no Vue, no router).
 */
import type { DeriveInput } from '@shared/schemas/derive';
import {
  formatGivenLine,
  isBlankRow,
  readGivenReactions,
  toGivenReaction,
  type GivenRow,
  type ReadProblem,
} from './given-reactions';

export type DeriveSource = 'library' | 'given' | 'both';

export interface DeriveFormState {
  target: string;
  using: DeriveSource;
  reactions: GivenRow[];
  /** Routes to list, 1–20. */
  maxRoutes: number;
  /** null: the current revision. */
  revision: number | null;
  /** A team whose derived values join the library's; null: none. */
  teamId: string | null;
}

export const DEFAULT_ROUTES = 5;
export const MAX_ROUTES = 20;

export function defaultDeriveState(): DeriveFormState {
  return { target: '', using: 'library', reactions: [], maxRoutes: DEFAULT_ROUTES, revision: null, teamId: null };
}

/** A route query value as the router gives it. */
type QueryValue = string | null | (string | null)[] | undefined;
export type QueryLike = Record<string, QueryValue>;

const first = (v: QueryValue): string | null => (Array.isArray(v) ? (v[0] ?? null) : (v ?? null));
const all = (v: QueryValue): string[] =>
  (Array.isArray(v) ? v : v === undefined || v === null ? [] : [v]).filter((x): x is string => x !== null);

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The query for a state; the order of keys is fixed so equal states give equal addresses. */
export function stateToQuery(state: DeriveFormState): Record<string, string | string[]> {
  const query: Record<string, string | string[]> = {};
  if (state.target.trim() !== '') query.t = state.target.trim();
  if (state.using !== 'library') query.from = state.using;
  const lines = state.reactions.filter((r) => !isBlankRow(r)).map(formatGivenLine);
  if (lines.length > 0) query.r = lines;
  if (state.maxRoutes !== DEFAULT_ROUTES) query.routes = String(state.maxRoutes);
  if (state.revision !== null) query.rev = String(state.revision);
  if (state.teamId !== null) query.team = state.teamId;
  return query;
}

export interface StateFromQuery {
  state: DeriveFormState;
  /** Given reactions in the address that could not be read (their line is the `r` entry's number). */
  problems: ReadProblem[];
}

/** The state an address describes; anything unreadable falls back to its default. */
export function stateFromQuery(query: QueryLike): StateFromQuery {
  const state = defaultDeriveState();
  const problems: ReadProblem[] = [];
  state.target = first(query.t) ?? '';
  const from = first(query.from);
  if (from === 'given' || from === 'both' || from === 'library') state.using = from;
  all(query.r).forEach((line, index) => {
    const reading = readGivenReactions(line, 'lines');
    for (const p of reading.problems) problems.push({ ...p, line: index + 1 });
    state.reactions.push(...reading.rows);
  });
  const routes = Number(first(query.routes));
  if (Number.isInteger(routes) && routes >= 1 && routes <= MAX_ROUTES) state.maxRoutes = routes;
  const rev = Number(first(query.rev));
  if (Number.isInteger(rev) && rev >= 1) state.revision = rev;
  const team = first(query.team);
  if (team !== null && UUID.test(team)) state.teamId = team.toLowerCase();
  return { state, problems };
}

/** Two queries describe the same inputs. */
export function sameQuery(a: QueryLike, b: QueryLike): boolean {
  const norm = (q: QueryLike) =>
    JSON.stringify(
      Object.keys(q)
        .filter((k) => all(q[k]).length > 0)
        .sort()
        .map((k) => [k, all(q[k])]),
    );
  return norm(a) === norm(b);
}

/**
 * The request for a state. Given reactions are sent only when they are used; blank rows are left
 * out. Values are not checked here: the shared schema does that and names the field.
 */
export function deriveRequest(state: DeriveFormState): DeriveInput {
  const input: DeriveInput = { target: state.target.trim() };
  const rows = state.reactions.filter((r) => !isBlankRow(r));
  if (state.using !== 'library') {
    input.using = state.using;
    input.reactions = rows.map(toGivenReaction);
  } else input.using = 'library';
  if (state.maxRoutes !== DEFAULT_ROUTES) input.maxRoutes = state.maxRoutes;
  if (state.revision !== null) input.revision = state.revision;
  if (state.teamId !== null) input.teamId = state.teamId;
  return input;
}

/** The state a saved request describes (to reopen it on the derive page). */
export function stateFromRequest(request: DeriveInput, rows: GivenRow[]): DeriveFormState {
  return {
    target: request.target,
    using: request.using ?? ((request.reactions?.length ?? 0) > 0 ? 'both' : 'library'),
    reactions: rows,
    maxRoutes: request.maxRoutes ?? DEFAULT_ROUTES,
    revision: request.revision ?? null,
    teamId: request.teamId ?? null,
  };
}
