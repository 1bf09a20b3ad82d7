import { describe, expect, it } from 'vitest';
import { buildReadout } from '../../src/core/readout/build-readout.js';
import { plan, totals, totalsText, type ArmNumbers } from './fixtures.js';

const read = (arms: Record<string, ArmNumbers>, options: { plan?: Parameters<typeof plan>[0]; dataThrough?: string } = {}) => {
  const p = plan(options.plan);
  return buildReadout(p, totals(totalsText(arms, options.dataThrough), p));
};

const codes = (r: ReturnType<typeof buildReadout>) => r.findings.map((f) => f.code);

describe('the primary outcome, classified from the registered rule', () => {
  it('win: significant in the expected direction, with the plan’s win decision quoted', () => {
    const r = read({ control: { units: 50000, conv: 5000, errors: 1000 }, treatment: { units: 50000, conv: 5400, errors: 990 } });
    expect(r.verdict).toBe('win');
    expect(r.primary.arms[0]!.primaryClass).toBe('win');
    expect(r.decision).toEqual({ rule: 'win', text: 'Ship wallets first.' });
  });

  it('loss: significant the other way', () => {
    const r = read({ control: { units: 50000, conv: 5000, errors: 1000 }, treatment: { units: 50000, conv: 4600, errors: 1000 } });
    expect(r.verdict).toBe('loss');
    expect(r.decision?.text).toBe('Revert.');
  });

  it('flat: the interval excludes the minimum detectable effect both ways (5% of 10% = 0.5 pp)', () => {
    const r = read({ control: { units: 200000, conv: 20000, errors: 4000 }, treatment: { units: 200000, conv: 20030, errors: 4000 } });
    const c = r.primary.arms[0]!.comparison!;
    expect(c.interval.low).toBeGreaterThan(-0.005);
    expect(c.interval.high).toBeLessThan(0.005);
    expect(r.verdict).toBe('flat');
    expect(r.decision?.text).toBe('Keep the card form.');
  });

  it('inconclusive: neither significant nor narrow enough to exclude the minimum effect', () => {
    const r = read({ control: { units: 3000, conv: 300, errors: 60 }, treatment: { units: 3000, conv: 310, errors: 60 } });
    expect(r.verdict).toBe('inconclusive');
    expect(r.decision?.rule).toBe('flat');
  });

  it('a one-sided plan: the same data wins at one side that is inconclusive at two', () => {
    const arms = { control: { units: 20000, conv: 2000, errors: 400 }, treatment: { units: 20000, conv: 2110, errors: 400 } };
    expect(read(arms).verdict).toBe('inconclusive');
    expect(read(arms, { plan: { design: '{ min-detectable-effect: { relative: 0.05 }, daily-units: 4000, sides: 1 }' } }).verdict).toBe('win');
  });

  it('Bonferroni across arms: with two treatments each comparison runs at α/2', () => {
    const p = plan({ design: '{ arms: [{ name: control, weight: 1 }, { name: blue, weight: 1 }, { name: green, weight: 1 }], min-detectable-effect: { relative: 0.05 }, daily-units: 4000 }' });
    const r = buildReadout(p, totals(totalsText({ control: { units: 20000, conv: 2000, errors: 400 }, blue: { units: 20000, conv: 2120, errors: 400 }, green: { units: 20000, conv: 2000, errors: 400 } }), p));
    expect(r.alphaPerComparison).toBeCloseTo(0.025, 12);
    const blue = r.primary.arms.find((a) => a.arm === 'blue')!;
    expect(blue.adjustedP).toBeCloseTo(Math.min(1, blue.comparison!.pValue * 2), 12);
    expect(blue.comparison!.pValue).toBeLessThan(0.05);
    expect(blue.comparison!.pValue).toBeGreaterThan(0.025);
    expect(blue.primaryClass).toBe('inconclusive');
  });
});

describe('guardrails as non-inferiority', () => {
  it('harm ruled out when the one-sided bound on harm is inside the tolerance', () => {
    const r = read({ control: { units: 50000, conv: 5000, errors: 1000 }, treatment: { units: 50000, conv: 5400, errors: 1000 } });
    expect(r.guardrails[0]!.arms[0]!.guardrailClass).toBe('harm-ruled-out');
    expect(r.guardrails[0]!.arms[0]!.harm!.upperBound).toBeLessThan(0.004);
  });

  it('harm not ruled out when the bound reaches past the tolerance', () => {
    const r = read({ control: { units: 2000, conv: 200, errors: 40 }, treatment: { units: 2000, conv: 240, errors: 44 } });
    expect(r.guardrails[0]!.arms[0]!.guardrailClass).toBe('harm-not-ruled-out');
  });

  it('a breach overrides a win, and the breach decision is quoted', () => {
    const r = read({ control: { units: 50000, conv: 5000, errors: 1000 }, treatment: { units: 50000, conv: 5400, errors: 1200 } });
    expect(r.primary.arms[0]!.primaryClass).toBe('win');
    expect(r.guardrails[0]!.arms[0]!.guardrailClass).toBe('breach');
    expect(r.verdict).toBe('guardrail-breach');
    expect(r.decision).toEqual({ rule: 'guardrail-breach', text: 'Roll back now.' });
    expect(r.findings.find((f) => f.code === 'readout/guardrail-breach')?.message).toContain('overrides its win');
  });

  it('a missing guardrail blocks', () => {
    const r = read({ control: { units: 50000, conv: 5000 }, treatment: { units: 50000, conv: 5400 } });
    expect(codes(r)).toContain('readout/guardrail-missing');
  });
});

