import { describe, expect, it } from 'vitest';
import { defaultSettings } from '../../src/core/config/load.js';
import { buildDigest } from '../../src/core/digest/build-digest.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { buildRegistry } from '../../src/core/registry/load.js';
import { renderDigestMarkdown } from '../../src/core/report/digest-markdown.js';
import { cleanPlan, planYaml } from '../review/scenarios.js';

// What the digest says about tests that are over: the outcome they owe, and the flag left behind.
function digestOf(plan: Record<string, unknown>, today: string, flags: string[]) {
  const loaded = loadPlan(planYaml(plan), 'experiments/good.yaml');
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  const registry = buildRegistry([loaded.loaded], []).registry;
  return buildDigest({ registry, today, settings: defaultSettings(), flagsInCode: new Map(flags.map((f) => [f, { file: 'src/cart.ts', line: 3, column: 7 }])) });
}
const items = (d: ReturnType<typeof digestOf>) => d.tests.flatMap((t) => t.items);

describe('tests that are over', () => {
  const outcome = { date: '2026-12-01', reason: 'Shipped: +2% orders.' };

  it('lists a concluded test whose flag is still read, with the days since its outcome', () => {
    const found = items(digestOf(cleanPlan({ state: 'concluded', outcome }), '2026-12-08', ['good-flag'])).find((i) => i.kind === 'concluded-flag-in-code')!;
    expect(found.daysSinceConclusion).toBe(7);
    expect(found.detail).toBe('Concluded 7 days ago (2026-12-01), but its flag good-flag is still read in the code (src/cart.ts:3): remove the flag and the code of the arm that lost.');
  });

  it('not once the flag is gone', () => {
    expect(items(digestOf(cleanPlan({ state: 'concluded', outcome }), '2026-12-08', [])).map((i) => i.kind)).toEqual([]);
  });

  it('lists a concluded test with no outcome recorded, and an on-hold test past its end', () => {
    expect(items(digestOf(cleanPlan({ state: 'concluded' }), '2026-12-08', [])).map((i) => i.kind)).toEqual(['outcome-missing']);
    expect(items(digestOf(cleanPlan({ state: 'on-hold' }), '2026-12-08', ['good-flag'])).map((i) => i.kind)).toContain('outcome-missing');
    expect(items(digestOf(cleanPlan({ state: 'on-hold' }), '2026-11-20', ['good-flag'])).map((i) => i.kind)).not.toContain('outcome-missing');
  });

  it('calls it "readout due" once the test is past its planned end, and "no outcome recorded" before it', () => {
    // The clean plan ends on 2026-11-29.
    const past = digestOf(cleanPlan({ state: 'concluded' }), '2026-12-08', []);
    expect(items(past)[0]).toMatchObject({ kind: 'outcome-missing', readoutDue: true });
    expect(items(past)[0]!.detail).toBe('Concluded, past its planned end (2026-11-29), but no outcome is recorded: read it out against its plan (plumbline readout good --totals <file> --record), or, if it ended without data, add outcome: { date, reason }.');
    expect(renderDigestMarkdown(past)).toContain('  - 📊 readout due: Concluded, past its planned end');
    // Stopped before its end: no readout to be had, a one-line reason is what is owed.
    const early = digestOf(cleanPlan({ state: 'concluded' }), '2026-11-20', []);
    expect(items(early)[0]).toMatchObject({ kind: 'outcome-missing', readoutDue: false });
    const markdown = renderDigestMarkdown(early);
    expect(markdown).toContain('  - 📋 no outcome recorded: Concluded, but no outcome is recorded: add outcome: { date, reason } with the decision in one line.');
    expect(markdown).not.toContain('readout due');
  });
});
