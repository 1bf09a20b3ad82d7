import { addDays } from '../calendar.js';
import type { Plan } from '../plan/schema.js';
import { DIALECT, tableName, type Dialect, type DialectName } from './dialects.js';
import { metricSpecs, type EventValue, type MetricSpec, type SpecProblem } from './metric-spec.js';

/**
 * One query per plan: the arm totals of every metric, per arm, per arm and day of first exposure, per
 * arm and segment, and the units left out, as the long rows of ROW_COLUMNS. Text only: it never runs
 * the query. The semantics are in docs/totals-from-sql.md; in short:
 *
 * 1. exposures of this plan inside [window start, end of data-through) (UTC); rows without a unit id are
 *    dropped (they belong to no unit); rows without an exposure time are counted and dropped;
 * 2. rows whose arm is not the plan's are counted and dropped; a unit's first exposure fixes its time;
 *    a unit seen in two arms is counted and dropped;
 * 3. events of the metrics from first exposure to the end of data-through (and within the metric's
 *    window), plus the pre-period before first exposure for CUPED;
 * 4. per-unit values, then their sums, squares and cross-products per group.
 */

/** The result's columns, in order (the contract of `--from-rows`). */
export const ROW_COLUMNS = ['grain', 'arm', 'bucket', 'metric', 'units', 'n', 'sum_y', 'sum_y2', 'sum_x', 'sum_x2', 'sum_xy', 'sum_pre', 'sum_pre2', 'sum_ypre'] as const;
export type RowColumn = (typeof ROW_COLUMNS)[number];
export const GRAINS = ['arm', 'day', 'segment', 'excluded'] as const;
export const EXCLUDED_REASONS = ['several-arms', 'unknown-arm'] as const;
/**
 * Exposure rows of this plan with no exposure time: they belong to no day of the window, so they are left
 * out, and counted (units and rows) so a short count is never silent. Not part of the totals file's
 * `excluded` block (its keys are a published contract): the totals' notes and the command's report say it.
 */
export const NO_EXPOSURE_TIME = 'no-exposure-time';
/** The bucket of a unit whose segment column is NULL at its first exposure. */
export const MISSING_SEGMENT = '(missing)';

export type QuerySource = { table: string } | { files: string[]; format: 'parquet' | 'csv' };

export interface TotalsQueryInput {
  plan: Plan;
  dialect: DialectName;
  /** The last day (UTC, included) the data covers. */
  dataThrough: string;
  exposures: { source: QuerySource; columns: { unitId: string; arm: string; exposedAt: string; experiment?: string }; segments: string[] };
  events: { source: QuerySource; columns: { unitId: string; event: string; occurredAt: string; value: string } };
  prePeriodDays?: number;
  metricWindowDays?: number;
}

export type TotalsQueryResult = { ok: true; sql: string; metrics: MetricSpec[] } | { ok: false; problems: SpecProblem[] };

const indent = (text: string, by = '  ') => text.split('\n').map((l) => (l ? by + l : l)).join('\n');

/** The FROM item that reads a source: a quoted table, or DuckDB's reader over the files. */
export function from(d: Dialect, source: QuerySource, what: string): string {
  if ('table' in source) return tableName(d, source.table);
  if (d.name !== 'duckdb') throw new Error(`${what}: files are read by DuckDB only`);
  const list = `[${source.files.map((f) => d.string(f)).join(', ')}]`;
  return source.format === 'parquet' ? `read_parquet(${list}, union_by_name = true)` : `read_csv(${list}, header = true, union_by_name = true)`;
}

const list = (d: Dialect, items: readonly string[]) => items.map((i) => d.string(i)).join(', ');

