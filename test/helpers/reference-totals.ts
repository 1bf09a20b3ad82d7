import { addDays } from '../../src/core/calendar.js';
import type { Plan } from '../../src/core/plan/schema.js';
import { MISSING_SEGMENT, ROW_COLUMNS, type RowColumn } from '../../src/core/totals-query/build-query.js';
import { metricSpecs, type EventValue, type MetricSpec } from '../../src/core/totals-query/metric-spec.js';
import type { ResultRow } from '../../src/core/totals-query/rows-csv.js';

/**
 * The totals query's rows computed in plain TypeScript from the raw rows, by the rules of the contract
 * (docs/totals-from-sql.md), with none of the SQL: the reference both engines must equal. Values are
 * kept exact as whole numbers of millionths (BigInt), the scale the query sums in.
 */

export interface ExposureRow {
  unit_id: string | null;
  arm: string | null;
  /** ISO-8601 with an offset, or a Date; null when the row has no time (counted, never in a total). */
  exposed_at: string | Date | null;
  experiment?: string | null;
  [segment: string]: string | Date | null | undefined;
}
export interface EventRow {
  unit_id: string | null;
  event: string;
  occurred_at: string | Date;
  value: number | null;
}

export interface ReferenceOptions {
  plan: Plan;
  dataThrough: string;
  segments?: string[];
  /** Filter on the experiment column (as when data.exposures.experiment is set). */
  experimentColumn?: boolean;
  prePeriodDays?: number;
  metricWindowDays?: number;
}

const SCALE = 1_000_000n;
const ms = (t: string | Date) => (t instanceof Date ? t.getTime() : Date.parse(t));
const HOUR = 3_600_000;

/** A double rounded to 6 decimals, half away from zero, as millionths (what CAST(... AS DECIMAL(38, 6)) gives). */
function millionths(value: number): bigint {
  const [int, frac = ''] = Math.abs(value).toFixed(7).split('.');
  let scaled = BigInt(int!) * SCALE + BigInt(frac.slice(0, 6).padEnd(6, '0'));
  if (Number(frac[6] ?? '0') >= 5) scaled += 1n;
  return value < 0 ? -scaled : scaled;
}

/** A scaled whole number as decimal text (scale 6 or 12). */
function decimalText(value: bigint, scale: number): string {
  const negative = value < 0n;
  const digits = (negative ? -value : value).toString().padStart(scale + 1, '0');
  const text = `${digits.slice(0, -scale)}.${digits.slice(-scale)}`.replace(/\.?0+$/, '');
  return `${negative ? '-' : ''}${text}`;
}

interface Unit {
  id: string;
  arm: string;
  first: number;
  day: string;
  segments: string[];
}

