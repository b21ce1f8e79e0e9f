import Papa from 'papaparse';
import readXlsxFile from 'read-excel-file/node';
import type { ImportProblem } from '@shared/schemas/library-io';

/** One data row of an uploaded table: its line (1 = header) and its cells by column name. */
export interface TableRow {
  line: number;
  cells: Record<string, string>;
}

export interface ReadTable {
  file: string;
  header: string[];
  rows: TableRow[];
  problems: ImportProblem[];
}

/** A leading ' that an export put before a formula-like cell is taken off again. */
function unneutralise(cell: string): string {
  return /^'[=+\-@\t\r]/.test(cell) ? cell.slice(1) : cell;
}

/**
 * Reads a CSV (RFC 4180, UTF-8, header row) into rows with their line numbers. Line numbers
 * follow the text (a quoted cell over several lines moves the next row's line on), counted
 * from papaparse's cursor. Empty lines are skipped; a row with too many or too few cells is a
 * problem naming its line.
 */
export function readCsv(file: string, text: string): ReadTable {
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const table: ReadTable = { file, header: [], rows: [], problems: [] };
  let line = 1;
  let scanned = 0;
  // Line of the row that starts at `start`: newlines before it, counted once.
  const lineAt = (start: number) => {
    for (let i = scanned; i < start; i++) if (source.charCodeAt(i) === 10) line++;
    scanned = Math.max(scanned, start);
    return line;
  };
  let start = 0;
  Papa.parse<string[]>(source, {
    header: false,
    delimiter: ',',
    skipEmptyLines: false,
    step: (result) => {
      const rowLine = lineAt(start);
      start = result.meta.cursor;
      // Skip the newline that ends this row, so the next row starts on the next line.
      if (source.charCodeAt(start) === 13) start++;
      if (source.charCodeAt(start) === 10) start++;
      for (const error of result.errors)
        table.problems.push({ file, line: rowLine, column: null, reason: `The CSV does not parse: ${error.message}.` });
      const cells = result.data;
      if (cells.every((c) => c.trim() === '')) return;
      if (table.header.length === 0) {
        table.header = cells.map((c) => c.trim());
        return;
      }
      if (cells.length !== table.header.length) {
        table.problems.push({
          file,
          line: rowLine,
          column: null,
          reason: `The row has ${cells.length} cells; the header has ${table.header.length}.`,
        });
        return;
      }
      const record: Record<string, string> = {};
      table.header.forEach((name, i) => (record[name] = unneutralise(cells[i]!)));
      table.rows.push({ line: rowLine, cells: record });
    },
  });
  return table;
}

/**
 * Reads every sheet of an XLSX workbook as a table (line = the sheet's row number). Numbers are
 * kept as the text the workbook stores, so "-393.51" is read as written.
 */
export async function readXlsx(file: string, bytes: Buffer): Promise<ReadTable[]> {
  const sheets = await readXlsxFile<string>(bytes, { parseNumber: (text) => text });
  return sheets.map(({ sheet, data }) => {
    const name = `${file} (sheet ${sheet})`;
    const table: ReadTable = { file: name, header: [], rows: [], problems: [] };
    data.forEach((row, index) => {
      const cells = row.map((cell) => (cell === null ? '' : cell instanceof Date ? cell.toISOString() : String(cell)));
      if (cells.every((c) => c.trim() === '')) return;
      if (table.header.length === 0) {
        table.header = cells.map((c) => c.trim()).filter((c, i, all) => c !== '' || i < all.length - 1);
        return;
      }
      const record: Record<string, string> = {};
      table.header.forEach((column, i) => (record[column] = unneutralise(cells[i] ?? '')));
      table.rows.push({ line: index + 1, cells: record });
    });
    return table;
  });
}
