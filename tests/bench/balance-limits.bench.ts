import { bench, describe } from 'vitest';
import { balanceBatchRequest, balanceRequest, ChemistryError } from '@shared/chemistry';

// How fast hostile inputs are refused (Issue B). Before the work limits, one batch line of 11,000
// `H` terms ran the server out of heap and 4,995 terms on /balance took 10.6 s and 1.7 GB. Each
// bench must stay in milliseconds: read `mean` (ms per refusal).
const terms = (n: number, joiner: string): string => Array.from({ length: n }, () => 'H').join(joiner);
const refused = (run: () => unknown): void => {
  try {
    run();
  } catch (err) {
    if (err instanceof ChemistryError) return;
    throw err;
  }
};

const OPTIONS = { time: 2000, warmupTime: 500 };

describe('refusals over the work limits', () => {
  const line = `${terms(11_000, ' + ')} -> H2`;
  bench('batch line of 11,000 H terms (own error entry)', () => void balanceBatchRequest({ text: line }), OPTIONS);
  const equation = `${terms(4_995, '+')}->H2`;
  bench('/balance with 4,995 terms', () => refused(() => balanceRequest({ equation })), OPTIONS);
  const nested = `${'('.repeat(3_000)}H -> H`;
  bench('3,000 nested brackets', () => refused(() => balanceRequest({ equation: nested })), OPTIONS);
  const lines = Array.from({ length: 2_001 }, () => 'H2 + O2 -> H2O').join('\n');
  bench('batch of 2,001 lines', () => refused(() => balanceBatchRequest({ text: lines })), OPTIONS);
  const wide = `${'H2 + O2 -> H2O\n'.repeat(16_700)}`;
  bench('batch of 250,500 characters', () => refused(() => balanceBatchRequest({ text: wide })), OPTIONS);
});
