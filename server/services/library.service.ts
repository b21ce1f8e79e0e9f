import { desc, eq, inArray } from 'drizzle-orm';
import { crossingsBetween, prepareThermoModel } from '@shared/chemistry/thermo/index';
import { MAX_LIMIT, MAX_OFFSET } from '@shared/search/index';
import type { LibraryProperty } from '@shared/schemas/library-core';
import type {
  LibraryModel,
  RevisionList,
  SpeciesDetail,
  SpeciesList,
  SpeciesQuery,
  SpeciesSummary,
  SourceList,
} from '@shared/schemas/library';
import type { ServiceContext } from '../context';
import {
  amendments,
  libraryModels,
  libraryRevisions,
  librarySelections,
  librarySources,
  librarySpecies,
  libraryValues,
  users,
} from '../db/tables/index';
import { AppError, errors } from '../errors';
import { presentModel, presentSource, presentValue, sourceOf, summarize } from '../library/present';
import { elementsOfHill, speciesIndexOf } from '../library/search';
import type { LibraryCache, LibrarySnapshot, SpeciesEntry } from '../library/snapshot';

/** The snapshot a request reads: the revision asked for, or the newest. */
export async function snapshotFor(library: LibraryCache, revision?: number): Promise<LibrarySnapshot> {
  const latest = await library.latestRevision();
  if (latest === null) throw new AppError('unavailable', 'The library is empty: it has not been seeded yet.');
  if (revision !== undefined && revision > latest) {
    throw new AppError('not_found', `There is no library revision ${revision}; the newest is ${latest}.`, {
      revision,
      latest,
    });
  }
  return library.at(revision ?? latest);
}

type Sortable = Exclude<SpeciesQuery['sort'], 'relevance'>;

const compareBy: Record<Sortable, (a: SpeciesSummary, b: SpeciesSummary) => number> = {
  name: (a, b) => a.name.localeCompare(b.name) || a.key.localeCompare(b.key),
  formula: (a, b) => a.hill.localeCompare(b.hill) || a.charge - b.charge || a.key.localeCompare(b.key),
  phase: (a, b) => a.phase.localeCompare(b.phase) || a.name.localeCompare(b.name),
  // Species without a value sort last whatever the order.
  deltaFH: (a, b) => (a.deltaFH?.value ?? Infinity) - (b.deltaFH?.value ?? Infinity) || a.key.localeCompare(b.key),
  molarMass: (a, b) => a.molarMass - b.molarMass || a.key.localeCompare(b.key),
};

function keep(summary: SpeciesSummary, query: SpeciesQuery): boolean {
  if (query.source && !summary.sources.includes(query.source)) return false;
  if (query.provenance && !summary.provenances.includes(query.provenance)) return false;
  if (query.hasValue === 'true' && !summary.deltaFH) return false;
  if (query.hasValue === 'false' && summary.deltaFH) return false;
  return true;
}

/**
 * Species of the library, searched (names, synonyms, formulas, CAS RN, InChIKey), filtered and
 * paged. With a query and the default sort, hits come in search rank; otherwise by the sort asked.
 */
export async function listSpecies(ctx: ServiceContext, query: SpeciesQuery): Promise<SpeciesList> {
  const snapshot = await snapshotFor(ctx.library, query.revision);
  const elements = query.element?.split(',') ?? [];
  let matched: SpeciesEntry[];
  let readings: string[] | undefined;
  const q = query.q?.trim();
  if (q) {
    const index = speciesIndexOf(snapshot);
    const options = { ...(query.phase ? { phase: query.phase } : {}), elements };
    // The index pages by itself; filters it does not know (source, provenance) need every hit.
    matched = [];
    for (let offset = 0; offset <= MAX_OFFSET; offset += MAX_LIMIT) {
      const result = index.search(q, { ...options, limit: MAX_LIMIT, offset });
      if (offset === 0 && result.readings.length > 1) readings = result.readings;
      matched.push(...result.hits.map((h) => h.entry.species));
      if (offset + MAX_LIMIT >= result.total) break;
    }
  } else {
    matched = [...snapshot.species.values()].filter(
      (s) => (!query.phase || s.phase === query.phase) && elements.every((e) => elementsOfHill(s.hill).includes(e)),
    );
  }
  let summaries = matched.map((s) => summarize(snapshot, s)).filter((s) => keep(s, query));
  const sort: Sortable | null = query.sort === 'relevance' ? (q ? null : 'name') : query.sort;
  if (sort) summaries = summaries.sort(compareBy[sort]);
  if (query.order === 'desc') summaries.reverse();
  return {
    items: summaries.slice(query.offset, query.offset + query.limit),
    total: summaries.length,
    libraryRevision: snapshot.revision,
    ...(readings ? { readings } : {}),
  };
}

