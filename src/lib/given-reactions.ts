/**
 * Reactions given to a derivation, as the page keeps them (one row each) and as people write them
 * in text: one reaction per line, `equation ; ΔH ; u ; unit ; T`, or the same five columns in a
 * CSV file. Reading reports every problem with its line and column and returns no rows when there
 * is one, so nothing is half-applied. Pure (no Vue).
 */
import Papa from 'papaparse';
import type { GivenReaction } from '@shared/schemas/derive';

export type EnergyUnit = 'kJ/mol' | 'kcal/mol' | 'J/mol';
export type TemperatureUnit = 'K' | 'C' | 'F';

export const energyUnits: readonly EnergyUnit[] = ['kJ/mol', 'kcal/mol', 'J/mol'];

/** One given reaction as the page edits it (null: not filled in). */
export interface GivenRow {
  equation: string;
  deltaH: number | null;
  uncertainty: number | null;
  unit: EnergyUnit;
  temperature: number | null;
  temperatureUnit: TemperatureUnit;
}

export function emptyRow(): GivenRow {
  return { equation: '', deltaH: null, uncertainty: null, unit: 'kJ/mol', temperature: null, temperatureUnit: 'K' };
}

/** The five fields of a line, in order. */
export const givenFields = ['equation', 'deltaH', 'uncertainty', 'unit', 'temperature'] as const;
export type GivenField = (typeof givenFields)[number];

export const givenFieldNames: Record<GivenField, string> = {
  equation: 'equation',
  deltaH: 'ΔH',
  uncertainty: 'u',
  unit: 'unit',
  temperature: 'T',
};

/** The format in words, as the page states it. */
export const givenLineFormat = 'equation ; ΔH ; u ; unit ; T';

export interface ReadProblem {
  /** Line of the input, from 1. */
  line: number;
  /** Plain lines: the character column where the field starts (from 1). CSV: the column number. */
  column: number;
  field: GivenField | null;
  message: string;
}

export interface GivenReading {
  rows: GivenRow[];
  problems: ReadProblem[];
}

