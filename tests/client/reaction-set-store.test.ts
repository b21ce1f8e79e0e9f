/**
 * The set page's autosave (useReactionSetStore) against a fake server that behaves like the real
 * PUT route: the request is checked with the shared schema (400 naming the path), the version is
 * checked (409 with the set as it is), text is trimmed and ids given by the schema, and the reply
 * goes through JSON and the reply schema as http.ts does. Timers are faked; no Vue component.
 */
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { nextTick } from 'vue';
import {
  reactionSetSchema,
  updateSetInputSchema,
  type ReactionSet,
  type SetEvaluation,
  type UpdateSetInput,
} from '@shared/schemas/reaction-sets';
import { ApiError } from '@/api/api-error';
import type * as SetsApi from '@/api/reaction-sets';

const server = vi.hoisted(() => ({
  set: null as unknown as ReactionSet,
  offline: false,
  /** Replies are held until `release()` when set, to edit while a save is on its way. */
  hold: false,
  waiting: [] as (() => void)[],
  puts: 0,
}));

function release(): void {
  const waiting = server.waiting.splice(0);
  for (const go of waiting) go();
}

vi.mock('@/api/reaction-sets', async (importOriginal) => {
  const actual = await importOriginal<typeof SetsApi>();
  const reply = (set: ReactionSet) => reactionSetSchema.parse(JSON.parse(JSON.stringify(set)));
  return {
    ...actual,
    getSet: vi.fn(async () => reply(server.set)),
    getSetResults: vi.fn(async (): Promise<SetEvaluation> => ({
      version: server.set.version,
      libraryRevision: 1,
      latestRevision: 1,
      evaluatedAt: new Date().toISOString(),
      results: [],
      sources: [],
      cautions: [],
    })),
    updateSet: vi.fn(async (_team: string, _id: string, input: UpdateSetInput) => {
      server.puts++;
      if (server.hold) await new Promise<void>((resolve) => server.waiting.push(resolve));
      if (server.offline) throw new ApiError(0, 'network_error', 'The server could not be reached.');
      const parsed = updateSetInputSchema.safeParse(JSON.parse(JSON.stringify(input)));
      if (!parsed.success) {
        const issues = parsed.error.issues.map((i) => ({ path: ['body', ...i.path], message: i.message }));
        throw new ApiError(400, 'validation_failed', `Check ${issues[0]!.path.join('.')}: ${issues[0]!.message}`, {
          issues,
        });
      }
      if (parsed.data.version !== server.set.version)
        throw new ApiError(409, 'conflict', 'Changed by someone else.', {
          currentVersion: server.set.version,
          current: server.set,
        });
      const { version: _v, ...fields } = parsed.data;
      server.set = {
        ...server.set,
        ...fields,
        items: (fields.items ?? server.set.items).map((item, i) => ({ ...item, id: item.id ?? `srv-${i}` })),
        version: server.set.version + 1,
        updatedBy: 'Milo Member',
      };
      return reply(server.set);
    }),
  };
});

const { useReactionSetStore, AUTOSAVE_DELAY_MS } = await import('@/stores/reaction-sets');

const METHANE = 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)';
const PROPANE = 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)';

function startingSet(): ReactionSet {
  return {
    id: '11111111-1111-4111-8111-111111111111',
    teamId: '22222222-2222-4222-8222-222222222222',
    title: 'Burners',
    description: '',
    tags: [],
    items: [{ kind: 'reaction', id: 'r1', equation: METHANE }],
    revision: 1,
    version: 1,
    owner: 'Milo Member',
    createdAt: '2026-12-02T10:00:00.000Z',
    updatedBy: 'Milo Member',
    updatedAt: '2026-12-02T10:00:00.000Z',
  };
}

async function openStore() {
  const store = useReactionSetStore();
  store.editable = true;
  await store.open(server.set.teamId, server.set.id);
  return store;
}

/** Lets watchers run, the autosave pause pass and the save's promises settle. */
async function settle(): Promise<void> {
  for (let i = 0; i < 4; i++) {
    await nextTick();
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
  }
}

beforeEach(() => {
  vi.useFakeTimers();
  setActivePinia(createPinia());
  server.set = startingSet();
  server.offline = false;
  server.hold = false;
  server.waiting = [];
  server.puts = 0;
});
afterEach(() => {
  vi.useRealTimers();
});

