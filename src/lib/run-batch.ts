/**
 * Runs a batch in chunks: each chunk goes to the server's batch endpoint; if the server has no
 * batch endpoint or cannot be reached, the same shared core balances the chunk in the browser.
 * Results carry the line numbers of the original input.
 */
import { formatEquation, parseEquationBatch, type BatchLine } from '@shared/chemistry/index';
import { ApiError } from '@/api/api-error';
import { chunkLines, type SourceLine } from './batch-lines';

export type BatchStatus = 'balanced' | 'multiple' | 'impossible' | 'error';

/** One row of the batch results table. */
export interface BatchRow {
  line: number;
  source: string;
  status: BatchStatus;
  /** The balanced equation as HTML (safe: built by the core), when there is one. */
  equationHtml: string | null;
  /** Plain text of the balanced equation, for export. */
  equationText: string | null;
  /** Reason for an impossible/multiple result, or the parse error. */
  message: string | null;
  /** Column of a parse error (from 1). */
  column: number | null;
}

export interface BatchRunOptions {
  /** Sends one chunk (one equation per line) to the server. */
  send: (text: string, signal?: AbortSignal) => Promise<BatchLine[]>;
  chunkSize?: number;
  signal?: AbortSignal;
  /** Called after each chunk with lines done and total. */
  onProgress?: (done: number, total: number) => void;
}

/** Turns one core/server batch line into a table row, renumbered to the original input. */
export function toBatchRow(item: BatchLine, originalLine: number): BatchRow {
  if ('error' in item) {
    // The core names the place within the chunk it was given; the row states the input's own line and column instead.
    const message = item.error.message.replace(/\s+at (line \d+, )?column \d+\s*$/, '');
    return {
      line: originalLine,
      source: item.source,
      status: 'error',
      equationHtml: null,
      equationText: null,
      message,
      column: item.error.details.column,
    };
  }
  const r = item.result;
  const balanced = r.status === 'balanced';
  return {
    line: originalLine,
    source: item.source,
    status: r.status,
    equationHtml: balanced ? formatEquation(r, 'html') : null,
    equationText: balanced ? r.equation : null,
    message:
      r.status === 'impossible'
        ? (r.reason ?? 'cannot be balanced')
        : r.status === 'multiple'
          ? `${r.dimension ?? 'several'} independent balancings; fix coefficients on the workbench`
          : null,
    column: null,
  };
}

/** Server failures after which the browser takes over (no batch endpoint, unreachable, over the rate). */
function shouldFallBack(error: unknown): boolean {
  return (
    error instanceof ApiError &&
    ['not_found', 'network_error', 'unexpected_reply', 'unavailable', 'rate_limited'].includes(error.code) &&
    error.details.aborted !== true
  );
}

/**
 * Balances every line. Resolves with rows in input order and whether the browser had to do
 * (part of) the work. Rejects only when aborted or the server refuses the content itself.
 */
export async function runBatch(
  lines: readonly SourceLine[],
  options: BatchRunOptions,
): Promise<{ rows: BatchRow[]; local: boolean }> {
  const chunks = chunkLines(lines, options.chunkSize ?? 250);
  const total = lines.length;
  const rows: BatchRow[] = [];
  let local = false;
  let done = 0;
  options.onProgress?.(0, total);
  for (const chunk of chunks) {
    if (options.signal?.aborted) throw new ApiError(0, 'network_error', 'The batch was cancelled.', { aborted: true });
    let items: BatchLine[];
    if (local) {
      items = parseEquationBatch(chunk.text);
    } else {
      try {
        items = await options.send(chunk.text, options.signal);
      } catch (error) {
        if (!shouldFallBack(error)) throw error;
        local = true;
        items = parseEquationBatch(chunk.text);
      }
    }
    for (const item of items) rows.push(toBatchRow(item, chunk.lines[item.line - 1] ?? item.line));
    done += chunk.lines.length;
    options.onProgress?.(done, total);
    // Let the progress bar paint between chunks.
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
  return { rows, local };
}
