import { describe, expect, it } from 'vitest';
import { excludedReactionsMessage } from '../../server/services/derive.service';

// The reasons a measured reaction stays out of Hess sums: a table computed from formation
// enthalpies restates them (counting it again would double-count; common practice, no source),
// and a reaction away from 298.15 K needs heat capacities to be brought there (Kirchhoff).
describe('the warning that lists library reactions left out of Hess sums', () => {
  it('says they restate library values, not that they are at another temperature', () => {
    const message = excludedReactionsMessage([
      { key: 'a', reason: 'restates values the library already holds', cause: 'restates' },
      { key: 'b', reason: 'restates values the library already holds', cause: 'restates' },
    ]);
    expect(message).toBe(
      '2 measured reactions of the library are left out of Hess sums: 2 restate values the library already holds (not independent measurements).',
    );
    expect(message).not.toMatch(/not at 298\.15/);
  });

  it('counts each cause on its own', () => {
    const message = excludedReactionsMessage([
      { key: 'a', reason: 'x', cause: 'restates' },
      { key: 'b', reason: 'y', cause: 'no-heat-capacity' },
    ]);
    expect(message).toContain('2 measured reactions');
    expect(message).toContain('1 restates values');
    expect(message).toContain('1 was measured away from 298.15 K');
  });
});
