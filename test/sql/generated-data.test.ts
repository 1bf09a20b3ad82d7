// The generated raw data, checked through real engines: DuckDB reads the CSV text (with its offsets) and the Parquet
// files, PostgreSQL parses the same text into timestamptz; all three must hold the same instants, and the dirt and
// the planted effects must be there in the amounts the generator says.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  generateData,
  isoWithOffset,
  loadDuckDb,
  loadIntoPostgres,
  OVERDUE_PLAN,
  PLANTED_GUARDRAIL,
  PLANTED_PRIMARY,
  writeCsv,
  writeParquet,
} from '../helpers/generated-data.js';
import { postgresForThisFile } from '../helpers/postgres.js';

const data = generateData({ seed: 7, units: 12_000 });
const folder = mkdtempSync(join(tmpdir(), 'plumbline-generated-'));
const csv = writeCsv(data, join(folder, 'csv'));
const parquet = await writeParquet(data, join(folder, 'parquet'));
const { DuckDBInstance } = await loadDuckDb();
const duck = await (await DuckDBInstance.create(':memory:')).connect();
await duck.run("SET TimeZone = 'UTC'");
const pg = await postgresForThisFile('generated-data');
afterAll(() => {
  duck.closeSync();
  rmSync(folder, { recursive: true, force: true });
});

const lit = (text: string) => `'${text.replaceAll("'", "''")}'`;
async function duckRows(sql: string): Promise<Record<string, unknown>[]> {
  return (await duck.runAndReadAll(sql)).getRowObjectsJson() as Record<string, unknown>[];
}
async function duckValue(sql: string): Promise<number> {
  const [row] = await duckRows(sql);
  return Number(Object.values(row!)[0]);
}

const start = `TIMESTAMPTZ '${OVERDUE_PLAN.windowStart} 00:00:00+00'`;
const end = `(TIMESTAMPTZ '${OVERDUE_PLAN.dataThrough} 00:00:00+00' + INTERVAL 1 DAY)`;
const exposuresParquet = `read_parquet(${lit(parquet.exposures)})`;
const eventsParquet = `read_parquet(${lit(parquet.events)})`;

describe('generateData', () => {
  it('gives the same rows for the same seed and other rows for another', () => {
    const again = generateData({ seed: 7, units: 12_000 });
    expect(again.exposures).toEqual(data.exposures);
    expect(again.events).toEqual(data.events);
    expect(generateData({ seed: 8, units: 12_000 }).events).not.toEqual(data.events);
  });

  it('writes offsets as ISO-8601 text whose instant is the row’s (checked against Date.parse)', () => {
    for (const row of data.exposures.slice(0, 2000)) expect(Date.parse(isoWithOffset(row.exposedAt))).toBe(row.exposedAt.utcMs);
    expect(isoWithOffset({ utcMs: Date.parse('2026-11-10T04:30:00Z'), offsetMinutes: -300 })).toBe('2026-11-09T23:30:00-05:00');
    expect(isoWithOffset({ utcMs: Date.parse('2026-11-09T23:30:00Z'), offsetMinutes: 540 })).toBe('2026-11-10T08:30:00+09:00');
  });

  it('has every kind of dirt', () => {
    for (const [kind, count] of Object.entries(data.dirt)) expect(count, kind).toBeGreaterThan(0);
  });
});

