import { parse } from './shared/chemistry/generated/equation.js';
const opt = { isElement: (s) => true };
const run = (label, text, o) => { for (let w = 0; w < 5000; w++) parse(text, o);
let t = performance.now(); const N = 50000; for (let i = 0; i < N; i++) parse(text, o);
console.log(label, (N / (performance.now() - t) * 1000).toFixed(0), '/s'); };
run('H2 + O2 -> H2O', 'H2 + O2 -> H2O', opt);
run('redox', 'MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O', opt);
run('Mn^2+', 'Mn^2+', {...opt, startRule: 'FormulaOnly'});
run('Mn2', 'Mn2', {...opt, startRule: 'FormulaOnly'});
