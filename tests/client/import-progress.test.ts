import { describe, expect, it } from 'vitest';
import type { ImportJob } from '@shared/schemas/library-io';
import { ApiError } from '@/api/api-error';
import {
  byteText,
  filesOverLimits,
  importCountText,
  importPercent,
  importPhase,
  problemRows,
  reportOfError,
  reportSummary,
  waitForImport,
} from '@/lib/import-progress';

const job = (patch: Partial<ImportJob>): ImportJob => ({
  jobId: '00000000-0000-4000-8000-000000000001',
  state: 'running',
  rowsRead: 0,
  rowsTotal: 10_000,
  report: null,
  amendmentId: null,
  error: null,
  ...patch,
});

describe('importPhase and importPercent', () => {
  it('says the files are being sent before the server answered', () => {
    expect(importPhase(null)).toBe('uploading');
    expect(importPercent(null)).toBe(0);
  });

  it('counts rows read, and keeps below 100 until the job is done', () => {
    expect(importPhase(job({ rowsRead: 2_500 }))).toBe('reading');
    expect(importPercent(job({ rowsRead: 2_500 }))).toBe(25);
    expect(importPercent(job({ rowsRead: 9_999 }))).toBe(99);
    // Every row read: the entries are checked against the library next.
    expect(importPhase(job({ rowsRead: 10_000 }))).toBe('checking');
    expect(importPercent(job({ rowsRead: 10_000 }))).toBe(99);
    expect(importPercent(job({ rowsRead: 10_000, state: 'done' }))).toBe(100);
  });

  it('reads a failed job as failed, with the share it reached', () => {
    const failed = job({ rowsRead: 10_000, state: 'failed' });
    expect(importPhase(failed)).toBe('failed');
    expect(importPercent(failed)).toBe(100);
    expect(importPercent(job({ rowsTotal: 0 }))).toBe(0);
  });

  it('writes the count with thousands separators and one row in the singular', () => {
    expect(importCountText(job({ rowsRead: 1_234 }))).toBe('1,234 of 10,000 rows read');
    expect(importCountText(job({ rowsRead: 1, rowsTotal: 1 }))).toBe('1 of 1 row read');
  });
});

describe('waitForImport', () => {
  it('reads the job until it ends, waiting longer each time up to the cap', async () => {
    const states = [job({ rowsRead: 4_000 }), job({ rowsRead: 10_000 }), job({ state: 'done', rowsRead: 10_000 })];
    const waits: number[] = [];
    const seen: number[] = [];
    const last = await waitForImport(job({}), async () => states.shift()!, {
      intervalMs: 200,
      maxIntervalMs: 400,
      sleep: async (ms) => void waits.push(ms),
      onUpdate: (j) => seen.push(j.rowsRead),
    });
    expect(last.state).toBe('done');
    expect(waits).toEqual([200, 300, 400]);
    expect(seen).toEqual([0, 4_000, 10_000, 10_000]);
  });

  it('does not read again when the first reply already ended', async () => {
    let reads = 0;
    const last = await waitForImport(job({ state: 'failed' }), async () => {
      reads++;
      return job({});
    });
    expect(last.state).toBe('failed');
    expect(reads).toBe(0);
  });

  it('stops waiting when aborted', async () => {
    const controller = new AbortController();
    const pending = waitForImport(job({}), async () => job({}), { signal: controller.signal, intervalMs: 10_000 });
    controller.abort(new Error('left the page'));
    await expect(pending).rejects.toThrow('left the page');
  });
});

describe('the report', () => {
  const problems = [
    { file: 'values.csv', line: 7, column: 'value', reason: 'must be a decimal number' },
    { file: 'species.csv', line: 3, column: 'key', reason: 'does not parse' },
    { file: 'values.csv', line: 2, column: 'source', reason: 'no such source' },
    { file: 'values.csv', line: 7, column: 'property', reason: 'unknown property' },
  ];

  it('lists problems by file, then line, then column, each with its own key', () => {
    const rows = problemRows(problems);
    expect(rows.map((r) => `${r.file}:${r.line}:${r.column}`)).toEqual([
      'species.csv:3:key',
      'values.csv:2:source',
      'values.csv:7:property',
      'values.csv:7:value',
    ]);
    expect(new Set(rows.map((r) => r.key)).size).toBe(4);
  });

  it('counts problems, rows and files in words', () => {
    expect(reportSummary(problems)).toBe('4 problems in 3 rows of 2 files.');
    expect(reportSummary([{ file: '', line: null, column: null, reason: 'The files hold no rows.' }])).toBe(
      '1 problem.',
    );
  });

  it('takes the report out of a refused import (400 with details.report) and nothing else', () => {
    const report = { rowsRead: 2, tables: { values: 2 }, problems: problems.slice(0, 1) };
    expect(reportOfError(new ApiError(400, 'validation_failed', 'Nothing was imported', { report }))).toEqual(report);
    expect(reportOfError(new ApiError(415, 'unsupported_media_type', 'Send CSV'))).toBeNull();
    expect(reportOfError(new Error('x'))).toBeNull();
  });
});

describe('limits before sending', () => {
  const limits = { maxFileBytes: 10 * 1024 * 1024, maxFiles: 2 };

  it('names files over the size limit in binary megabytes, as the server does', () => {
    expect(byteText(10 * 1024 * 1024)).toBe('10 MB');
    expect(byteText(2048)).toBe('2 kB');
    expect(filesOverLimits([{ name: 'big.csv', size: 11 * 1024 * 1024 }], limits)).toBe(
      'big.csv is larger than 10 MB, the most one file may be.',
    );
  });

  it('refuses more files than one import takes, and passes files within the limits', () => {
    const f = { name: 'a.csv', size: 10 };
    expect(filesOverLimits([f, f, f], limits)).toBe('Choose at most 2 files for one import.');
    expect(filesOverLimits([f, f], limits)).toBeNull();
  });
});
