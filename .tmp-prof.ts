import { balanceEquationText } from './shared/chemistry/index';
const eqs = ['H2 + O2 -> H2O','CH4(g) + O2(g) -> CO2(g) + H2O(l)','MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O','C57H110O6 + O2 -> CO2 + H2O', 'Ca3(PO4)2 + SiO2 + C -> CaSiO3 + P4 + CO'];
for (let w = 0; w < 3000; w++) balanceEquationText({ equation: eqs[w % 5]! });
const t = performance.now(); const N = 20000;
for (let i = 0; i < N; i++) balanceEquationText({ equation: eqs[i % 5]! });
console.log('balance', (N / (performance.now() - t) * 1000).toFixed(0), '/s');
