// Entry file of the calculation worker threads. Node 20 cannot run TypeScript by itself, so the
// worker loads calc.worker.ts through tsx's API (the same transform `npm start` uses), with the
// server's tsconfig for the @shared alias. Works the same under tsx, vitest and plain node.
import { fileURLToPath, URL } from 'node:url';
import { tsImport } from 'tsx/esm/api';

const worker = await tsImport('./calc.worker.ts', {
  parentURL: import.meta.url,
  tsconfig: fileURLToPath(new URL('../../tsconfig.server.json', import.meta.url)),
});

export default worker.default;
