import { describe, expect, it } from 'vitest';
import { curveRange, gapIntervals, gapReason } from '@/lib/enthalpy-curve';

describe('curveRange', () => {
  it('asks for the range every model covers, widened by a tenth to multiples of 5 K', () => {
    // Common range 250–650 K, 40 K on each side.
    expect(
      curveRange([
        [250, 1000],
        [200, 650],
      ]),
    ).toEqual({ kind: 'range', from: 210, to: 690, points: 81 });
  });

  it('uses a fit from 300 K down to 298.15 K', () => {
    // 298.15–351.4 K, pad 5.325 K: 292.825 → 290, 356.725 → 360.
    expect(
      curveRange([
        [300, 1000],
        [273.15, 351.4],
      ]),
    ).toMatchObject({ from: 290, to: 360 });
  });

  it('spans all models when they share no temperature', () => {
    expect(
      curveRange([
        [200, 300],
        [400, 500],
      ]),
    ).toMatchObject({ from: 170, to: 530 });
  });

  it('has no curve when a species has no model, and takes the user range as given', () => {
    expect(curveRange([[200, 300], null]).kind).toBe('none');
    expect(curveRange([null], { from: 300, to: 400 })).toEqual({ kind: 'range', from: 300, to: 400, points: 81 });
    expect(curveRange([[200, 300]], { from: 400, to: 300 }).kind).toBe('none');
  });
});

describe('gapIntervals', () => {
  it('joins neighbouring gaps and reaches to the points beside them', () => {
    const points = [{ temperature: 300 }, { temperature: 310 }];
    const gaps = [
      { temperature: 280, reason: 'The reaction cannot be evaluated at 280 K: A(l) starts at 290 K.' },
      { temperature: 290, reason: 'The reaction cannot be evaluated at 290 K: A(l) starts at 290 K.' },
      { temperature: 320, reason: 'The reaction cannot be evaluated at 320 K: B(l) ends at 315 K.' },
    ];
    expect(gapIntervals(points, gaps)).toEqual([
      { from: 280, to: 300, reasons: ['A(l) starts at 290 K.'] },
      { from: 310, to: 320, reasons: ['B(l) ends at 315 K.'] },
    ]);
    expect(gapReason('no prefix')).toBe('no prefix');
  });
});

describe('curveRange on wide models', () => {
  it('widens by 100 K at most', () => {
    // 200–5000 K: a tenth would be 480 K; 100 K is used.
    expect(
      curveRange([
        [200, 6000],
        [200, 5000],
      ]),
    ).toMatchObject({ from: 100, to: 5100 });
  });
});
