/**
 * The accessibility sweep: axe-core (through @axe-core/playwright) on a page as it stands, every
 * rule axe runs by default plus "label-content-name-mismatch" (WCAG 2.2 SC 2.5.3 Label in Name,
 * which axe ships switched off as experimental). Results are counted by impact.
 */
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';

export type Impact = 'minor' | 'moderate' | 'serious' | 'critical';

export interface AxeSummary {
  /** Violations (rules broken) by impact. */
  byImpact: Record<Impact, number>;
  /** The serious and critical ones, as "rule: first offending element". */
  blocking: string[];
}

export async function axeSummary(page: Page): Promise<AxeSummary> {
  const results = await new AxeBuilder({ page }).options({ rules: { 'label-content-name-mismatch': { enabled: true } } }).analyze();
  const byImpact: Record<Impact, number> = { minor: 0, moderate: 0, serious: 0, critical: 0 };
  const blocking: string[] = [];
  for (const violation of results.violations) {
    const impact = (violation.impact ?? 'minor') as Impact;
    byImpact[impact] += 1;
    if (impact === 'serious' || impact === 'critical') {
      blocking.push(`${violation.id} (${impact}): ${violation.nodes.map((node) => node.target.join(' ')).slice(0, 3).join(', ')}`);
    }
  }
  return { byImpact, blocking };
}
