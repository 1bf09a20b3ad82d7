import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { hasR, runR } from '../helpers/r.js';
import { makeRepo, runCli } from './helpers.js';

/**
 * `plumbline size` at traffic so low that the test never reaches its sample (design.daily-units down to 0.01, the
 * smallest a plan may give), and at a power so close to 1 that rounding would print 100%. Nothing a report prints may
 * be a rate outside 0–100%, a count rounded to 0 that is not 0, or a power the test does not have.
 */

function plan(options: { dailyUnits: number; power?: number }): string {
  return `id: express-checkout
title: One-page express checkout
owners: ["@tester"]
flags: ["express-checkout"]
state: live
window: { start: 2026-11-23, end: 2026-12-20 }
hypothesis:
  change: Returning users get a single-page checkout.
  because: Fewer page loads remove the step where most people drop out.
  expected-direction: increase
unit: { randomization: user }
surface: { path: cart/checkout }
exposure: { event: checkout_started, reach: 1 }
metrics:
  primary: { name: order-rate, kind: proportion, baseline: { rate: 0.3 }, events: [order_completed] }
  guardrails:
    - { name: avatar-views, kind: proportion, baseline: { rate: 0.6 }, events: [avatar_shown], direction: increase, tolerance: { relative: 0.10 } }
    - { name: checkout-latency, kind: mean, baseline: { mean: 420, sd: 180 }, events: [checkout_started], direction: decrease, tolerance: { relative: 0.02 } }
design:
  arms: [{ name: control, weight: 50 }, { name: treatment, weight: 50 }]
  alpha: 0.05
  power: ${options.power ?? 0.8}
  min-detectable-effect: { relative: 0.03 }
  daily-units: ${options.dailyUnits}
  interim-looks: 3
  interim-boundary: pocock-spending
decisions:
  win: Ship express checkout to everyone.
  flat: Keep the classic checkout.
  loss: Revert and study drop-off.
  guardrail-breach: Turn the flag off at once.
`;
}

const repos: string[] = [];
function size(options: { dailyUnits: number; power?: number }, format: 'text' | 'json' | 'markdown') {
  const root = makeRepo({ 'experiments/express-checkout.yaml': plan(options) });
  repos.push(root);
  return runCli(['-C', root, 'size', 'experiments/express-checkout.yaml', '--format', format]);
}
afterAll(() => {
  for (const root of repos) rmSync(root, { recursive: true, force: true });
});

interface Change {
  to: number;
}
interface Entry {
  metric: string;
  kind: string;
  power: number;
  result: {
    ok: true;
    value: {
      atPlannedEnd?: { totalUnits: number; power?: number; detectable?: Change; noneDetectable?: { reason: string }; noPower?: { reason: string } };
      feasibility?: { detectableAtLongest?: Change; noneDetectableAtLongest?: { reason: string } };
    };
  };
}

