import { describe, expect, it, vi } from 'vitest';
import { balanceBatchRequest } from '@shared/chemistry/index';
import type { BalanceBatchLine } from '@shared/schemas/balance-batch';
import { ApiError } from '@/api/api-error';
import { runBatch, toBatchRow } from '@/lib/run-batch';
import { batchLines, equationLines } from '@/lib/batch-lines';

// The equations are textbook staples (combustion of propane and of methane; water from its elements) — common practice, no source.
const input = [
  'C3H8 + O2 -> CO2 + H2O',
  '',
  '# skipped',
  'H2 + Xx2 -> H2O',
  'CH4 + O2 -> CO2 + H2O',
  'H2 + O2 -> H2O',
].join('\n');
const lines = equationLines(batchLines(input, 'text'));
/** What the server answers for a chunk: the same adapter the route uses. */
const server = async (text: string): Promise<BalanceBatchLine[]> => balanceBatchRequest({ text }).results;

describe('runBatch', () => {
  it('sends chunks and maps chunk line numbers back to the input', async () => {
    const send = vi.fn(server);
    const progress: Array<[number, number]> = [];
    const { rows, local } = await runBatch(lines, { send, chunkSize: 2, onProgress: (d, t) => progress.push([d, t]) });
    expect(send).toHaveBeenCalledTimes(2);
    expect(local).toBe(false);
    expect(rows.map((r) => [r.line, r.status])).toEqual([
      [1, 'balanced'],
      [4, 'error'],
      [5, 'balanced'],
      [6, 'balanced'],
    ]);
    expect(rows[0]!.equationText).toBe('C3H8 + 5 O2 -> 3 CO2 + 4 H2O');
    expect(rows[0]!.equationHtml).toBe(
      'C<sub>3</sub>H<sub>8</sub> + 5 O<sub>2</sub> → 3 CO<sub>2</sub> + 4 H<sub>2</sub>O',
    );
    // The row keeps the problem without its place; the input's own line and the column sit beside it.
    expect(rows[1]).toMatchObject({ column: 6, message: "Unknown element symbol 'Xx'" });
    expect(progress.at(-1)).toEqual([4, 4]);
  });

  it('falls back to the browser when the server has no batch endpoint', async () => {
    const send = vi.fn(async (): Promise<BalanceBatchLine[]> => {
      throw new ApiError(404, 'not_found', 'No such route.');
    });
    const { rows, local } = await runBatch(lines, { send, chunkSize: 2 });
    expect(local).toBe(true);
    expect(send).toHaveBeenCalledTimes(1);
    expect(rows).toHaveLength(4);
    expect(rows[3]!.equationText).toBe('2 H2 + O2 -> 2 H2O');
  });

  it('passes other server refusals on', async () => {
    const send = async (): Promise<BalanceBatchLine[]> => {
      throw new ApiError(413, 'payload_too_large', 'Too large.');
    };
    await expect(runBatch(lines, { send })).rejects.toMatchObject({ code: 'payload_too_large' });
  });
});

describe('toBatchRow', () => {
  it('shows a line over the term limit as unreadable, with the limit in words and no column', () => {
    const long = `${Array.from({ length: 100 }, () => 'H').join(' + ')} -> H2`;
    const [item] = balanceBatchRequest({ text: long }).results;
    expect(toBatchRow(item!, 12)).toMatchObject({
      line: 12,
      status: 'error',
      column: null,
      message: 'This equation has 101 terms; the limit is 80.',
    });
  });

  it('describes several balancings and impossible lines from the typed reply', () => {
    const [several, none] = balanceBatchRequest({ text: 'C + O2 -> CO + CO2\nH2 -> O2' }).results;
    expect(toBatchRow(several!, 1)).toMatchObject({
      status: 'multiple',
      equationHtml: null,
      message: expect.stringMatching(/^2 independent/),
    });
    expect(toBatchRow(none!, 2)).toMatchObject({
      status: 'impossible',
      message: expect.stringMatching(/Hydrogen \(H\)/),
    });
  });
});
