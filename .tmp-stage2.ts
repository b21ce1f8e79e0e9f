import { parseEquation } from './shared/chemistry/index';
const eqs = ['H2 + O2 -> H2O','CH4(g) + O2(g) -> CO2(g) + H2O(l)','C3H8 + O2 -> CO2 + H2O, ΔH = -2220 kJ','MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O','Ca3(PO4)2 + SiO2 + C -> CaSiO3 + P4 + CO','CuSO4·5H2O(s) -> CuSO4(s) + H2O(g)'];
for (let i = 0; i < 100000; i++) parseEquation(eqs[i % 6]!);
