import { AxeBuilder } from '@axe-core/playwright';
import type { AxeResults, ImpactValue } from 'axe-core';
import type { Page } from 'playwright-core';

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
  /** Check only this part of the screen (a CSS selector); the whole page when left out. */
  include?: string;
};

/** One violation as a line a person can act on: rule, impact, where, and what to do. */
export function describeViolation(violation: AxeResults['violations'][number]): string {
  // Generated class names say little, so each target comes with the start of its markup.
  const targets = violation.nodes
    .map((node) => `${node.target.map(String).join(' ')} ${node.html.replace(/\s+/g, ' ').slice(0, 160)}`)
    .join(', ');
  return `${violation.id} (${violation.impact ?? 'unknown'}): ${violation.help} [${violation.helpUrl}] at ${targets}`;
}

/**
 * Runs axe-core on the page as it is now and fails on any serious or critical violation of WCAG
 * 2.0/2.1/2.2 A and AA, listing each with its rule id, impact, target selectors and help text.
 * `label` names the screen, size and role in the failure ("workbench at phone, signed out").
 * Wait for the screen to settle (its data shown) before calling. Returns the full results.
 */
export async function expectAccessible(page: Page, label: string, options: AccessibilityOptions = {}): Promise<AxeResults> {
  // Only violations are reported back: passes and incomplete results would cost time on every call.
  // Legacy mode runs axe once in the page itself. The default runs it per frame, then opens a
  // second page to merge the frames' results: for frames of other origins, which Blazebook's
  // screens do not have (no iframe anywhere in app/ or features/). Measured on the workbench at
  // wide size: 4.0–4.6 s a check by default, 0.74–0.85 s in legacy mode, the same violations.
  let builder = new AxeBuilder({ page }).setLegacyMode(true).options({ resultTypes: ['violations'] }).withTags([...wcagTags]);
  if (options.include) builder = builder.include(options.include);
  for (const selector of options.exclude ?? []) builder = builder.exclude(selector);
  const results = await builder.analyze();
  const serious = results.violations.filter((violation) => violation.impact && failing.has(violation.impact));
  // The message carries every violation, so a caller that gathers failures keeps the details.
  if (serious.length > 0) {
    throw new Error(`axe: serious or critical WCAG violations on ${label}:\n${serious.map(describeViolation).join('\n')}`);
  }
  return results;
}
