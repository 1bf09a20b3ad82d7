import fc from 'fast-check';
import { stringify } from 'yaml';
import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import { armsToShip, buildReadout } from '../../src/core/readout/build-readout.js';
import { withLaunchRule } from '../../src/core/readout/launch-note.js';
import { launchRule } from '../../src/core/plan/launch-rule.js';
import { renderReadoutMarkdown } from '../../src/core/report/readout-markdown.js';
import { renderReadoutText } from '../../src/core/report/readout-text.js';
import { readoutSectionMarkdown, ruleAppliedLine, MARKDOWN_STYLE } from '../../src/core/report/review-readout.js';
import type { PlanReview } from '../../src/core/review/build-review.js';
import { loadTotals } from '../../src/core/totals/load.js';
import { cleanPlan, planYaml } from '../review/scenarios.js';

/**
 * Whatever totals a file holds, as long as they load, no report of the readout shows a number that is
 * not one: no NaN, Infinity, null, undefined or "n/a" in the text, the Markdown, the JSON, or the
 * readout section of the review comment (the house rule for every report; common practice, no source).
 */
const NOT_A_NUMBER = /NaN|Infinity|\bnull\b|\bundefined\b|\bn\/a\b/;

function planOf(overrides: Record<string, unknown>) {
  const loaded = loadPlan(planYaml(cleanPlan(overrides)), 'experiments/good.yaml');
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.loaded.plan;
}

const proportionPlan = planOf({});
const meanPlan = planOf({
  metrics: {
    primary: { name: 'bought', kind: 'mean', baseline: { mean: 20, sd: 15 }, events: ['order_done'] },
    guardrails: [{ name: 'errors', kind: 'proportion', baseline: { rate: 0.02 }, events: ['cart_error'], direction: 'decrease', tolerance: { relative: 0.2 } }],
  },
  design: { 'min-detectable-effect': { absolute: 0.5 }, 'daily-units': 20000, 'interim-looks': 2 },
});

/** Counts from the empty to the very large, with the edges (0, 1, all) likely. */
const units = fc.oneof(fc.constantFrom(0, 1, 2, 3), fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 0, max: 2 ** 40 }));
const share = fc.oneof(fc.constantFrom(0, 1), fc.double({ min: 0, max: 1, noNaN: true }));
const value = fc.oneof(fc.constantFrom(0, 1e-12, 1e12), fc.double({ min: -1e9, max: 1e9, noNaN: true }));

const proportionArm = fc.record({ units, bought: share, errors: share }).map(({ units: n, bought, errors }) => ({
  units: n,
  metrics: { bought: { 'units-with-event': Math.floor(n * bought) }, errors: { 'units-with-event': Math.floor(n * errors) } },
}));
// Σy² at or above (Σy)²/n by construction: n·mean² plus a spread.
const meanArm = fc.record({ units, mean: value, spread: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1e9, noNaN: true })), errors: share }).map(({ units: n, mean, spread, errors }) => ({
  units: n,
  metrics: { bought: { n, sum: n * mean, 'sum-of-squares': n * mean * mean + spread * n }, errors: { 'units-with-event': Math.floor(n * errors) } },
}));

const through = fc.constantFrom('2026-11-10', '2026-11-20', '2026-11-29', '2026-12-20');

function reports(plan: typeof proportionPlan, totalsText: string): string[] | undefined {
  const loaded = loadTotals(totalsText, 'readouts/good.totals.yaml', plan);
  if (!loaded.ok) return undefined;
  const readout = withLaunchRule(buildReadout(plan, loaded.totals), launchRule(plan, 'experiments/good.yaml', loaded.totals.planCommit, { found: false, reason: 'no-history' }));
  const section: PlanReview['readout'] = {
    file: 'readouts/good.totals.yaml',
    source: 'latest',
    verdict: readout.verdict,
    arms: readout.verdictArms,
    ships: armsToShip(readout),
    ...(readout.decision ? { decision: readout.decision.text } : {}),
    ...(readout.verdict !== 'not-read' ? { primary: readout.primary } : {}),
    removes: { flags: ['good-flag'], kept: 'treatment' },
    ...(readout.rule ? { rule: readout.rule } : {}),
  };
  const review = { readout: section } as PlanReview;
  return [renderReadoutText(readout, { color: false }), renderReadoutMarkdown(readout), JSON.stringify(readout), ...readoutSectionMarkdown(review), ruleAppliedLine(section, MARKDOWN_STYLE)];
}

describe('no report of a readout shows a number that is not one (fast-check over totals)', () => {
  it.each([
    ['proportions', proportionPlan, proportionArm],
    ['means, with interim looks', meanPlan, meanArm],
  ] as const)('%s', (_name, plan, arm) => {
    let read = 0;
    fc.assert(
      fc.property(arm, arm, through, (control, treatment, dataThrough) => {
        const text = stringify({ plan: 'good', 'plan-commit': '4b1d2e7', 'data-through': dataThrough, arms: { control, treatment } });
        const out = reports(plan, text);
        if (!out) return;
        read++;
        for (const report of out) expect(report).not.toMatch(NOT_A_NUMBER);
      }),
      { numRuns: 300 },
    );
    // The generator must produce readable totals most of the time, or the property says nothing.
    expect(read).toBeGreaterThan(150);
  });
});
