/**
 * axe-core in a journey: every rule tagged WCAG 2.0/2.1 level A or AA, the experimental ones
 * included (axe leaves those out unless they are named, e.g. `label-content-name-mismatch`).
 * AAA-only and best-practice rules are not run. The browser context needs `bypassCSP: true` so
 * the script tag can be injected; the app's own CSP is unchanged.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { expect } from 'vitest';

const AXE = path.resolve(import.meta.dirname, '../../node_modules/axe-core/axe.min.js');

/** The WCAG tags whose rules the journeys run (A and AA of WCAG 2.0 and 2.1). */
export const AXE_WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] as const;

export interface AxeFinding {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[]; summary: string }[];
}

/** Runs axe-core with every WCAG 2.1 A/AA rule (experimental ones included) and answers the violations. */
export async function axeViolations(page: Page, options: { exclude?: string[] } = {}): Promise<AxeFinding[]> {
  const loaded = await page.evaluate(() => 'axe' in window);
  if (!loaded) await page.addScriptTag({ path: AXE });
  return page.evaluate(
    async ({ tags, exclude }) => {
      type Rule = { ruleId: string; tags: string[] };
      type Result = { violations: { id: string; impact: string | null; help: string; nodes: { target: string[]; failureSummary?: string }[] }[] };
      const axe = (window as unknown as { axe: { getRules: (t?: string[]) => Rule[]; run: (ctx: unknown, opts: unknown) => Promise<Result> } }).axe;
      // getRules lists experimental rules too; naming them in runOnly is what turns them on.
      const ids = axe.getRules([...tags]).map((r) => r.ruleId);
      const result = await axe.run(exclude.length > 0 ? { include: [document], exclude: exclude.map((s) => [s]) } : document, { runOnly: { type: 'rule', values: ids } });
      return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => ({ target: n.target, summary: n.failureSummary ?? '' })) }));
    },
    { tags: AXE_WCAG_TAGS, exclude: options.exclude ?? [] },
  );
}

/** Fails with the violations listed when axe-core (WCAG 2.1 A/AA, experimental rules included) finds any. */
export async function expectNoAxeViolations(page: Page, label: string, options: { exclude?: string[] } = {}): Promise<void> {
  const violations = await axeViolations(page, options);
  const listed = violations.map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => `${n.target.join(' ')} — ${n.summary}`).join('; ')}`).join('\n');
  expect(violations, `axe-core on ${label}:\n${listed}`).toEqual([]);
}
