/**
 * The autosave of a set page as data, without Vue: what the page shows (saved, saving, not saved
 * and why) follows from the last reply and whether the draft moved on since it was sent. Pure, so
 * the rules are tested without a server.
 */
import { canonicalJson } from '@shared/reaction-sets/diff';
import type { SetItem, SetItemInput, SetRevision, SetState } from '@shared/schemas/reaction-sets';

/** The part of a set people edit on its page. */
export interface SetDraft {
  title: string;
  description: string;
  tags: string[];
  items: SetItemInput[];
  revision: SetRevision;
}

export type SaveStatus =
  | { state: 'saved' }
  | { state: 'saving' }
  /** Edited, waiting for the pause before saving. */
  | { state: 'pending' }
  /** Not saved: why, and whether trying again can help. */
  | { state: 'failed'; reason: string; retry: boolean }
  /** Someone else saved first: nothing was overwritten; the page asks to reload or reapply. */
  | { state: 'conflict'; reason: string };

/** Words for the status line beside the title. */
export function saveStatusWords(status: SaveStatus): string {
  switch (status.state) {
    case 'saved':
      return 'All changes saved';
    case 'saving':
      return 'Saving…';
    case 'pending':
      return 'Not saved yet: saving after a short pause';
    case 'failed':
      return `Not saved: ${status.reason}`;
    case 'conflict':
      return `Not saved: ${status.reason}`;
  }
}

/**
 * A stable text of a draft, to tell whether it changed since a save was sent: keys sorted and
 * undefined left out, so the server's copy of the same items (keys in its schema's order) compares equal.
 */
export function draftKey(draft: SetDraft): string {
  return canonicalJson([draft.title, draft.description, draft.tags, draft.items, draft.revision]);
}

/** A copy of a set's editable fields (items deep-copied, so edits never touch the server copy). */
export function draftOf(set: SetDraft): SetDraft {
  return {
    title: set.title,
    description: set.description,
    tags: [...set.tags],
    // JSON, not structuredClone: the items may be Vue proxies, which structuredClone refuses.
    items: JSON.parse(JSON.stringify(set.items)) as SetItemInput[],
    revision: set.revision,
  };
}

/**
 * A draft as a set state (what the shared diff compares). Items the page added carry an id from
 * the page already; one without (never expected) gets a stable stand-in so the diff still works.
 */
export function stateOf(draft: SetDraft): SetState {
  return {
    title: draft.title,
    description: draft.description,
    tags: draft.tags,
    items: draft.items.map((item, i) => ({ ...item, id: item.id ?? `unsaved-${i}` }) as SetItem),
    revision: draft.revision,
  };
}
