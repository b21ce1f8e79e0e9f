import { readFileSync } from 'node:fs';
import { bench, describe } from 'vitest';
import { balanceEquation, balanceRequest, isEquationLine, parseEquation, toBalanceReply } from '@shared/chemistry';

// The mixed set of equations as chemists type them (redox with ions, hydrates including fractional
// formula units, organics with 10+ species, several balancings, impossible ones): text in, reply
// out, and the stages on their own. One iteration = the whole set: equations per second = hz × 146.
// The side-by-side comparison with sympy is tests/bench/compare-sympy.ts (npm run bench:sympy).
const equations = readFileSync(new URL('./fixtures/mixed-equations.txt', import.meta.url), 'utf8')
  .split('\n')
  .filter(isEquationLine);
const readings = equations.map((e) => parseEquation(e));
const balancings = readings.map((r) => balanceEquation(r));

const OPTIONS = { time: 3000, warmupTime: 1500, warmupIterations: 200 };

describe(`mixed set (${equations.length} equations per iteration)`, () => {
  bench(
    'text in, reply JSON out',
    () => {
      for (const equation of equations) JSON.stringify(balanceRequest({ equation }));
    },
    OPTIONS,
  );
  bench(
    'parse only',
    () => {
      for (const equation of equations) parseEquation(equation);
    },
    OPTIONS,
  );
  bench(
    'balance only (parsed)',
    () => {
      for (const reading of readings) balanceEquation(reading);
    },
    OPTIONS,
  );
  bench(
    'reply only (balanced)',
    () => {
      for (const balancing of balancings) toBalanceReply(balancing);
    },
    OPTIONS,
  );
});
