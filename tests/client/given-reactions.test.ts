import { describe, expect, it } from 'vitest';
import {
  emptyRow,
  formatGivenLine,
  fromGivenReaction,
  isBlankRow,
  problemText,
  readEnergyUnit,
  readGivenReactions,
  readNumber,
  readTemperature,
  toGivenReaction,
  type GivenRow,
} from '@/lib/given-reactions';

const row = (over: Partial<GivenRow>): GivenRow => ({ ...emptyRow(), ...over });

describe('readNumber', () => {
  it('reads decimals, exponents and a true minus sign', () => {
    expect(readNumber(' -393.51 ')).toBe(-393.51);
    expect(readNumber('\u2212110.53')).toBe(-110.53);
    expect(readNumber('1.5e3')).toBe(1500);
    expect(readNumber('.5')).toBe(0.5);
  });

  it('says why a text is not a number, pointing at a decimal comma', () => {
    expect(readNumber('-393,51')).toBe('“-393,51” has a decimal comma: write a point, as in -393.51.');
    expect(readNumber('abc')).toBe('“abc” is not a number.');
    expect(readNumber('')).toBe('“” is not a number.');
  });
});

describe('readEnergyUnit', () => {
  it('reads the three units in any case, with or without /mol, and kJ/mol when empty', () => {
    expect(readEnergyUnit('')).toBe('kJ/mol');
    expect(readEnergyUnit('KJ')).toBe('kJ/mol');
    expect(readEnergyUnit('kcal / mol')).toBe('kcal/mol');
    expect(readEnergyUnit('J/mol')).toBe('J/mol');
    expect(readEnergyUnit('eV')).toBeNull();
  });
});

describe('readTemperature', () => {
  it('reads kelvin by default and degrees Celsius or Fahrenheit when written', () => {
    expect(readTemperature('500')).toEqual({ value: 500, unit: 'K' });
    expect(readTemperature('500 K')).toEqual({ value: 500, unit: 'K' });
    expect(readTemperature('25 °C')).toEqual({ value: 25, unit: 'C' });
    expect(readTemperature('77F')).toEqual({ value: 77, unit: 'F' });
  });

  it('explains a temperature it cannot read', () => {
    expect(readTemperature('warm')).toMatch(/not a number\. Write a temperature such as 500 K/);
  });
});

describe('readGivenReactions (lines)', () => {
  it('reads the five fields, skipping blank lines, comments and a header', () => {
    const text = [
      'equation ; ΔH ; u ; unit ; T',
      '# combustion of graphite and of carbon monoxide',
      'C(cr, graphite) + O2(g) -> CO2(g) ; -393.51 ; 0.13',
      '',
      'CO(g) + 1/2 O2(g) -> CO2(g) ; -67.64 ; ; kcal/mol ; 25 °C',
    ].join('\n');
    const reading = readGivenReactions(text, 'lines');
    expect(reading.problems).toEqual([]);
    expect(reading.rows).toEqual([
      row({ equation: 'C(cr, graphite) + O2(g) -> CO2(g)', deltaH: -393.51, uncertainty: 0.13 }),
      row({
        equation: 'CO(g) + 1/2 O2(g) -> CO2(g)',
        deltaH: -67.64,
        unit: 'kcal/mol',
        temperature: 25,
        temperatureUnit: 'C',
      }),
    ]);
  });

  it('names the line, column and field of every problem and returns no rows', () => {
    const text = ['H2(g) + 1/2 O2(g) -> H2O(l) ; -285.83', 'CO(g) ; abc ; -1', 'X(g) -> Y(g)'].join('\n');
    const reading = readGivenReactions(text, 'lines');
    expect(reading.rows).toEqual([]);
    expect(reading.problems).toEqual([
      { line: 2, column: 9, field: 'deltaH', message: '“abc” is not a number.' },
      { line: 2, column: 15, field: 'uncertainty', message: 'An uncertainty is not negative.' },
      { line: 3, column: 13, field: 'deltaH', message: 'ΔH is missing.' },
    ]);
    expect(problemText(reading.problems[0]!)).toBe('Line 2, column 9 (ΔH): “abc” is not a number.');
  });

  it('refuses a sixth field and an unknown unit', () => {
    const reading = readGivenReactions('A(g) -> B(g) ; 1 ; 0.1 ; eV ; 300 ; extra', 'lines');
    expect(reading.problems.map((p) => [p.column, p.field])).toEqual([[37, null]]);
    const unit = readGivenReactions('A(g) -> B(g) ; 1 ; 0.1 ; eV', 'lines');
    expect(unit.problems).toEqual([
      { line: 1, column: 26, field: 'unit', message: '“eV” is not a unit we read: write kJ/mol, kcal/mol or J/mol.' },
    ]);
  });
});

describe('readGivenReactions (CSV)', () => {
  it('reads quoted fields with commas and line breaks, a byte-order mark and padded rows', () => {
    const csv =
      '\uFEFFreaction,dH,u,unit,T\r\n"C(cr, graphite) + O2(g)\r\n-> CO2(g)",-393.51,0.13,,\r\n"CO(g) + 1/2 O2(g) -> CO2(g)",-282.98,0.12,kJ/mol,298.15\r\n';
    const reading = readGivenReactions(csv, 'csv');
    expect(reading.problems).toEqual([]);
    expect(reading.rows).toEqual([
      row({ equation: 'C(cr, graphite) + O2(g) -> CO2(g)', deltaH: -393.51, uncertainty: 0.13 }),
      row({ equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -282.98, uncertainty: 0.12, temperature: 298.15 }),
    ]);
  });

  it('numbers problems by the line a record starts on, and columns from 1', () => {
    const csv = 'equation,ΔH\n"A(g)\n-> B(g)",1\n"C(g) -> D(g)",x\n';
    const reading = readGivenReactions(csv, 'csv');
    expect(reading.problems).toEqual([{ line: 4, column: 2, field: 'deltaH', message: '“x” is not a number.' }]);
  });
});

describe('formatGivenLine', () => {
  it('leaves off trailing empty fields and the default unit, and reads back to the same row', () => {
    const plain = row({ equation: 'A(g) -> B(g)', deltaH: -10.5 });
    expect(formatGivenLine(plain)).toBe('A(g) -> B(g) ; -10.5');
    const full = row({
      equation: 'A(g) -> B(g)',
      deltaH: 2,
      uncertainty: null,
      unit: 'kcal/mol',
      temperature: 25,
      temperatureUnit: 'C',
    });
    expect(formatGivenLine(full)).toBe('A(g) -> B(g) ; 2 ;  ; kcal/mol ; 25 °C');
    for (const r of [plain, full]) expect(readGivenReactions(formatGivenLine(r), 'lines').rows).toEqual([r]);
  });
});

describe('toGivenReaction and fromGivenReaction', () => {
  it('send only what was filled in and come back to the same row', () => {
    const r = row({ equation: ' A(g) -> B(g) ', deltaH: 1, temperature: 400 });
    const reaction = toGivenReaction(r);
    expect(reaction).toEqual({
      equation: 'A(g) -> B(g)',
      deltaH: { value: 1, unit: 'kJ/mol' },
      temperature: { value: 400, unit: 'K' },
    });
    expect(fromGivenReaction(reaction)).toEqual({ ...r, equation: 'A(g) -> B(g)' });
  });
});

describe('isBlankRow', () => {
  it('is true only when nothing was typed', () => {
    expect(isBlankRow(emptyRow())).toBe(true);
    expect(isBlankRow(row({ unit: 'kcal/mol' }))).toBe(true);
    expect(isBlankRow(row({ deltaH: 0 }))).toBe(false);
  });
});
