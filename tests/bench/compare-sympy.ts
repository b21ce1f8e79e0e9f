/**
 * Side by side, in one run: our balancer (text in, reply out) against exact nullspaces from
 * sympy on the same mixed set of equations (tests/bench/fixtures/mixed-equations.txt).
 *
 *   npm run bench:sympy            (SYMPY_PYTHON=/path/to/python3 to pick another interpreter;
 *                                   ROUNDS=n for more rounds)
 *
 * Ours: `balanceRequest({ equation })` then `JSON.stringify` for every line — parse, balance,
 * build the API reply and serialise it. sympy: the composition matrix of each equation, exported
 * here from our parser, then `Matrix(rows).nullspace()` scaled to primitive whole numbers
 * (tests/bench/sympy-nullspace.py). sympy does no parsing and builds no reply, so the ratio is
 * conservative. The machine is shared, so rounds alternate (ours, sympy, ours, …) and the ratio
 * is taken per round, under the same load; the median of those ratios is the headline figure.
 * The kernels are cross-checked: same dimension, same span.
 *
 * A benchmark, not a test: it prints figures and fails only when the two disagree on a kernel.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import Fraction from 'fraction.js';
import { balanceRequest, compositionMatrix, isEquationLine, parseEquation } from '@shared/chemistry/index';
import { integerNullspace } from '@shared/chemistry/nullspace';

const here = path.dirname(fileURLToPath(import.meta.url));
const equations = readFileSync(path.join(here, 'fixtures', 'mixed-equations.txt'), 'utf8')
  .split('\n')
  .filter(isEquationLine);
const ROUNDS = Number(process.env.ROUNDS ?? 9);
// Our rounds repeat the set so that each lasts about as long as timer noise allows; time per set.
const OUR_REPEATS = 10;

/** One pass over the set: text in, reply JSON out. */
function balanceAll(): void {
  for (const equation of equations) JSON.stringify(balanceRequest({ equation }));
}

function ourRound(): number {
  const start = performance.now();
  for (let i = 0; i < OUR_REPEATS; i++) balanceAll();
  return (performance.now() - start) / 1000 / OUR_REPEATS;
}

/** Rank over the rationals with fraction.js (independent of both sides). */
function rank(rows: bigint[][]): number {
  const m = rows.map((r) => r.map((v) => new Fraction(v)));
  const cols = m[0]?.length ?? 0;
  let r = 0;
  for (let c = 0; c < cols && r < m.length; c++) {
    const p = m.findIndex((row, i) => i >= r && !row[c]!.equals(0));
    if (p === -1) continue;
    [m[p], m[r]] = [m[r]!, m[p]!];
    for (let i = 0; i < m.length; i++) {
      if (i === r || m[i]![c]!.equals(0)) continue;
      const f = m[i]![c]!.div(m[r]![c]!);
      m[i] = m[i]!.map((v, j) => v.sub(f.mul(m[r]![j]!)));
    }
    r++;
  }
  return r;
}

const median = (values: number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

// ----- sympy, as a worker answering one command per line -----------------------------------------
const matrices = equations.map((equation) => {
  const m = compositionMatrix(parseEquation(equation).terms);
  const rows = (m.rows as ReadonlyArray<ReadonlyArray<number | bigint>>).map((row) => row.map(String));
  return { equation, rows, cols: m.cols };
});
const file = path.join(mkdtempSync(path.join(tmpdir(), 'thermoledger-sympy-')), 'matrices.json');
writeFileSync(file, JSON.stringify(matrices));
const python = process.env.SYMPY_PYTHON ?? '/usr/bin/python3';
const worker = spawn(python, [path.join(here, 'sympy-nullspace.py'), file], { stdio: ['pipe', 'pipe', 'inherit'] });
worker.on('error', (err) => {
  console.error(`sympy did not start (${python}: ${err.message}); install it with: apt-get install -y python3-sympy`);
  process.exit(1);
});
const answers = createInterface({ input: worker.stdout })[Symbol.asyncIterator]();
async function answer<T>(command?: string): Promise<T> {
  if (command) worker.stdin.write(`${command}\n`);
  const next = await answers.next();
  if (next.done) throw new Error('the sympy worker stopped; is python3-sympy installed?');
  return JSON.parse(next.value) as T;
}
const versions = await answer<{ sympy: string; python: string }>();

// ----- Alternating rounds ------------------------------------------------------------------------
for (let i = 0; i < 200; i++) balanceAll(); // warm-up: let the JIT settle
const ours: number[] = [];
const matrix: number[] = [];
const domain: number[] = [];
for (let r = 0; r < ROUNDS; r++) {
  ours.push(ourRound());
  matrix.push((await answer<{ seconds: number }>('matrix')).seconds);
  ours.push(ourRound());
  domain.push((await answer<{ seconds: number }>('domain')).seconds);
}
const bases = await answer<string[][][]>('bases');
worker.stdin.end();

// ----- Cross-check: same kernel dimension and span -------------------------------------------------
let disagreements = 0;
matrices.forEach((m, i) => {
  const ourBasis = integerNullspace(
    m.rows.map((row) => row.map((x) => BigInt(x))),
    m.cols,
  ).basis;
  const theirs = bases[i]!.map((v) => v.map((x) => BigInt(x)));
  const same =
    ourBasis.length === theirs.length && (ourBasis.length === 0 || rank([...ourBasis, ...theirs]) === ourBasis.length);
  if (!same) {
    disagreements++;
    console.error(`kernel differs for: ${m.equation}`);
  }
});

// ----- Report ------------------------------------------------------------------------------------
const n = equations.length;
const line = (name: string, seconds: number[]): string =>
  `  ${name.padEnd(46)} ${Math.round(n / Math.min(...seconds))
    .toLocaleString('en-GB')
    .padStart(8)} eq/s best` +
  `  ${Math.round(n / median(seconds))
    .toLocaleString('en-GB')
    .padStart(8)} eq/s median` +
  `  ${((median(seconds) / n) * 1e6).toFixed(1).padStart(8)} µs/eq median`;
/** sympy's round r over ours on either side of it (ours[k] ran just before, ours[k + 1] just after). */
const ratios = (theirs: number[], offset: number): number[] =>
  theirs.map((t, r) => {
    const before = ours[2 * r + offset]!;
    const after = ours[2 * r + offset + 1] ?? before;
    return t / ((before + after) / 2);
  });
console.log(
  `Mixed set: ${n} equations, ${ROUNDS} alternating rounds (node ${process.version}, python ${versions.python})`,
);
console.log(line('ours: text in, reply JSON out', ours));
console.log(line(`sympy ${versions.sympy} Matrix.nullspace (matrix in)`, matrix));
console.log(line(`sympy ${versions.sympy} DomainMatrix(QQ).nullspace (matrix in)`, domain));
const m = ratios(matrix, 0);
const d = ratios(domain, 1);
console.log(
  `  ours vs Matrix.nullspace:       ${median(m).toFixed(1)}× faster (median of per-round ratios; range ${Math.min(...m).toFixed(1)}–${Math.max(...m).toFixed(1)})`,
);
console.log(
  `  ours vs DomainMatrix.nullspace: ${median(d).toFixed(1)}× faster (median of per-round ratios; range ${Math.min(...d).toFixed(1)}–${Math.max(...d).toFixed(1)})`,
);
console.log(`  kernels: ${n - disagreements} of ${n} agree with sympy (dimension and span)`);
if (disagreements > 0) process.exit(1);
