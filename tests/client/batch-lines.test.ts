import { describe, expect, it } from 'vitest';
import { batchLines, chunkLines, equationLines } from '@/lib/batch-lines';

describe('batchLines (text)', () => {
  it('keeps original line numbers, including blanks and comments', () => {
    expect(batchLines('A -> B\n\n# c\r\nC -> D', 'text')).toEqual([
      { line: 1, text: 'A -> B' },
      { line: 2, text: '' },
      { line: 3, text: '# c' },
      { line: 4, text: 'C -> D' },
    ]);
  });
});

describe('batchLines (csv, read by papaparse)', () => {
  it('takes the first column, drops a header row and handles CRLF and a BOM', () => {
    const csv = '\uFEFFequation,note\r\nH2 + O2 -> H2O,water\r\n"C + O2 -> CO2",soot\r\n';
    expect(equationLines(batchLines(csv, 'csv'))).toEqual([
      { line: 2, text: 'H2 + O2 -> H2O' },
      { line: 3, text: 'C + O2 -> CO2' },
    ]);
  });

  it('honours quotes, doubled quotes and a comma inside a quoted equation', () => {
    const csv = '"CH4 + O2 -> CO2 + H2O, ΔH = -890 kJ",note\n"say ""hi""",x';
    expect(batchLines(csv, 'csv').map((l) => l.text)).toEqual(['CH4 + O2 -> CO2 + H2O, ΔH = -890 kJ', 'say "hi"']);
  });

  it('reads quoted fields that span several lines, keeping each record at the line where it starts', () => {
    const csv = [
      'equation,note',
      'H2 + O2 -> H2O,"a note',
      'on two lines"',
      '"N2 + H2',
      '-> NH3",ammonia',
      'Fe + O2 -> Fe2O3,rust',
    ].join('\r\n');
    expect(equationLines(batchLines(csv, 'csv'))).toEqual([
      { line: 2, text: 'H2 + O2 -> H2O' },
      // An equation is one line: the break inside the quoted field becomes a space.
      { line: 4, text: 'N2 + H2 -> NH3' },
      { line: 6, text: 'Fe + O2 -> Fe2O3' },
    ]);
  });

  it('guesses a semicolon or tab delimiter', () => {
    expect(batchLines('equation;note\nN2 + H2 -> NH3;x', 'csv').map((l) => l.text)).toEqual(['', 'N2 + H2 -> NH3']);
    expect(batchLines('N2 + H2 -> NH3\tx\nH2 + O2 -> H2O\ty', 'csv').map((l) => l.text)).toEqual([
      'N2 + H2 -> NH3',
      'H2 + O2 -> H2O',
    ]);
  });
});

describe('equationLines', () => {
  it('skips blank lines and # comments as the core does', () => {
    expect(equationLines(batchLines('  \n # x\nH2 -> H2', 'text'))).toEqual([{ line: 3, text: 'H2 -> H2' }]);
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
