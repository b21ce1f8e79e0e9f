import { describe, expect, it } from 'vitest';
import {
  absoluteEnthalpy,
  enthalpyChange,
  enthalpyIncrement,
  entropy,
  evaluateMonotoneCubic,
  heatCapacity,
  integrateMonotoneCubic,
  integrateMonotoneCubicOverT,
  monotoneCubic,
  TemperatureOutOfRangeError,
  ThermoInputError,
  validRange,
  type SpeciesThermoModel,
} from '@shared/chemistry/thermo';
import { entry, nasaModel, refH } from './nasa-fixture';

// Shomate coefficients of the NIST-JANAF fits (Chase, NIST-JANAF Thermochemical Tables, 4th ed.,
// 1998, as printed in the NIST Chemistry WebBook), typed from memory: A, B, C, D, E, F, G, H.
const SHOMATE_N2 = {
  ranges: [100, 500, 2000],
  coefficients: [
    [28.98641, 1.853978, -9.647459, 16.63537, 0.000117, -8.671914, 226.4168, 0.0],
    [19.50583, 19.88705, -8.598535, 1.369784, 0.527601, -4.935202, 212.39, 0.0],
  ],
};
const SHOMATE_CO2 = {
  ranges: [298, 1200],
  coefficients: [[24.99735, 55.18696, -33.69137, 7.948387, -0.136638, -403.6075, 228.2431, -393.5224]],
};
const SHOMATE_H2O = {
  ranges: [500, 1700],
  coefficients: [[30.092, 6.832514, 6.793435, -2.53448, 0.082139, -250.881, 223.3967, -241.8264]],
};

const shomate = (
  species: string,
  fit: { ranges: number[]; coefficients: number[][] },
  scale: 'formation' | 'relative' = 'relative',
): SpeciesThermoModel => ({
  species,
  scale,
  forms: [{ form: null, label: 'NIST-JANAF Shomate', model: { kind: 'shomate', ...fit } }],
});

// JANAF tabulated Cp°/J K⁻¹ mol⁻¹ (Chase 1998), typed from memory.
const JANAF_CP: Record<string, [number, number][]> = {
  'N2(g)': [
    [298.15, 29.124],
    [300, 29.125],
    [400, 29.249],
    [500, 29.58],
    [600, 30.11],
    [700, 30.754],
    [800, 31.433],
    [900, 32.09],
    [1000, 32.697],
  ],
  'CO2(g)': [
    [298.15, 37.129],
    [300, 37.221],
    [400, 41.325],
    [500, 44.627],
    [600, 47.321],
    [700, 49.564],
    [800, 51.434],
    [900, 52.999],
    [1000, 54.308],
  ],
  'H2O(g)': [
    [298.15, 33.59],
    [300, 33.596],
    [400, 34.262],
    [500, 35.226],
    [600, 36.325],
    [700, 37.495],
    [800, 38.721],
    [900, 39.987],
    [1000, 41.268],
  ],
};
const cpTable = (species: string): SpeciesThermoModel => ({
  species,
  scale: 'relative',
  forms: [{ form: null, label: 'JANAF Cp table', model: { kind: 'cp-table', points: JANAF_CP[species]! } }],
});

// NASA TM-4513 (fixture): H(T) − H(298.15 K) by the independent straight-line evaluation.
const nasaIncrement = (label: string, t: number) => refH(entry(label), t) - refH(entry(label), 298.15);

