import { defineStore } from 'pinia';
import { ref, shallowRef } from 'vue';
import type { RevisionList, SpeciesDetail, SpeciesList } from '@shared/schemas/library';
import * as libraryApi from '@/api/library';
import { isApiError } from '@/api/api-error';
import { apiErrorText } from '@/lib/api-error-words';
import { defaultSearchState, speciesQueryParams, type LibrarySearchState } from '@/lib/library-query';
import { defaultColumns, type LibraryColumnId } from '@/lib/library-columns';

/** The library as the pages read it: the search on the library page, species details, revisions. */
export const useLibraryStore = defineStore('library', () => {
  const search = ref<LibrarySearchState>({ ...defaultSearchState });
  const columns = ref<LibraryColumnId[]>([...defaultColumns]);
  const results = shallowRef<SpeciesList | null>(null);
  const searching = ref(false);
  const searchError = ref<string | null>(null);
  /** Source keys met in results so far: the source filter offers them (the API has no list of sources). */
  const knownSources = ref<string[]>([]);

  const revisions = shallowRef<RevisionList | null>(null);
  const details = new Map<string, Promise<SpeciesDetail>>();

  let controller: AbortController | null = null;
  let sequence = 0;

  function remember(list: SpeciesList): void {
    const seen = new Set(knownSources.value);
    for (const item of list.items) for (const s of item.sources) seen.add(s);
    if (seen.size !== knownSources.value.length) knownSources.value = [...seen].sort();
  }

  /** Runs the current search; an older reply that arrives late is dropped. */
  async function runSearch(): Promise<void> {
    const mine = ++sequence;
    controller?.abort();
    controller = new AbortController();
    searching.value = true;
    try {
      const list = await libraryApi.listSpecies(speciesQueryParams(search.value), controller.signal);
      if (mine !== sequence) return;
      results.value = list;
      searchError.value = null;
      remember(list);
    } catch (error) {
      if (mine !== sequence || (isApiError(error) && error.details.aborted === true)) return;
      searchError.value = apiErrorText(error);
    } finally {
      if (mine === sequence) searching.value = false;
    }
  }

  /** Every revision, loaded once per visit (a new import shows after a reload). */
  async function loadRevisions(force = false): Promise<RevisionList> {
    if (revisions.value && !force) return revisions.value;
    revisions.value = await libraryApi.listRevisions();
    return revisions.value;
  }

  /** One species as it stands at `revision` (null: the current one); replies are kept for the visit. */
  function speciesDetail(id: string, revision: number | null = null): Promise<SpeciesDetail> {
    const key = `${id}@${revision ?? 'current'}`;
    let pending = details.get(key);
    if (!pending) {
      pending = libraryApi.getSpecies(id, revision);
      // A failure is not kept: the next call asks again.
      pending.catch(() => details.delete(key));
      details.set(key, pending);
    }
    return pending;
  }

  /** After an accepted amendment: the current revision moved, so current replies are stale. */
  function forgetCurrent(): void {
    for (const key of [...details.keys()]) if (key.endsWith('@current')) details.delete(key);
    revisions.value = null;
  }

  return {
    forgetCurrent,
    search,
    columns,
    results,
    searching,
    searchError,
    knownSources,
    revisions,
    runSearch,
    loadRevisions,
    speciesDetail,
  };
});
