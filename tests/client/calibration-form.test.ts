import { describe, expect, it } from 'vitest';
import { calibrationRunSchema, type CalibrationRunInput } from '@shared/schemas/calorimetry';
import { calibrationRunHeatCapacity } from '@shared/chemistry/calorimetry/calibration';
import { calibrationRow, calibrationRunInput, emptyCalibrationRow } from '@/lib/calibration-form';

const electrical: CalibrationRunInput = {
  kind: 'electrical',
  current: { value: 2, unit: 'A', uncertainty: 0.01 },
  voltage: { value: 5, unit: 'V', uncertainty: 0.02 },
  duration: { value: 300, unit: 's' },
  deltaT: { value: 2.5, unit: 'K', uncertainty: 0.02 },
  contents: { mass: { value: 200, unit: 'g', uncertainty: 0.1 }, specificHeat: { value: 4.184, unit: 'J/(g K)' } },
};
const mixing: CalibrationRunInput = {
  kind: 'mixing',
  hot: { mass: { value: 50, unit: 'g', uncertainty: 0.05 }, temperature: { value: 60, unit: 'C', uncertainty: 0.1 } },
  cold: { mass: { value: 50, unit: 'g' }, temperature: { value: 20, unit: 'C', uncertainty: 0.1 } },
  finalTemperature: { value: 38, unit: 'C', uncertainty: 0.1 },
  specificHeat: { value: 4.18, unit: 'J/(g K)', uncertainty: 0.01 },
};

describe('calibration rows ↔ calibration runs', () => {
  it.each([
    ['electrical', electrical],
    ['mixing', mixing],
  ])('a %s run fills a row that gives the same run back, and passes the API schema', (_kind, run) => {
    const row = calibrationRow(run);
    expect(row.kind).toBe(run.kind);
    const again = calibrationRunInput(row);
    expect(again).toEqual(run);
    expect(calibrationRunSchema.safeParse(again).success).toBe(true);
    // form → body → form → body
    expect(calibrationRunInput(calibrationRow(calibrationRunInput(row)))).toEqual(run);
  });

  it('a mixing run without a specific heat leaves it out again (the server takes water)', () => {
    const { specificHeat: _dropped, ...withoutWater } = mixing as Extract<CalibrationRunInput, { kind: 'mixing' }>;
    const row = calibrationRow(withoutWater);
    expect(row.specificHeat).toBeNull();
    expect(calibrationRunInput(row)).toEqual(withoutWater);
  });

  it('shows kilograms in grams, and temperatures on mixed scales in kelvin', () => {
    const row = calibrationRow({
      kind: 'mixing',
      hot: {
        mass: { value: 0.05, unit: 'kg', uncertainty: 0.0001 },
        temperature: { value: 140, unit: 'F', uncertainty: 0.18 },
      },
      cold: { mass: { value: 50, unit: 'g' }, temperature: { value: 293.15, unit: 'K' } },
      finalTemperature: { value: 38, unit: 'C' },
    });
    expect(row.scale).toBe('K');
    expect(row.hotMass).toBeCloseTo(50, 10);
    expect(row.hotMassU).toBeCloseTo(0.1, 10);
    // 140 °F = 60 °C = 333.15 K; 0.18 °F = 0.1 K (from memory: 1 °F = 5/9 K).
    expect(row.hotTemperature).toBeCloseTo(333.15, 10);
    expect(row.hotTemperatureU).toBeCloseTo(0.1, 10);
    expect(row.coldTemperature).toBe(293.15);
    expect(row.finalTemperature).toBeCloseTo(311.15, 10);
  });

  it('a new row sends empty fields as NaN, so the server names them, and water for the contents', () => {
    const run = calibrationRunInput(emptyCalibrationRow());
    expect(run.kind).toBe('electrical');
    if (run.kind !== 'electrical') return;
    expect(run.current.value).toBeNaN();
    expect(run.contents.specificHeat).toEqual({ value: 4.184, unit: 'J/(g K)' });
    expect(calibrationRunSchema.safeParse(run).success).toBe(false);
  });

  it('an electrical run typed in the form gives the heat capacity of hand arithmetic', () => {
    const row = emptyCalibrationRow('electrical');
    Object.assign(row, { current: 2, voltage: 5, duration: 300, deltaT: 2.5, contentsMass: 200 });
    const run = calibrationRunInput(row);
    if (run.kind !== 'electrical') throw new Error('expected an electrical run');
    const m = (q: { value: number; uncertainty?: number | null }) => ({ value: q.value, u: q.uncertainty ?? null });
    const c = calibrationRunHeatCapacity({
      kind: 'electrical',
      current: m(run.current),
      voltage: m(run.voltage),
      duration: m(run.duration),
      deltaT: m(run.deltaT),
      contents: { mass: m(run.contents.mass), specificHeat: m(run.contents.specificHeat) },
    });
    // Common practice, no source: C = I·V·t/ΔT − m·c.
    // 2.00 A × 5.00 V × 300 s / 2.50 K = 1200 J/K in all; 200 g × 4.184 J/(g K) = 836.8 J/K of water;
    // the calorimeter itself: 1200 − 836.8 = 363.2 J/K.
    expect(c.value).toBeCloseTo(363.2, 9);
  });
});