describe('useReactionSetStore autosave', () => {
  it('saves an added reaction item and then calls the draft saved, with no unsaved note left', async () => {
    const store = await openStore();
    store.draft!.items = [...store.draft!.items, { kind: 'reaction', id: 'new-1', equation: PROPANE }];
    await nextTick();
    expect(store.status.state).toBe('pending');
    expect(store.dirty).toBe(true);
    await settle();
    expect(server.set.version).toBe(2);
    expect(store.status).toEqual({ state: 'saved' });
    expect(store.dirty).toBe(false);
    expect(store.current!.items.map((i) => i.id)).toEqual(['r1', 'new-1']);
  });

  it('edits an item in place (the items editor writes into the draft) and saves it', async () => {
    const store = await openStore();
    const item = store.draft!.items[0]!;
    if (item.kind !== 'reaction') throw new Error('reaction expected');
    item.temperature = { value: 350, unit: 'K' };
    await settle();
    expect(server.set.items[0]).toMatchObject({ temperature: { value: 350, unit: 'K' } });
    expect(store.status.state).toBe('saved');
    expect(store.dirty).toBe(false);
  });

  it('takes the server copy when it trims text, so the draft is not left unsaved', async () => {
    const store = await openStore();
    store.draft!.title = 'Burners and boilers  ';
    await settle();
    expect(server.set.title).toBe('Burners and boilers');
    expect(store.draft!.title).toBe('Burners and boilers');
    expect(store.status.state).toBe('saved');
    expect(store.dirty).toBe(false);
  });

  it('keeps an edit made while a save is on its way and saves it next, never losing it', async () => {
    const store = await openStore();
    server.hold = true;
    store.draft!.items = [...store.draft!.items, { kind: 'note', id: 'n1', text: 'first' }];
    await settle();
    expect(store.status.state).toBe('saving');
    const note = store.draft!.items[1]!;
    if (note.kind !== 'note') throw new Error('note expected');
    note.text = 'first, then more';
    await nextTick();
    server.hold = false;
    release();
    await settle();
    expect(server.puts).toBe(2);
    expect(server.set.items[1]).toMatchObject({ text: 'first, then more' });
    expect(store.status.state).toBe('saved');
    expect(store.dirty).toBe(false);
  });

  it('names the item and the field when the server refuses the input, and saves once it is fixed', async () => {
    const store = await openStore();
    store.draft!.items = [...store.draft!.items, { kind: 'derivation', id: 'd1', target: '' }];
    await settle();
    expect(store.status.state).toBe('failed');
    const failed = store.status as { reason: string; retry: boolean };
    expect(failed.retry).toBe(false);
    expect(failed.reason).toContain('item 2 (Derivation: )');
    expect(failed.reason).toContain('Target reaction: Type the target reaction.');
    expect(store.dirty).toBe(true);
    const item = store.draft!.items[1]!;
    if (item.kind !== 'derivation') throw new Error('derivation expected');
    item.target = 'CO(g) + 1/2 O2(g) -> CO2(g)';
    await settle();
    expect(store.status.state).toBe('saved');
    expect(server.set.items).toHaveLength(2);
  });

  it('calls a draft saved again when the refused edit is undone', async () => {
    const store = await openStore();
    store.draft!.items = [...store.draft!.items, { kind: 'reaction', id: 'x', equation: '' }];
    await settle();
    expect(store.status.state).toBe('failed');
    store.draft!.items = store.draft!.items.slice(0, 1);
    await settle();
    expect(store.status.state).toBe('saved');
    expect(store.dirty).toBe(false);
  });

  it('says offline, keeps the edit, and sends it again on retry', async () => {
    const store = await openStore();
    server.offline = true;
    store.draft!.description = 'Scale-up notes';
    await settle();
    expect(store.status).toMatchObject({ state: 'failed', retry: true });
    expect((store.status as { reason: string }).reason).toContain('cannot be reached');
    expect(store.dirty).toBe(true);
    server.offline = false;
    await store.save();
    expect(store.status.state).toBe('saved');
    expect(server.set.description).toBe('Scale-up notes');
  });

  it('shows a stale save as a conflict, overwrites nothing, and reapplies the edit on top', async () => {
    const store = await openStore();
    // Someone else saves version 2 meanwhile.
    server.set = { ...server.set, version: 2, description: 'changed elsewhere', updatedBy: 'Tara Admin' };
    store.draft!.title = 'Burners (renamed)';
    await settle();
    expect(store.status.state).toBe('conflict');
    expect(server.set.title).toBe('Burners');
    // No save goes out while the conflict is open, whatever is typed.
    const puts = server.puts;
    store.draft!.tags = ['hot'];
    await settle();
    expect(server.puts).toBe(puts);
    await store.reapplyAfterConflict();
    await settle();
    expect(store.status.state).toBe('saved');
    expect(server.set).toMatchObject({ title: 'Burners (renamed)', description: 'changed elsewhere', tags: ['hot'] });
  });

  it('drops the local edit on reload after a conflict and shows the set as saved', async () => {
    const store = await openStore();
    server.set = { ...server.set, version: 2, description: 'changed elsewhere' };
    store.draft!.title = 'Mine';
    await settle();
    store.reloadFromConflict();
    await settle();
    expect(store.draft!.title).toBe('Burners');
    expect(store.draft!.description).toBe('changed elsewhere');
    expect(store.status.state).toBe('saved');
    expect(store.dirty).toBe(false);
  });

  it('never saves the draft of a reader who may not edit', async () => {
    const store = await openStore();
    store.editable = false;
    store.draft!.title = 'Not mine to change';
    await settle();
    expect(server.puts).toBe(0);
  });
});
