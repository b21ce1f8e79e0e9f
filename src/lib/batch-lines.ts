/**
 * Preparing batch input: pasted text or an uploaded .txt/.csv becomes one equation per line
 * (for CSV the first column), kept at its original line number, then cut into chunks for the
 * server. Pure, so the line bookkeeping is tested on its own.
 */

/** One input line: its number in the original text (from 1) and the equation text. */
export interface SourceLine {
  line: number;
  text: string;
}

/**
 * First field of one CSV record: quoted ("a, b" with "" for a quote) or up to the first
 * delimiter. Equations contain no commas normally, but a ΔH written "; ΔH = …" might, so
 * quoting is honoured.
 */
export function firstCsvField(record: string, delimiter = ','): string {
  const trimmed = record.trimStart();
  if (trimmed.startsWith('"')) {
    let out = '';
    for (let i = 1; i < trimmed.length; i += 1) {
      const ch = trimmed[i]!;
      if (ch === '"') {
        if (trimmed[i + 1] === '"') {
          out += '"';
          i += 1;
        } else {
          return out;
        }
      } else {
        out += ch;
      }
    }
    return out;
  }
  const end = trimmed.indexOf(delimiter);
  return (end === -1 ? trimmed : trimmed.slice(0, end)).trim();
}

/** Guesses the CSV delimiter from the first line: semicolon or tab when they outnumber commas. */
export function guessDelimiter(firstLine: string): string {
  const count = (c: string) => firstLine.split(c).length - 1;
  const candidates: Array<[string, number]> = [
    [',', count(',')],
    [';', count(';')],
    ['\t', count('\t')],
  ];
  candidates.sort((a, b) => b[1] - a[1]);
  return candidates[0]![1] > 0 ? candidates[0]![0] : ',';
}

/** A header row ("equation", "reaction", …) is not an equation. */
function looksLikeHeader(field: string): boolean {
  return /^(equation|equations|reaction|reactions|input)$/i.test(field.trim());
}

/**
 * Lines of a batch. For `kind: 'csv'` each record's first column is taken and a header row is
 * dropped; for text the lines are taken as they are. Line numbers stay those of the input.
 * Records spanning several lines (quoted newlines) are not supported: each line is a record.
 */
export function batchLines(text: string, kind: 'text' | 'csv'): SourceLine[] {
  const raw = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const delimiter = kind === 'csv' ? guessDelimiter(raw.find((l) => l.trim() !== '') ?? '') : ',';
  const out: SourceLine[] = [];
  raw.forEach((value, index) => {
    const field = kind === 'csv' ? firstCsvField(value, delimiter) : value;
    if (kind === 'csv' && out.every((l) => l.text.trim() === '') && looksLikeHeader(field)) {
      out.push({ line: index + 1, text: '' });
      return;
    }
    out.push({ line: index + 1, text: field });
  });
  return out;
}

/** Lines that hold an equation (not blank, not a "#" comment), as the core skips the others. */
export function equationLines(lines: readonly SourceLine[]): SourceLine[] {
  return lines.filter((l) => l.text.trim() !== '' && !l.text.trimStart().startsWith('#'));
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
