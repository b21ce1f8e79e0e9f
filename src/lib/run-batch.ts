/**
 * Runs a batch in chunks: each chunk goes to the server's batch endpoint; if the server has no
 * batch endpoint or cannot be reached, the same shared core balances the chunk in the browser and
 * builds the same reply. Results carry the line numbers of the original input.
 */
import {
  balanceEquationLines,
  formatEquation,
  parseEquation,
  toBalanceBatchReply,
  type ParsedEquation,
} from '@shared/chemistry/index';
import type { BalanceBatchLine } from '@shared/schemas/balance-batch';
import { ApiError } from '@/api/api-error';
import { chunkLines, type SourceLine } from './batch-lines';
import { answerModel } from './workbench-view';

export type BatchStatus = 'balanced' | 'multiple' | 'impossible' | 'error';

/** One row of the batch results table. */
export interface BatchRow {
  line: number;
  source: string;
  status: BatchStatus;
  /** The balanced equation as HTML (safe: built by the core from known symbols, text escaped), when there is one. */
  equationHtml: string | null;
  /** Plain text of the balanced equation, for export. */
  equationText: string | null;
  /** Reason for an impossible/multiple result, or the problem of an unreadable line (without its place). */
  message: string | null;
  /** Column of a parse problem (from 1), shown beside the input's own line number. */
  column: number | null;
}

export interface BatchRunOptions {
  /** Sends one chunk (one equation per line) to the server. */
  send: (text: string, signal?: AbortSignal) => Promise<BalanceBatchLine[]>;
  chunkSize?: number;
  signal?: AbortSignal;
  /** Called after each chunk with lines done and total. */
  onProgress?: (done: number, total: number) => void;
}

/** The browser's own reading of a line the reply answers (the line is the user's input, read as the server read it). */
function readingOf(source: string): ParsedEquation | null {
  try {
    return parseEquation(source);
  } catch {
    return null;
  }
}

/** Turns one batch reply line into a table row, renumbered to the original input. */
export function toBatchRow(item: BalanceBatchLine, originalLine: number): BatchRow {
  if ('error' in item) {
    const { error } = item;
    return {
      line: originalLine,
      source: item.source,
      status: 'error',
      equationHtml: null,
      equationText: null,
      message: error.problem ?? error.message,
      column: error.code === 'payload_too_large' ? null : error.details.column,
    };
  }
  const reply = item.result;
  const balanced = reply.status === 'balanced';
  let equationHtml: string | null = null;
  if (balanced) {
    const reading = readingOf(item.source);
    const model = reading ? answerModel({ reading, reply }) : null;
    equationHtml = model ? formatEquation(model, 'html') : null;
  }
  return {
    line: originalLine,
    source: item.source,
    status: reply.status,
    equationHtml,
    equationText: balanced ? reply.equation : null,
    message:
      reply.status === 'impossible'
        ? (reply.reason ?? 'cannot be balanced')
        : reply.status === 'multiple'
          ? `${reply.dimension ?? 'several'} independent balancings; fix coefficients on the workbench`
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

/** The same reply the server gives, computed in the browser. */
function balanceHere(text: string): BalanceBatchLine[] {
  return toBalanceBatchReply(balanceEquationLines(text)).results;
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
    let items: BalanceBatchLine[];
    if (local) {
      items = balanceHere(chunk.text);
    } else {
      try {
        items = await options.send(chunk.text, options.signal);
      } catch (error) {
        if (!shouldFallBack(error)) throw error;
        local = true;
        items = balanceHere(chunk.text);
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
