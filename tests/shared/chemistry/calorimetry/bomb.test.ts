import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { parseFormula } from '@shared/chemistry';
import {
  buoyancyCorrected,
  combustionReaction,
  formationEnthalpy,
  nitricAcidEnergy,
  reduceBombCalorimetry,
  SRM_39J_MASSIC_ENERGY,
  type BombRun,
  type FormationValue,
  type Measured,
} from '@shared/chemistry/calorimetry';
import { seededNormal } from './support';

const m = (value: number, u: number | null = null): Measured => ({ value, u });
const none = m(0, 0);
const reaction = (formula: string, sulfur: 'H2SO4(aq)' | 'SO2(g)' = 'H2SO4(aq)') =>
  combustionReaction(parseFormula(formula), 'cr', sulfur);

/** CODATA Key Values (Cox, Wagman & Medvedev 1989; as in seeds/library/values-codata.csv, from memory). */
const codata = new Map<string, FormationValue>([
  ['CO2(g)', { value: -393.51, u: 0.065 }],
  ['H2O(l)', { value: -285.83, u: 0.02 }],
  ['N2(g)', { value: 0, u: 0 }],
]);

describe('combustionReaction', () => {
  it('benzoic acid burns with 15/2 O2 and Δn(gas) = −1/2 (domain notes §4)', () => {
    const r = reaction('C7H6O2');
    expect(r.equation).toBe('C7H6O2(cr) + 15/2 O2(g) -> 7 CO2(g) + 3 H2O(l)');
    expect(r.deltaNGas.equals(new Fraction(-1, 2))).toBe(true);
    // M(C7H6O2) = 122.12 g/mol (CIAAW 2021: 7 × 12.011 + 6 × 1.008 + 2 × 15.999 = 122.123).
    expect(r.sample.molarMass.value).toBeCloseTo(122.123, 3);
  });

  it('follows Δn = c/2 + d/2 − b/4 for CₐH_bO_cN_d (glycine: 1/4)', () => {
    const r = reaction('C2H5NO2');
    expect(r.equation).toBe('C2H5NO2(cr) + 9/4 O2(g) -> 2 CO2(g) + 5/2 H2O(l) + 1/2 N2(g)');
    expect(r.deltaNGas.equals(new Fraction(2, 2).add(new Fraction(1, 2)).sub(new Fraction(5, 4)))).toBe(true);
  });

  it('sends sulfur to H2SO4(aq) or SO2(g) as asked, balancing O and H (hand-balanced thiophene)', () => {
    // C4H4S + 13/2 O2 → 4 CO2 + H2O + H2SO4(aq);  C4H4S + 6 O2 → 4 CO2 + 2 H2O + SO2.
    expect(reaction('C4H4S').equation).toBe('C4H4S(cr) + 13/2 O2(g) -> 4 CO2(g) + H2O(l) + H2SO4(aq)');
    expect(reaction('C4H4S').deltaNGas.equals(new Fraction(-5, 2))).toBe(true);
    expect(reaction('C4H4S', 'SO2(g)').equation).toBe('C4H4S(cr) + 6 O2(g) -> 4 CO2(g) + 2 H2O(l) + SO2(g)');
  });

  it('takes water from the bomb when the sample has too little hydrogen for its sulfuric acid', () => {
    // CS2 + 4 O2 + 2 H2O(l) → CO2 + 2 H2SO4(aq) (hand-balanced).
    const r = reaction('CS2');
    expect(r.equation).toBe('CS2(cr) + 4 O2(g) + 2 H2O(l) -> CO2(g) + 2 H2SO4(aq)');
  });

  it('refuses elements whose products it does not handle, naming the formula', () => {
    expect(() => reaction('C6H5Cl')).toThrow(expect.objectContaining({ path: ['sample', 'formula'] }));
  });
});

