/**
 * Where to draw the error marker under an equation: the text before the faulty spot, the faulty
 * token itself and the rest. Pure, so the marker's position is tested without a browser.
 */

export interface MarkedLine {
  before: string;
  bad: string;
  after: string;
  /** True when the problem is at the very end (something is missing): `bad` is then a blank to mark. */
  atEnd: boolean;
}

/**
 * Splits one line at a 1-based column. The marked token is the symbol-like word there (a
 * capital and its lower-case letters, e.g. "Xx"), a run of digits or lower-case letters, else one
 * character; at the end of the line a single blank stands for what is missing.
 */
export function markColumn(line: string, column: number): MarkedLine {
  const start = Math.min(Math.max(column - 1, 0), line.length);
  if (start >= line.length) return { before: line, bad: ' ', after: '', atEnd: true };
  const rest = line.slice(start);
  const word = /^(?:[A-Z][a-z]*|[a-z]+|\d+)/.exec(rest);
  const length = word ? word[0].length : Array.from(rest)[0]!.length;
  return {
    before: line.slice(0, start),
    bad: line.slice(start, start + length),
    after: line.slice(start + length),
    atEnd: false,
  };
}

/** The given line (1-based) of a possibly multi-line text. */
export function lineOf(text: string, line: number): string {
  return text.split(/\r?\n/)[line - 1] ?? '';
}
