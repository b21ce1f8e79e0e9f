import { describe, expect, it } from 'vitest';
import { lineOf, markColumn } from '@/lib/error-span';

describe('markColumn', () => {
  it('marks the faulty text the core names by column and length', () => {
    // "H2 + Xx2 -> H2O": X is the 6th character; the core reports length 2 for the symbol.
    expect(markColumn('H2 + Xx2 -> H2O', 6, 2)).toEqual({
      before: 'H2 + ',
      bad: 'Xx',
      after: '2 -> H2O',
      atEnd: false,
    });
  });
  it('marks one character when the length is 0', () => {
    expect(markColumn('H2 + + O2', 6, 0)).toEqual({ before: 'H2 + ', bad: '+', after: ' O2', atEnd: false });
  });
  it('keeps a character outside the basic plane whole', () => {
    expect(markColumn('H2 -> 𝐇', 7).bad).toBe('𝐇');
  });
  it('marks a blank after the end when something is missing', () => {
    expect(markColumn('H2 + O2 ->', 11)).toEqual({ before: 'H2 + O2 ->', bad: ' ', after: '', atEnd: true });
  });
  it('clamps columns and lengths outside the line', () => {
    expect(markColumn('abc', 0).before).toBe('');
    expect(markColumn('abc', 99).atEnd).toBe(true);
    expect(markColumn('abc', 2, 50)).toEqual({ before: 'a', bad: 'bc', after: '', atEnd: false });
  });
});

describe('lineOf', () => {
  it('picks the numbered line', () => expect(lineOf('a\r\nb\nc', 2)).toBe('b'));
  it('gives empty text beyond the end', () => expect(lineOf('a', 3)).toBe(''));
});
