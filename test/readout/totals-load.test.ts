import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import { loadTotals } from '../../src/core/totals/load.js';
import { plan, totalsText } from './fixtures.js';

const FILE = 'readouts/wallet-test.totals.yaml';
const good = { control: { units: 1000, conv: 100, errors: 20 }, treatment: { units: 1000, conv: 110, errors: 20 } };

function errorsOf(text: string, withPlan = true) {
  const loaded = loadTotals(text, FILE, withPlan ? plan() : undefined);
  if (loaded.ok) throw new Error('expected errors');
  return loaded.errors;
}

describe('arm totals: bad input is named by file, line and field', () => {
  it('loads a valid file, and the demo’s totals against the demo’s plan', () => {
    expect(loadTotals(totalsText(good), FILE, plan()).ok).toBe(true);
    const demoPlan = loadPlan(readFileSync('demo/repo/experiments/checkout-wallet-first.yaml', 'utf8'), 'experiments/checkout-wallet-first.yaml');
    if (!demoPlan.ok) throw new Error('demo plan');
    const demo = loadTotals(readFileSync('demo/repo/readouts/checkout-wallet-first.totals.yaml', 'utf8'), 'readouts/checkout-wallet-first.totals.yaml', demoPlan.loaded.plan);
    expect(demo.ok).toBe(true);
  });

  const rows: { name: string; text: string; code: string; line: number; field: string; message: RegExp }[] = [
    {
      name: 'a negative count',
      text: totalsText({ ...good, treatment: { units: -5, conv: 0, errors: 0 } }),
      code: 'totals/invalid-value',
      line: 11,
      field: 'arms.treatment.units',
      message: /out of range/,
    },
    {
      name: 'Σy² below (Σy)²/n',
      text: totalsText({ ...good, treatment: { ...good.treatment, extra: '      spend: { n: 1000, sum: 20000, sum-of-squares: 390000 }' } }),
      code: 'totals/impossible-sums',
      line: 15,
      field: 'arms.treatment.metrics.spend.sum-of-squares',
      message: /below \(Σy\)²\/n = 400000/,
    },
    {
      // (Σy)²/n overflows a double here; the message must not print Infinity.
      name: 'Σy² below (Σy)²/n when (Σy)²/n is too large to write',
      text: totalsText({ ...good, treatment: { ...good.treatment, extra: '      spend: { n: 1000, sum: 1e300, sum-of-squares: 5 }' } }),
      code: 'totals/impossible-sums',
      line: 15,
      field: 'arms.treatment.metrics.spend.sum-of-squares',
      message: /below \(Σy\)²\/n \(too large to write\), which no data can give$/,
    },
    {
      name: 'an arm not in the plan',
      text: totalsText({ control: good.control, treatmnt: good.treatment }),
      code: 'totals/unknown-arm',
      line: 10,
      field: 'arms.treatmnt',
      message: /arm "treatmnt" is not in the plan; did you mean "treatment"\?/,
    },
    {
      name: 'data before the start',
      text: totalsText(good, '2026-10-30'),
      code: 'totals/before-start',
      line: 3,
      field: 'data-through',
      message: /before the test started on 2026-11-02/,
    },
    {
      name: 'a metric the plan does not register',
      text: totalsText({ ...good, treatment: { ...good.treatment, extra: '      basket: { units-with-event: 3 }' } }),
      code: 'totals/unknown-metric',
      line: 15,
      field: 'arms.treatment.metrics.basket',
      message: /not in the plan/,
    },
    {
      name: 'the wrong kind of totals for the metric',
      text: totalsText({ ...good, treatment: { ...good.treatment, extra: '      spend: { units-with-event: 3 }' } }),
      code: 'totals/metric-kind',
      line: 15,
      field: 'arms.treatment.metrics.spend',
      message: /registers "spend" as a mean metric/,
    },
    {
      name: 'more units with the event than units',
      text: totalsText({ ...good, treatment: { units: 1000, conv: 1001, errors: 20 } }),
      code: 'totals/more-than-units',
      line: 13,
      field: 'arms.treatment.metrics.conv.units-with-event',
      message: /1001 units with the event out of 1000/,
    },
  ];

  for (const row of rows) {
    it(`${row.name}: ${row.code} at line ${row.line}, ${row.field}`, () => {
      const problem = errorsOf(row.text).find((p) => p.code === row.code);
      expect(problem).toBeDefined();
      expect(problem).toMatchObject({ file: FILE, line: row.line, field: row.field });
      expect(problem!.message).toMatch(row.message);
    });
  }

  it('days that add up to more units than the arm are an error, to fewer a warning', () => {
    const days = (a: number, b: number) => `    days:\n      - { date: 2026-11-02, units: ${a} }\n      - { date: 2026-11-03, units: ${b} }`;
    const over = errorsOf(totalsText({ ...good, treatment: { ...good.treatment, extra: days(600, 500) } }));
    expect(over.find((p) => p.code === 'totals/days-sum')).toMatchObject({ line: 15, field: 'arms.treatment.days' });
    const under = loadTotals(totalsText({ ...good, treatment: { ...good.treatment, extra: days(400, 500) } }), FILE, plan());
    expect(under.ok && under.warnings.map((w) => w.code)).toEqual(['totals/days-sum']);
  });

  it('a plan id that is not the plan read', () => {
    const text = totalsText(good).replace('plan: wallet-test', 'plan: other-test');
    expect(errorsOf(text)[0]).toMatchObject({ code: 'totals/other-plan', line: 1, field: 'plan' });
  });

  it('without the plan, only the file’s own rules run', () => {
    expect(loadTotals(totalsText({ control: good.control, treatmnt: good.treatment }), FILE).ok).toBe(true);
  });
});

describe('arm totals: a commit id YAML would read as a number', () => {
  // Short ids made only of digits, or digits around an "e", are numbers to YAML (1.2 core schema; common practice
  // to quote them, no source): about one id in ten. The id is the text as written, leading zeros and all.
  it.each(['1234567', '0123456', '12e4567', '1e10000'])('loads plan-commit: %s as written', (id) => {
    const text = totalsText(good).replace('plan-commit: 4b1d2e7', `plan-commit: ${id}   # the launch commit`);
    const loaded = loadTotals(text, FILE, plan());
    expect(loaded.ok && loaded.totals.planCommit).toBe(id);
  });
});