export function buildTotalsQuery(input: TotalsQueryInput): TotalsQueryResult {
  const { plan } = input;
  const d = DIALECT[input.dialect];
  const start = plan.window.start;
  if (!start) return { ok: false, problems: [{ path: ['window', 'start'], message: 'the plan has no start date, so the query cannot tell which exposures belong to the test', expected: 'window.start, e.g. 2026-11-09' }] };
  if (input.dataThrough < start) return { ok: false, problems: [{ path: ['window', 'start'], message: `the data would run through ${input.dataThrough}, before the test starts on ${start}`, expected: `--through on or after ${start}` }] };
  const specs = metricSpecs(plan, {
    ...(input.prePeriodDays !== undefined ? { prePeriodDays: input.prePeriodDays } : {}),
    ...(input.metricWindowDays !== undefined ? { metricWindowDays: input.metricWindowDays } : {}),
  });
  if (!specs.ok) return specs;
  for (const [what, source] of [['exposures', input.exposures.source], ['events', input.events.source]] as const) {
    if (!('table' in source) && d.name !== 'duckdb') {
      return { ok: false, problems: [{ path: [], message: `the ${what} are files, which only DuckDB reads`, expected: `data.${what}.table for --dialect ${d.name}, or --engine duckdb` }] };
    }
  }
  const metrics = specs.specs;
  const arms = plan.design.arms.map((a) => a.name);
  const begin = d.midnightUtc(start);
  const end = d.midnightUtc(addDays(input.dataThrough, 1));
  const preHours = metrics.some((m) => m.pre) ? input.prePeriodDays! * 24 : 0;
  const x = input.exposures.columns;
  const e = input.events.columns;
  const segments = input.exposures.segments;
  const seg = (i: number) => `segment_${i + 1}`;
  const col = (name: string) => d.identifier(name);
  const exposedAt = d.instant(col(x.exposedAt));
  const occurredAt = d.instant(col(e.occurredAt));

  const ctes: [string, string][] = [];
  ctes.push([
    'exposure_rows',
    [
      `SELECT ${d.text(col(x.unitId))} AS unit_id, ${d.text(col(x.arm))} AS arm, ${exposedAt} AS exposed_at${segments.map((s, i) => `, ${d.text(col(s))} AS ${seg(i)}`).join('')}`,
      `FROM ${from(d, input.exposures.source, 'exposures')}`,
      `WHERE ${col(x.unitId)} IS NOT NULL`,
      // Rows without a time stay here only to be counted (the untimed row below); every other use skips them.
      `  AND (${exposedAt} IS NULL`,
      `    OR (${exposedAt} >= ${begin}`,
      `      AND ${exposedAt} < ${end}))`,
      ...(x.experiment ? [`  AND ${d.text(col(x.experiment))} = ${d.string(plan.id)}`] : []),
    ].join('\n'),
  ]);
  ctes.push(['known_rows', `SELECT *\nFROM exposure_rows\nWHERE exposed_at IS NOT NULL\n  AND arm IN (${list(d, arms)})`]);
  // MIN and MAX of the arm tell a unit seen in two arms without COUNT(DISTINCT) (not a window function everywhere).
  ctes.push(['first_exposures', 'SELECT unit_id, MIN(exposed_at) AS first_exposed, MIN(arm) AS arm, MAX(arm) AS last_arm\nFROM known_rows\nGROUP BY unit_id']);
  if (segments.length) {
    // The segment at the first exposure; ties at the same instant take the smallest value, so every engine agrees.
    ctes.push([
      'first_segments',
      [
        `SELECT k.unit_id${segments.map((_, i) => `, MIN(k.${seg(i)}) AS ${seg(i)}`).join('')}`,
        'FROM known_rows k',
        'JOIN first_exposures f ON f.unit_id = k.unit_id AND f.first_exposed = k.exposed_at',
        'GROUP BY k.unit_id',
      ].join('\n'),
    ]);
  }
  ctes.push([
    'units',
    [
      `SELECT f.unit_id, f.arm, f.first_exposed, ${d.utcDay('f.first_exposed')} AS exposure_day${segments.map((_, i) => `, COALESCE(s.${seg(i)}, ${d.string(MISSING_SEGMENT)}) AS ${seg(i)}`).join('')}`,
      'FROM first_exposures f',
      ...(segments.length ? ['LEFT JOIN first_segments s ON s.unit_id = f.unit_id'] : []),
      'WHERE f.arm = f.last_arm',
    ].join('\n'),
  ]);

  const allEvents = [...new Set(metrics.flatMap((m) => [...m.y.events, ...(m.x?.events ?? []), ...(m.among ?? [])]))];
  ctes.push([
    'event_rows',
    [
      `SELECT ${d.text(col(e.unitId))} AS unit_id, ${d.text(col(e.event))} AS event, ${occurredAt} AS occurred_at, ${d.value(col(e.value))} AS value`,
      `FROM ${from(d, input.events.source, 'events')}`,
      `WHERE ${col(e.unitId)} IS NOT NULL`,
      `  AND ${d.text(col(e.event))} IN (${list(d, allEvents)})`,
      `  AND ${occurredAt} >= ${preHours ? d.addHours(begin, -preHours) : begin}`,
      `  AND ${occurredAt} < ${end}`,
    ].join('\n'),
  ]);

  // Per unit and metric: raw event aggregates over the counting period (and the pre-period).
  const after = (m: MetricSpec) => `e.occurred_at >= u.first_exposed${m.withinHours ? ` AND e.occurred_at < ${d.addHours('u.first_exposed', m.withinHours)}` : ''}`;
  const before = `e.occurred_at >= ${d.addHours('u.first_exposed', -preHours)} AND e.occurred_at < u.first_exposed`;
  const aggregate = (v: EventValue, when: string) =>
    v.rule === 'sum' ? `SUM(CASE WHEN e.event IN (${list(d, v.events)}) AND ${when} THEN COALESCE(e.value, 0) ELSE 0 END)` : `SUM(CASE WHEN e.event IN (${list(d, v.events)}) AND ${when} THEN 1 ELSE 0 END)`;
  const raw: string[] = [];
  metrics.forEach((m, i) => {
    raw.push(`${aggregate(m.y, after(m))} AS m${i}_y`);
    if (m.x) raw.push(`${aggregate(m.x, after(m))} AS m${i}_x`);
    if (m.among) raw.push(`${aggregate({ events: m.among, rule: 'count' }, after(m))} AS m${i}_in`);
    if (m.pre) raw.push(`${aggregate(m.y, before)} AS m${i}_pre`);
  });
  ctes.push(['unit_events', ['SELECT u.unit_id,', indent(raw.join(',\n')), 'FROM units u', 'JOIN event_rows e ON e.unit_id = u.unit_id', 'GROUP BY u.unit_id'].join('\n')]);

  const valueOf = (v: EventValue, column: string) => {
    const zeroed = `COALESCE(ue.${column}, 0)`;
    if (v.rule === 'any') return `CASE WHEN ${zeroed} > 0 THEN 1 ELSE 0 END`;
    if (v.rule === 'none') return `CASE WHEN ${zeroed} = 0 THEN 1 ELSE 0 END`;
    return zeroed;
  };
  const perUnit: string[] = [];
  metrics.forEach((m, i) => {
    const inN = m.among ? `CASE WHEN COALESCE(ue.m${i}_in, 0) > 0 THEN 1 ELSE 0 END` : '1';
    const onlyIn = (expr: string) => (m.among ? `CASE WHEN COALESCE(ue.m${i}_in, 0) > 0 THEN ${expr} ELSE 0 END` : expr);
    perUnit.push(`${inN} AS m${i}_n`);
    perUnit.push(`${onlyIn(valueOf(m.y, `m${i}_y`))} AS m${i}_y`);
    if (m.x) perUnit.push(`${valueOf(m.x, `m${i}_x`)} AS m${i}_x`);
    if (m.pre) perUnit.push(`${onlyIn(valueOf(m.y, `m${i}_pre`))} AS m${i}_pre`);
  });
  const capped = metrics.map((m, i) => (m.cap ? i : -1)).filter((i) => i >= 0);
  ctes.push([
    capped.length ? 'uncapped_values' : 'unit_values',
    [`SELECT u.unit_id, u.arm, u.exposure_day${segments.map((_, i) => `, u.${seg(i)}`).join('')},`, indent(perUnit.join(',\n')), 'FROM units u', 'LEFT JOIN unit_events ue ON ue.unit_id = u.unit_id'].join('\n'),
  ]);
  if (capped.length) {
    // The cap is the percentile by nearest rank over the units of every arm: the value at rank ⌈p·N⌉,
    // found with whole numbers only (rank × den ≥ num × N), so every engine picks the same unit.
    for (const i of capped) {
      const { numerator, denominator } = metrics[i]!.cap!;
      ctes.push([
        `cap_${i}`,
        [
          `SELECT MIN(value) AS cap`,
          'FROM (',
          indent(`SELECT m${i}_y AS value, ROW_NUMBER() OVER (ORDER BY m${i}_y) AS unit_rank, COUNT(*) OVER () AS unit_count\nFROM uncapped_values`),
          ') ranked',
          `WHERE unit_rank * ${denominator} >= unit_count * ${numerator}`,
        ].join('\n'),
      ]);
    }
    const columns = metrics.flatMap((m, i) => {
      const own = [`v.m${i}_n`, m.cap ? `CASE WHEN v.m${i}_y > c${i}.cap THEN c${i}.cap ELSE v.m${i}_y END AS m${i}_y` : `v.m${i}_y`];
      if (m.x) own.push(`v.m${i}_x`);
      if (m.pre) own.push(`v.m${i}_pre`);
      return own;
    });
    ctes.push([
      'unit_values',
      [`SELECT v.unit_id, v.arm, v.exposure_day${segments.map((_, i) => `, v.${seg(i)}`).join('')},`, indent(columns.join(',\n')), 'FROM uncapped_values v', ...capped.map((i) => `CROSS JOIN cap_${i} c${i}`)].join('\n'),
    ]);
  }

  // Sums per group, one wide row per group; then the long rows.
  const sums: string[] = ['COUNT(*) AS units'];
  metrics.forEach((m, i) => {
    sums.push(`SUM(m${i}_n) AS m${i}_n`, `SUM(m${i}_y) AS m${i}_sy`, `SUM(m${i}_y * m${i}_y) AS m${i}_sy2`);
    if (m.x) sums.push(`SUM(m${i}_x) AS m${i}_sx`, `SUM(m${i}_x * m${i}_x) AS m${i}_sx2`, `SUM(m${i}_y * m${i}_x) AS m${i}_sxy`);
    if (m.pre) sums.push(`SUM(m${i}_pre) AS m${i}_sp`, `SUM(m${i}_pre * m${i}_pre) AS m${i}_sp2`, `SUM(m${i}_y * m${i}_pre) AS m${i}_syp`);
  });
  const groups: { name: string; grain: string; bucket: string; by: string }[] = [
    { name: 'by_arm', grain: 'arm', bucket: 'NULL', by: 'arm' },
    { name: 'by_day', grain: 'day', bucket: 'exposure_day', by: 'arm, exposure_day' },
    ...segments.map((s, i) => ({ name: `by_${seg(i)}`, grain: 'segment', bucket: `CONCAT(${d.string(`${s}: `)}, ${seg(i)})`, by: `arm, ${seg(i)}` })),
  ];
  for (const g of groups) {
    ctes.push([g.name, [`SELECT arm, ${g.bucket === 'NULL' ? `${d.text('NULL')}` : g.bucket} AS bucket,`, indent(sums.join(',\n')), 'FROM unit_values', `GROUP BY ${g.by}`].join('\n')]);
  }

  const nullText = d.text('NULL');
  const nullInt = d.integer('NULL');
  const nullSum = d.wide('NULL');
  const row = (grain: string, arm: string, bucket: string, metric: string, units: string, n: string, s: Partial<Record<RowColumn, string>>) =>
    `SELECT ${d.text(d.string(grain))} AS grain, ${arm} AS arm, ${bucket} AS bucket, ${metric} AS metric, ${units} AS units, ${n} AS n, ${(['sum_y', 'sum_y2', 'sum_x', 'sum_x2', 'sum_xy', 'sum_pre', 'sum_pre2', 'sum_ypre'] as const)
      .map((c) => `${s[c] ? d.wide(s[c]) : nullSum} AS ${c}`)
      .join(', ')}`;
  const selects: string[] = [];
  for (const g of groups) {
    selects.push(`${row(g.grain, 'arm', 'bucket', nullText, d.integer('units'), nullInt, {})}\nFROM ${g.name}`);
    metrics.forEach((m, i) => {
      selects.push(
        `${row(g.grain, 'arm', 'bucket', d.text(d.string(m.name)), d.integer('units'), d.integer(`m${i}_n`), {
          sum_y: `m${i}_sy`,
          sum_y2: `m${i}_sy2`,
          ...(m.x ? { sum_x: `m${i}_sx`, sum_x2: `m${i}_sx2`, sum_xy: `m${i}_sxy` } : {}),
          ...(m.pre ? { sum_pre: `m${i}_sp`, sum_pre2: `m${i}_sp2`, sum_ypre: `m${i}_syp` } : {}),
        })}\nFROM ${g.name}`,
      );
    });
  }
  selects.push(`${row('excluded', nullText, d.text(d.string('several-arms')), nullText, d.integer('COUNT(*)'), nullInt, {})}\nFROM first_exposures\nWHERE arm <> last_arm`);
  // Rows of this plan whose arm is not one of its arms: units among them, and the rows themselves as n.
  selects.push(`${row('excluded', nullText, d.text(d.string('unknown-arm')), nullText, d.integer('COUNT(DISTINCT unit_id)'), d.integer('COUNT(*)'), {})}\nFROM exposure_rows\nWHERE exposed_at IS NOT NULL\n  AND (arm IS NULL OR arm NOT IN (${list(d, arms)}))`);
  // Rows of this plan without an exposure time, whatever their arm: units among them, and the rows as n.
  selects.push(`${row('excluded', nullText, d.text(d.string(NO_EXPOSURE_TIME)), nullText, d.integer('COUNT(DISTINCT unit_id)'), d.integer('COUNT(*)'), {})}\nFROM exposure_rows\nWHERE exposed_at IS NULL`);

  const header = [
    `-- Plumbline arm totals for plan ${oneLine(plan.id)}, data through ${input.dataThrough} (UTC), dialect ${d.name}.`,
    `-- Columns: ${ROW_COLUMNS.join(', ')}. Save the result as CSV with a header and run: plumbline totals ${oneLine(plan.id)} --from-rows <file.csv> --through ${input.dataThrough}`,
  ];
  const sql = `${header.join('\n')}\nWITH\n${ctes.map(([name, body]) => `${name} AS (\n${indent(body)}\n)`).join(',\n')}\n${selects.join('\nUNION ALL\n')}\n`;
  return { ok: true, sql, metrics };
}

/** Comment text: a plan id is kebab-case, but a comment must never be ended by what it quotes. */
function oneLine(text: string): string {
  return text.replace(/[^a-z0-9-]/g, '?');
}