describe('CSV and Parquet through DuckDB', () => {
  it('hold the same instants: the CSV text with its offsets parses to the Parquet TIMESTAMPTZ values', async () => {
    const csvExposures = `read_csv(${lit(csv.exposures)}, header = true, columns = {'unit_id': 'VARCHAR', 'arm': 'VARCHAR', 'exposed_at': 'TIMESTAMPTZ', 'experiment': 'VARCHAR', 'platform': 'VARCHAR'})`;
    const csvEvents = `read_csv(${lit(csv.events)}, header = true, columns = {'unit_id': 'VARCHAR', 'event': 'VARCHAR', 'occurred_at': 'TIMESTAMPTZ', 'value': 'DOUBLE'})`;
    expect(await duckValue(`SELECT count(*) FROM ${exposuresParquet}`)).toBe(data.exposures.length);
    expect(await duckValue(`SELECT count(*) FROM ${eventsParquet}`)).toBe(data.events.length);
    expect(await duckValue(`SELECT count(*) FROM (SELECT * FROM ${csvExposures} EXCEPT ALL SELECT * FROM ${exposuresParquet})`)).toBe(0);
    expect(await duckValue(`SELECT count(*) FROM (SELECT * FROM ${csvEvents} EXCEPT ALL SELECT * FROM ${eventsParquet})`)).toBe(0);
    const [types] = await duckRows(`SELECT typeof(exposed_at) AS t FROM ${exposuresParquet} LIMIT 1`);
    expect(types!.t).toBe('TIMESTAMP WITH TIME ZONE');
  });

  it('writes day-boundary exposures whose local day (in the CSV text) differs from the UTC day', async () => {
    const text = readFileSync(csv.exposures, 'utf8');
    // Near UTC midnight and near local midnight, in both zones.
    for (const pattern of [/T08:\d\d:00\+09:00/, /T00:\d\d:00\+09:00/, /T19:\d\d:00-05:00/, /T23:\d\d:00-05:00/]) expect(text).toMatch(pattern);
    const differing = await duckValue(
      `SELECT count(*) FROM read_csv(${lit(csv.exposures)}, header = true, all_varchar = true)
       WHERE substr(exposed_at, 1, 10) <> strftime(exposed_at::TIMESTAMPTZ, '%Y-%m-%d')`,
    );
    expect(differing).toBeGreaterThanOrEqual(data.dirt.dayBoundaryUnits);
  });

  it('has the dirt in the amounts generated, counted by SQL over the Parquet files', async () => {
    const plan = `experiment = ${lit(OVERDUE_PLAN.id)}`;
    const known = `arm IN (${OVERDUE_PLAN.arms.map((a) => lit(a.name)).join(', ')})`;
    const inWindow = `exposed_at >= ${start} AND exposed_at < ${end}`;
    expect(await duckValue(`SELECT count(*) FROM (SELECT unit_id FROM ${exposuresParquet} WHERE ${plan} AND ${known} AND ${inWindow} AND unit_id IS NOT NULL GROUP BY unit_id HAVING count(DISTINCT arm) > 1)`)).toBe(
      data.dirt.severalArmUnits,
    );
    expect(await duckValue(`SELECT count(*) FROM ${exposuresParquet} WHERE ${plan} AND NOT (${known})`)).toBe(data.dirt.unknownArmRows);
    expect(await duckValue(`SELECT count(DISTINCT unit_id) FROM ${exposuresParquet} WHERE ${plan} AND NOT (${known})`)).toBe(data.dirt.unknownArmUnits);
    expect(await duckValue(`SELECT count(*) FROM (SELECT unit_id FROM ${exposuresParquet} WHERE ${plan} AND unit_id IS NOT NULL GROUP BY unit_id HAVING bool_and(NOT (${inWindow})))`)).toBe(
      data.dirt.outsideWindowUnits,
    );
    expect(await duckValue(`SELECT count(*) FROM (SELECT unit_id, arm FROM ${exposuresParquet} WHERE ${plan} AND ${known} GROUP BY ALL HAVING count(*) > 1)`)).toBeGreaterThanOrEqual(
      data.dirt.duplicateExposureUnits,
    );
    expect(await duckValue(`SELECT count(*) FROM ${exposuresParquet} WHERE experiment <> ${lit(OVERDUE_PLAN.id)}`)).toBe(data.dirt.otherExperimentRows);
    expect(await duckValue(`SELECT count(*) FROM ${eventsParquet} WHERE event = ${lit(PLANTED_PRIMARY.event)} AND value IS NULL`)).toBe(data.dirt.nullValues);
    expect(await duckValue(`SELECT count(*) FROM ${eventsParquet} WHERE occurred_at >= ${end}`)).toBe(data.dirt.eventsAfterWindow);
    const nullUnits = (await duckValue(`SELECT count(*) FROM ${eventsParquet} WHERE unit_id IS NULL`)) + (await duckValue(`SELECT count(*) FROM ${exposuresParquet} WHERE unit_id IS NULL`));
    expect(nullUnits).toBe(data.dirt.nullUnitRows);
  });

  it('carries the planted effects: the primary’s rate per arm near its planted value, the guardrail flat', async () => {
    // Clean units only: first exposure in the window, a single known arm; a unit converts with an event after it.
    const rows = await duckRows(`
      WITH units AS (
        SELECT unit_id, min(arm) AS arm, min(exposed_at) AS first_at FROM ${exposuresParquet}
        WHERE experiment = ${lit(OVERDUE_PLAN.id)} AND arm IN ('control', 'treatment') AND exposed_at >= ${start} AND exposed_at < ${end} AND unit_id IS NOT NULL
        GROUP BY unit_id HAVING count(DISTINCT arm) = 1
      ), converted AS (
        SELECT u.unit_id, e.event FROM units u JOIN ${eventsParquet} e ON e.unit_id = u.unit_id AND e.occurred_at >= u.first_at AND e.occurred_at < ${end}
        GROUP BY ALL
      )
      SELECT u.arm, count(*) AS n,
        count(*) FILTER (WHERE EXISTS (SELECT 1 FROM converted c WHERE c.unit_id = u.unit_id AND c.event = ${lit(PLANTED_PRIMARY.event)})) AS primary_units,
        count(*) FILTER (WHERE EXISTS (SELECT 1 FROM converted c WHERE c.unit_id = u.unit_id AND c.event = ${lit(PLANTED_GUARDRAIL.event)})) AS guardrail_units
      FROM units u GROUP BY u.arm ORDER BY u.arm`);
    const byArm = Object.fromEntries(rows.map((r) => [r.arm as string, { n: Number(r.n), primary: Number(r.primary_units), guardrail: Number(r.guardrail_units) }]));
    const within = (successes: number, n: number, p: number) => Math.abs(successes / n - p) / Math.sqrt((p * (1 - p)) / n);
    // Four standard errors: a fixed seed, so this either always holds or never does (common practice, no source).
    expect(within(byArm.control!.primary, byArm.control!.n, PLANTED_PRIMARY.controlRate)).toBeLessThan(4);
    expect(within(byArm.treatment!.primary, byArm.treatment!.n, PLANTED_PRIMARY.treatmentRate)).toBeLessThan(4);
    expect(within(byArm.control!.guardrail, byArm.control!.n, PLANTED_GUARDRAIL.rate)).toBeLessThan(4);
    expect(within(byArm.treatment!.guardrail, byArm.treatment!.n, PLANTED_GUARDRAIL.rate)).toBeLessThan(4);
  });
});