describe('size at very low traffic', () => {
  it.each([0.01, 0.1, 0.5])('daily-units %s: no rate outside 0–100% in text, Markdown or JSON; the reason in words instead', (dailyUnits) => {
    const text = size({ dailyUnits }, 'text');
    expect(text.status).toBe(0);
    for (const out of [text.stdout, size({ dailyUnits }, 'markdown').stdout]) {
      // Values of a rate: "60.0% → x%" never has x below 0 or above 100.
      for (const m of out.matchAll(/\d+(?:\.\d+)?% → (-?[\d.]+)%/g)) expect(Number(m[1])).toBeGreaterThanOrEqual(0);
      for (const m of out.matchAll(/\d+(?:\.\d+)?% → (-?[\d.]+)%/g)) expect(Number(m[1])).toBeLessThanOrEqual(100);
      expect(out).toContain('no change within 0–100% is detectable with ');
      expect(out).not.toMatch(/got 0\b|e\+\d/);
    }
    const json = JSON.parse(size({ dailyUnits }, 'json').stdout) as { metrics: Entry[] };
    for (const entry of json.metrics.filter((m) => m.kind === 'proportion')) {
      const { atPlannedEnd: end, feasibility } = entry.result.value;
      for (const change of [end?.detectable, feasibility?.detectableAtLongest]) {
        if (change) expect(change.to >= 0 && change.to <= 1, `${entry.metric}: ${change.to}`).toBe(true);
      }
      // Either a detectable change inside the range or a reason, never neither and never both.
      expect(Boolean(end?.detectable) !== Boolean(end?.noneDetectable)).toBe(true);
    }
    // At 0.1 a day or less, 56 days give at most 5 units: even a fall of the 60% guardrail to 0% is out of reach.
    const guardrail = json.metrics.find((m) => m.metric === 'avatar-views')!.result.value;
    if (dailyUnits <= 0.1) {
      expect(guardrail.feasibility?.detectableAtLongest).toBeUndefined();
      expect(guardrail.feasibility?.noneDetectableAtLongest?.reason).toMatch(/^no change within 0–100% is detectable with /);
    }
  });

  it.runIf(hasR())('says "none" exactly when the non-inferiority margin R computes passes the rate (Chow, Shao & Wang sec. 4.2, from memory; qnorm in R)', () => {
    // avatar-views: baseline 60%, one-sided α 0.05, power 80%, equal arms. The margin the whole units rule out is
    // (z_0.95 + z_0.8) · sqrt(2 p (1 − p) / n1); a margin above 0.6 would take the rate below 0%.
    const rows = runR(
      `x <- read.csv("input.csv"); n1 <- floor(x$units) %/% 2
       m <- (qnorm(0.95) + qnorm(0.8)) * sqrt(2 * 0.6 * 0.4 / n1)
       write.csv(data.frame(margin = ifelse(n1 > 0, m, Inf)), "output.csv", row.names = FALSE)`,
      [0.1, 0.5, 2, 5].map((daily) => ({ units: daily * 28 })),
    );
    [0.1, 0.5, 2, 5].forEach((dailyUnits, i) => {
      const json = JSON.parse(size({ dailyUnits }, 'json').stdout) as { metrics: Entry[] };
      const end = json.metrics.find((m) => m.metric === 'avatar-views')!.result.value.atPlannedEnd!;
      const margin = rows[i]!.margin!;
      if (margin > 0.6) expect(end.noneDetectable?.reason, `daily ${dailyUnits}`).toMatch(/^no change within 0–100%/);
      else expect(end.detectable!.to).toBeCloseTo(0.6 - margin, 6);
    });
  });

  it('prints small traffic as given and fractional units honestly; no "got 0"', () => {
    const out = size({ dailyUnits: 0.01 }, 'text').stdout;
    expect(out).toContain('0.01 new eligible units a day');
    expect(out).toContain('no change within 0–100% is detectable with fewer than 1 unit (0.28 expected)');
    expect(out).toContain('In the longest window (56 days), no change within 0–100% is detectable with fewer than 1 unit (0.56 expected).');
    expect(out).not.toMatch(/\b0 new eligible|got 0|control units are needed/);
    expect(size({ dailyUnits: 0.1 }, 'text').stdout).toContain('0.1 new eligible units a day');
    // Too few units for power and for a detectable change: one note says both, the unit count once.
    expect(out).toContain('order-rate: By the planned end (28 days): no power, and no change within 0–100% is detectable with fewer than 1 unit (0.28 expected).');
    expect(out).not.toContain('order-rate: By the planned end (28 days) no power can be computed');
    const json = JSON.parse(size({ dailyUnits: 0.01 }, 'json').stdout) as { metrics: Entry[] };
    expect(json.metrics[0]!.result.value.atPlannedEnd).toMatchObject({ noPower: { tooFewUnits: true } });
  });

  it('leaves the family power out with a reason when the primary has no power at the planned end, and never puts the target in its place', () => {
    const low = size({ dailyUnits: 0.01 }, 'text').stdout;
    expect(low).toContain('Power for the family is not computed: order-rate has no power by the planned end; fewer than 1 unit (0.28 expected) by then, too few to analyse.');
    expect(low).not.toContain('(80.0% alone)');
    const json = JSON.parse(size({ dailyUnits: 0.01 }, 'json').stdout) as { family?: unknown; familyOmitted?: { reason: string }; metrics: Entry[] };
    expect(json.family).toBeUndefined();
    expect(json.familyOmitted?.reason).toMatch(/order-rate has no power by the planned end/);
    // Where the power at the end is known, the family is built from it, not from the planned 80%.
    const half = JSON.parse(size({ dailyUnits: 0.5 }, 'json').stdout) as { family: { primaryPower: number }; metrics: Entry[] };
    expect(half.family.primaryPower).toBe(half.metrics[0]!.result.value.atPlannedEnd!.power);
    expect(half.family.primaryPower).toBeLessThan(0.1);
  });
});