describe('Shomate models (NIST-JANAF fits, from memory) against NASA TM-4513', () => {
  it('N2 and CO2: H(T) − H(298.15 K) at 500 K and 1000 K within 0.02 kJ/mol', () => {
    for (const [model, label] of [
      [shomate('N2(g)', SHOMATE_N2), 'N2'],
      [shomate('CO2(g)', SHOMATE_CO2), 'CO2'],
    ] as const) {
      for (const t of [500, 1000])
        expect(Math.abs(enthalpyIncrement(model, t) - nasaIncrement(label, t))).toBeLessThan(0.02);
    }
  });

  it('H2O(g) from 500 K: H(1000 K) − H(500 K) within 0.02 kJ/mol, and no increment from 298.15 K (outside the fit)', () => {
    const model = shomate('H2O(g)', SHOMATE_H2O);
    expect(
      Math.abs(enthalpyChange(model, 500, 1000) - (nasaIncrement('H2O', 1000) - nasaIncrement('H2O', 500))),
    ).toBeLessThan(0.02);
    expect(() => enthalpyIncrement(model, 1000)).toThrow(TemperatureOutOfRangeError);
  });

  it('Cp° within 0.05 J/(mol K) of NASA; S° with the caller’s S°(298.15 K) within 0.05 J/(mol K)', () => {
    const n2 = shomate('N2(g)', SHOMATE_N2);
    const n2Nasa = nasaModel('N2(g)', [[null, 'N2']]);
    for (const t of [300, 500, 800, 1000]) {
      expect(Math.abs(heatCapacity(n2, t) - heatCapacity(n2Nasa, t))).toBeLessThan(0.05);
      expect(Math.abs(entropy(n2, t, 191.609) - entropy(n2Nasa, t))).toBeLessThan(0.05); // S°(298.15) CODATA 1989, from memory
    }
  });

  it('on the formation scale, At + … + F is H° with the H coefficient = ΔfH°(298.15 K) (CO2: −393.52 kJ/mol)', () => {
    const co2 = shomate('CO2(g)', SHOMATE_CO2, 'formation');
    expect(absoluteEnthalpy(co2, 298.15)).toBeCloseTo(-393.52, 1);
    expect(Math.abs(absoluteEnthalpy(co2, 1000) - refH(entry('CO2'), 1000))).toBeLessThan(0.02);
  });

  it('a relative-scale model needs S°(298.15 K) from the caller and has no absolute H', () => {
    const n2 = shomate('N2(g)', SHOMATE_N2);
    expect(() => entropy(n2, 500)).toThrow(ThermoInputError);
    expect(() => absoluteEnthalpy(n2, 500)).toThrow(ThermoInputError);
  });
});

describe('Cp tables (JANAF Cp°, from memory) against NASA TM-4513', () => {
  for (const [species, label] of [
    ['N2(g)', 'N2'],
    ['CO2(g)', 'CO2'],
    ['H2O(g)', 'H2O'],
  ] as const) {
    it(`${species}: H(T) − H(298.15 K) at 500 K and 1000 K within 0.02 kJ/mol`, () => {
      const model = cpTable(species);
      for (const t of [500, 1000])
        expect(Math.abs(enthalpyIncrement(model, t) - nasaIncrement(label, t))).toBeLessThan(0.02);
    });
  }

  it('passes through the tabulated points and stays inside the table', () => {
    const model = cpTable('CO2(g)');
    for (const [t, cp] of JANAF_CP['CO2(g)']!) expect(heatCapacity(model, t)).toBeCloseTo(cp, 10);
    expect(validRange(model)).toMatchObject({ min: 298.15, max: 1000 });
    expect(() => heatCapacity(model, 1000.5)).toThrow(TemperatureOutOfRangeError);
  });
});