describe.skipIf(!pg)('loaded into PostgreSQL', () => {
  it('holds the same rows as the Parquet files, timestamps parsed with their offsets', async () => {
    await loadIntoPostgres(pg!.client, pg!.schema, data);
    const summary = (table: string, at: string, extra: string) =>
      `SELECT count(*) AS rows, count(unit_id) AS units, sum(extract(epoch FROM ${at}))::bigint AS seconds, ${extra} FROM ${table}`;
    const [pgExposures] = (await pg!.client.query(summary('exposures', 'exposed_at', 'count(DISTINCT arm) AS arms'))).rows;
    const [duckExposures] = await duckRows(summary(exposuresParquet, 'exposed_at', 'count(DISTINCT arm) AS arms'));
    expect(Object.values(pgExposures!).map(Number)).toEqual(Object.values(duckExposures!).map(Number));
    const [pgEvents] = (await pg!.client.query(summary('events', 'occurred_at', 'sum(value) AS value, count(value) AS values'))).rows;
    const [duckEvents] = await duckRows(summary(eventsParquet, 'occurred_at', 'sum(value) AS value, count(value) AS values'));
    expect(Object.values(pgEvents!).map(Number)).toEqual(Object.values(duckEvents!).map(Number));
    const types = await pg!.client.query(
      `SELECT column_name, data_type FROM information_schema.columns WHERE table_schema = $1 AND column_name IN ('exposed_at', 'occurred_at')`,
      [pg!.schema],
    );
    expect(types.rows.map((r) => r.data_type)).toEqual(['timestamp with time zone', 'timestamp with time zone']);
  });

  it('leaves the other experiment out with the experiment column', async () => {
    await pg!.client.query(`CREATE SCHEMA "${pg!.schema}_plain"`);
    try {
      await loadIntoPostgres(pg!.client, `${pg!.schema}_plain`, data, { experimentColumn: false });
      const { rows } = await pg!.client.query(`SELECT count(*)::int AS n FROM "${pg!.schema}_plain".exposures`);
      expect(rows[0]!.n).toBe(data.exposures.length - data.dirt.otherExperimentRows);
    } finally {
      await pg!.client.query(`DROP SCHEMA "${pg!.schema}_plain" CASCADE`);
    }
  });
});
