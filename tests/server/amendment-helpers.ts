import type TestAgent from 'supertest/lib/agent';
import type { AmendmentEntry } from '@shared/schemas/amendments';
import type { DemoRole, TestApp } from './helpers';

/** Proposes entries as `author` and opens them for review; returns the amendment's id. */
export async function proposeOpen(
  t: TestApp,
  entries: AmendmentEntry[] | Record<string, unknown>[],
  options: { author?: DemoRole | TestAgent; title?: string } = {},
): Promise<string> {
  const author = typeof options.author === 'object' ? options.author : await t.signIn(options.author ?? 'member');
  const created = await author
    .post('/api/v1/amendments')
    .send({ title: options.title ?? 'Test amendment', rationale: 'A change made for a test.', entries });
  if (created.status !== 201) throw new Error(`create: ${created.status} ${JSON.stringify(created.body)}`);
  const opened = await author.post(`/api/v1/amendments/${created.body.id}/open`).send({});
  if (opened.status !== 200) throw new Error(`open: ${opened.status} ${JSON.stringify(opened.body)}`);
  return created.body.id as string;
}

/**
 * The one way a test changes the library: a member proposes the entries, the curator accepts.
 * Returns the amendment's id and the revision its acceptance made.
 */
export async function acceptEntries(
  t: TestApp,
  entries: AmendmentEntry[] | Record<string, unknown>[],
  title = 'Test amendment',
): Promise<{ id: string; revision: number }> {
  const id = await proposeOpen(t, entries, { title });
  const curator = await t.signIn('curator');
  const accepted = await curator.post(`/api/v1/amendments/${id}/accept`).send({});
  if (accepted.status !== 200) throw new Error(`accept: ${accepted.status} ${JSON.stringify(accepted.body)}`);
  return { id, revision: accepted.body.resultRevision as number };
}
