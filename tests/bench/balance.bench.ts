import { bench, describe } from 'vitest';
import { balanceRequest } from '@shared/chemistry';

// Throughput target: ≥ 20,000 parse-and-balance per second for typical equations (≤ 8 species);
// hard cases ≤ 2 ms each. Read the figures from `npm run bench` (hz = operations per second).
const TYPICAL = [
  'H2 + O2 -> H2O',
  'CH4(g) + O2(g) -> CO2(g) + H2O(l)',
  'C3H8 + O2 -> CO2 + H2O, ΔH = -2220 kJ',
  'Fe2O3(s) + CO(g) -> Fe(s) + CO2(g)',
  'MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O',
  'Cr2O7^2- + Fe^2+ + H+ -> Cr^3+ + Fe^3+ + H2O',
  'Ca3(PO4)2 + SiO2 + C -> CaSiO3 + P4 + CO',
  'CuSO4·5H2O(s) -> CuSO4(s) + H2O(g)',
  'NH3 + O2 -> NO + H2O',
  'Al + HCl -> AlCl3 + H2',
];

// 30 species: a fuel blend burnt in air with by-products (several independent balancings).
const THIRTY =
  'CH4 + C2H6 + C3H8 + C4H10 + C5H12 + C6H14 + C7H16 + C8H18 + C9H20 + C10H22 + C2H4 + C3H6 + C6H6 + C7H8 + CH3OH + C2H5OH + H2S + NH3 + O2 + N2 ' +
  '-> CO2 + H2O + SO2 + NO + NO2 + CO + N2O + SO3 + H2 + HNO3';

const HARD = {
  'C57H110O6 combustion': 'C57H110O6 + O2 -> CO2 + H2O',
  // 12 species, 9 of them ions; several independent balancings, so the exact LP runs too.
  'redox with a dozen ions':
    'MnO4^- + Fe^2+ + Cr2O7^2- + C2O4^2- + H^+ + Cl^- -> Mn^2+ + Fe^3+ + Cr^3+ + CO2 + H2O + Cl2',
  'ferrocyanide–permanganate (9 species)':
    'K4[Fe(CN)6] + KMnO4 + H2SO4 -> KHSO4 + Fe2(SO4)3 + MnSO4 + HNO3 + CO2 + H2O',
  '30 species': THIRTY,
};

// Long warm-up: with tinybench's defaults the figures are dominated by JIT warm-up and the first GCs.
const OPTIONS = { time: 3000, warmupTime: 1500, warmupIterations: 2000 };

describe('parse and balance, typical equations (≤ 8 species)', () => {
  // One iteration = all 10 typical equations: equations per second = hz × 10.
  bench(
    '10 typical equations per iteration (equations/s = hz × 10)',
    () => {
      for (const equation of TYPICAL) balanceRequest({ equation });
    },
    OPTIONS,
  );
});

describe('parse and balance, hard cases', () => {
  for (const [name, equation] of Object.entries(HARD)) {
    bench(
      name,
      () => {
        balanceRequest({ equation });
      },
      OPTIONS,
    );
  }
});
