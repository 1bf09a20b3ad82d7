import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runDuckDbQuery } from '../../src/adapters/sql/duckdb.js';
import { runPostgresQuery } from '../../src/adapters/sql/postgres.js';
import { loadPlan } from '../../src/core/plan/load.js';
import type { Plan } from '../../src/core/plan/schema.js';
import { buildTotalsQuery, type QuerySource, type TotalsQueryInput } from '../../src/core/totals-query/build-query.js';
import { rowsFromResult, type ResultRow } from '../../src/core/totals-query/rows-csv.js';
import { rowsToTotals } from '../../src/core/totals-query/rows-to-totals.js';
import { generateData, GUARDRAIL_EVENT_FIX, isoWithOffset, loadIntoPostgres, OVERDUE_PLAN, PRE_PERIOD_DAYS, writeCsv, writeParquet } from '../helpers/generated-data.js';
import { postgresForThisFile, type TestPostgres } from '../helpers/postgres.js';
import { referenceRows, type EventRow, type ExposureRow } from '../helpers/reference-totals.js';
import { urlOf, writeDataFiles } from './engine-data.js';
import { SHAPES_PLAN, shapesPlan, smallData } from './fixtures.js';

/**
 * The same rows in DuckDB files (CSV and Parquet) and in a real PostgreSQL server give identical totals,
 * equal to the plain TypeScript reference (test/helpers/reference-totals.ts). The engines are the outside
 * check: each runs the query the way a user's would. Two data sets: the generated one of the demo's overdue
 * test (test/helpers/generated-data.ts, with the dirt of real logging tables) and a small one with a metric
 * of every shape (test/sql/fixtures.ts).
 */

const folder = mkdtempSync(join(tmpdir(), 'plumbline-engines-'));
const pg = await postgresForThisFile('engines');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const COLUMNS = {
  exposures: { unitId: 'unit_id', arm: 'arm', exposedAt: 'exposed_at', experiment: 'experiment' },
  events: { unitId: 'unit_id', event: 'event', occurredAt: 'occurred_at', value: 'value' },
};

/** Rows keyed by grain, arm, bucket and metric, with decimals written without trailing zeros. */
function normalized(rows: readonly ResultRow[]): Record<string, (string | null)[]> {
  const decimal = (v: string | null) => (v === null ? null : v.includes('.') ? v.replace(/0+$/, '').replace(/\.$/, '') : v);
  return Object.fromEntries(
    rows.map((r) => [
      [r.grain.value, r.arm.value, r.bucket.value, r.metric.value].join(' | '),
      (['units', 'n', 'sum_y', 'sum_y2', 'sum_x', 'sum_x2', 'sum_xy', 'sum_pre', 'sum_pre2', 'sum_ypre'] as const).map((c) => decimal(r[c].value)),
    ]),
  );
}

interface Case {
  plan: Plan;
  dataThrough: string;
  prePeriodDays: number;
  segments: string[];
}

function sqlOf(c: Case, dialect: 'duckdb' | 'postgres', exposures: QuerySource, events: QuerySource): string {
  const input: TotalsQueryInput = { plan: c.plan, dialect, dataThrough: c.dataThrough, exposures: { source: exposures, columns: COLUMNS.exposures, segments: c.segments }, events: { source: events, columns: COLUMNS.events }, prePeriodDays: c.prePeriodDays };
  const built = buildTotalsQuery(input);
  if (!built.ok) throw new Error(JSON.stringify(built.problems));
  return built.sql;
}

function totalsOf(c: Case, rows: readonly ResultRow[]) {
  const built = rowsToTotals({ plan: c.plan, planCommit: 'abc1234', dataThrough: c.dataThrough, rows, file: 'rows' });
  if (!built.ok) throw new Error(JSON.stringify(built.problems));
  return built.totals;
}