describe('monotone cubic interpolation (PCHIP)', () => {
  // Reference: SciPy 1.17.1 `PchipInterpolator` and its `integrate`, an independent
  // implementation; ∫p/T by `scipy.integrate.quad` (epsrel 1e-14). Values computed offline.
  const N2 = JANAF_CP['N2(g)']!;
  const PEAK: [number, number][] = [
    [200, 40],
    [250, 42],
    [300, 55],
    [310, 90],
    [330, 60],
    [400, 58],
    [600, 58],
    [700, 62],
  ]; // invented, non-monotone, uneven
  const cases: [string, [number, number][], number[], [number, number, number, number][]][] = [
    [
      'N2 Cp table',
      N2,
      [
        0.000527835582269238, 0.0006685241782053126, 0.0018041318681318544, 0.004075029036004645, 0.0058146507666098956,
        0.006610370370370373, 0.0066781886227545014, 0.006310110759493683, 0.005819999999999972,
      ],
      [
        [299.075, 29.124467465762187, 26.93991735192785, 0.09021704979798317],
        [607.3, 30.15300495798759, 9114.201146005595, 20.932847199499346],
        [1000, 32.697, 21462.28738835628, 36.561569885097384],
      ],
    ],
    [
      'peaked data',
      PEAK,
      [0, 0.06933333333333333, 0.5986842105263158, 0, -0.06823925863521482, 0, 0, 0.05333333333333333],
      [
        [225, 40.56666666666666, 1004.8611111111112, 4.733565866376413],
        [337.3, 59.53961853934141, 7018.811995861645, 25.888357105448694],
        [700, 62.00000000000001, 28240.228991462085, 68.54920607648205],
      ],
    ],
    [
      'two points',
      [
        [300, 20],
        [500, 30],
      ],
      [0.05, 0.05],
      [
        [400, 25, 2250, 6.438410362258905],
        [500, 30, 5000, 12.554128118829952],
      ],
    ],
    // End slope limited to 3·m0 where the data turn (invented points).
    [
      'turning end',
      [
        [300, 10],
        [310, 11],
        [311, 0.5],
        [400, 3],
      ],
      [0.30000000000000004, 0, 0, 0.08426966292134831],
      [
        [305, 10.875, 52.65625, NaN],
        [310.5, 5.75, 112.015625, NaN],
        [350, 0.7103603137159222, 134.80101305873023, NaN],
      ],
    ],
  ];
  for (const [name, points, slopes, values] of cases) {
    it(`${name}: slopes, values, ∫p dT and ∫p/T dT agree with SciPy`, () => {
      const f = monotoneCubic(
        points.map((p) => p[0]),
        points.map((p) => p[1]),
      );
      f.slopes.forEach((s, i) => expect(s).toBeCloseTo(slopes[i]!, 12));
      for (const [t, value, integral, overT] of values) {
        expect(evaluateMonotoneCubic(f, t)).toBeCloseTo(value, 9);
        expect(integrateMonotoneCubic(f, t)).toBeCloseTo(integral, 7);
        if (!Number.isNaN(overT)) expect(integrateMonotoneCubicOverT(f, points[0]![0], t)).toBeCloseTo(overT, 9);
      }
    });
  }

  it('does not overshoot: between two knots the value stays between their values', () => {
    const f = monotoneCubic(
      PEAK.map((p) => p[0]),
      PEAK.map((p) => p[1]),
    );
    for (let k = 0; k + 1 < PEAK.length; k++) {
      const [x0, y0] = PEAK[k]!;
      const [x1, y1] = PEAK[k + 1]!;
      for (let j = 1; j < 20; j++) {
        const v = evaluateMonotoneCubic(f, x0 + ((x1 - x0) * j) / 20);
        expect(v).toBeGreaterThanOrEqual(Math.min(y0, y1) - 1e-9);
        expect(v).toBeLessThanOrEqual(Math.max(y0, y1) + 1e-9);
      }
    }
  });
});

describe('constant Cp', () => {
  it('H = Cp·ΔT and S = Cp·ln(T2/T1) (definition)', () => {
    const model: SpeciesThermoModel = {
      species: 'X(l)',
      scale: 'relative',
      forms: [{ form: null, label: 'x', model: { kind: 'constant', cp: 75.3, range: [273.15, 373.15] } }],
    };
    expect(enthalpyIncrement(model, 350)).toBeCloseTo((75.3 * (350 - 298.15)) / 1000, 12);
    expect(entropy(model, 350, 70)).toBeCloseTo(70 + 75.3 * Math.log(350 / 298.15), 12);
    expect(() => enthalpyIncrement(model, 400)).toThrow(TemperatureOutOfRangeError);
  });
});