describe('formationEnthalpy', () => {
  it('closes the Hess cycle for benzoic acid: ΔcH° = −3226.9 → ΔfH° ≈ −385.2 kJ/mol', () => {
    // ΔcH°(C7H6O2, cr) = −3226.9 kJ/mol and ΔfH°(C7H6O2, cr) = −385.2 kJ/mol (Cox & Pilcher,
    // Thermochemistry of Organic and Organometallic Compounds, 1970; both from memory).
    const r = formationEnthalpy(reaction('C7H6O2'), m(-3226.9, 0.2), codata);
    expect(r.value).toBeCloseTo(7 * -393.51 + 3 * -285.83 + 3226.9, 8);
    expect(Math.abs(r.value - -385.2)).toBeLessThan(0.3);
    // u² = u²(ΔcH°) + 7²u²(CO2) + 3²u²(H2O) (domain notes §6).
    expect(r.u).toBeCloseTo(Math.sqrt(0.2 ** 2 + (7 * 0.065) ** 2 + (3 * 0.02) ** 2), 8);
  });

  it('says which formation value is missing', () => {
    expect(() => formationEnthalpy(reaction('C4H4S'), m(-2800), codata)).toThrow(/H2SO4\(aq\)/);
  });
});

describe('reduceBombCalorimetry', () => {
  const run = (mass: number, deltaT: number, extra: Partial<BombRun> = {}): BombRun => ({
    mass: m(mass, 0.00002),
    deltaT: m(deltaT, 0.0003),
    fuse: m(50, 2),
    nitricAcid: m(40, 4),
    auxiliary: none,
    ignition: none,
    ...extra,
  });
  // An invented calorimeter of ε = 10 000 J/K: the rise each calibration gives is computed from it.
  const epsilon = 10_000;
  const riseFor = (mass: number, massic: number, other = 90) => (mass * -massic + other) / epsilon;
  const certificate = m(SRM_39J_MASSIC_ENERGY * 1000, 1.5);
  const calibrationRuns = [0.98, 1.0, 1.01, 0.99, 1.02, 1.0].map((g) => run(g, riseFor(g, certificate.value)));

  it('returns the certificate value when the calibrant is burnt as a sample (NIST SRM 39j, −26.434 kJ/g; from memory)', () => {
    const samples = [0.95, 1.05].map((g) => run(g, riseFor(g, certificate.value)));
    const r = reduceBombCalorimetry({
      energyEquivalent: { kind: 'calibration', certificate, runs: calibrationRuns },
      runs: samples,
      reaction: reaction('C7H6O2'),
      standardStateCorrection: null,
      temperature: 298.15,
      formation: codata,
    });
    expect(r.energyEquivalent.value).toBeCloseTo(epsilon, 6);
    expect(r.massicEnergy.value / 1000).toBeCloseTo(-26.434, 6);
    // RT = 2.479 kJ/mol at 298.15 K (domain notes §4).
    expect(r.rt).toBeCloseTo(2.479, 3);
    expect(r.deltaCH.value - r.deltaCU.value).toBeCloseTo(-0.5 * r.rt, 10);
    expect(r.notes.join(' ')).toMatch(/Washburn\) corrections not applied/);
    // The certificate's uncertainty reaches the result: every run shares it.
    const cert = r.massicEnergy.contributions.find((c) => c.id === 'calibration.certificate')!;
    expect(cert.contribution).toBeCloseTo(1.5, 1);
  });

  it('reduces a textbook naphthalene run with a typed energy equivalent (Chang, Chemistry; from memory)', () => {
    // 1.435 g of C10H8 raise a bomb of 10.17 kJ/°C from 20.28 to 25.95 °C: ΔcU = −5.15 × 10³ kJ/mol.
    const r = reduceBombCalorimetry({
      energyEquivalent: { kind: 'typed', value: m(10_170) },
      runs: [
        { mass: m(1.435), deltaT: m(25.95 - 20.28), fuse: none, nitricAcid: none, auxiliary: none, ignition: none },
      ],
      reaction: reaction('C10H8'),
      standardStateCorrection: null,
      temperature: 298.15,
      formation: null,
    });
    expect(r.deltaCU.value / 1000).toBeCloseTo(-5.15, 2);
    expect(r.massicEnergy.value / 1000).toBeCloseTo(-40.18, 1);
    expect(r.deltaFH).toBeNull();
  });

  it('applies a standard-state correction when it is supplied', () => {
    const base = {
      energyEquivalent: { kind: 'calibration' as const, certificate, runs: calibrationRuns },
      runs: [run(1.0, riseFor(1.0, -26_414))],
      reaction: reaction('C7H6O2'),
      temperature: 298.15,
      formation: codata,
    };
    const without = reduceBombCalorimetry({ ...base, standardStateCorrection: null });
    const withIt = reduceBombCalorimetry({ ...base, standardStateCorrection: m(-20, 2) });
    expect(withIt.standardMassicEnergy!.value - without.massicEnergy.value).toBeCloseTo(-20, 8);
    expect(withIt.deltaCU.value - without.deltaCU.value).toBeCloseTo((-20 * 122.123) / 1000, 3);
    expect(withIt.notes.join(' ')).not.toMatch(/not applied/);
  });

  it('propagates the budget as a seeded Monte Carlo run of the same inputs does', () => {
    const samples = [1.001, 0.998, 1.003].map((g) => run(g, riseFor(g, -26_414)));
    const r = reduceBombCalorimetry({
      energyEquivalent: { kind: 'typed', value: m(10_000, 1.2) },
      runs: samples,
      reaction: reaction('C7H6O2'),
      standardStateCorrection: null,
      temperature: 298.15,
      formation: codata,
    });
    const uRuns = r.massicEnergy.contributions.find((c) => c.id === 'runs')!.u!;
    // ΔfH° = 7 ΔfH(CO2) + 3 ΔfH(H2O) − [M (Δcu + δ)/1000 − RT/2], written out again here.
    const normal = seededNormal(7);
    const meanMassic = r.replicates.mean;
    const draws = 100_000;
    let sum = 0;
    let sumSq = 0;
    for (let i = 0; i < draws; i++) {
      const eps = 10_000 + 1.2 * normal();
      const massic =
        samples.reduce((s, x) => s - (eps * x.deltaT.value - 90) / x.mass.value, 0) / samples.length + uRuns * normal();
      const M = 122.123 + r.deltaCU.contributions.find((c) => c.id === 'sample.molarMass')!.u! * normal();
      const dcH = (massic * M) / 1000 - 0.5 * ((8.314462618 * 298.15) / 1000);
      const dfH = 7 * (-393.51 + 0.065 * normal()) + 3 * (-285.83 + 0.02 * normal()) - dcH;
      sum += dfH;
      sumSq += dfH * dfH;
    }
    const mean = sum / draws;
    const sd = Math.sqrt((sumSq - draws * mean * mean) / (draws - 1));
    expect(meanMassic).toBeCloseTo(r.massicEnergy.value, 8);
    expect(r.deltaFH!.value).toBeCloseTo(mean, 1);
    expect(r.deltaFH!.u / sd).toBeGreaterThan(0.98);
    expect(r.deltaFH!.u / sd).toBeLessThan(1.02);
  });

  it('refuses a positive certified value, naming it', () => {
    expect(() =>
      reduceBombCalorimetry({
        energyEquivalent: { kind: 'calibration', certificate: m(26_434), runs: calibrationRuns },
        runs: [run(1, 2.6)],
        reaction: reaction('C7H6O2'),
        standardStateCorrection: null,
        temperature: 298.15,
        formation: null,
      }),
    ).toThrow(expect.objectContaining({ path: ['calibration', 'certificate', 'massicEnergy', 'value'] }));
  });
});

describe('bomb corrections', () => {
  it('buoyancy: 1 g of benzoic acid weighed in air against steel weights is 1.00076 g (hand-computed)', () => {
    // (1 − 0.0012/8.0)/(1 − 0.0012/1.32) = 0.99985/0.9990909 = 1.000760.
    expect(buoyancyCorrected(m(1), { sample: 1.32, air: 0.0012, weights: 8.0 }).value).toBeCloseTo(1.00076, 5);
  });
  it('nitric acid: 10.0 mL of 0.100 mol/L base is 1.00 mmol of HNO3, 59.7 J', () => {
    expect(nitricAcidEnergy(m(10), m(0.1), m(59.7), []).value).toBeCloseTo(59.7, 10);
  });
});
