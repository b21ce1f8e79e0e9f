/**
 * Summarises a V8 CPU profile (node --cpu-prof) written by one of the benchmark scripts: self time
 * per function and per file (our own files by path, packages by name), and total (inclusive) time
 * of the functions whose name matches a filter. Run:
 *
 *   npx tsx tests/bench/cpu-profile-summary.ts <file.cpuprofile> [top=25] [inclusive-filter-regex]
 */
import { readFileSync } from 'node:fs';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
interface Profile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

const [file, topArg, filter] = process.argv.slice(2);
if (!file) {
  console.error('usage: cpu-profile-summary.ts <file.cpuprofile> [top] [inclusive-filter-regex]');
  process.exit(2);
}
const top = Number(topArg ?? 25);
const profile = JSON.parse(readFileSync(file, 'utf8')) as Profile;
const byId = new Map(profile.nodes.map((n) => [n.id, n]));
const parent = new Map<number, number>();
for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);

// Self time per node from the samples (µs).
const self = new Map<number, number>();
profile.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
const total = [...self.values()].reduce((a, b) => a + b, 0);

function place(url: string): string {
  const nodeModules = url.lastIndexOf('node_modules/');
  if (nodeModules >= 0) {
    const rest = url.slice(nodeModules + 'node_modules/'.length).split('/');
    return `pkg ${rest[0]!.startsWith('@') ? `${rest[0]}/${rest[1]}` : rest[0]}`;
  }
  const repo = url.indexOf('/wt/');
  if (repo >= 0) return url.slice(repo).split('/').slice(3).join('/');
  return url || '(native)';
}
const label = (n: ProfileNode) =>
  `${n.callFrame.functionName || '(anonymous)'}  ${place(n.callFrame.url)}:${n.callFrame.lineNumber + 1}`;

const selfByFunction = new Map<string, number>();
const selfByFile = new Map<string, number>();
for (const [id, us] of self) {
  const n = byId.get(id)!;
  selfByFunction.set(label(n), (selfByFunction.get(label(n)) ?? 0) + us);
  const where = place(n.callFrame.url);
  selfByFile.set(where, (selfByFile.get(where) ?? 0) + us);
}
const pct = (us: number) =>
  `${((100 * us) / total).toFixed(1).padStart(5)} %  ${(us / 1000).toFixed(0).padStart(6)} ms`;
const show = (title: string, map: Map<string, number>) => {
  console.log(`\n${title}`);
  for (const [k, us] of [...map].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`${pct(us)}  ${k}`);
};
console.log(`${file}: ${(total / 1000).toFixed(0)} ms sampled`);
show('self time by function', selfByFunction);
show('self time by file or package', selfByFile);

if (filter) {
  // Inclusive time: every sample counts once for each distinct matching function on its stack.
  const re = new RegExp(filter);
  const inclusive = new Map<string, number>();
  for (const [id, us] of self) {
    const seen = new Set<string>();
    for (let at: number | undefined = id; at !== undefined; at = parent.get(at)) {
      const n = byId.get(at)!;
      const l = label(n);
      if (re.test(l) && !seen.has(l)) {
        seen.add(l);
        inclusive.set(l, (inclusive.get(l) ?? 0) + us);
      }
    }
  }
  show(`inclusive time of functions matching /${filter}/`, inclusive);
}