function transitionsOf(model: LibraryModel['forms'], speciesKey: string, scale: LibraryModel['scale']) {
  const prepared = prepareThermoModel({ species: speciesKey, scale, forms: model });
  const range = prepared.range;
  return crossingsBetween(prepared, range.min, range.max).map((c) =>
    c.kind === 'transition'
      ? { kind: c.kind, from: c.from.form, to: c.to.form, temperature: c.temperature, enthalpy: c.enthalpy }
      : { kind: c.kind, from: c.form.form, to: c.form.form, temperature: c.temperature, enthalpy: c.enthalpyJump },
  );
}

/** Pairs of values of one property whose difference exceeds their combined standard uncertainty. */
function disagreements(values: SpeciesDetail['values']): SpeciesDetail['disagreements'] {
  const out: SpeciesDetail['disagreements'] = [];
  for (let i = 0; i < values.length; i++) {
    for (let j = i + 1; j < values.length; j++) {
      const a = values[i]!;
      const b = values[j]!;
      if (a.property !== b.property) continue;
      const combined = Math.hypot(a.uncertainty ?? 0, b.uncertainty ?? 0);
      // Without any stated uncertainty there is nothing to compare the difference with.
      if (a.uncertainty === null && b.uncertainty === null) continue;
      const difference = Math.abs(a.value - b.value);
      if (difference > combined)
        out.push({ property: a.property, a: a.id, b: b.id, difference, combinedUncertainty: combined });
    }
  }
  return out;
}

const propertyWords: Record<LibraryProperty | 'cp', string> = { dfH298: 'ΔfH°', S298: 'S°', cp: 'heat-capacity model' };

/** What changed for one species, revision by revision (every row ever written for it). */
async function historyOf(
  db: ServiceContext['db'],
  snapshot: LibrarySnapshot,
  speciesId: string,
): Promise<SpeciesDetail['history']> {
  const [speciesRows, valueRows, modelRows, selectionRows] = await Promise.all([
    db.select().from(librarySpecies).where(eq(librarySpecies.id, speciesId)),
    db.select().from(libraryValues).where(eq(libraryValues.speciesId, speciesId)),
    db.select().from(libraryModels).where(eq(libraryModels.speciesId, speciesId)),
    db.select().from(librarySelections).where(eq(librarySelections.speciesId, speciesId)),
  ]);
  const sourceIds = [...new Set([...valueRows, ...modelRows].map((r) => r.sourceId))];
  const sourceRows = sourceIds.length
    ? await db.select().from(librarySources).where(inArray(librarySources.id, sourceIds))
    : [];
  const sourceKey = new Map(sourceRows.map((s) => [s.id, s.key]));
  const valueSource = new Map(valueRows.map((v) => [v.id, sourceKey.get(v.sourceId) ?? '?']));
  const modelSource = new Map(modelRows.map((m) => [m.id, sourceKey.get(m.sourceId) ?? '?']));
  const changes = new Map<number, string[]>();
  const note = (revision: number, text: string) => {
    if (revision > snapshot.revision) return;
    const list = changes.get(revision) ?? [];
    list.push(text);
    changes.set(revision, list);
  };
  const firstSpecies = Math.min(...speciesRows.map((r) => r.validFrom));
  for (const row of speciesRows)
    note(row.validFrom, row.validFrom === firstSpecies ? 'species added' : 'names or identifiers changed');
  for (const row of valueRows) {
    const source = sourceKey.get(row.sourceId) ?? '?';
    const earlier = valueRows.find((v) => v.id === row.id && v.validTo === row.validFrom);
    note(
      row.validFrom,
      earlier
        ? `${propertyWords[row.property]} from ${source}: ${earlier.value} → ${row.value}${row.provenance !== earlier.provenance ? ` (${earlier.provenance} → ${row.provenance})` : ''}`
        : `${propertyWords[row.property]} ${row.value} from ${source} added (${row.provenance})`,
    );
  }
  for (const row of modelRows) {
    const earlier = modelRows.some((m) => m.id === row.id && m.validTo === row.validFrom);
    note(
      row.validFrom,
      `heat-capacity model from ${sourceKey.get(row.sourceId) ?? '?'} ${earlier ? 'revised' : 'added'}`,
    );
  }
  for (const row of selectionRows) {
    const from = row.property === 'cp' ? modelSource.get(row.valueId) : valueSource.get(row.valueId);
    note(row.validFrom, `${propertyWords[row.property]}: ${from ?? '?'} selected (${row.reason})`);
  }
  const numbers = [...changes.keys()];
  const revisions = numbers.length
    ? await db
        .select({
          number: libraryRevisions.number,
          createdAt: libraryRevisions.createdAt,
          summary: libraryRevisions.summary,
          email: libraryRevisions.createdByEmail,
          amendmentId: libraryRevisions.amendmentId,
        })
        .from(libraryRevisions)
        .where(inArray(libraryRevisions.number, numbers))
        .orderBy(desc(libraryRevisions.number))
    : [];
  return revisions.map((r) => ({
    revision: r.number,
    at: r.createdAt.toISOString(),
    by: r.email,
    summary: r.summary,
    amendmentId: r.amendmentId,
    changes: changes.get(r.number) ?? [],
  }));
}

