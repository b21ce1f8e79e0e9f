import { describe, expect, it } from 'vitest';
import { lineOf, markColumn } from '@/lib/error-span';

describe('markColumn', () => {
  it('marks a whole unknown symbol at its column', () => {
    // "H2 + Xx2 -> H2O": X is the 6th character.
    expect(markColumn('H2 + Xx2 -> H2O', 6)).toEqual({ before: 'H2 + ', bad: 'Xx', after: '2 -> H2O', atEnd: false });
  });
  it('marks a single punctuation character', () => {
    expect(markColumn('H2 + + O2', 6)).toEqual({ before: 'H2 + ', bad: '+', after: ' O2', atEnd: false });
  });
  it('marks a blank after the end when something is missing', () => {
    expect(markColumn('H2 + O2 ->', 11)).toEqual({ before: 'H2 + O2 ->', bad: ' ', after: '', atEnd: true });
  });
  it('clamps columns outside the line', () => {
    expect(markColumn('abc', 0).before).toBe('');
    expect(markColumn('abc', 99).atEnd).toBe(true);
  });
});

describe('lineOf', () => {
  it('picks the numbered line', () => expect(lineOf('a\r\nb\nc', 2)).toBe('b'));
  it('gives empty text beyond the end', () => expect(lineOf('a', 3)).toBe(''));
});
