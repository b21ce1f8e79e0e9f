import { balanceEquationText } from './shared/chemistry/index';
const THIRTY = 'CH4 + C2H6 + C3H8 + C4H10 + C5H12 + C6H14 + C7H16 + C8H18 + C9H20 + C10H22 + C2H4 + C3H6 + C6H6 + C7H8 + CH3OH + C2H5OH + H2S + NH3 + O2 + N2 -> CO2 + H2O + SO2 + NO + NO2 + CO + N2O + SO3 + H2 + HNO3';
const R = 'MnO4^- + Cr^3+ + Fe^2+ + C2O4^2- + H^+ + Cl^- + Na^+ -> Mn^2+ + Cr2O7^2- + Fe^3+ + CO2 + H2O + Cl2';
for (const e of [THIRTY, R]) { const t = performance.now(); let r; for (let i = 0; i < 100; i++) r = balanceEquationText({ equation: e }); console.log(((performance.now() - t) / 100).toFixed(3), 'ms', r!.status, r!.dimension, r!.equation.slice(0, 200)); }