describe('sample ratio mismatch', () => {
  it('stops the readout: nothing is a result', () => {
    const r = read({ control: { units: 50000, conv: 5000, errors: 1000 }, treatment: { units: 48500, conv: 5400, errors: 1000 } });
    expect(r.srm!.mismatch).toBe(true);
    expect(r.verdict).toBe('not-read');
    expect(r.decision).toBeUndefined();
    expect(r.findings[0]!.severity).toBe('block');
  });

  it('checks each day at the same threshold', () => {
    const day = (date: string, units: number) => `      - { date: ${date}, units: ${units} }`;
    const r = read({
      control: { units: 20000, conv: 2000, errors: 400, extra: ['    days:', day('2026-11-02', 10000), day('2026-11-03', 10000)].join('\n') },
      treatment: { units: 20000, conv: 2000, errors: 400, extra: ['    days:', day('2026-11-02', 10600), day('2026-11-03', 9400)].join('\n') },
    });
    expect(r.srm!.mismatch).toBe(false);
    expect(r.srm!.days.map((d) => d.date)).toEqual(['2026-11-02', '2026-11-03']);
    expect(codes(r)).toContain('readout/sample-ratio-mismatch-day');
  });
});

describe('timing', () => {
  it('read early without interim looks is a blocking finding, and nothing is called flat', () => {
    const r = read({ control: { units: 200000, conv: 20000, errors: 4000 }, treatment: { units: 200000, conv: 20030, errors: 4000 } }, { dataThrough: '2026-11-20' });
    expect(r.timing.readEarly).toBe(true);
    expect(codes(r)).toContain('readout/read-early');
    expect(r.verdict).toBe('inconclusive');
  });

  it('with interim looks, the spending boundary at the fraction reached replaces 1.96', () => {
    const design = '{ min-detectable-effect: { relative: 0.05 }, daily-units: 4000, interim-looks: 2 }';
    const r = read({ control: { units: 20000, conv: 2000, errors: 400 }, treatment: { units: 20000, conv: 2130, errors: 400 } }, { plan: { design }, dataThrough: '2026-11-12' });
    expect(r.timing.boundary).toBeDefined();
    const t = r.timing.informationFraction!;
    expect(t).toBeGreaterThan(0);
    expect(t).toBeLessThan(1);
    // An O'Brien–Fleming-type boundary early on is far above the fixed 1.96.
    expect(r.timing.boundary!.z).toBeGreaterThan(2.2);
    expect(r.primary.arms[0]!.comparison!.critical).toBe(r.timing.boundary!.z);
    expect(codes(r)).toContain('readout/interim-look');
    expect(codes(r)).not.toContain('readout/read-early');
  });
});

describe('exploratory results', () => {
  it('flags "flat overall, one segment wins" as a pattern to confirm, after Benjamini–Hochberg', () => {
    const seg = (name: string, units: number, conv: number) => `      - { segment: "${name}", units: ${units}, metrics: { conv: { units-with-event: ${conv} } } }`;
    const r = read({
      control: { units: 40000, conv: 4000, errors: 800, extra: ['    segments:', seg('platform: ios', 10000, 1000), seg('platform: web', 30000, 3000)].join('\n') },
      treatment: { units: 40000, conv: 4040, errors: 800, extra: ['    segments:', seg('platform: ios', 10000, 1200), seg('platform: web', 30000, 2840)].join('\n') },
    });
    expect(['flat', 'inconclusive']).toContain(r.verdict);
    expect(r.segments.map((s) => s.segment)).toEqual(['platform: ios', 'platform: web']);
    expect(r.findings.find((f) => f.code === 'readout/segment-pattern')?.message).toContain('platform: ios');
  });

  it('notes a first week far from the later weeks (novelty)', () => {
    const week = (starting: string, units: number, conv: number) => `      - { starting: ${starting}, units: ${units}, metrics: { conv: { units-with-event: ${conv} } } }`;
    const r = read({
      control: { units: 40000, conv: 4000, errors: 800, extra: ['    weeks:', week('2026-11-02', 20000, 2000), week('2026-11-09', 20000, 2000)].join('\n') },
      treatment: { units: 40000, conv: 4300, errors: 800, extra: ['    weeks:', week('2026-11-02', 20000, 2300), week('2026-11-09', 20000, 2000)].join('\n') },
    });
    expect(codes(r)).toContain('readout/novelty');
  });
});

describe('never NaN or Infinity', () => {
  it('an arm without variation gives a reason, not a number', () => {
    const r = read({ control: { units: 1000, conv: 0, errors: 0 }, treatment: { units: 1000, conv: 0, errors: 0 } });
    const json = JSON.stringify(r);
    expect(json).not.toMatch(/NaN|Infinity|null/);
    expect(r.primary.arms[0]!.ok).toBe(false);
    expect(codes(r)).toContain('readout/primary-not-computed');
  });
});

describe('the spending boundary at an information fraction', () => {
  it('reproduces the Lan–DeMets O’Brien–Fleming-type boundaries of two equally spaced looks at two-sided 0.05: 2.963 then 1.969 (Jennison & Turnbull 2000, table 7.6, from memory)', async () => {
    const { spendingBoundaryAt } = await import('../../src/core/stats/sequential.js');
    const first = spendingBoundaryAt('obrien-fleming-spending', 0.05, 2, [0.5]);
    const second = spendingBoundaryAt('obrien-fleming-spending', 0.05, 2, [0.5, 1]);
    expect(first.ok && first.value).toBeCloseTo(2.963, 2);
    expect(second.ok && second.value).toBeCloseTo(1.969, 2);
  });
});
