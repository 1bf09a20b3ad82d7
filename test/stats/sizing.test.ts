import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import { proportionSampleSize } from '../../src/core/stats/proportion.js';
import { sequentialInflation } from '../../src/core/stats/sequential.js';
import { sizePlan } from '../../src/core/stats/plan-sizing.js';
import { EXACT_T_LIMIT, sizeMetric, type SizingRequest } from '../../src/core/stats/sizing.js';
import { meanSampleSize } from '../../src/core/stats/mean.js';

const base: SizingRequest = {
  baseline: { kind: 'proportion', rate: 0.1 },
  direction: 'increase',
  effect: { relative: 0.05 },
  arms: [
    { name: 'control', weight: 50 },
    { name: 'treatment', weight: 50 },
  ],
  control: 'control',
  alpha: 0.05,
  power: 0.8,
  sides: 2,
  dailyUnits: 10_000,
  trafficShare: 1,
  reach: 1,
  interimLooks: 0,
  boundary: 'obrien-fleming-spending',
  prePeriodCorrelation: 0,
};

function sized(overrides: Partial<SizingRequest>) {
  const result = sizeMetric({ ...base, ...overrides });
  if (!result.ok) throw new Error(`${result.error.input}: ${result.error.message}`);
  return result.value;
}

const fixedN1 = (alpha = 0.05) => {
  const n = proportionSampleSize({ p1: 0.1, p2: 0.105, alpha, sides: 2, ratio: 1 }, 0.8);
  if (!n.ok) throw new Error('no n');
  return n.value;
};

