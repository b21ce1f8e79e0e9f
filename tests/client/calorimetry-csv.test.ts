import { describe, expect, it } from 'vitest';
import { guessMapping, readReadingsTable, ReadingsError, seriesFromTable } from '@/lib/calorimetry-csv';

describe('readReadingsTable and seriesFromTable', () => {
  it('maps named columns and converts minutes to seconds', () => {
    const table = readReadingsTable('reading,time/min,temperature/°C\n1,0,22.50\n2,0.5,22.51\n3,1,25.80\n');
    expect(table.columns).toEqual(['reading', 'time/min', 'temperature/°C']);
    const mapping = guessMapping(table);
    expect(mapping).toEqual({ time: 1, temperature: 2, timeUnit: 'min' });
    expect(seriesFromTable(table, mapping)).toEqual([
      [0, 22.5],
      [30, 22.51],
      [60, 25.8],
    ]);
  });

  it('reads a file without a header, semicolon-separated', () => {
    const table = readReadingsTable('0;295.1\n10;295.2\n');
    expect(table.hasHeader).toBe(false);
    expect(seriesFromTable(table, guessMapping(table))).toEqual([
      [0, 295.1],
      [10, 295.2],
    ]);
  });

  it('names the line and column of a cell that is not a number', () => {
    const table = readReadingsTable('t_s,T_C\n0,22.5\n10,n/a\n');
    const run = () => seriesFromTable(table, { time: 0, temperature: 1, timeUnit: 's' });
    expect(run).toThrow(ReadingsError);
    expect(run).toThrow(/Line 3/);
    try {
      run();
    } catch (error) {
      expect((error as ReadingsError).column).toBe('T_C');
    }
  });

  it('refuses times that do not increase', () => {
    const table = readReadingsTable('t_s,T_C\n0,22.5\n0,22.6\n');
    expect(() => seriesFromTable(table, { time: 0, temperature: 1, timeUnit: 's' })).toThrow(/does not increase/);
  });
});
