import { loadPlan } from '../../src/core/plan/load.js';
import type { Plan } from '../../src/core/plan/schema.js';
import { seededRandom } from '../helpers/random.js';
import type { EventRow, ExposureRow } from '../helpers/reference-totals.js';

/**
 * A plan with one metric of every shape the query computes (a proportion, a proportion among units with
 * another event and counting those without one, a capped mean of values with a pre-period, a mean of
 * event counts, a ratio of counts), and a small data set with the dirt real data has. The large
 * generated data set comes from test/helpers/generated-data.ts; this one is small enough to read.
 */
export const SHAPES_PLAN = `id: basket-shapes
title: Every metric shape
owners: ["@ana-lima"]
flags: [basket-shapes]
state: live
window: { start: 2026-11-09, end: 2026-11-22 }
hypothesis: { change: Shortcut., because: Faster., expected-direction: increase }
unit: { randomization: user }
surface: { path: basket/view }
metrics:
  primary: { name: ordered, kind: proportion, baseline: { rate: 0.3 }, events: [order_placed] }
  guardrails:
    - name: abandonment
      kind: proportion
      baseline: { rate: 0.2 }
      events: [basket_viewed, order_placed]
      direction: decrease
      tolerance: { relative: 0.05 }
      per-unit: { counts: without-event, events: [order_placed], among: [basket_viewed] }
  secondary:
    - { name: spend, kind: mean, baseline: { mean: 20, sd: 10 }, events: [order_placed], capped-at: 90 }
    - { name: views, kind: mean, baseline: { mean: 2, sd: 1 }, events: [basket_viewed], per-unit: { value: count, within-days: 3 } }
    - name: orders-per-view
      kind: ratio
      baseline: { numerator: { mean: 0.3, sd: 0.5 }, denominator: { mean: 2, sd: 1 } }
      events: [order_placed, basket_viewed]
      per-unit: { numerator: { value: count }, denominator: { value: count } }
design:
  arms: [{ name: control, weight: 50 }, { name: shortcut, weight: 50 }]
  min-detectable-effect: { relative: 0.05 }
  daily-units: 4000
  pre-period-correlation: 0.4
decisions: { win: Ship., flat: Keep., loss: Revert., guardrail-breach: Roll back. }
`;

export function shapesPlan(text = SHAPES_PLAN): Plan {
  const loaded = loadPlan(text, 'experiments/basket-shapes.yaml');
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.loaded.plan;
}

const iso = (ms: number, offsetHours = 0) => {
  const local = new Date(ms + offsetHours * 3_600_000).toISOString().slice(0, 19);
  const sign = offsetHours < 0 ? '-' : '+';
  const h = String(Math.abs(offsetHours)).padStart(2, '0');
  return `${local}${sign}${h}:00`;
};

/** Units exposed over the window with duplicates, switchers, unknown arms, day-boundary times in two zones, NULL values and times, early and late events. */
export function smallData(units = 400, seed = 7): { exposures: ExposureRow[]; events: EventRow[] } {
  const rnd = seededRandom(seed);
  const start = Date.parse('2026-11-09T00:00:00Z');
  const exposures: ExposureRow[] = [];
  const events: EventRow[] = [];
  const platforms = ['web', 'ios', 'android'];
  for (let i = 0; i < units; i++) {
    const id = `u${i}`;
    const arm = rnd() < 0.5 ? 'control' : 'shortcut';
    // Some exposures fall a minute either side of midnight UTC, written with a -05:00 offset.
    const day = Math.floor(rnd() * 12);
    const atBoundary = rnd() < 0.15;
    const t = start + day * 86_400_000 + (atBoundary ? (rnd() < 0.5 ? -60_000 : 60_000) + 86_400_000 : Math.floor(rnd() * 86_400) * 1000);
    const offset = rnd() < 0.5 ? -5 : 0;
    const platform = rnd() < 0.05 ? null : platforms[Math.floor(rnd() * 3)]!;
    exposures.push({ unit_id: id, arm, exposed_at: iso(t, offset), experiment: 'basket-shapes', platform });
    if (rnd() < 0.2) exposures.push({ unit_id: id, arm, exposed_at: iso(t + 3_600_000, 0), experiment: 'basket-shapes', platform: platforms[0]! });
    if (rnd() < 0.03) exposures.push({ unit_id: id, arm: arm === 'control' ? 'shortcut' : 'control', exposed_at: iso(t + 7_200_000), experiment: 'basket-shapes', platform });
    if (rnd() < 0.02) exposures.push({ unit_id: id, arm: 'Shortcut', exposed_at: iso(t + 60_000), experiment: 'basket-shapes', platform });
    if (rnd() < 0.03) exposures.push({ unit_id: id, arm, exposed_at: iso(t), experiment: 'another-test', platform });
    const lift = arm === 'shortcut' ? 0.08 : 0;
    const views = Math.floor(rnd() * 4);
    for (let v = 0; v < views; v++) events.push({ unit_id: id, event: 'basket_viewed', occurred_at: iso(t + Math.floor(rnd() * 6 * 86_400_000)), value: null });
    if (rnd() < 0.3 + lift) {
      const value = rnd() < 0.1 ? null : Math.round(rnd() * 8000) / 100;
      events.push({ unit_id: id, event: 'order_placed', occurred_at: iso(t + Math.floor(rnd() * 5 * 86_400_000), offset), value });
      if (rnd() < 0.2) events.push({ unit_id: id, event: 'order_placed', occurred_at: iso(t + 86_400_000), value: Math.round(rnd() * 50000) / 100 });
    }
    // Before exposure: the pre-period (and, further back, outside it).
    if (rnd() < 0.4) events.push({ unit_id: id, event: 'order_placed', occurred_at: iso(t - Math.floor(rnd() * 20 * 86_400_000) - 1000), value: Math.round(rnd() * 6000) / 100 });
    if (rnd() < 0.1) events.push({ unit_id: id, event: 'other_event', occurred_at: iso(t + 1000), value: 1 });
  }
  // Exposures with no time (an empty field; NULL in Parquet and PostgreSQL): counted, in no total. Two units
  // also have timed exposures, two have none; one row is another experiment's and one has an unknown arm.
  for (const [unit_id, arm, experiment] of [['u10', 'control', 'basket-shapes'], ['u11', 'shortcut', 'basket-shapes'], ['u11', 'shortcut', 'basket-shapes'], ['untimed-1', 'control', 'basket-shapes'], ['untimed-2', 'Shortcut', 'basket-shapes'], ['untimed-3', 'control', 'another-test']] as const) {
    exposures.push({ unit_id, arm, exposed_at: null, experiment, platform: 'web' });
  }
  // After the data's end, and for a unit never exposed.
  events.push({ unit_id: 'u1', event: 'order_placed', occurred_at: '2026-12-30T00:00:00Z', value: 5 });
  events.push({ unit_id: 'nobody', event: 'order_placed', occurred_at: '2026-11-10T00:00:00Z', value: 5 });
  return { exposures, events };
}
