/**
 * A time–temperature file read for the calorimetry page: CSV (or tab- or semicolon-separated)
 * parsed with papaparse, its columns offered for mapping, and the chosen columns turned into the
 * series the reduction API takes ([t in s, T], in the file's temperature unit). Pure, no Vue.
 */
import Papa from 'papaparse';

export interface ReadingsTable {
  /** Column names: the header row, or "Column 1…" when the first row is numbers. */
  columns: string[];
  /** Data rows as text, header excluded. */
  rows: string[][];
  hasHeader: boolean;
}

export interface ColumnMapping {
  time: number;
  temperature: number;
  /** Unit of the time column. */
  timeUnit: 's' | 'min';
}

const isNumber = (text: string | undefined) =>
  text !== undefined && text.trim() !== '' && Number.isFinite(Number(text));

/** Reads the file's text into columns and rows (blank lines skipped). */
export function readReadingsTable(text: string): ReadingsTable {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy' });
  const all = parsed.data.filter((r) => r.length > 0);
  const first = all[0] ?? [];
  const hasHeader = first.some((cell) => !isNumber(cell));
  const width = Math.max(0, ...all.map((r) => r.length));
  const columns = Array.from({ length: width }, (_, i) =>
    hasHeader ? (first[i]?.trim() ?? `Column ${i + 1}`) || `Column ${i + 1}` : `Column ${i + 1}`,
  );
  return { columns, rows: hasHeader ? all.slice(1) : all, hasHeader };
}

/** A first guess: a column named like time, and one named like temperature (else the first two). */
export function guessMapping(table: ReadingsTable): ColumnMapping {
  const find = (re: RegExp) => table.columns.findIndex((c) => re.test(c));
  const time = find(/time|^t\b|\bs\b|sec|min/i);
  const temperature = find(/temp|°|deg|^T\b|\bK\b|\bC\b/);
  const t = time >= 0 ? time : 0;
  const T = temperature >= 0 && temperature !== t ? temperature : t === 0 ? 1 : 0;
  return { time: t, temperature: T, timeUnit: /min/i.test(table.columns[t] ?? '') ? 'min' : 's' };
}

/** A problem with one cell, named by its line in the file and its column. */
export class ReadingsError extends Error {
  constructor(
    message: string,
    readonly line: number,
    readonly column: string,
  ) {
    super(message);
  }
}

/**
 * The series [t/s, T] from the mapped columns, in file order.
 * @throws ReadingsError naming the line and column of the first cell that is not a number, or
 * times that do not increase.
 */
export function seriesFromTable(table: ReadingsTable, mapping: ColumnMapping): [number, number][] {
  const out: [number, number][] = [];
  const offset = table.hasHeader ? 2 : 1;
  const factor = mapping.timeUnit === 'min' ? 60 : 1;
  table.rows.forEach((row, i) => {
    const line = i + offset;
    const timeText = row[mapping.time];
    const tempText = row[mapping.temperature];
    if (!isNumber(timeText))
      throw new ReadingsError(`Line ${line}: “${timeText ?? ''}” is not a time.`, line, table.columns[mapping.time]!);
    if (!isNumber(tempText))
      throw new ReadingsError(
        `Line ${line}: “${tempText ?? ''}” is not a temperature.`,
        line,
        table.columns[mapping.temperature]!,
      );
    const t = Number(timeText) * factor;
    const previous = out[out.length - 1];
    if (previous && t <= previous[0])
      throw new ReadingsError(`Line ${line}: the time does not increase.`, line, table.columns[mapping.time]!);
    out.push([t, Number(tempText)]);
  });
  return out;
}
