import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import type {
  CreateSetInput,
  ReactionSet,
  SetEvaluation,
  SetItemInput,
  SetList,
  SetListQuery,
} from '@shared/schemas/reaction-sets';
import * as setsApi from '@/api/reaction-sets';
import { reapplyEdit } from '@shared/reaction-sets/diff';
import { draftKey, draftOf, saveFailure, stateOf, type SaveStatus, type SetDraft } from '@/lib/set-autosave';

/** Pause after the last keystroke before a save is sent. */
export const AUTOSAVE_DELAY_MS = 800;

/**
 * Reaction sets: the team's list, and the one set open on its page with its draft and autosave.
 * A save names the version it edited; when someone saved first the server refuses it (409) and
 * the store keeps both sides, so the page can show what changed and let the user choose.
 */
export const useReactionSetStore = defineStore('reaction-sets', () => {
  // ─── The team's list ───
  const list = ref<SetList>({ items: [], total: 0 });
  const listLoading = ref(false);

  async function loadList(teamId: string, query: Partial<SetListQuery>): Promise<void> {
    listLoading.value = true;
    try {
      list.value = await setsApi.listSets(teamId, query);
    } finally {
      listLoading.value = false;
    }
  }

  // ─── The set on its page ───
  const teamId = ref<string | null>(null);
  const current = shallowRef<ReactionSet | null>(null);
  const draft = ref<SetDraft | null>(null);
  const status = ref<SaveStatus>({ state: 'saved' });
  const conflict = shallowRef<setsApi.SetConflict | null>(null);
  const results = shallowRef<SetEvaluation | null>(null);
  const resultsLoading = ref(false);
  /** After a reapplied edit: places both edits changed differently (the reapplied one won there). */
  const overlaps = ref<string[]>([]);
  /** Whether the page may edit (members and above); viewers' drafts are never saved. */
  const editable = ref(false);
  let timer: ReturnType<typeof setTimeout> | null = null;
  let inFlight: Promise<void> | null = null;

  /** The draft differs from the set as last saved: the one rule behind both the status and the page's note. */
  const dirty = computed(
    () => draft.value !== null && current.value !== null && draftKey(draft.value) !== draftKey(current.value),
  );

  // The store sees every change of the draft itself, whoever made it (a field, the items editor, a
  // radio group, a replay after a conflict): an edit can never sit in the draft unknown to the autosave.
  watch(
    () => (draft.value ? draftKey(draft.value) : null),
    () => {
      if (editable.value) edited();
    },
  );

  function cancelTimer(): void {
    if (timer !== null) clearTimeout(timer);
    timer = null;
  }

  async function refreshResults(): Promise<void> {
    if (!current.value || !teamId.value) return;
    const set = current.value;
    resultsLoading.value = true;
    try {
      const evaluation = await setsApi.getSetResults(teamId.value, set.id);
      // A reply for a version that has since been replaced is dropped.
      if (current.value?.id === set.id && evaluation.version === current.value.version) results.value = evaluation;
    } finally {
      resultsLoading.value = false;
    }
  }

  function adopt(set: ReactionSet, keepDraft = false): void {
    current.value = set;
    if (!keepDraft || !draft.value) draft.value = draftOf(set);
  }

  async function open(forTeam: string, setId: string): Promise<void> {
    cancelTimer();
    teamId.value = forTeam;
    conflict.value = null;
    overlaps.value = [];
    status.value = { state: 'saved' };
    results.value = null;
    if (current.value?.id !== setId) {
      current.value = null;
      draft.value = null;
    }
    adopt(await setsApi.getSet(forTeam, setId));
    await refreshResults();
  }

  function close(): void {
    cancelTimer();
    status.value = { state: 'saved' };
    current.value = null;
    draft.value = null;
    results.value = null;
    conflict.value = null;
  }

  /**
   * After a change of the draft (called by the store's own watcher): saves after a short pause,
   * never while a conflict is open. A draft back to the saved set is simply saved, whatever failed before.
   */
  function edited(): void {
    if (status.value.state === 'conflict') return;
    if (inFlight) {
      // The running save re-checks the draft when it returns; only say that more is to come.
      if (dirty.value && status.value.state !== 'saving') status.value = { state: 'pending' };
      return;
    }
    cancelTimer();
    if (!dirty.value) {
      status.value = { state: 'saved' };
      return;
    }
    status.value = { state: 'pending' };
    timer = setTimeout(() => void save(), AUTOSAVE_DELAY_MS);
  }

  /** Sends the draft now. Saves run one at a time; an edit made meanwhile is saved after. */
  async function save(): Promise<void> {
    cancelTimer();
    if (inFlight) {
      await inFlight;
      if (dirty.value && status.value.state !== 'conflict') return save();
      return;
    }
    if (!draft.value || !current.value || !teamId.value || !dirty.value) return;
    const sent = draftOf(draft.value);
    const sentKey = draftKey(sent);
    const base = current.value;
    status.value = { state: 'saving' };
    inFlight = (async () => {
      try {
        const saved = await setsApi.updateSet(teamId.value!, base.id, { version: base.version, ...sent });
        // The page was closed or moved to another set meanwhile: nothing here to update.
        if (current.value?.id !== base.id || !draft.value) return;
        // No edit since sending: take the server's copy (trimmed text, ids) as the draft, so the
        // page is not left "not saved" by differences the server made itself. An edit made
        // meanwhile stays in the draft and goes out with the next save.
        adopt(saved, draftKey(draft.value) !== sentKey);
        void refreshResults().catch(() => undefined);
      } catch (error) {
        if (current.value?.id !== base.id) return;
        const stale = setsApi.conflictOf(error);
        if (stale) {
          conflict.value = stale;
          status.value = {
            state: 'conflict',
            reason: `${stale.current.updatedBy} saved version ${stale.currentVersion} while you were editing.`,
          };
        } else status.value = { state: 'failed', ...saveFailure(error, sent) };
      } finally {
        inFlight = null;
      }
    })();
    await inFlight;
    // The status follows the same comparison as the page's note: saved only when the draft equals
    // the set as saved; an edit made while sending is saved next.
    const after = status.value as SaveStatus;
    const editedSince = draft.value !== null && draftKey(draft.value) !== sentKey;
    if (after.state === 'saving' || after.state === 'pending' || (after.state === 'failed' && editedSince)) edited();
  }

  /** Drops the local edit and shows the set as it is now on the server. */
  function reloadFromConflict(): void {
    if (!conflict.value) return;
    const theirs = conflict.value.current;
    conflict.value = null;
    overlaps.value = [];
    current.value = theirs;
    draft.value = draftOf(theirs);
    status.value = { state: 'saved' };
    void refreshResults().catch(() => undefined);
  }

  /**
   * Replays the local edit (from the version it started on to the draft) on top of the version
   * that won, and saves that. Places both sides changed are listed in `overlaps` for the page.
   */
  async function reapplyAfterConflict(): Promise<void> {
    if (!conflict.value || !current.value || !draft.value) return;
    const theirs = conflict.value.current;
    const { state, overlaps: both } = reapplyEdit(stateOf(current.value), stateOf(draft.value), stateOf(theirs));
    overlaps.value = both;
    current.value = theirs;
    draft.value = draftOf(state);
    conflict.value = null;
    status.value = { state: 'pending' };
    await save();
  }

  /** Replaces the set after a server action that made a new version (restore, move to latest). */
  function replaced(set: ReactionSet): void {
    cancelTimer();
    conflict.value = null;
    adopt(set);
    status.value = { state: 'saved' };
    void refreshResults().catch(() => undefined);
  }

  async function create(forTeam: string, input: CreateSetInput): Promise<ReactionSet> {
    return setsApi.createSet(forTeam, input);
  }

  /**
   * "Save to a set": adds items to a new set, or to the end of an existing one (a save of its
   * current version; a stale one is retried once on the newest).
   */
  async function addItems(
    forTeam: string,
    target: { setId: string } | { title: string },
    items: SetItemInput[],
  ): Promise<ReactionSet> {
    if ('title' in target) return setsApi.createSet(forTeam, { title: target.title, items });
    const put = (set: ReactionSet) =>
      setsApi.updateSet(forTeam, set.id, { version: set.version, items: [...set.items, ...items] });
    const set = await setsApi.getSet(forTeam, target.setId);
    try {
      return await put(set);
    } catch (error) {
      const stale = setsApi.conflictOf(error);
      if (!stale) throw error;
      return put(stale.current);
    }
  }

  return {
    list,
    listLoading,
    loadList,
    teamId,
    editable,
    current,
    draft,
    status,
    conflict,
    overlaps,
    results,
    resultsLoading,
    dirty,
    open,
    close,
    edited,
    save,
    reloadFromConflict,
    reapplyAfterConflict,
    replaced,
    refreshResults,
    create,
    addItems,
  };
});
