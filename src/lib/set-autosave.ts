/**
 * The autosave of a set page as data, without Vue: what the page shows (saved, saving, not saved
 * and why) follows from the last reply and whether the draft moved on since it was sent. Pure, so
 * the rules are tested without a server.
 */
import { canonicalJson, itemLabel } from '@shared/reaction-sets/diff';
import type { SetItem, SetItemInput, SetRevision, SetState } from '@shared/schemas/reaction-sets';
import { ApiError } from '@/api/api-error';
import { apiErrorText, retryAfterSeconds } from '@/lib/api-error-words';

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

/** The fields of the set and of its items as the page labels them, for messages about a save. */
const FIELD_WORDS: Record<string, string> = {
  title: 'Title',
  description: 'Description',
  tags: 'Tags',
  revision: 'Library revision',
  label: 'Label',
  equation: 'Equation',
  target: 'Target reaction',
  temperature: 'Temperature',
  deltaH: 'ΔH',
  uncertainty: 'Uncertainty',
  unit: 'Unit',
  source: 'Where the value comes from',
  text: 'Note',
  using: 'Derive from',
  reactions: 'Given reactions',
  amounts: 'Amounts',
  route: 'Route',
};

function fieldWords(path: readonly unknown[]): string {
  const words = path.filter((p): p is string => typeof p === 'string' && p !== 'value').map((p) => FIELD_WORDS[p] ?? p);
  return words.join(', ');
}

/**
 * Where a refused save went wrong, in the page's words: "item 2 (Derivation: …), Target reaction:
 * Type the target reaction." A validation reply names its place as a path (["body", "items", 1,
 * "target"]); the item is found in the draft that was sent, so the words match what the user sees.
 */
export function validationWords(error: ApiError, sent: SetDraft): string | null {
  const issues = error.details.issues;
  if (error.code !== 'validation_failed' || !Array.isArray(issues) || issues.length === 0) return null;
  const sentences = issues.slice(0, 3).map((issue: unknown) => {
    const { path, message } = (issue ?? {}) as { path?: unknown; message?: unknown };
    const parts = Array.isArray(path) ? path.filter((p) => p !== 'body') : [];
    const text = typeof message === 'string' ? message : 'not valid';
    if (parts[0] === 'items' && typeof parts[1] === 'number') {
      const item = sent.items[parts[1]];
      const about = item ? ` (${itemLabel({ ...item, id: item.id ?? '' } as SetItem)})` : '';
      const field = fieldWords(parts.slice(2));
      return `item ${parts[1] + 1}${about}${field ? `, ${field}` : ''}: ${text}`;
    }
    const field = fieldWords(parts);
    return field ? `${field}: ${text}` : text;
  });
  const more = issues.length > 3 ? ` (and ${issues.length - 3} more)` : '';
  return `${sentences.join('; ')}${more}`;
}

/**
 * Why a save failed, and whether sending it again can help: not while the input is refused, yes
 * when offline, when the server was busy or failed. The edit stays in the page either way.
 */
export function saveFailure(error: unknown, sent: SetDraft): { reason: string; retry: boolean } {
  if (!(error instanceof ApiError)) return { reason: apiErrorText(error), retry: true };
  if (error.status === 0)
    return {
      reason:
        'the server cannot be reached (offline?). Your edit is kept on this page and sent again when you are back.',
      retry: true,
    };
  if (error.status === 429 || error.status === 503) {
    const wait = retryAfterSeconds(error);
    return {
      reason: `the server is busy${wait === undefined ? '' : `; try again in ${wait} s`}. Your edit is kept on this page.`,
      retry: true,
    };
  }
  if (error.status >= 500) return { reason: `${apiErrorText(error)} Your edit is kept on this page.`, retry: true };
  const fields = validationWords(error, sent);
  if (fields) return { reason: `fix ${fields}`, retry: false };
  return { reason: apiErrorText(error), retry: false };
}
