import { absBigInt, gcdBigInt, lcmBigInt } from './rational';

/**
 * Finds whole numbers c_j ≥ 1 with (M c)_i > 0 for every row, exactly, or returns null when none
 * exists. M is r × k. Method: phase one of the simplex method on c = 1 + y, y ≥ 0, M y ≥ 1 − M·1
 * (the homogeneous problem allows "≥ 1" in place of "> 0"), with Bland's rule (no cycling) on a
 * fraction-free integer tableau: each row carries its own positive scale, divided out by gcds.
 * Used for kernels in "free-column" form, whose free entries of Σ c_f b_f are positive multiples
 * of c_f and whose pivot entries are M c.
 */
export function findPositiveCombination(m: bigint[][], k: number): bigint[] | null {
  const r = m.length;
  const h = m.map((row) => 1n - row.reduce((s, x) => s + x, 0n));
  // Columns: y (k), surplus s (r), artificial a (r), right-hand side. Rows with h_i < 0 are
  // negated so that their surplus is basic; the others start with their artificial basic.
  const cols = k + 2 * r;
  const tab: bigint[][] = [];
  const basis: number[] = [];
  for (let i = 0; i < r; i++) {
    const flip = h[i]! < 0n;
    const row = new Array<bigint>(cols + 1).fill(0n);
    for (let j = 0; j < k; j++) row[j] = flip ? -m[i]![j]! : m[i]![j]!;
    row[k + i] = flip ? 1n : -1n;
    if (!flip) row[k + r + i] = 1n;
    row[cols] = flip ? -h[i]! : h[i]!;
    tab.push(row);
    basis.push(flip ? k + i : k + r + i);
  }
  // Reduced costs of "minimise Σ a": 1 on artificials minus the rows with an artificial basic.
  const cost = new Array<bigint>(cols + 1).fill(0n);
  for (let j = k + r; j < cols; j++) cost[j] = 1n;
  for (let i = 0; i < r; i++) {
    if (basis[i]! < k + r) continue;
    for (let j = 0; j <= cols; j++) cost[j] = cost[j]! - tab[i]![j]!;
  }
  const reduce = (row: bigint[]): void => {
    let g = 0n;
    for (const x of row) g = gcdBigInt(g, x);
    if (g > 1n) for (let j = 0; j < row.length; j++) row[j] = row[j]! / g;
  };
  for (let guard = 0; guard < 100_000; guard++) {
    let enter = -1;
    for (let j = 0; j < cols; j++) {
      if (cost[j]! < 0n) {
        enter = j;
        break;
      }
    }
    if (enter === -1) break;
    let leave = -1;
    for (let i = 0; i < r; i++) {
      const a = tab[i]![enter]!;
      if (a <= 0n) continue;
      if (leave === -1) {
        leave = i;
        continue;
      }
      // Compare rhs_i / a_i with rhs_leave / a_leave (row scales cancel in each ratio).
      const lhs = tab[i]![cols]! * tab[leave]![enter]!;
      const rhs = tab[leave]![cols]! * a;
      if (lhs < rhs || (lhs === rhs && basis[i]! < basis[leave]!)) leave = i;
    }
    if (leave === -1) break; // phase one is bounded below by 0; kept for safety
    const pr = tab[leave]!;
    const p = pr[enter]!;
    for (let i = 0; i < r; i++) {
      if (i === leave) continue;
      const row = tab[i]!;
      const f = row[enter]!;
      if (f === 0n) continue;
      for (let j = 0; j <= cols; j++) row[j] = row[j]! * p - f * pr[j]!;
      reduce(row);
    }
    const f = cost[enter]!;
    for (let j = 0; j <= cols; j++) cost[j] = cost[j]! * p - f * pr[j]!;
    reduce(cost);
    basis[leave] = enter;
  }
  if (cost[cols]! !== 0n) return null; // phase-one optimum above zero: infeasible
  // y_j = rhs_i / scale_i for basic y_j (scale_i = the row's entry at its basic column).
  let l = 1n;
  for (let i = 0; i < r; i++) if (basis[i]! < k) l = lcmBigInt(l, absBigInt(tab[i]![basis[i]!]!));
  const c = new Array<bigint>(k).fill(l);
  for (let i = 0; i < r; i++) {
    const b = basis[i]!;
    if (b < k) c[b] = l + (tab[i]![cols]! * l) / tab[i]![b]!;
  }
  return c;
}
