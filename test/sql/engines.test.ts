import { rmSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runDuckDbQuery } from '../../src/adapters/sql/duckdb.js';
import { runPostgresQuery } from '../../src/adapters/sql/postgres.js';
import { buildTotalsQuery, type QuerySource, type TotalsQueryInput } from '../../src/core/totals-query/build-query.js';
import { rowsFromResult, type ResultRow } from '../../src/core/totals-query/rows-csv.js';
import { rowsToTotals } from '../../src/core/totals-query/rows-to-totals.js';
import { referenceRows } from '../helpers/reference-totals.js';
import { writeDataFiles, type DataFiles } from './engine-data.js';
import { SHAPES_PLAN, shapesPlan, smallData } from './fixtures.js';
import { connectTestPostgres, type TestPostgres } from './pg-local.js';

/**
 * The same rows in DuckDB files (CSV and Parquet) and in a real PostgreSQL server give identical totals,
 * equal to the plain TypeScript reference (test/helpers/reference-totals.ts). The engines are the outside
 * check: each runs the query the way a user's would.
 */

const plan = shapesPlan();
const data = smallData();
const DATA_THROUGH = '2026-11-19';
const columns = {
  exposures: { unitId: 'unit_id', arm: 'arm', exposedAt: 'exposed_at', experiment: 'experiment' },
  events: { unitId: 'unit_id', event: 'event', occurredAt: 'occurred_at', value: 'value' },
};
const input = (dialect: 'duckdb' | 'postgres', exposures: QuerySource, events: QuerySource): TotalsQueryInput => ({
  plan,
  dialect,
  dataThrough: DATA_THROUGH,
  exposures: { source: exposures, columns: columns.exposures, segments: ['platform'] },
  events: { source: events, columns: columns.events },
  prePeriodDays: 7,
});

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

function totalsOf(rows: readonly ResultRow[]) {
  const built = rowsToTotals({ plan, planCommit: 'abc1234', dataThrough: DATA_THROUGH, rows, file: 'rows' });
  if (!built.ok) throw new Error(JSON.stringify(built.problems));
  return built.totals;
}

function sqlOf(i: TotalsQueryInput): string {
  const built = buildTotalsQuery(i);
  if (!built.ok) throw new Error(JSON.stringify(built.problems));
  return built.sql;
}

const reference = referenceRows(data, { plan, dataThrough: DATA_THROUGH, segments: ['platform'], experimentColumn: true, prePeriodDays: 7 });

let files: DataFiles;
beforeAll(async () => {
  files = await writeDataFiles(data, ['unit_id', 'arm', 'exposed_at', 'experiment', 'platform']);
});
afterAll(() => rmSync(files.folder, { recursive: true, force: true }));

describe('the reference itself', () => {
  it('sees the dirt the data was made with: units in two arms, unknown arms, a capped mean', () => {
    const excluded = Object.fromEntries(reference.filter((r) => r.grain.value === 'excluded').map((r) => [r.bucket.value, Number(r.units.value)]));
    expect(excluded['several-arms']).toBeGreaterThan(0);
    expect(excluded['unknown-arm']).toBeGreaterThan(0);
    expect(reference.filter((r) => r.grain.value === 'arm' && r.metric.value !== null)).toHaveLength(2 * 5);
    // Without the cap the spend sums are larger: the cap bites.
    const uncapped = referenceRows(data, { plan: shapesPlan(SHAPES_PLAN.replace(', capped-at: 90', '')), dataThrough: DATA_THROUGH, experimentColumn: true, prePeriodDays: 7 });
    const spend = (rows: typeof reference) => Number(rows.find((r) => r.grain.value === 'arm' && r.arm.value === 'control' && r.metric.value === 'spend')!.sum_y.value);
    expect(spend(uncapped)).toBeGreaterThan(spend(reference));
  });
});

describe('DuckDB over files', () => {
  it.each([
    ['CSV', () => ({ files: [files.exposuresCsv], format: 'csv' as const }), () => ({ files: [files.eventsCsv], format: 'csv' as const })],
    ['Parquet', () => ({ files: [files.exposuresParquet], format: 'parquet' as const }), () => ({ files: [files.eventsParquet], format: 'parquet' as const })],
  ])('%s: the rows equal the TypeScript reference, and so do the totals', async (_name, exposures, events) => {
    const result = await runDuckDbQuery(sqlOf(input('duckdb', exposures(), events())), { memoryLimit: '512MB', threads: 1 });
    const rows = rowsFromResult(result, 'duckdb');
    if (!rows.ok) throw new Error(JSON.stringify(rows.problems));
    expect(normalized(rows.rows)).toEqual(normalized(reference));
    expect(totalsOf(rows.rows)).toEqual(totalsOf(reference));
  });
});

describe('PostgreSQL', () => {
  let pg: TestPostgres | undefined;
  beforeAll(async () => {
    pg = await connectTestPostgres('engines');
    if (pg) await pg.load(data, ['platform']);
  });
  afterAll(async () => pg?.close());

  it('gives the same rows and totals as the reference (and so as DuckDB)', async (ctx) => {
    if (!pg) return ctx.skip();
    const sql = sqlOf(input('postgres', { table: `${pg.schema}.exposures` }, { table: `${pg.schema}.events` }));
    const rows = rowsFromResult(await runPostgresQuery(sql, { url: pg.url }), 'postgres');
    if (!rows.ok) throw new Error(JSON.stringify(rows.problems));
    expect(normalized(rows.rows)).toEqual(normalized(reference));
    expect(totalsOf(rows.rows)).toEqual(totalsOf(reference));
  });
});
