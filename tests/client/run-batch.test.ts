import { describe, expect, it, vi } from 'vitest';
import { parseEquationBatch, type BatchLine } from '@shared/chemistry/index';
import { ApiError } from '@/api/api-error';
import { runBatch } from '@/lib/run-batch';
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

describe('runBatch', () => {
  it('sends chunks and maps chunk line numbers back to the input', async () => {
    const send = vi.fn(async (text: string) => parseEquationBatch(text));
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
    expect(rows[1]!.column).toBe(6);
    expect(rows[1]!.message).toMatch(/Xx/);
    // The core's own "at line 2" would name the line inside the chunk; the row keeps only the input's line.
    expect(rows[1]!.message).not.toMatch(/at (line|column)/);
    expect(progress.at(-1)).toEqual([4, 4]);
  });

  it('falls back to the browser when the server has no batch endpoint', async () => {
    const send = vi.fn(async (): Promise<BatchLine[]> => {
      throw new ApiError(404, 'not_found', 'No such route.');
    });
    const { rows, local } = await runBatch(lines, { send, chunkSize: 2 });
    expect(local).toBe(true);
    expect(send).toHaveBeenCalledTimes(1);
    expect(rows).toHaveLength(4);
    expect(rows[3]!.equationText).toBe('2 H2 + O2 -> 2 H2O');
  });

  it('passes other server refusals on', async () => {
    const send = async (): Promise<BatchLine[]> => {
      throw new ApiError(413, 'payload_too_large', 'Too large.');
    };
    await expect(runBatch(lines, { send })).rejects.toMatchObject({ code: 'payload_too_large' });
  });
});
