/**
 * CSV writing for the library seed files (seeds/library/FORMAT.md: RFC 4180, UTF-8, header row,
 * `,` separator, fields with commas, quotes or line breaks quoted). Lines end in LF and the file
 * ends with one, so regenerated files diff cleanly.
 */
import Papa from 'papaparse';

/** The whole file: header, then one record per row. Every row must have the header's width. */
export function toCsv(header: readonly string[], rows: readonly (readonly string[])[]): string {
  rows.forEach((row, i) => {
    if (row.length !== header.length) {
      throw new Error(`CSV row ${i + 1} has ${row.length} fields, the header has ${header.length}`);
    }
  });
  return `${Papa.unparse({ fields: [...header], data: rows.map((r) => [...r]) }, { newline: '\n' })}\n`;
}

/** One record as CSV text, without its line ending. */
export function csvRecord(fields: readonly string[]): string {
  return Papa.unparse([[...fields]], { newline: '\n' });
}

/**
 * The raw text of each record (line endings removed), honouring quoted fields that hold line
 * breaks. Empty lines are dropped.
 */
export function splitCsvRecords(text: string): string[] {
  const records: string[] = [];
  let start = 0;
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === '"')
      quoted = !quoted; // a doubled quote toggles twice: still inside
    else if (!quoted && (ch === '\n' || ch === '\r')) {
      records.push(text.slice(start, i));
      if (ch === '\r' && text[i + 1] === '\n') i++;
      start = i + 1;
    }
  }
  if (quoted) throw new Error('CSV ends inside a quoted field');
  records.push(text.slice(start));
  return records.filter((r) => r !== '');
}

/** The fields of one record. */
export function parseCsvRecord(record: string): string[] {
  const parsed = Papa.parse<string[]>(record, { header: false });
  if (parsed.errors.length > 0) throw new Error(`cannot read CSV record '${record}': ${parsed.errors[0]!.message}`);
  return parsed.data[0] ?? [''];
}

/**
 * A CSV file with the record whose first field is `key` written as `fields`: replaced where it was,
 * or appended. Every other record keeps its exact text. A missing file starts from the header.
 */
export function upsertCsvRecord(existing: string | null, header: readonly string[], fields: readonly string[]): string {
  const key = fields[0];
  if (fields.length !== header.length)
    throw new Error(`the record for '${key}' has ${fields.length} fields, the header has ${header.length}`);
  const records = existing === null || existing.trim() === '' ? [csvRecord(header)] : splitCsvRecords(existing);
  const foundHeader = parseCsvRecord(records[0]!);
  if (foundHeader.join(',') !== header.join(',')) {
    throw new Error(`unexpected header '${records[0]}', expected '${header.join(',')}'`);
  }
  const line = csvRecord(fields);
  const at = records.findIndex((r, i) => i > 0 && parseCsvRecord(r)[0] === key);
  if (at > 0) records[at] = line;
  else records.push(line);
  return `${records.join('\n')}\n`;
}
