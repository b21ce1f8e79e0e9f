import { describe, expect, it } from 'vitest';
import { CalorimetryInputError, driftCorrection, lineAt } from '@shared/chemistry/calorimetry';
import { newtonianReadings, trueRise, type NewtonianRun } from './support';

// Synthetic curves with a known answer (generated here): Newton's law of cooling with stirring
// and a first-order heat release, solved exactly (support.ts). The corrected rise must recover
// the release ∫p dt; the uncorrected rise T_f − T_i must not, so each check can fail.
const quiet: NewtonianRun = {
  k: 1e-4,
  convergence: 295.05,
  start: 294.0,
  rise: 3,
  release: 0.1,
  mixingTime: 300,
  step: 5,
  end: 900,
};

describe('driftCorrection', () => {
  const series = newtonianReadings(quiet);
  const truth = trueRise(quiet, 400);

  it('recovers the release on a Newtonian curve by Regnault–Pfaundler', () => {
    const r = driftCorrection(series, { method: 'regnault-pfaundler', mixingTime: 300, afterPeriodStart: 400 });
    expect(Math.abs(r.observedDeltaT - truth)).toBeGreaterThan(0.015);
    expect(r.correctedDeltaT).toBeCloseTo(truth, 3);
    expect(Math.abs(r.correctedDeltaT - truth)).toBeLessThan(2e-4);
    // The exchange law read from the drifts is the one the curve was made with.
    expect(r.exchange!.coolingConstant).toBeCloseTo(quiet.k, 6);
    expect(r.exchange!.convergenceTemperature!).toBeCloseTo(quiet.convergence, 1);
  });

  it("recovers it by Dickinson's equal areas, with t_m near 63 % of the rise for a first-order release", () => {
    const r = driftCorrection(series, { method: 'dickinson', mixingTime: 300, afterPeriodStart: 400 });
    expect(Math.abs(r.correctedDeltaT - truth)).toBeLessThan(1e-3);
    // For an exponential release t_m − t_i → 1/λ, where 1 − 1/e = 63 % of the rise is reached
    // (the 60–63 % rule of thumb; domain notes §5, Dickinson 1915).
    expect(r.tMid! - 300).toBeCloseTo(1 / quiet.release, 0);
    expect(r.riseFractionAtTMid!).toBeGreaterThan(0.6);
    expect(r.riseFractionAtTMid!).toBeLessThan(0.66);
    // The two drift lines meet the curve's boundary readings and are what the correction used.
    expect(lineAt(r.after, r.tMid!) - lineAt(r.fore, r.tMid!)).toBeCloseTo(r.correctedDeltaT, 12);
    expect(r.fore.anchor.time).toBe(300);
    expect(r.after.anchor.time).toBe(400);
  });

  it('handles a fall in temperature (an endothermic process) the same way', () => {
    const cold = { ...quiet, rise: -1.5 };
    const r = driftCorrection(newtonianReadings(cold), {
      method: 'regnault-pfaundler',
      mixingTime: 300,
      afterPeriodStart: 400,
    });
    expect(r.correctedDeltaT).toBeLessThan(0);
    expect(Math.abs(r.correctedDeltaT - trueRise(cold, 400))).toBeLessThan(2e-4);
    const d = driftCorrection(newtonianReadings(cold), { method: 'dickinson', mixingTime: 300, afterPeriodStart: 400 });
    expect(Math.abs(d.correctedDeltaT - trueRise(cold, 400))).toBeLessThan(1e-3);
  });

  it('keeps Regnault–Pfaundler right under strong exchange, and says Dickinson’s steady-drift assumption fails', () => {
    const leaky = { ...quiet, k: 2e-3 };
    const s = newtonianReadings(leaky);
    const truthLeaky = trueRise(leaky, 400);
    const rp = driftCorrection(s, { method: 'regnault-pfaundler', mixingTime: 300, afterPeriodStart: 400 });
    expect(Math.abs(rp.observedDeltaT - truthLeaky) / truthLeaky).toBeGreaterThan(0.1);
    expect(Math.abs(rp.correctedDeltaT - truthLeaky) / truthLeaky).toBeLessThan(0.003);
    const d = driftCorrection(s, { method: 'dickinson', mixingTime: 300, afterPeriodStart: 400 });
    expect(d.notes.join(' ')).toMatch(/assumes steady drifts/);
  });

  it('finds the start of the after-period where the release has died away, and says so', () => {
    const r = driftCorrection(series, { method: 'regnault-pfaundler', mixingTime: 300 });
    expect(r.afterPeriodFound).toBe(true);
    // Less than 0.1 % of the release is left after it: e^{−λ(t_f − t_i)} < 0.001.
    expect(r.mainPeriod.end).toBeGreaterThanOrEqual(300 + Math.log(1000) / quiet.release);
    expect(r.mainPeriod.end).toBeLessThan(500);
    expect(Math.abs(r.correctedDeltaT - quiet.rise)).toBeLessThan(2e-3);
    expect(r.notes.join(' ')).toMatch(/after-period was taken from/);
  });

  it('gives an uncertainty that matches the spread of repeated noisy runs (seeded)', () => {
    const noisy = { ...quiet, noise: 0.002 };
    const values: number[] = [];
    const stated: number[] = [];
    for (let seed = 1; seed <= 300; seed++) {
      const r = driftCorrection(newtonianReadings({ ...noisy, seed }), {
        method: 'regnault-pfaundler',
        mixingTime: 300,
        afterPeriodStart: 400,
      });
      values.push(r.correctedDeltaT);
      stated.push(r.u!);
    }
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
    const typicalU = stated.reduce((a, b) => a + b, 0) / stated.length;
    expect(Math.abs(mean - truth)).toBeLessThan(3 * (sd / Math.sqrt(values.length)) + 2e-4);
    // The propagated u describes the real scatter within 25 % (neglected correlations included).
    expect(typicalU / sd).toBeGreaterThan(0.75);
    expect(typicalU / sd).toBeLessThan(1.25);
  });

  it('names the field at fault', () => {
    const shuffled = series.map((p) => [...p] as [number, number]);
    shuffled[3] = [shuffled[2]![0], shuffled[3]![1]];
    expect(() => driftCorrection(shuffled, { method: 'dickinson', mixingTime: 300 }, ['temperature'])).toThrow(
      expect.objectContaining({ path: ['temperature', 'series', 3, 0] }),
    );
    expect(() => driftCorrection(series, { method: 'dickinson', mixingTime: 0 })).toThrow(
      expect.objectContaining({ path: ['mixingTime'] }),
    );
    expect(() => driftCorrection(series, { method: 'dickinson', mixingTime: 300, afterPeriodStart: 250 })).toThrow(
      expect.objectContaining({ path: ['afterPeriodStart'] }),
    );
    expect(() => driftCorrection(series.slice(0, 4), { method: 'dickinson', mixingTime: 5 })).toThrow(
      CalorimetryInputError,
    );
    // Readings that stop during the rise: there is no after-period to find.
    const cut = series.filter(([t]) => t <= 320);
    expect(() => driftCorrection(cut, { method: 'dickinson', mixingTime: 300 })).toThrow(
      expect.objectContaining({ code: 'unprocessable' }),
    );
  });
});
