import type { SetDiff, SetItem, SetState } from '../schemas/reaction-sets';

/**
 * Comparing two states of a reaction set (two versions, or the page's edit and the server's
 * current set), and replaying one edit on top of another. Pure: the server's version diff and
 * the page's conflict view use the same functions.
 */

const kindWords: Record<SetItem['kind'], string> = {
  reaction: 'Reaction',
  'given-reaction': 'Given reaction',
  derivation: 'Derivation',
  quantities: 'Quantities',
  note: 'Note',
  'calorimetry-run': 'Calorimetry run',
};

/** Words for an item in lists and diffs: its label, else its kind and what it is about. */
export function itemLabel(item: SetItem): string {
  const kind = kindWords[item.kind];
  if (item.label) return `${kind}: ${item.label}`;
  switch (item.kind) {
    case 'reaction':
    case 'given-reaction':
    case 'quantities':
      return `${kind}: ${item.equation}`;
    case 'derivation':
      return `${kind}: ${item.target}`;
    case 'note': {
      const first = item.text.split('\n')[0]!.trim();
      return `${kind}: ${first.length > 60 ? `${first.slice(0, 59)}…` : first || '(empty)'}`;
    }
    case 'calorimetry-run':
      return item.runKind === 'bomb'
        ? `${kind}: combustion of ${item.inputs.sample.formula}(${item.inputs.sample.phase})`
        : `${kind}: ${item.inputs.reaction.equation}`;
  }
}

/** JSON with keys in a fixed order, so equal values compare equal whatever order they were built in. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

const same = (a: unknown, b: unknown) => canonicalJson(a) === canonicalJson(b);

/** The top-level fields of an item that differ between two versions of it. */
function changedFields(before: SetItem, after: SetItem): string[] {
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  keys.delete('id');
  const a = before as unknown as Record<string, unknown>;
  const b = after as unknown as Record<string, unknown>;
  return [...keys].filter((k) => !same(a[k], b[k])).sort();
}

const FIELDS = ['title', 'description', 'tags', 'revision'] as const;

/** What changed from `before` to `after`: fields, items added, removed and changed (by id), order. */
export function diffSetStates(before: SetState, after: SetState): SetDiff {
  const fields = FIELDS.filter((f) => !same(before[f], after[f])).map((f) => ({
    field: f,
    before: before[f],
    after: after[f],
  }));
  const beforeById = new Map(before.items.map((i) => [i.id, i]));
  const afterById = new Map(after.items.map((i) => [i.id, i]));
  const items: SetDiff['items'] = [];
  for (const item of after.items) {
    const old = beforeById.get(item.id);
    if (!old)
      items.push({ id: item.id, change: 'added', label: itemLabel(item), fields: [], before: null, after: item });
    else if (!same(old, item))
      items.push({
        id: item.id,
        change: 'changed',
        label: itemLabel(item),
        fields: changedFields(old, item),
        before: old,
        after: item,
      });
  }
  for (const item of before.items)
    if (!afterById.has(item.id))
      items.push({ id: item.id, change: 'removed', label: itemLabel(item), fields: [], before: item, after: null });
  const keptBefore = before.items.filter((i) => afterById.has(i.id)).map((i) => i.id);
  const keptAfter = after.items.filter((i) => beforeById.has(i.id)).map((i) => i.id);
  return { fields, items, reordered: !same(keptBefore, keptAfter) };
}

export interface Reapplied {
  state: SetState;
  /** Fields and items both edits changed differently: the replayed edit wins there, and the page says so. */
  overlaps: string[];
}

/**
 * Replays the edit `base → mine` on top of `theirs` (the set as someone else saved it meanwhile):
 * fields and items I changed take my value, items I added are added, items I removed go, and
 * everything I left alone keeps their value. Where both changed the same thing differently, mine
 * wins and the place is listed in `overlaps`, so nothing is overwritten without being shown.
 */
export function reapplyEdit(base: SetState, mine: SetState, theirs: SetState): Reapplied {
  const overlaps: string[] = [];
  const state: SetState = { ...theirs, items: [...theirs.items] };
  for (const f of FIELDS) {
    if (same(base[f], mine[f])) continue;
    if (!same(base[f], theirs[f]) && !same(theirs[f], mine[f])) overlaps.push(f);
    (state as Record<string, unknown>)[f] = mine[f];
  }
  const baseById = new Map(base.items.map((i) => [i.id, i]));
  const mineById = new Map(mine.items.map((i) => [i.id, i]));
  const theirsById = new Map(theirs.items.map((i) => [i.id, i]));
  let items = state.items;
  // Removed by me.
  for (const item of base.items) {
    if (mineById.has(item.id)) continue;
    const current = theirsById.get(item.id);
    if (current && !same(current, item)) overlaps.push(itemLabel(current));
    items = items.filter((i) => i.id !== item.id);
  }
  // Changed by me.
  items = items.map((item) => {
    const old = baseById.get(item.id);
    const edited = mineById.get(item.id);
    if (!old || !edited || same(old, edited)) return item;
    if (!same(old, item) && !same(item, edited)) overlaps.push(itemLabel(edited));
    return edited;
  });
  // Added by me (or changed by me and removed by them: kept, and said): placed after the item
  // that precedes it in my list (or first).
  mine.items.forEach((item, index) => {
    if (theirsById.has(item.id)) return;
    const old = baseById.get(item.id);
    if (old && same(old, item)) return;
    if (old) overlaps.push(itemLabel(item));
    const previous = mine.items[index - 1];
    const at = previous ? items.findIndex((i) => i.id === previous.id) + 1 : 0;
    items.splice(at, 0, item);
  });
  state.items = items;
  return { state, overlaps };
}
