/**
 * Where to draw the error marker under an equation: the text before the faulty spot, the faulty
 * text itself and the rest. The core says where the problem is and how long the faulty text is;
 * this only cuts the line. Pure, so the marker's position is tested without a browser.
 */

export interface MarkedLine {
  before: string;
  bad: string;
  after: string;
  /** True when the problem is at the very end (something is missing): `bad` is then a blank to mark. */
  atEnd: boolean;
}

/**
 * Splits one line at a 1-based column, marking `length` characters (UTF-16 code units, as the
 * core counts). A length of 0 (something is missing) marks the one character there, or a blank
 * after the end of the line.
 */
export function markColumn(line: string, column: number, length = 0): MarkedLine {
  const start = Math.min(Math.max(column - 1, 0), line.length);
  if (start >= line.length) return { before: line, bad: ' ', after: '', atEnd: true };
  const end = Math.min(line.length, start + Math.max(length, String.fromCodePoint(line.codePointAt(start)!).length));
  return { before: line.slice(0, start), bad: line.slice(start, end), after: line.slice(end), atEnd: false };
}

/** The given line (1-based) of a possibly multi-line text. */
export function lineOf(text: string, line: number): string {
  return text.split(/\r?\n/)[line - 1] ?? '';
}