function parsed(result: { columns: string[]; rows: (string | null)[][] }): ResultRow[] {
  const rows = rowsFromResult(result, 'result');
  if (!rows.ok) throw new Error(JSON.stringify(rows.problems));
  return rows.rows;
}

function engineChecks(name: string, c: Case, reference: () => ResultRow[], files: () => Promise<{ csv: { exposures: string; events: string }; parquet: { exposures: string; events: string } }>, loadPg: (p: TestPostgres, schema: string) => Promise<void>) {
  describe(name, () => {
    let written: Awaited<ReturnType<typeof files>>;
    it.each(['csv', 'parquet'] as const)('DuckDB over %s files: the rows equal the TypeScript reference, and so do the totals', async (format) => {
      written ??= await files();
      const f = written[format];
      const result = await runDuckDbQuery(sqlOf(c, 'duckdb', { files: [f.exposures], format }, { files: [f.events], format }), { memoryLimit: '512MB', threads: 1 });
      const rows = parsed(result);
      expect(normalized(rows)).toEqual(normalized(reference()));
      expect(totalsOf(c, rows)).toEqual(totalsOf(c, reference()));
    });

    it.skipIf(!pg)('PostgreSQL: the same rows and totals (and so the same as DuckDB)', { timeout: 120_000 }, async () => {
      const schema = `${pg!.schema}_${name.replace(/\W+/g, '_').toLowerCase()}`.slice(0, 60);
      await pg!.client.query(`CREATE SCHEMA "${schema}"`);
      try {
        await loadPg(pg!, schema);
        const result = await runPostgresQuery(sqlOf(c, 'postgres', { table: `${schema}.exposures` }, { table: `${schema}.events` }), { url: urlOf(pg!) });
        const rows = parsed(result);
        expect(normalized(rows)).toEqual(normalized(reference()));
        expect(totalsOf(c, rows)).toEqual(totalsOf(c, reference()));
      } finally {
        await pg!.client.query(`DROP SCHEMA "${schema}" CASCADE`);
      }
    });
  });
}

// The demo's overdue test on the generated data, with a capped mean of order value and variance reduction added.
const demoText = readFileSync(join(__dirname, '../../demo/repo', OVERDUE_PLAN.file), 'utf8')
  .replace(GUARDRAIL_EVENT_FIX.from, GUARDRAIL_EVENT_FIX.to)
  .replace('  daily-units: 14000', '  daily-units: 14000\n  pre-period-correlation: 0.4')
  .replace('\ndesign:', '  secondary:\n    - { name: order-value, kind: mean, baseline: { mean: 40, sd: 30 }, events: [order_placed], capped-at: 99 }\n\ndesign:');
const demoLoaded = loadPlan(demoText, OVERDUE_PLAN.file);
if (!demoLoaded.ok) throw new Error(JSON.stringify(demoLoaded.errors));
const demoCase: Case = { plan: demoLoaded.loaded.plan, dataThrough: OVERDUE_PLAN.dataThrough, prePeriodDays: PRE_PERIOD_DAYS, segments: ['platform'] };
const generated = generateData({ seed: 11, units: 6000 });
const asRows = {
  exposures: generated.exposures.map((x): ExposureRow => ({ unit_id: x.unitId, arm: x.arm, exposed_at: isoWithOffset(x.exposedAt), experiment: x.experiment, platform: x.platform })),
  events: generated.events.map((e): EventRow => ({ unit_id: e.unitId, event: e.event, occurred_at: isoWithOffset(e.occurredAt), value: e.value })),
};
let demoReference: ResultRow[] | undefined;
const demoRef = () => (demoReference ??= referenceRows(asRows, { plan: demoCase.plan, dataThrough: demoCase.dataThrough, segments: ['platform'], experimentColumn: true, prePeriodDays: PRE_PERIOD_DAYS }));