export function referenceRows(raw: { exposures: readonly ExposureRow[]; events: readonly EventRow[] }, options: ReferenceOptions): ResultRow[] {
  const { plan } = options;
  const specsResult = metricSpecs(plan, { ...(options.prePeriodDays ? { prePeriodDays: options.prePeriodDays } : {}), ...(options.metricWindowDays ? { metricWindowDays: options.metricWindowDays } : {}) });
  if (!specsResult.ok) throw new Error(JSON.stringify(specsResult.problems));
  const specs = specsResult.specs;
  const segments = options.segments ?? [];
  const arms = plan.design.arms.map((a) => a.name);
  const begin = Date.parse(`${plan.window.start}T00:00:00Z`);
  const end = Date.parse(`${addDays(options.dataThrough, 1)}T00:00:00Z`);

  // Exposures of this plan in the window; unknown arms counted.
  const ofPlan = raw.exposures.filter((x) => x.unit_id !== null && (!options.experimentColumn || x.experiment === plan.id));
  const untimed = ofPlan.filter((x) => x.exposed_at === null);
  type Timed = ExposureRow & { exposed_at: string | Date };
  const inWindow = ofPlan.filter((x): x is Timed => x.exposed_at !== null && ms(x.exposed_at) >= begin && ms(x.exposed_at) < end);
  const unknown = inWindow.filter((x) => x.arm === null || !arms.includes(x.arm));
  const known = inWindow.filter((x) => x.arm !== null && arms.includes(x.arm));
  const byUnit = new Map<string, Timed[]>();
  for (const x of known) byUnit.set(x.unit_id!, [...(byUnit.get(x.unit_id!) ?? []), x]);
  let several = 0;
  const units: Unit[] = [];
  for (const [id, rows] of byUnit) {
    if (new Set(rows.map((r) => r.arm)).size > 1) {
      several++;
      continue;
    }
    const first = Math.min(...rows.map((r) => ms(r.exposed_at)));
    const atFirst = rows.filter((r) => ms(r.exposed_at) === first);
    const segmentValues = segments.map((s) => {
      const values = atFirst.map((r) => r[s]).filter((v): v is string => typeof v === 'string').sort();
      return values[0] ?? MISSING_SEGMENT;
    });
    units.push({ id, arm: rows[0]!.arm!, first, day: new Date(first).toISOString().slice(0, 10), segments: segmentValues });
  }

  const eventsOf = new Map<string, EventRow[]>();
  for (const e of raw.events) if (e.unit_id !== null) eventsOf.set(e.unit_id, [...(eventsOf.get(e.unit_id) ?? []), e]);
  const preHours = options.prePeriodDays ? options.prePeriodDays * 24 : 0;

  /** The per-unit value of one rule over events in [from, to), scaled by 10^6. */
  const valueOver = (events: EventRow[], v: EventValue, from: number, to: number): bigint => {
    const counting = events.filter((e) => v.events.includes(e.event) && ms(e.occurred_at) >= from && ms(e.occurred_at) < to && ms(e.occurred_at) < end);
    if (v.rule === 'sum') return counting.reduce((s, e) => s + (e.value === null ? 0n : millionths(e.value)), 0n);
    if (v.rule === 'count') return BigInt(counting.length) * SCALE;
    if (v.rule === 'any') return counting.length ? SCALE : 0n;
    return counting.length ? 0n : SCALE;
  };
  interface Values { n: bigint; y: bigint; x?: bigint; pre?: bigint }
  const values = new Map<string, Values[]>();
  for (const u of units) {
    const events = eventsOf.get(u.id) ?? [];
    values.set(
      u.id,
      specs.map((m: MetricSpec) => {
        const to = m.withinHours ? u.first + m.withinHours * HOUR : end;
        const inN = !m.among || valueOver(events, { events: m.among, rule: 'any' }, u.first, to) > 0n;
        const y = inN ? valueOver(events, m.y, u.first, to) : 0n;
        return {
          n: inN ? 1n : 0n,
          y,
          ...(m.x ? { x: valueOver(events, m.x, u.first, to) } : {}),
          ...(m.pre ? { pre: inN ? valueOver(events, m.y, u.first - preHours * HOUR, u.first) : 0n } : {}),
        };
      }),
    );
  }
  // Caps: the value at rank ⌈p·N⌉ of every unit's value, pooled over arms.
  specs.forEach((m, i) => {
    if (!m.cap) return;
    const sorted = units.map((u) => values.get(u.id)![i]!.y).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
    const rank = Math.ceil((sorted.length * m.cap.numerator) / m.cap.denominator);
    const cap = sorted[Math.max(0, rank - 1)];
    if (cap === undefined) return;
    for (const u of units) {
      const v = values.get(u.id)![i]!;
      if (v.y > cap) v.y = cap;
    }
  });

  const rows: Record<RowColumn, string | null>[] = [];
  const emit = (grain: string, arm: string, bucket: string | null, members: Unit[]) => {
    const base = { grain, arm, bucket, units: String(members.length) };
    rows.push({ ...base, metric: null, n: null, sum_y: null, sum_y2: null, sum_x: null, sum_x2: null, sum_xy: null, sum_pre: null, sum_pre2: null, sum_ypre: null });
    specs.forEach((m, i) => {
      const vs = members.map((u) => values.get(u.id)![i]!);
      const sum = (f: (v: Values) => bigint) => vs.reduce((s, v) => s + f(v), 0n);
      rows.push({
        ...base,
        metric: m.name,
        n: String(sum((v) => v.n)),
        sum_y: decimalText(sum((v) => v.y), 6),
        sum_y2: decimalText(sum((v) => v.y * v.y), 12),
        sum_x: m.x ? decimalText(sum((v) => v.x!), 6) : null,
        sum_x2: m.x ? decimalText(sum((v) => v.x! * v.x!), 12) : null,
        sum_xy: m.x ? decimalText(sum((v) => v.y * v.x!), 12) : null,
        sum_pre: m.pre ? decimalText(sum((v) => v.pre!), 6) : null,
        sum_pre2: m.pre ? decimalText(sum((v) => v.pre! * v.pre!), 12) : null,
        sum_ypre: m.pre ? decimalText(sum((v) => v.y * v.pre!), 12) : null,
      });
    });
  };
  const groupBy = (key: (u: Unit) => string) => {
    const map = new Map<string, Unit[]>();
    for (const u of units) map.set(key(u), [...(map.get(key(u)) ?? []), u]);
    return map;
  };
  for (const arm of arms) {
    const members = units.filter((u) => u.arm === arm);
    if (members.length) emit('arm', arm, null, members);
    for (const [day, dayUnits] of groupBy((u) => u.day)) {
      const inArm = dayUnits.filter((u) => u.arm === arm);
      if (inArm.length) emit('day', arm, day, inArm);
    }
    segments.forEach((s, i) => {
      for (const [value, segUnits] of groupBy((u) => u.segments[i]!)) {
        const inArm = segUnits.filter((u) => u.arm === arm);
        if (inArm.length) emit('segment', arm, `${s}: ${value}`, inArm);
      }
    });
  }
  const none = { arm: null, metric: null, sum_y: null, sum_y2: null, sum_x: null, sum_x2: null, sum_xy: null, sum_pre: null, sum_pre2: null, sum_ypre: null };
  rows.push({ grain: 'excluded', bucket: 'several-arms', units: String(several), n: null, ...none });
  rows.push({ grain: 'excluded', bucket: 'unknown-arm', units: String(new Set(unknown.map((x) => x.unit_id)).size), n: String(unknown.length), ...none });
  rows.push({ grain: 'excluded', bucket: 'no-exposure-time', units: String(new Set(untimed.map((x) => x.unit_id)).size), n: String(untimed.length), ...none });
  return rows.map((r, i) => ({ line: i + 2, ...Object.fromEntries(ROW_COLUMNS.map((c, j) => [c, { value: r[c], line: i + 2, column: j + 1 }])) }) as ResultRow);
}
