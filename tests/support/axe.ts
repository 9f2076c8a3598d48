import { AxeBuilder } from '@axe-core/playwright';
import type { AxeResults, ImpactValue } from 'axe-core';
import type { Page } from 'playwright-core';
import { expect } from 'vitest';

/**
 * The success criteria we hold every screen to: WCAG 2.0, 2.1 and 2.2 at levels A and AA
 * (W3C, WCAG 2.2, 2023). axe-core names its rules by these tags.
 */
export const wcagTags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa'] as const;

/** Impacts that fail a test. Moderate and minor findings are returned for the caller to read. */
const failing = new Set<ImpactValue>(['serious', 'critical']);

export type AccessibilityOptions = {
  /** CSS selectors left out of the check, each with a reason in the caller's comment. */
  exclude?: readonly string[];
};

/** One violation as a line a person can act on: rule, impact, where, and what to do. */
export function describeViolation(violation: AxeResults['violations'][number]): string {
  const targets = violation.nodes.map((node) => node.target.map(String).join(' ')).join(', ');
  return `${violation.id} (${violation.impact ?? 'unknown'}) at ${targets}: ${violation.help} [${violation.helpUrl}]`;
}

/**
 * Runs axe-core on the page as it is now and fails on any serious or critical violation of WCAG
 * 2.0/2.1/2.2 A and AA, listing each with its rule id, impact, target selectors and help text.
 * `label` names the screen, size and role in the failure ("workbench at phone, signed out").
 * Wait for the screen to settle (its data shown) before calling. Returns the full results.
 */
export async function expectAccessible(page: Page, label: string, options: AccessibilityOptions = {}): Promise<AxeResults> {
  let builder = new AxeBuilder({ page }).withTags([...wcagTags]);
  for (const selector of options.exclude ?? []) builder = builder.exclude(selector);
  const results = await builder.analyze();
  const serious = results.violations.filter((violation) => violation.impact && failing.has(violation.impact));
  expect(serious.map(describeViolation), `axe: serious or critical WCAG violations on ${label}`).toEqual([]);
  return results;
}