describe('size prints power one way everywhere', () => {
  it('never shows 100%: header, notes, table and the chart data (power 0.9999999)', () => {
    const text = size({ dailyUnits: 8000, power: 0.9999999 }, 'text').stdout;
    const markdown = size({ dailyUnits: 8000, power: 0.9999999 }, 'markdown').stdout;
    expect(text).toContain('power >99.9%');
    // "100% of them enrolled" is the traffic share, not a power.
    for (const out of [text, markdown]) expect(out.replace(/100% of them enrolled/g, '')).not.toMatch(/\b100(\.0)?%/);
    const lines = [...markdown.matchAll(/ {2}line \[([^\]]*)\]/g)].flatMap((m) => m[1]!.split(', ').map(Number));
    expect(lines.length).toBeGreaterThan(0);
    expect(Math.max(...lines)).toBeLessThanOrEqual(99.9);
    expect(markdown).toContain('(the flat line is the planned >99.9%)');
  });

  it('the note about power by the planned end says what the table says, for every metric', () => {
    for (const dailyUnits of [0.5, 100, 2000]) {
      const out = size({ dailyUnits }, 'text').stdout;
      const notes = [...out.matchAll(/^- ([a-z-]+): The planned 28 days give (\S+) power, below the planned (\S+)\.$/gm)];
      expect(notes.length, `daily ${dailyUnits}`).toBeGreaterThan(0);
      for (const [, metric, power, planned] of notes) {
        const row = out.split('\n').find((l) => l.startsWith(`${metric!} `))!;
        expect(row.split(/\s{2,}/)).toContain(power);
        expect(planned).toBe('80.0%');
      }
    }
  });

  it('says "an 11.7% chance" (the article goes by the spoken number)', () => {
    const out = size({ dailyUnits: 8000 }, 'text').stdout;
    expect(out).toContain('gives an 11.7% chance of a false alarm at some look');
    expect(out).not.toMatch(/\ba 11\.7%/);
  });
});

describe('size --daily-units takes the range a plan may hold', () => {
  it('refuses 0.001 with exit code 2 and names the plan’s range; takes 0.01', () => {
    const refused = runCli(['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--daily-units', '0.001']);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toContain('--daily-units is too small for sizing to give a meaningful figure; got 0.001');
    expect(refused.stderr).toContain('from 0.01 (one unit in a hundred days)');
    expect(refused.stderr).not.toMatch(/\n\s+at /);
    const plan = size({ dailyUnits: 0.001 }, 'text');
    expect(plan.status).not.toBe(0);
    expect(plan.stderr + plan.stdout).toContain('from 0.01 (one unit in a hundred days)');
    const taken = runCli(['size', '--kind', 'proportion', '--baseline', '0.1', '--effect', '0.1', '--daily-units', '0.01']);
    expect(taken.status).toBe(0);
    expect(taken.stdout).toContain('0.01 new eligible units a day');
  });
});
