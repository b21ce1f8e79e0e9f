/** Line and column (both from 1) of an offset in `source`; lines end at "\n". */
export function positionAt(source: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = source.indexOf('\n'); i !== -1 && i < offset; i = source.indexOf('\n', i + 1)) {
    line++;
    lineStart = i + 1;
  }
  return { line, column: offset - lineStart + 1 };
}

const EXCERPT_RADIUS = 24;

/** The text of the offset's line around the offset, with "…" where it was cut. */
export function excerptAt(source: string, offset: number): string {
  const lineStart = source.lastIndexOf('\n', offset - 1) + 1;
  let lineEnd = source.indexOf('\n', offset);
  if (lineEnd === -1) lineEnd = source.length;
  const from = Math.max(lineStart, offset - EXCERPT_RADIUS);
  const to = Math.min(lineEnd, offset + EXCERPT_RADIUS);
  return (from > lineStart ? '…' : '') + source.slice(from, to).replace(/\r$/, '') + (to < lineEnd ? '…' : '');
}
