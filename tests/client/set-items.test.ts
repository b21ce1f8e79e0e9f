import { describe, expect, it } from 'vitest';
import { derivationItem, itemOpenLink, workbenchItems, workbenchQuery } from '@/lib/set-items';
import { draftKey, draftOf, saveStatusWords, stateOf } from '@/lib/set-autosave';

describe('workbenchItems', () => {
  it('keeps the reaction, leaving out the reference temperature', () => {
    expect(workbenchItems({ equation: 'A(g) -> B(g)', temperature: { value: 298.15, unit: 'K' } })).toEqual([
      { kind: 'reaction', equation: 'A(g) -> B(g)' },
    ]);
  });

  it('keeps another temperature and adds batch quantities when amounts were typed', () => {
    const items = workbenchItems({
      equation: 'A(g) -> B(g)',
      temperature: { value: 80, unit: 'C' },
      amounts: [{ term: 0, value: 2, unit: 'mol' }],
    });
    expect(items).toEqual([
      { kind: 'reaction', equation: 'A(g) -> B(g)', temperature: { value: 80, unit: 'C' } },
      {
        kind: 'quantities',
        equation: 'A(g) -> B(g)',
        temperature: { value: 80, unit: 'C' },
        amounts: [{ term: 0, value: 2, unit: 'mol' }],
      },
    ]);
  });
});

describe('derivationItem', () => {
  it('keeps only what was chosen', () => {
    expect(derivationItem({ target: 'X -> Y' })).toEqual({ kind: 'derivation', target: 'X -> Y' });
    expect(derivationItem({ target: 'X -> Y', using: 'library', route: null, reactions: [] })).toEqual({
      kind: 'derivation',
      target: 'X -> Y',
      using: 'library',
      route: null,
    });
  });
});

describe('itemOpenLink and workbenchQuery', () => {
  it('open a reaction back in the workbench with its inputs', () => {
    const link = itemOpenLink({ kind: 'reaction', equation: 'A(g) -> B(g)', temperature: { value: 350, unit: 'K' } });
    expect(link).toEqual({ name: 'workbench', query: { equation: 'A(g) -> B(g)', temperature: '350 K' } });
    expect(workbenchQuery((link as { query: Record<string, string> }).query)).toEqual({
      equation: 'A(g) -> B(g)',
      temperature: { value: 350, unit: 'K' },
    });
  });

  it('give nothing for notes, empty equations or a query without an equation', () => {
    expect(itemOpenLink({ kind: 'note', text: 'x' })).toBeNull();
    expect(itemOpenLink({ kind: 'reaction', equation: '  ' })).toBeNull();
    expect(workbenchQuery({ temperature: '350 K' })).toBeNull();
    expect(workbenchQuery({ equation: 'A -> B', temperature: 'hot' })).toEqual({
      equation: 'A -> B',
      temperature: null,
    });
  });
});

describe('set autosave helpers', () => {
  const draft = {
    title: 'T',
    description: '',
    tags: ['a'],
    items: [{ kind: 'note' as const, id: 'n1', text: 'x' }],
    revision: 3 as const,
  };

  it('copy a draft deeply, so editing the copy leaves the saved set alone', () => {
    const copy = draftOf(draft);
    (copy.items[0] as { text: string }).text = 'changed';
    copy.tags.push('b');
    expect(draft.items[0]!.text).toBe('x');
    expect(draft.tags).toEqual(['a']);
    expect(draftKey(copy)).not.toBe(draftKey(draft));
    expect(draftKey(draftOf(draft))).toBe(draftKey(draft));
  });

  it('compare a draft with the server copy of the same items whatever the order of their keys', () => {
    const server = { ...draft, items: [{ id: 'n1', text: 'x', kind: 'note' as const, label: undefined }] };
    expect(draftKey(server)).toBe(draftKey(draft));
  });

  it('give every item an id for the diff', () => {
    const state = stateOf({ ...draft, items: [{ kind: 'note', text: 'no id yet' }] });
    expect(state.items[0]!.id).toBe('unsaved-0');
  });

  it('say why a save did not happen', () => {
    expect(saveStatusWords({ state: 'saved' })).toBe('All changes saved');
    expect(saveStatusWords({ state: 'failed', reason: 'The server is not answering.', retry: true })).toBe(
      'Not saved: The server is not answering.',
    );
    expect(saveStatusWords({ state: 'conflict', reason: 'Ada saved version 4 while you were editing.' })).toContain(
      'Ada saved version 4',
    );
  });
});