/** "Line 3, column 12 (ΔH): “abc” is not a number." */
export function problemText(p: ReadProblem): string {
  const field = p.field ? ` (${givenFieldNames[p.field]})` : '';
  return `Line ${p.line}, column ${p.column}${field}: ${p.message}`;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A decimal number as typed (a true minus sign is read as one), or a sentence saying why not. */
export function readNumber(text: string): number | string {
  const t = text.trim().replace(/\u2212/g, '-');
  if (NUMBER.test(t)) return Number(t);
  if (/^[+-]?\d+,\d+$/.test(t))
    return `“${text.trim()}” has a decimal comma: write a point, as in ${t.replace(',', '.')}.`;
  return `“${text.trim()}” is not a number.`;
}

/** kJ/mol, kcal/mol or J/mol, in any case and with or without "/mol"; empty means kJ/mol. */
export function readEnergyUnit(text: string): EnergyUnit | null {
  const t = text.trim().toLowerCase().replace(/\s+/g, '');
  if (t === '' || t === 'kj/mol' || t === 'kj') return 'kJ/mol';
  if (t === 'kcal/mol' || t === 'kcal') return 'kcal/mol';
  if (t === 'j/mol' || t === 'j') return 'J/mol';
  return null;
}

/** "500", "500 K", "25 °C", "77 F" → value and unit (K when none is written). */
export function readTemperature(text: string): { value: number; unit: TemperatureUnit } | string {
  const match = /^(.*?)\s*(°?\s*[CF]|K)?$/i.exec(text.trim());
  const numberText = match?.[1] ?? '';
  const unitText = (match?.[2] ?? 'K').replace(/[°\s]/g, '').toUpperCase();
  const value = readNumber(numberText);
  if (typeof value === 'string') return `${value} Write a temperature such as 500 K or 25 °C.`;
  return { value, unit: unitText as TemperatureUnit };
}

const temperatureText: Record<TemperatureUnit, string> = { K: 'K', C: '°C', F: '°F' };

/** A header row ("equation; ΔH; …") is not a reaction. */
function isHeader(first: string): boolean {
  return /^(equation|equations|reaction|reactions)$/i.test(first.trim());
}

interface FieldAt {
  text: string;
  column: number;
}

/** Reads the fields of one line or record into a row, adding a problem for each bad field. */
function readFields(fields: FieldAt[], line: number, problems: ReadProblem[]): GivenRow | null {
  const before = problems.length;
  const fail = (at: FieldAt, field: GivenField | null, message: string) =>
    problems.push({ line, column: at.column, field, message });
  if (fields.length > givenFields.length) {
    fail(fields[givenFields.length]!, null, `Too many fields: at most five (${givenLineFormat}).`);
    return null;
  }
  const [equation, deltaH, uncertainty, unit, temperature] = fields;
  const row = emptyRow();
  row.equation = equation!.text.trim();
  if (row.equation === '') fail(equation!, 'equation', 'The reaction is missing.');
  if (!deltaH || deltaH.text.trim() === '') {
    fail(deltaH ?? { text: '', column: equation!.column + equation!.text.length }, 'deltaH', 'ΔH is missing.');
  } else {
    const value = readNumber(deltaH.text);
    if (typeof value === 'string') fail(deltaH, 'deltaH', value);
    else row.deltaH = value;
  }
  if (uncertainty && uncertainty.text.trim() !== '') {
    const value = readNumber(uncertainty.text);
    if (typeof value === 'string') fail(uncertainty, 'uncertainty', value);
    else if (value < 0) fail(uncertainty, 'uncertainty', 'An uncertainty is not negative.');
    else row.uncertainty = value;
  }
  if (unit) {
    const read = readEnergyUnit(unit.text);
    if (read === null)
      fail(unit, 'unit', `“${unit.text.trim()}” is not a unit we read: write kJ/mol, kcal/mol or J/mol.`);
    else row.unit = read;
  }
  if (temperature && temperature.text.trim() !== '') {
    const read = readTemperature(temperature.text);
    if (typeof read === 'string') fail(temperature, 'temperature', read);
    else {
      row.temperature = read.value;
      row.temperatureUnit = read.unit;
    }
  }
  return problems.length === before ? row : null;
}

/** Splits a line at `;`, keeping where each field starts (the first non-blank character, from 1). */
function splitLine(text: string): FieldAt[] {
  const out: FieldAt[] = [];
  let start = 0;
  for (const piece of text.split(';')) {
    const lead = piece.length - piece.trimStart().length;
    out.push({ text: piece, column: start + Math.min(lead, piece.length) + 1 });
    start += piece.length + 1;
  }
  return out;
}

function readPlainLines(text: string): GivenReading {
  const rows: GivenRow[] = [];
  const problems: ReadProblem[] = [];
  let seenData = false;
  text.split(/\r\n|\n|\r/).forEach((content, index) => {
    const trimmed = content.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const fields = splitLine(content);
    if (!seenData && isHeader(fields[0]!.text)) return;
    seenData = true;
    const row = readFields(fields, index + 1, problems);
    if (row) rows.push(row);
  });
  return { rows, problems };
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

function readCsv(text: string): GivenReading {
  const rows: GivenRow[] = [];
  const problems: ReadProblem[] = [];
  let line = 1;
  let start = 0;
  let seenData = false;
  Papa.parse<string[]>(text, {
    skipEmptyLines: false,
    step: (record) => {
      const recordLine = line;
      const end = record.meta.cursor;
      line += lineBreaksIn(text, start, end);
      start = end;
      const cells = record.data.map((cell) => cell.replace(/\r\n|\n|\r/g, ' '));
      // Spreadsheets pad short rows with empty cells: they are not fields.
      while (cells.length > 1 && cells[cells.length - 1]!.trim() === '') cells.pop();
      const first = cells[0] ?? '';
      if (cells.length <= 1 && first.trim() === '') return;
      if (first.trim().startsWith('#')) return;
      if (!seenData && isHeader(first)) return;
      seenData = true;
      const row = readFields(
        cells.map((cell, i) => ({ text: cell, column: i + 1 })),
        recordLine,
        problems,
      );
      if (row) rows.push(row);
    },
  });
  return { rows, problems };
}

/**
 * Reads given reactions from text: plain lines (`equation ; ΔH ; u ; unit ; T`, blank lines and
 * `#` comments skipped) or CSV (the same five columns; quoted fields, the delimiter guessed by
 * papaparse). A header row is skipped. ΔH is required; u, unit (kJ/mol by default) and T
 * (298.15 K when empty) are optional. When any problem is found, `rows` is empty.
 */
export function readGivenReactions(text: string, kind: 'lines' | 'csv'): GivenReading {
  const clean = text.replace(/^\uFEFF/, '');
  const reading = kind === 'csv' ? readCsv(clean) : readPlainLines(clean);
  return reading.problems.length > 0 ? { rows: [], problems: reading.problems } : reading;
}

/** A number as the shortest text that reads back to it. */
const numberText = (x: number) => String(x);

/** One row as a line of the text format; trailing empty fields are left off. */
export function formatGivenLine(row: GivenRow): string {
  const fields = [
    row.equation.trim(),
    row.deltaH === null ? '' : numberText(row.deltaH),
    row.uncertainty === null ? '' : numberText(row.uncertainty),
    row.unit,
    row.temperature === null ? '' : `${numberText(row.temperature)} ${temperatureText[row.temperatureUnit]}`,
  ];
  // The unit is left off too when it is the default and nothing follows it.
  if (fields[4] === '' && fields[3] === 'kJ/mol') fields[3] = '';
  while (fields.length > 2 && fields[fields.length - 1] === '') fields.pop();
  return fields.join(' ; ');
}

/**
 * A row as the API's given reaction. Fields left empty stay out or null, so the shared schema
 * names them when it checks the request (ΔH is required).
 */
export function toGivenReaction(row: GivenRow): GivenReaction {
  const reaction = {
    equation: row.equation.trim(),
    deltaH: {
      value: row.deltaH as number,
      unit: row.unit,
      ...(row.uncertainty === null ? {} : { uncertainty: row.uncertainty }),
    },
    ...(row.temperature === null ? {} : { temperature: { value: row.temperature, unit: row.temperatureUnit } }),
  };
  return reaction;
}

/** The API's given reaction back as a row (to show a saved derivation). */
export function fromGivenReaction(reaction: GivenReaction): GivenRow {
  return {
    equation: reaction.equation,
    deltaH: reaction.deltaH.value,
    uncertainty: reaction.deltaH.uncertainty ?? null,
    unit: reaction.deltaH.unit,
    temperature: reaction.temperature?.value ?? null,
    temperatureUnit: reaction.temperature?.unit ?? 'K',
  };
}

/** A row is blank when nothing was typed into it (left out of a request). */
export function isBlankRow(row: GivenRow): boolean {
  return row.equation.trim() === '' && row.deltaH === null && row.uncertainty === null && row.temperature === null;
}