/** One species with every value, model and source at a revision, and its history up to it. */
export async function getSpecies(
  ctx: ServiceContext,
  { speciesId, revision }: { speciesId: string; revision?: number | undefined },
): Promise<SpeciesDetail> {
  const snapshot = await snapshotFor(ctx.library, revision);
  const species = snapshot.species.get(speciesId);
  if (!species) throw errors.notFound(revision ? `The species at revision ${revision}` : 'The species');
  const values = (snapshot.values.get(species.id) ?? [])
    .map((v) => presentValue(snapshot, v))
    .sort((a, b) => a.property.localeCompare(b.property) || Number(b.selected) - Number(a.selected));
  const models = (snapshot.models.get(species.id) ?? []).map((m) =>
    presentModel(snapshot, m, transitionsOf(m.forms, species.key, m.scale)),
  );
  const sourceIds = new Set([...values.map((v) => v.source.id), ...models.map((m) => m.source.id)]);
  return {
    ...summarize(snapshot, species),
    inchi: species.inchi,
    note: species.note,
    values,
    models,
    sourceDetails: [...sourceIds].map((id) => presentSource(sourceOf(snapshot, id))),
    disagreements: disagreements(values),
    history: await historyOf(ctx.db, snapshot, species.id),
    libraryRevision: snapshot.revision,
  };
}

function sumOfCounts(detail: Record<string, unknown>): number {
  const counts = detail['counts'];
  if (typeof counts !== 'object' || counts === null) return 0;
  return Object.values(counts).reduce<number>((sum, n) => sum + (typeof n === 'number' ? n : 0), 0);
}

/**
 * Every library revision, newest first: who accepted it and when, the amendment it came from
 * (its author and rationale), and how many things it changed.
 */
export async function listRevisions(ctx: ServiceContext, _input: Record<string, never> = {}): Promise<RevisionList> {
  const rows = await ctx.db
    .select({
      revision: libraryRevisions,
      email: users.email,
      name: users.displayName,
      proposedBy: amendments.authorName,
      rationale: amendments.rationale,
    })
    .from(libraryRevisions)
    .leftJoin(users, eq(users.id, libraryRevisions.createdBy))
    .leftJoin(amendments, eq(amendments.id, libraryRevisions.amendmentId))
    .orderBy(desc(libraryRevisions.number));
  return {
    items: rows.map(({ revision: r, email, name, proposedBy, rationale }) => {
      const accepted = r.kind === 'amendment';
      return {
        number: r.number,
        kind: r.kind,
        summary: r.summary,
        createdAt: r.createdAt.toISOString(),
        createdBy: email ?? r.createdByEmail,
        amendmentId: r.amendmentId,
        acceptedBy: accepted ? (name ?? r.createdByEmail) : null,
        acceptedAt: accepted ? r.createdAt.toISOString() : null,
        proposedBy: proposedBy ?? null,
        rationale: rationale ?? null,
        // The seed records counts only (it touched everything there is).
        changes: r.touched.length || sumOfCounts(r.detail),
        detail: r.detail,
      };
    }),
    current: rows[0]?.revision.number ?? null,
  };
}

/** Every source at a revision, by key, with how many values, models and reactions cite it. */
export async function listSources(
  ctx: ServiceContext,
  { revision }: { revision?: number | undefined },
): Promise<SourceList> {
  const snapshot = await snapshotFor(ctx.library, revision);
  const count = (ids: string[]) => {
    const map = new Map<string, number>();
    for (const id of ids) map.set(id, (map.get(id) ?? 0) + 1);
    return map;
  };
  const values = count([...snapshot.values.values()].flat().map((v) => v.sourceId));
  const models = count([...snapshot.models.values()].flat().map((m) => m.sourceId));
  const reactions = count(snapshot.reactions.map((r) => r.sourceId));
  return {
    items: [...snapshot.sources.values()]
      .sort((a, b) => a.key.localeCompare(b.key))
      .map((s) => ({
        ...presentSource(s),
        values: values.get(s.id) ?? 0,
        models: models.get(s.id) ?? 0,
        reactions: reactions.get(s.id) ?? 0,
      })),
    libraryRevision: snapshot.revision,
  };
}
