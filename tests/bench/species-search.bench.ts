import { afterAll, bench, describe } from 'vitest';
import { buildSpeciesIndex } from '@shared/search';
import {
  generateQueries,
  generateSpeciesLibrary,
  type BenchQuery,
  type QueryKind,
} from './fixtures/generate-species-library';
import { formatSummary, FUZZY_STRATEGIES, fuzzyWorkbench, summarize } from './fixtures/species-search-measure';

// Target: p95 ≤ 20 ms per query on 20,000 species, for each kind (exact formulas, name prefixes,
// names with one typo) and overall. vitest prints p75/p99/p995 per iteration; one iteration is
// one query, and the p95 of our own samples is printed at the end. For a fuller report (build
// time, heap, the whole-library fuse.js baseline) run tests/bench/species-search-p95.ts.
const { entries } = generateSpeciesLibrary(20_000);
const index = buildSpeciesIndex(entries);
const queries = generateQueries(entries, 200);
const byKind = (kind: QueryKind): BenchQuery[] => queries.filter((q) => q.kind === kind);
const OPTIONS = { time: 2000, warmupTime: 500, warmupIterations: 200 };

const samples: Record<QueryKind | 'mixed', number[]> = { formula: [], prefix: [], typo: [], mixed: [] };

/** One query per call, cycling through the list, timing each into `into`. */
function cycling(list: readonly BenchQuery[], into: number[]): () => void {
  let next = 0;
  return () => {
    const q = list[next++ % list.length]!;
    const start = performance.now();
    index.search(q.text);
    into.push(performance.now() - start);
  };
}

describe('species search, 20,000 species, one query per iteration', () => {
  for (const kind of ['formula', 'prefix', 'typo'] as const) {
    bench(`${kind} queries`, cycling(byKind(kind), samples[kind]), OPTIONS);
  }
  bench('mixed: formulas, prefixes and typos in equal parts', cycling(queries, samples.mixed), OPTIONS);
});

describe('building the index over 20,000 species', () => {
  bench(
    'buildSpeciesIndex',
    () => {
      buildSpeciesIndex(entries);
    },
    { time: 5000, iterations: 5, warmupIterations: 1 },
  );
});

// The ways of letting fuse.js score the trigram candidates, on the candidates of the typo and
// prefix queries (prefixes leave more candidates).
const workbench = fuzzyWorkbench(entries);
const fuzzyCases = queries
  .filter((q) => q.kind !== 'formula' && q.text.length >= 4)
  .map((q) => {
    const candidates = workbench.candidatesFor(q.text);
    const texts = candidates.map((c) => workbench.terms[c]!);
    const ids = new Set(candidates.flatMap((c) => workbench.termEntries.get(workbench.terms[c]!) ?? []));
    return { pattern: q.text.toLowerCase(), texts, candidateEntries: [...ids].map((i) => entries[i]!) };
  });

describe('fuzzy scoring of trigram candidates, one query per iteration', () => {
  for (const [label, strategy] of Object.entries(FUZZY_STRATEGIES)) {
    let next = 0;
    bench(
      label,
      () => {
        const c = fuzzyCases[next++ % fuzzyCases.length]!;
        strategy(c.pattern, c.texts, c.candidateEntries);
      },
      OPTIONS,
    );
  }
});

afterAll(() => {
  // Warm-up iterations are included: this p95 is, if anything, pessimistic.
  const lines = (['formula', 'prefix', 'typo', 'mixed'] as const).map((kind) =>
    formatSummary(`${kind} (own samples)`, summarize(samples[kind])),
  );
  console.log(`\nspecies search p95 from our own samples:\n${lines.join('\n')}`);
});
