/**
 * Accessibility checks with axe-core (through @axe-core/playwright): every rule axe runs by
 * default (WCAG 2.x A/AA and best practices). A check fails on critical or serious findings and
 * lists them; the lesser ones are printed so they stay visible without failing the run.
 */
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';

export type Impact = 'critical' | 'serious' | 'moderate' | 'minor';
const failing: ReadonlySet<string> = new Set<Impact>(['critical', 'serious']);

export interface AxeFinding {
  where: string;
  rule: string;
  impact: Impact;
  text: string;
}

/**
 * Runs axe on the page as it is now; `where` names the page and state in the messages. `rules`
 * limits the run to those rule ids (all rules when omitted).
 */
export async function axeFindings(page: Page, where: string, rules?: string[]): Promise<AxeFinding[]> {
  // Let naive-ui's fade-in transitions finish, or colours are measured half-way.
  await page.waitForTimeout(400);
  // Only violations are needed (the full result lists every passing node too), and the legacy
  // single-call run skips a blank page per check; it only loses cross-origin iframes, which we have none of.
  const builder = new AxeBuilder({ page }).options({ resultTypes: ['violations'] }).setLegacyMode(true);
  if (rules) builder.withRules(rules);
  const results = await builder.analyze();
  return results.violations.map((v) => ({
    where,
    rule: v.id,
    impact: (v.impact ?? 'minor') as Impact,
    text:
      `${v.help} (${v.id}): ` +
      v.nodes
        .slice(0, 6)
        .map((n) => `${n.target.join(' ')} — ${(n.failureSummary ?? '').replace(/\s+/g, ' ').trim()}`)
        .join(' | '),
  }));
}

/** One line per finding, for a test failure message or the log. */
export function describeFindings(findings: readonly AxeFinding[]): string[] {
  return findings.map((f) => `[${f.impact}] ${f.where}: ${f.text}`);
}

/** The findings that fail a check (critical and serious), each described in one line. */
export function blocking(findings: readonly AxeFinding[]): string[] {
  return describeFindings(findings.filter((f) => failing.has(f.impact)));
}

/** Prints how many findings of each impact a walk produced, and the minor and moderate ones. */
export function logSummary(label: string, findings: readonly AxeFinding[]): void {
  const counts: Record<Impact, number> = { critical: 0, serious: 0, moderate: 0, minor: 0 };
  for (const f of findings) counts[f.impact] += 1;
  console.log(`axe ${label}: ${JSON.stringify(counts)}`);
  for (const line of describeFindings(findings.filter((f) => !failing.has(f.impact)))) console.log(`  ${line}`);
}

/** Runs axe and returns the failing findings, described (empty when the page passes). */
export async function axeBlocking(page: Page, where: string): Promise<string[]> {
  return blocking(await axeFindings(page, where));
}