describe('sizeMetric', () => {
  it('rounds each arm up and turns units into days and whole weeks', () => {
    const s = sized({});
    const n1 = Math.ceil(fixedN1());
    expect(s.headline?.perArm).toEqual([
      { arm: 'control', units: n1 },
      { arm: 'treatment', units: n1 },
    ]);
    // days = ceil(total / (daily units x traffic share x reach))
    expect(s.headline?.duration).toEqual({ days: Math.ceil((2 * n1) / 10_000), weeks: Math.ceil(Math.ceil((2 * n1) / 10_000) / 7) });
  });

  it('spreads a half-traffic test over twice the days', () => {
    const full = sized({ dailyUnits: 1000 });
    const half = sized({ dailyUnits: 1000, trafficShare: 0.5 });
    expect(half.headline?.totalUnits).toBe(full.headline?.totalUnits);
    expect(half.headline!.duration!.days).toBe(Math.ceil(full.headline!.totalUnits / 500));
  });

  it('prices exposure dilution in units and in days', () => {
    const s = sized({ reach: 0.5, dailyUnits: 2000 });
    // The triggered analysis counts reached units, which arrive at reach x daily units.
    expect(s.triggered?.duration?.days).toBe(Math.ceil(s.triggered!.totalUnits / 1000));
    expect(s.diluted?.duration?.days).toBe(Math.ceil(s.diluted!.totalUnits / 2000));
    // Halving the effect among exposed units needs about four times the units and twice the days.
    expect(s.multipliers.dilutionUnits).toBeGreaterThan(3.8);
    expect(s.multipliers.dilutionUnits).toBeLessThan(4.2);
    expect(s.multipliers.dilutionDays).toBeCloseTo(s.multipliers.dilutionUnits * 0.5, 10);
    expect(s.headline).toBe(s.diluted);
  });

  it('tests each of several treatment arms at alpha / arms (Bonferroni), sized by the hungriest comparison', () => {
    const s = sized({ arms: [{ name: 'control', weight: 1 }, { name: 'a', weight: 1 }, { name: 'b', weight: 1 }] });
    expect(s.multipliers.alphaPerComparison).toBe(0.025);
    expect(s.headline?.perArm.map((a) => a.units)).toEqual(Array(3).fill(Math.ceil(fixedN1(0.025))));
  });

  it('gives a small treatment arm what it needs against a large control', () => {
    const s = sized({ arms: [{ name: 'control', weight: 80 }, { name: 'treatment', weight: 20 }] });
    const [control, treatment] = s.headline!.perArm;
    expect(control!.units / treatment!.units).toBeCloseTo(4, 3);
    expect(s.headline!.totalUnits).toBeGreaterThan(sized({}).headline!.totalUnits);
  });

  it('applies the design effect, CUPED and the sequential inflation as multipliers on units', () => {
    const plain = sized({}).headline!.totalUnits;
    const clustered = sized({ cluster: { meanSize: 10, icc: 0.02, sizeCv: 0 } });
    expect(clustered.multipliers.designEffect).toBeCloseTo(1.18, 12);
    expect(clustered.headline!.totalUnits / plain).toBeCloseTo(1.18, 3);
    expect(clustered.headline!.clusters).toBe(Math.ceil(clustered.headline!.totalUnits / 10));
    expect(sized({ prePeriodCorrelation: 0.6 }).headline!.totalUnits / plain).toBeCloseTo(0.64, 3);
    const looks = sized({ interimLooks: 3 });
    const expected = sequentialInflation({ kind: 'obrien-fleming-spending', looks: 4, alpha: 0.05, sides: 2 }, 0.8);
    expect(expected.ok && looks.multipliers.sequential).toBe(expected.ok ? expected.value.inflation : NaN);
  });

  it('reports power and the detectable effect by the planned end, and warns when the window is too short', () => {
    const needed = sized({ dailyUnits: 1000, plannedDays: 7 * 52 }).headline!.duration!.days;
    const short = sized({ dailyUnits: 1000, plannedDays: Math.floor(needed / 2) });
    expect(short.atPlannedEnd!.power!).toBeLessThan(0.8);
    expect(short.atPlannedEnd!.detectable!.relative).toBeGreaterThan(0.05);
    const long = sized({ dailyUnits: 1000, plannedDays: needed * 2 });
    expect(long.atPlannedEnd!.power!).toBeGreaterThan(0.8);
    expect(long.atPlannedEnd!.detectable!.relative).toBeLessThan(0.05);
    expect(long.notes).toEqual([]);
  });

  it('draws power by week for long tests, rising to the target at the needed duration', () => {
    const s = sized({ dailyUnits: 1000, plannedDays: 84 });
    const curve = s.powerByDay!;
    expect(curve.map((p) => p.day).slice(0, 3)).toEqual([7, 14, 21]);
    for (let i = 1; i < curve.length; i++) expect(curve[i]!.power).toBeGreaterThan(curve[i - 1]!.power);
    const weeks = s.headline!.duration!.weeks;
    expect(curve[weeks - 1]!.power).toBeGreaterThanOrEqual(0.8 - 1e-9);
    expect(curve[weeks - 2]!.power).toBeLessThan(0.8);
  });

  it('draws power by day for short tests', () => {
    const s = sized({ dailyUnits: 20_000, plannedDays: 14 });
    const days = s.headline!.duration!.days;
    expect(s.powerByDay!.map((p) => p.day)).toEqual(Array.from({ length: 15 }, (_, i) => i + 1));
    expect(s.powerByDay![days - 1]!.power).toBeGreaterThanOrEqual(0.8 - 1e-9);
  });

  it('sizes a ratio metric with the delta-method standard deviation', () => {
    const s = sized({ baseline: { kind: 'ratio', numerator: { mean: 0.9, sd: 1.4 }, denominator: { mean: 3.2, sd: 2.5 }, correlation: 0.55 } });
    const r = 0.9 / 3.2;
    expect(s.baselineValue).toBeCloseTo(r, 12);
    expect(s.sd).toBeCloseTo(Math.sqrt(1.4 ** 2 - 2 * r * 0.55 * 1.4 * 2.5 + r ** 2 * 2.5 ** 2) / 3.2, 12);
  });

  it.each([
    ['a baseline rate of 0', { baseline: { kind: 'proportion' as const, rate: 0 } }, 'baseline.rate'],
    ['a baseline rate of 1', { baseline: { kind: 'proportion' as const, rate: 1 } }, 'baseline.rate'],
    ['an effect that pushes the rate past 1', { baseline: { kind: 'proportion' as const, rate: 0.9 }, effect: { relative: 0.2 } }, 'effect'],
    ['an effect that pushes the rate below 0', { direction: 'decrease' as const, effect: { absolute: 0.2 } }, 'effect'],
    ['power at or below alpha', { power: 0.05 }, 'power'],
    ['zero traffic', { dailyUnits: 0 }, 'daily-units'],
    ['a relative effect on a zero mean', { baseline: { kind: 'mean' as const, mean: 0, sd: 1 } }, 'effect'],
    ['a control arm that is not there', { control: 'nobody' }, 'arms'],
    ['a ratio with no variance', { baseline: { kind: 'ratio' as const, numerator: { mean: 1, sd: 1 }, denominator: { mean: 1, sd: 1 }, correlation: 1 } }, 'baseline'],
  ])('refuses %s, naming the input', (_name, overrides, input) => {
    const result = sizeMetric({ ...base, ...overrides } as SizingRequest);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.error.input).toBe(input);
      expect(result.error.message).not.toMatch(/NaN|Infinity|undefined/);
    }
  });
});

