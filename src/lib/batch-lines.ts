/**
 * Preparing batch input: pasted text or an uploaded .txt/.csv becomes one equation per line
 * (for CSV the first column, read by papaparse), kept at its original line number, then cut into
 * chunks for the server. Pure, so the line bookkeeping is tested on its own.
 */
import Papa from 'papaparse';
import { isEquationLine } from '@shared/chemistry/index';

/** One input line: its number in the original text (from 1) and the equation text. */
export interface SourceLine {
  line: number;
  text: string;
}

/** A header row ("equation", "reaction", …) is not an equation. */
function looksLikeHeader(field: string): boolean {
  return /^(equation|equations|reaction|reactions|input)$/i.test(field.trim());
}

/** Line breaks (CRLF, LF or CR) in text[from, to). */
function lineBreaksIn(text: string, from: number, to: number): number {
  let count = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c === 10 || (c === 13 && text.charCodeAt(i + 1) !== 10)) count++;
  }
  return count;
}

/**
 * The first column of each CSV record (papaparse: quoted fields, doubled quotes, fields spanning
 * several lines, the delimiter guessed among comma, semicolon, tab and others). A record keeps
 * the line number where it starts; line breaks inside its first field become spaces, since an
 * equation is one line. A header row is dropped.
 */
function csvLines(text: string): SourceLine[] {
  const out: SourceLine[] = [];
  let line = 1;
  let start = 0;
  let seenData = false;
  Papa.parse<string[]>(text, {
    skipEmptyLines: false,
    step: (row) => {
      const first = (row.data[0] ?? '').replace(/\r\n|\n|\r/g, ' ');
      const header = !seenData && looksLikeHeader(first);
      if (first.trim() !== '') seenData = true;
      out.push({ line, text: header ? '' : first });
      const end = row.meta.cursor;
      line += lineBreaksIn(text, start, end);
      start = end;
    },
  });
  return out;
}

/**
 * Lines of a batch. For `kind: 'csv'` each record's first column is taken (see `csvLines`); for
 * text the lines are taken as they are. Line numbers stay those of the input. A leading
 * byte-order mark is dropped.
 */
export function batchLines(text: string, kind: 'text' | 'csv'): SourceLine[] {
  const clean = text.replace(/^\uFEFF/, '');
  if (kind === 'csv') return csvLines(clean);
  return clean.split(/\r\n|\n|\r/).map((value, index) => ({ line: index + 1, text: value }));
}

/** Lines that hold an equation (not blank, not a "#" comment), as the core skips the others. */
export function equationLines(lines: readonly SourceLine[]): SourceLine[] {
  return lines.filter((l) => isEquationLine(l.text));
}

/** A chunk to send: its text (one equation per line) and the original line of each of its lines. */
export interface Chunk {
  text: string;
  lines: number[];
}

/**
 * Cuts equation lines into chunks of at most `size` lines and `maxChars` characters. The
 * server numbers lines within the chunk from 1; `lines[n - 1]` maps them back.
 */
export function chunkLines(lines: readonly SourceLine[], size: number, maxChars = 150_000): Chunk[] {
  const chunks: Chunk[] = [];
  let current: Chunk = { text: '', lines: [] };
  for (const line of lines) {
    const addition = (current.lines.length === 0 ? '' : '\n') + line.text;
    if (
      current.lines.length > 0 &&
      (current.lines.length >= size || current.text.length + addition.length > maxChars)
    ) {
      chunks.push(current);
      current = { text: '', lines: [] };
    }
    current.text += (current.lines.length === 0 ? '' : '\n') + line.text;
    current.lines.push(line.line);
  }
  if (current.lines.length > 0) chunks.push(current);
  return chunks;
}
