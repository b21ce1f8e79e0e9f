/**
 * Standard atomic weights (relative atomic masses, dimensionless; used as g/mol).
 *
 * Source: T. Prohaska et al., "Standard atomic weights of the elements 2021 (IUPAC Technical
 * Report)", Pure Appl. Chem. 94 (2022) 573–600 (CIAAW).
 *
 * Values were TYPED FROM MEMORY of that table and are cross-checked by
 * tests/shared/chemistry/atomic-weights.test.ts against the `chemical-elements` npm package.
 *
 * Policy:
 * - Elements with a single standard atomic weight: that value and its uncertainty.
 * - Elements whose standard atomic weight is an interval (H, Li, B, C, N, O, Mg, Si, S, Cl, Ar,
 *   Br, Tl, Pb): the CIAAW conventional value, with the uncertainty of the CIAAW abridged value
 *   (`kind: 'conventional'`); the interval is kept in `interval`.
 * - Elements with no standard atomic weight (no stable isotope and no characteristic terrestrial
 *   composition: Tc, Pm, Po, At, Rn, Fr, Ra, Ac, Np and beyond): the mass number of the
 *   longest-lived known isotope (common practice; mass numbers from memory), `kind: 'mass-number'`,
 *   with a nominal uncertainty of 0.5 (the isotope's atomic mass lies within 0.5 of its mass number).
 * - D and T: atomic masses of ²H and ³H (AME 2020, from memory), `kind: 'nuclide'`.
 */
export const ATOMIC_WEIGHTS_SOURCE =
  'T. Prohaska et al., Standard atomic weights of the elements 2021 (IUPAC Technical Report), Pure Appl. Chem. 94 (2022) 573–600';

/** One atomic-weight entry. `value` and `uncertainty` in g/mol. */
export interface AtomicWeightEntry {
  value: number;
  uncertainty: number;
  kind: 'standard' | 'conventional' | 'mass-number' | 'nuclide';
  /** Lower and upper bound of the CIAAW interval, for interval elements only. */
  interval?: readonly [number, number];
}

const s = (value: number, uncertainty: number): AtomicWeightEntry => ({ value, uncertainty, kind: 'standard' });
const c = (value: number, uncertainty: number, lo: number, hi: number): AtomicWeightEntry => ({
  value,
  uncertainty,
  kind: 'conventional',
  interval: [lo, hi],
});
const m = (massNumber: number): AtomicWeightEntry => ({ value: massNumber, uncertainty: 0.5, kind: 'mass-number' });