describe('the generated data reaches the reference with its dirt', () => {
  it('counts the units in two arms and in unknown arms the generator planted', () => {
    const excluded = Object.fromEntries(demoRef().filter((r) => r.grain.value === 'excluded').map((r) => [r.bucket.value, Number(r.units.value)]));
    expect(excluded['several-arms']).toBe(generated.dirt.severalArmUnits);
    expect(excluded['unknown-arm']).toBeGreaterThanOrEqual(generated.dirt.unknownArmUnits);
    expect(demoRef().some((r) => r.sum_pre.value !== null && Number(r.sum_pre.value) > 0)).toBe(true);
  });
});

engineChecks(
  'the demo’s overdue test on the generated data',
  demoCase,
  demoRef,
  async () => ({ csv: writeCsv(generated, join(folder, 'demo-csv')), parquet: await writeParquet(generated, join(folder, 'demo-parquet')) }),
  (p, schema) => loadIntoPostgres(p.client, schema, generated),
);

// Every metric shape on the small data set.
const shapesCase: Case = { plan: shapesPlan(), dataThrough: '2026-11-19', prePeriodDays: 7, segments: ['platform'] };
const small = smallData();
const shapesReference = referenceRows(small, { plan: shapesCase.plan, dataThrough: shapesCase.dataThrough, segments: ['platform'], experimentColumn: true, prePeriodDays: 7 });

describe('the small data set reaches the reference with its dirt', () => {
  it('has units in two arms, unknown arms, exposures with no time and a cap that bites', () => {
    const excluded = Object.fromEntries(shapesReference.filter((r) => r.grain.value === 'excluded').map((r) => [r.bucket.value, Number(r.units.value)]));
    expect(excluded['several-arms']).toBeGreaterThan(0);
    expect(excluded['unknown-arm']).toBeGreaterThan(0);
    // Planted in smallData(): 5 rows of 4 units with no exposure time (another test's untimed row not among them).
    const untimed = shapesReference.find((r) => r.grain.value === 'excluded' && r.bucket.value === 'no-exposure-time')!;
    expect([untimed.units.value, untimed.n.value]).toEqual(['4', '5']);
    expect(shapesReference.filter((r) => r.grain.value === 'arm' && r.metric.value !== null)).toHaveLength(2 * 5);
    const uncapped = referenceRows(small, { plan: shapesPlan(SHAPES_PLAN.replace(', capped-at: 90', '')), dataThrough: shapesCase.dataThrough, experimentColumn: true, prePeriodDays: 7 });
    const spend = (rows: ResultRow[]) => Number(rows.find((r) => r.grain.value === 'arm' && r.arm.value === 'control' && r.metric.value === 'spend')!.sum_y.value);
    expect(spend(uncapped)).toBeGreaterThan(spend(shapesReference));
  });
});

engineChecks(
  'every metric shape on the small data set',
  shapesCase,
  () => shapesReference,
  async () => {
    const f = await writeDataFiles(small, ['unit_id', 'arm', 'exposed_at', 'experiment', 'platform']);
    return { csv: { exposures: f.exposuresCsv, events: f.eventsCsv }, parquet: { exposures: f.exposuresParquet, events: f.eventsParquet } };
  },
  async (p, schema) => {
    const q = (sql: string, values?: unknown[]) => p.client.query(sql, values);
    await q(`CREATE TABLE "${schema}".exposures (unit_id text, arm text, exposed_at timestamptz, experiment text, platform text)`);
    await q(`CREATE TABLE "${schema}".events (unit_id text, event text, occurred_at timestamptz, value double precision)`);
    for (const x of small.exposures) await q(`INSERT INTO "${schema}".exposures VALUES ($1, $2, $3, $4, $5)`, [x.unit_id, x.arm, x.exposed_at, x.experiment, x.platform]);
    for (const e of small.events) await q(`INSERT INTO "${schema}".events VALUES ($1, $2, $3, $4)`, [e.unit_id, e.event, e.occurred_at, e.value]);
  },
);
