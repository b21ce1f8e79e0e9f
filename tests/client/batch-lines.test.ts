import { describe, expect, it } from 'vitest';
import { batchLines, chunkLines, equationLines, firstCsvField, guessDelimiter } from '@/lib/batch-lines';

describe('firstCsvField', () => {
  it('takes the text up to the first comma', () =>
    expect(firstCsvField('H2 + O2 -> H2O, combustion, 3')).toBe('H2 + O2 -> H2O'));
  it('honours quotes and doubled quotes', () => {
    expect(firstCsvField('"CH4 + O2 -> CO2 + H2O, ΔH = -890 kJ",note')).toBe('CH4 + O2 -> CO2 + H2O, ΔH = -890 kJ');
    expect(firstCsvField('"say ""hi""",x')).toBe('say "hi"');
  });
  it('uses the given delimiter', () => expect(firstCsvField('N2 + H2 -> NH3;x', ';')).toBe('N2 + H2 -> NH3'));
});

describe('guessDelimiter', () => {
  it('picks the most frequent of comma, semicolon and tab', () => {
    expect(guessDelimiter('equation;note;id')).toBe(';');
    expect(guessDelimiter('equation\tnote')).toBe('\t');
    expect(guessDelimiter('equation,note')).toBe(',');
    expect(guessDelimiter('H2 + O2 -> H2O')).toBe(',');
  });
});

describe('batchLines', () => {
  it('keeps original line numbers for text, including blanks and comments', () => {
    expect(batchLines('A -> B\n\n# c\nC -> D', 'text')).toEqual([
      { line: 1, text: 'A -> B' },
      { line: 2, text: '' },
      { line: 3, text: '# c' },
      { line: 4, text: 'C -> D' },
    ]);
  });
  it('takes the first CSV column, drops a header row and handles CRLF and a BOM', () => {
    const csv = '\uFEFFequation,note\r\nH2 + O2 -> H2O,water\r\n"C + O2 -> CO2",soot\r\n';
    expect(equationLines(batchLines(csv, 'csv'))).toEqual([
      { line: 2, text: 'H2 + O2 -> H2O' },
      { line: 3, text: 'C + O2 -> CO2' },
    ]);
  });
});

describe('chunkLines', () => {
  const lines = Array.from({ length: 7 }, (_, i) => ({ line: i * 2 + 1, text: `L${i}` }));
  it('cuts into chunks of the given size and maps chunk lines back', () => {
    const chunks = chunkLines(lines, 3);
    expect(chunks.map((c) => c.lines)).toEqual([[1, 3, 5], [7, 9, 11], [13]]);
    expect(chunks[0]!.text).toBe('L0\nL1\nL2');
  });
  it('also starts a new chunk before the character limit is passed', () => {
    const long = [
      { line: 1, text: 'x'.repeat(60) },
      { line: 2, text: 'y'.repeat(60) },
    ];
    expect(chunkLines(long, 100, 100).map((c) => c.lines)).toEqual([[1], [2]]);
  });
  it('gives no chunks for no lines', () => expect(chunkLines([], 10)).toEqual([]));
});
