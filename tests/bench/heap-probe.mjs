// Worker thread for calc-limits.bench.ts: loads the server's calculation code the way the
// calculation pool does, runs one case, and reports how much heap the thread had to commit.
import { Buffer } from 'node:buffer';
import { performance } from 'node:perf_hooks';
import { getHeapStatistics } from 'node:v8';
import { fileURLToPath, URL } from 'node:url';
import { parentPort, workerData } from 'node:worker_threads';
import { tsImport } from 'tsx/esm/api';

const tsconfig = fileURLToPath(new URL('../../tsconfig.server.json', import.meta.url));
const { default: runCalcTask } = await tsImport('../../server/calc/calc.worker.ts', {
  parentURL: import.meta.url,
  tsconfig,
});
// Warm up on a small equation, so the baseline includes the loaded core.
runCalcTask({ kind: 'balance', input: { equation: 'H2 + O2 -> H2O' }, limits: workerData.task.limits });
const before = getHeapStatistics();
const started = performance.now();
const outcome = runCalcTask(workerData.task);
const ms = performance.now() - started;
const after = getHeapStatistics();
parentPort.postMessage({
  ms,
  ok: outcome.ok,
  replyBytes: outcome.ok ? Buffer.byteLength(outcome.json) : 0,
  error: outcome.ok ? null : outcome.error.code,
  heapCommittedMb: (after.total_heap_size - before.total_heap_size) / 2 ** 20,
  heapUsedMb: (after.used_heap_size - before.used_heap_size) / 2 ** 20,
  peakMallocedMb: after.peak_malloced_memory / 2 ** 20,
});
