/**
 * The bulk-import page's logic without Vue: the words and share of a job's progress, waiting for
 * the job to end, and the row-level report out of a finished job or a refused upload.
 */
import { importReportSchema, type ImportJob, type ImportProblem, type ImportReport } from '@shared/schemas/library-io';
import { ApiError } from '@/api/api-error';

/** The files the import reads: CSV, XLSX, or the JSON export (the server checks the content again). */
export const importAccept =
  '.csv,.xlsx,.json,text/csv,application/json,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

export type ImportPhase = 'uploading' | 'reading' | 'checking' | 'done' | 'failed';

/** Where a job stands; `null` while the files are still being sent. */
export function importPhase(job: ImportJob | null): ImportPhase {
  if (job === null) return 'uploading';
  if (job.state === 'done') return 'done';
  if (job.state === 'failed') return 'failed';
  // Every row read: the entries are being checked against the library and the draft made.
  return job.rowsRead < job.rowsTotal ? 'reading' : 'checking';
}

export const importPhaseWords: Record<ImportPhase, string> = {
  uploading: 'Sending the files',
  reading: 'Reading rows',
  checking: 'Checking the rows against the library and making the draft',
  done: 'Done: the draft amendment is made',
  failed: 'Stopped: no amendment was made',
};

/** Whole per cent of rows read; 100 only once the job is done (checking still takes a moment). */
export function importPercent(job: ImportJob | null): number {
  if (job === null) return 0;
  if (job.state === 'done') return 100;
  if (job.rowsTotal <= 0) return 0;
  const share = Math.floor((100 * Math.min(job.rowsRead, job.rowsTotal)) / job.rowsTotal);
  return job.state === 'running' ? Math.min(share, 99) : share;
}

/** "1,234 of 10,000 rows read". */
export function importCountText(job: ImportJob | null): string {
  if (job === null) return 'Sending…';
  const n = (x: number) => x.toLocaleString('en-GB');
  return `${n(Math.min(job.rowsRead, job.rowsTotal))} of ${n(job.rowsTotal)} row${job.rowsTotal === 1 ? '' : 's'} read`;
}

export interface PollOptions {
  /** First wait between two reads, ms; it grows by half each time up to `maxIntervalMs`. */
  intervalMs?: number;
  maxIntervalMs?: number;
  /** Hears every state read, the first included. */
  onUpdate?: (job: ImportJob) => void;
  /** Stops waiting (rejects with the signal's reason). */
  signal?: AbortSignal;
  /** Replaced in tests. */
  sleep?: (ms: number, signal?: AbortSignal) => Promise<void>;
}

function defaultSleep(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(signal.reason);
    const timer = setTimeout(resolve, ms);
    signal?.addEventListener(
      'abort',
      () => {
        clearTimeout(timer);
        reject(signal.reason);
      },
      { once: true },
    );
  });
}

/** Reads the job until it is no longer running and resolves with its last state. */
export async function waitForImport(
  first: ImportJob,
  read: (jobId: string, signal?: AbortSignal) => Promise<ImportJob>,
  options: PollOptions = {},
): Promise<ImportJob> {
  const sleep = options.sleep ?? defaultSleep;
  const max = options.maxIntervalMs ?? 1_500;
  let interval = options.intervalMs ?? 300;
  let job = first;
  options.onUpdate?.(job);
  while (job.state === 'running') {
    await sleep(interval, options.signal);
    job = await read(job.jobId, options.signal);
    options.onUpdate?.(job);
    interval = Math.min(max, Math.round(interval * 1.5));
  }
  return job;
}

/** The row-level report of a refused import (400 with details.report), or null for other failures. */
export function reportOfError(error: unknown): ImportReport | null {
  if (!(error instanceof ApiError) || error.code !== 'validation_failed') return null;
  const parsed = importReportSchema.safeParse(error.details.report);
  return parsed.success ? parsed.data : null;
}

/** One row of the report table, with a stable key. */
export interface ProblemRow extends ImportProblem {
  key: string;
}

/** The problems in file, then line order (problems of no line first), each with a key for the table. */
export function problemRows(problems: readonly ImportProblem[]): ProblemRow[] {
  return problems
    .map((p, i) => ({ ...p, index: i }))
    .sort(
      (a, b) =>
        a.file.localeCompare(b.file) ||
        (a.line ?? -1) - (b.line ?? -1) ||
        (a.column ?? '').localeCompare(b.column ?? '') ||
        a.index - b.index,
    )
    .map(({ index, ...p }) => ({ ...p, key: String(index) }));
}

/** "Bad rows: 3 problems in 2 rows of 1 file." */
export function reportSummary(problems: readonly ImportProblem[]): string {
  const rows = new Set(problems.filter((p) => p.line !== null).map((p) => `${p.file}\u0000${p.line}`)).size;
  const files = new Set(problems.map((p) => p.file).filter((f) => f !== '')).size;
  const plural = (n: number, word: string) => `${n.toLocaleString('en-GB')} ${word}${n === 1 ? '' : 's'}`;
  const where = rows > 0 ? ` in ${plural(rows, 'row')}` : '';
  const of = files > 0 ? ` of ${plural(files, 'file')}` : '';
  return `${plural(problems.length, 'problem')}${where}${of}.`;
}

/** "10 MB", "512 kB": a byte limit in the words of the server's own messages (binary megabytes). */
export function byteText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;
  return `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

/** Files over the size limit or beyond the count limit, named before anything is sent. */
export function filesOverLimits(
  files: readonly { name: string; size: number }[],
  limits: { maxFileBytes: number; maxFiles: number },
): string | null {
  if (files.length > limits.maxFiles) return `Choose at most ${limits.maxFiles} files for one import.`;
  const big = files.filter((f) => f.size > limits.maxFileBytes).map((f) => f.name);
  if (big.length > 0)
    return `${big.join(', ')} ${big.length === 1 ? 'is' : 'are'} larger than ${byteText(limits.maxFileBytes)}, the most one file may be.`;
  return null;
}