describe('exact and normal calculations for means', () => {
  it.each([0.3, 0.1, 0.03, 0.01])('differ by less than one unit per arm (standardized effect %s)', (d) => {
    const test = { alpha: 0.05, sides: 2 as const, ratio: 1, delta: d, sd: 1 };
    const exact = meanSampleSize({ ...test, method: 'exact' }, 0.8);
    const normal = meanSampleSize({ ...test, method: 'normal' }, 0.8);
    expect(exact.ok && normal.ok).toBe(true);
    if (exact.ok && normal.ok) {
      expect(exact.value - normal.value).toBeGreaterThan(0);
      expect(exact.value - normal.value).toBeLessThan(1);
    }
  });

  it('auto uses the exact calculation below EXACT_T_LIMIT control units', () => {
    const small = sized({ baseline: { kind: 'mean', mean: 10, sd: 5 }, effect: { relative: 0.1 } });
    const exact = sized({ baseline: { kind: 'mean', mean: 10, sd: 5 }, effect: { relative: 0.1 }, method: 'exact' });
    expect(small.headline).toEqual(exact.headline);
    expect(small.headline!.perArm[0]!.units).toBeLessThan(EXACT_T_LIMIT);
  });
});

describe('sizePlan', () => {
  const plan = (name: string) => {
    const r = loadPlan(readFileSync(new URL(`../../demo/repo/experiments/${name}.yaml`, import.meta.url), 'utf8'), name);
    if (!r.ok) throw new Error(name);
    return r.loaded.plan;
  };

  it('sizes guardrails one-sided for harm, against their desired direction', () => {
    const s = sizePlan(plan('checkout-wallet-first'));
    expect(s.plannedDays).toBe(28);
    expect(s.metrics.map((m) => [m.metric, m.role, m.direction, m.sides])).toEqual([
      ['payment-completed', 'primary', 'increase', 2],
      ['payment-errors', 'guardrail', 'increase', 1],
    ]);
    const guardrail = s.metrics[1]!.result;
    expect(guardrail.ok && guardrail.value.effect).toMatchObject({ from: 0.015, to: 0.018 });
  });

  it('applies the design effect only when groups are randomized and members analysed', () => {
    const s = sizePlan(plan('shared-list-invite'));
    const primary = s.metrics[0]!.result;
    expect(primary.ok && primary.value.multipliers.designEffect).toBeCloseTo(1 + ((0.45 ** 2 + 1) * 2.3 - 1) * 0.3, 12);
  });
});

describe('a detectable change stays within a rate’s range', () => {
  it('for any rate, direction, hypothesis and traffic down to 0.01 a day: a change within [0, 1], or a reason instead (fast-check)', async () => {
    const fc = (await import('fast-check')).default;
    fc.assert(
      fc.property(
        fc.double({ min: 0.001, max: 0.999, noNaN: true }),
        fc.constantFrom<'increase' | 'decrease'>('increase', 'decrease'),
        fc.constantFrom<'superiority' | 'non-inferiority'>('superiority', 'non-inferiority'),
        fc.double({ min: 0.01, max: 50, noNaN: true }),
        fc.integer({ min: 1, max: 90 }),
        (rate, direction, hypothesis, dailyUnits, plannedDays) => {
          const s = sized({ baseline: { kind: 'proportion', rate }, direction, hypothesis, effect: { absolute: Math.min(rate, 1 - rate) / 2 }, dailyUnits, plannedDays });
          const end = s.atPlannedEnd!;
          expect(Boolean(end.detectable) !== Boolean(end.noneDetectable)).toBe(true);
          for (const change of [end.detectable, s.feasibility?.detectableAtLongest]) {
            if (change) expect(change.to >= 0 && change.to <= 1).toBe(true);
          }
          if (end.noneDetectable) expect(end.noneDetectable.reason).toMatch(/^no change within 0–100% is detectable with (fewer than 1 unit \([\d.]+ expected\)|[\d,]+ units?)$/);
        },
      ),
      { numRuns: 300 },
    );
  });
});
