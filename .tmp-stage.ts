import { balanceParsedEquation, parseEquation } from './shared/chemistry/index';
import { parse } from './shared/chemistry/generated/equation.js';
import { isElementSymbol } from './shared/chemistry/elements';
import { integerNullspace } from './shared/chemistry/nullspace';
const eqs = [
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
const parsed = eqs.map(parseEquation);
const opt = { isElement: isElementSymbol, startRule: 'Equation' as const };
function run(name: string, fn: (i: number) => unknown) {
  for (let i = 0; i < 5000; i++) fn(i);
  const N = 30000; const t = performance.now();
  for (let i = 0; i < N; i++) fn(i);
  console.log(name.padEnd(20), Math.round(N / (performance.now() - t) * 1000), '/s');
}
run('peggy', (i) => parse(eqs[i % 10]!, opt));
run('parseEquation', (i) => parseEquation(eqs[i % 10]!));
run('balanceParsed', (i) => balanceParsedEquation(parsed[i % 10]!));
const mats = parsed.map((p) => { const keys = [...new Set(p.terms.flatMap((t) => Object.keys(t.species.composition)))]; return keys.map((k) => p.terms.map((t) => (t.side === 'reactant' ? 1 : -1) * (t.species.composition[k] ?? 0))); });
run('nullspace', (i) => integerNullspace(mats[i % 10]!, parsed[i % 10]!.terms.length));