/** Atomic weights by symbol (all 118 elements plus D and T). */
export const standardAtomicWeights: Readonly<Record<string, AtomicWeightEntry>> = {
  H: c(1.008, 0.0002, 1.00784, 1.00811),
  He: s(4.002602, 0.000002),
  Li: c(6.94, 0.06, 6.938, 6.997),
  Be: s(9.0121831, 0.0000005),
  B: c(10.81, 0.02, 10.806, 10.821),
  C: c(12.011, 0.002, 12.0096, 12.0116),
  N: c(14.007, 0.001, 14.00643, 14.00728),
  O: c(15.999, 0.001, 15.99903, 15.99977),
  F: s(18.998403162, 0.000000005),
  Ne: s(20.1797, 0.0006),
  Na: s(22.98976928, 0.00000002),
  Mg: c(24.305, 0.002, 24.304, 24.307),
  Al: s(26.9815384, 0.0000003),
  Si: c(28.085, 0.001, 28.084, 28.086),
  P: s(30.973761998, 0.000000005),
  S: c(32.06, 0.02, 32.059, 32.076),
  Cl: c(35.45, 0.01, 35.446, 35.457),
  Ar: c(39.95, 0.16, 39.792, 39.963),
  K: s(39.0983, 0.0001),
  Ca: s(40.078, 0.004),
  Sc: s(44.955907, 0.000004),
  Ti: s(47.867, 0.001),
  V: s(50.9415, 0.0001),
  Cr: s(51.9961, 0.0006),
  Mn: s(54.938043, 0.000002),
  Fe: s(55.845, 0.002),
  Co: s(58.933194, 0.000003),
  Ni: s(58.6934, 0.0004),
  Cu: s(63.546, 0.003),
  Zn: s(65.38, 0.02),
  Ga: s(69.723, 0.001),
  Ge: s(72.63, 0.008),
  As: s(74.921595, 0.000006),
  Se: s(78.971, 0.008),
  Br: c(79.904, 0.003, 79.901, 79.907),
  Kr: s(83.798, 0.002),
  Rb: s(85.4678, 0.0003),
  Sr: s(87.62, 0.01),
  Y: s(88.905838, 0.000002),
  Zr: s(91.222, 0.003),
  Nb: s(92.90637, 0.00001),
  Mo: s(95.95, 0.01),
  Tc: m(97),
  Ru: s(101.07, 0.02),
  Rh: s(102.90549, 0.00002),
  Pd: s(106.42, 0.01),
  Ag: s(107.8682, 0.0002),
  Cd: s(112.414, 0.004),
  In: s(114.818, 0.001),
  Sn: s(118.71, 0.007),
  Sb: s(121.76, 0.001),
  Te: s(127.6, 0.03),
  I: s(126.90447, 0.00003),
  Xe: s(131.293, 0.006),
  Cs: s(132.90545196, 0.00000006),
  Ba: s(137.327, 0.007),
  La: s(138.90547, 0.00007),
  Ce: s(140.116, 0.001),
  Pr: s(140.90766, 0.00001),
  Nd: s(144.242, 0.003),
  Pm: m(145),
  Sm: s(150.36, 0.02),
  Eu: s(151.964, 0.001),
  Gd: s(157.25, 0.03),
  Tb: s(158.925354, 0.000007),
  Dy: s(162.5, 0.001),
  Ho: s(164.930329, 0.000005),
  Er: s(167.259, 0.003),
  Tm: s(168.934219, 0.000005),
  Yb: s(173.045, 0.01),
  Lu: s(174.9668, 0.0001),
  Hf: s(178.486, 0.006),
  Ta: s(180.94788, 0.00002),
  W: s(183.84, 0.01),
  Re: s(186.207, 0.001),
  Os: s(190.23, 0.03),
  Ir: s(192.217, 0.002),
  Pt: s(195.084, 0.009),
  Au: s(196.96657, 0.000004),
  Hg: s(200.592, 0.003),
  Tl: c(204.38, 0.01, 204.382, 204.385),
  Pb: c(207.2, 1.1, 206.14, 207.94),
  Bi: s(208.9804, 0.00001),
  Po: m(209),
  At: m(210),
  Rn: m(222),
  Fr: m(223),
  Ra: m(226),
  Ac: m(227),
  Th: s(232.0377, 0.0004),
  Pa: s(231.03588, 0.00001),
  U: s(238.02891, 0.00003),
  Np: m(237),
  Pu: m(244),
  Am: m(243),
  Cm: m(247),
  Bk: m(247),
  Cf: m(251),
  Es: m(252),
  Fm: m(257),
  Md: m(258),
  No: m(259),
  Lr: m(266),
  Rf: m(267),
  Db: m(268),
  Sg: m(269),
  Bh: m(270),
  Hs: m(269),
  Mt: m(278),
  Ds: m(281),
  Rg: m(282),
  Cn: m(285),
  Nh: m(286),
  Fl: m(289),
  Mc: m(290),
  Lv: m(293),
  Ts: m(294),
  Og: m(294),
  D: { value: 2.01410177812, uncertainty: 0.00000000012, kind: 'nuclide' },
  T: { value: 3.01604928, uncertainty: 0.00000001, kind: 'nuclide' },
};
