import { describe, expect, it } from 'vitest';
import {
  calibrationRunHeatCapacity,
  calorimeterCalibration,
  type ElectricalCalibrationRun,
  type Measured,
} from '@shared/chemistry/calorimetry';

const m = (value: number, u: number | null = null): Measured => ({ value, u });

describe('calibrationRunHeatCapacity', () => {
  it('electrical: C = I·V·t/ΔT (Atkins & de Paula, Physical Chemistry, calorimeter calibration; from memory)', () => {
    // A current of 10.0 A from a 12 V supply for 300 s gives 36 kJ; a rise of 5.5 K means
    // C = 36 kJ / 5.5 K = 6.5 kJ/K (nothing counted separately as contents).
    const run: ElectricalCalibrationRun = {
      kind: 'electrical',
      current: m(10.0),
      voltage: m(12),
      duration: m(300),
      deltaT: m(5.5),
      contents: { mass: m(0), specificHeat: m(4.184) },
    };
    expect(calibrationRunHeatCapacity(run).value / 1000).toBeCloseTo(6.5, 1);
  });

  it('electrical: the contents are taken off, leaving the calorimeter itself', () => {
    // 2.00 A × 5.00 V × 200 s = 2000 J; ΔT = 4.50 K → 444.44 J/K in all; 100 g of water at
    // 4.184 J/(g K) is 418.40 J/K, leaving 26.04 J/K (hand-computed).
    const r = calibrationRunHeatCapacity({
      kind: 'electrical',
      current: m(2.0, 0.01),
      voltage: m(5.0, 0.01),
      duration: m(200, 0.5),
      deltaT: m(4.5, 0.01),
      contents: { mass: m(100, 0.05), specificHeat: m(4.184) },
    });
    expect(r.value).toBeCloseTo(2000 / 4.5 - 418.4, 8);
    // Relative uncertainties 0.5 %, 0.2 %, 0.25 %, 0.22 % on 444 J/K, and 0.05 g × 4.184 J/(g K).
    const expected = Math.sqrt(
      (444.444 * 0.005) ** 2 +
        (444.444 * 0.002) ** 2 +
        (444.444 * 0.0025) ** 2 +
        (444.444 * (0.01 / 4.5)) ** 2 +
        (0.05 * 4.184) ** 2,
    );
    expect(r.u).toBeCloseTo(expected, 2);
  });

  it('hot and cold water: m_h c (T_h − T_f) = (m_c c + C)(T_f − T_c) (energy balance; hand-computed)', () => {
    // 50.0 g at 60.0 °C onto 50.0 g at 20.0 °C settling at 39.0 °C:
    // C = 50 × 4.184 × 21 / 19 − 50 × 4.184 = 231.221 − 209.200 = 22.021 J/K.
    const r = calibrationRunHeatCapacity({
      kind: 'mixing',
      hot: { mass: m(50), temperature: m(333.15) },
      cold: { mass: m(50), temperature: m(293.15) },
      finalTemperature: m(312.15),
      specificHeat: m(4.184),
    });
    expect(r.value).toBeCloseTo(22.021, 3);
  });

  it('refuses a final temperature outside the hot and cold ones, naming it', () => {
    expect(() =>
      calibrationRunHeatCapacity(
        {
          kind: 'mixing',
          hot: { mass: m(50), temperature: m(333.15) },
          cold: { mass: m(50), temperature: m(293.15) },
          finalTemperature: m(290),
          specificHeat: m(4.184),
        },
        ['calibration', 'runs', 0],
      ),
    ).toThrow(expect.objectContaining({ path: ['calibration', 'runs', 0, 'final', 'value'] }));
  });
});

describe('calorimeterCalibration', () => {
  const run = (deltaT: number): ElectricalCalibrationRun => ({
    kind: 'electrical',
    current: m(2.0, 0.01),
    voltage: m(5.0, 0.01),
    duration: m(200, 0.5),
    deltaT: m(deltaT, 0.01),
    contents: { mass: m(100, 0.05), specificHeat: m(4.184) },
  });

  it('averages several runs with u = s/√n and keeps a suspect run in the mean', () => {
    const r = calorimeterCalibration([run(4.5), run(4.49), run(4.51), run(4.5)]);
    const values = [4.5, 4.49, 4.51, 4.5].map((dT) => 2000 / dT - 418.4);
    const mean = values.reduce((a, b) => a + b) / 4;
    const s = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / 3);
    expect(r.basis).toBe('replicates');
    expect(r.value).toBeCloseTo(mean, 8);
    expect(r.u).toBeCloseTo(s / 2, 8);
  });

  it('uses the stated inputs of a single run and says it is one run', () => {
    const r = calorimeterCalibration([run(4.5)]);
    expect(r.basis).toBe('one-run');
    expect(r.u).toBeCloseTo(r.runs[0]!.u, 12);
    expect(r.notes.join(' ')).toMatch(/One calibration run/);
  });
});
