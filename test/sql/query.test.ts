import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pkg from 'node-sql-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runPostgresQuery } from '../../src/adapters/sql/postgres.js';
import type { Plan } from '../../src/core/plan/schema.js';
import { buildTotalsQuery, ROW_COLUMNS, type TotalsQueryInput } from '../../src/core/totals-query/build-query.js';
import { DIALECT, DIALECTS, type DialectName } from '../../src/core/totals-query/dialects.js';
import { rowsFromResult } from '../../src/core/totals-query/rows-csv.js';
import { toCsv, urlOf } from './engine-data.js';
import { shapesPlan } from './fixtures.js';
import { postgresForThisFile } from '../helpers/postgres.js';

const { Parser } = pkg;
const pg = await postgresForThisFile('hostile');

/**
 * The query text per dialect: a reviewed golden file each, parsed by node-sql-parser with that dialect's
 * grammar (an outside parser: it knows nothing of how the text was built), and hostile names that reach
 * SQL only quoted. node-sql-parser 5.4.0 has no DuckDB grammar (DuckDB's query runs on DuckDB in
 * engines.test.ts) and reads Spark SQL with its Hive grammar, Spark SQL's ancestor.
 */
const PARSER_DATABASE: Partial<Record<DialectName, string>> = { postgres: 'postgresql', trino: 'trino', bigquery: 'bigquery', snowflake: 'snowflake', spark: 'hive' };

const tables = (dialect: DialectName): Pick<TotalsQueryInput, 'exposures' | 'events'> => ({
  exposures: {
    source: dialect === 'duckdb' ? { files: ['data/exposures-2026-11.parquet', 'data/exposures-2026-12.parquet'], format: 'parquet' } : { table: 'analytics.exposures' },
    columns: { unitId: 'user_id', arm: 'variant', exposedAt: 'exposed_at', experiment: 'experiment' },
    segments: ['platform', 'country'],
  },
  events: { source: dialect === 'duckdb' ? { files: ['data/events-*.parquet'], format: 'parquet' } : { table: 'analytics.events' }, columns: { unitId: 'user_id', event: 'event_name', occurredAt: 'occurred_at', value: 'amount' } },
});

function query(input: TotalsQueryInput): string {
  const built = buildTotalsQuery(input);
  if (!built.ok) throw new Error(JSON.stringify(built.problems));
  return built.sql;
}

describe('the query per dialect', () => {
  it.each(DIALECTS)('%s matches its reviewed golden file', async (dialect) => {
    const sql = query({ plan: shapesPlan(), dialect, dataThrough: '2026-11-19', prePeriodDays: 14, ...tables(dialect) });
    await expect(sql).toMatchFileSnapshot(`golden/${dialect}.sql`);
  });

  it.each(Object.entries(PARSER_DATABASE))('%s parses with node-sql-parser (database: %s) as one SELECT with the contract’s columns', (dialect, database) => {
    const sql = query({ plan: shapesPlan(), dialect: dialect as DialectName, dataThrough: '2026-11-19', prePeriodDays: 14, ...tables(dialect as DialectName) });
    const ast = new Parser().astify(sql, { database });
    const statement = Array.isArray(ast) ? ast : [ast];
    expect(statement).toHaveLength(1);
    expect(statement[0]!.type).toBe('select');
    const columns = (statement[0] as { columns: { as: string | null }[] }).columns.map((c) => c.as);
    expect(columns).toEqual([...ROW_COLUMNS]);
  });

  it('refuses files for a warehouse dialect and a plan without a start', () => {
    const base = { plan: shapesPlan(), dataThrough: '2026-11-19', ...tables('duckdb') };
    expect(buildTotalsQuery({ ...base, dialect: 'trino' })).toMatchObject({ ok: false, problems: [{ message: expect.stringContaining('only DuckDB') }] });
    const noStart = { ...shapesPlan(), window: {} } as Plan;
    expect(buildTotalsQuery({ ...base, plan: noStart, dialect: 'duckdb' })).toMatchObject({ ok: false, problems: [{ path: ['window', 'start'] }] });
  });

  it('asks which events make a ratio when there are three', () => {
    const plan = shapesPlan();
    const ratio = plan.metrics.secondary[2]!;
    const three = { ...plan, metrics: { ...plan.metrics, secondary: [{ ...ratio, events: ['a', 'b', 'c'], perUnit: {} }] } } as Plan;
    expect(buildTotalsQuery({ plan: three, dialect: 'postgres', dataThrough: '2026-11-19', ...tables('postgres') })).toMatchObject({
      ok: false,
      problems: [{ path: ['metrics', 'secondary', 0, 'events'], message: expect.stringContaining('numerator') }],
    });
  });
});

/** A plan whose names no plan file allows (the schema is not the only guard), and settings with hostile names. */
const EVIL = `x'); drop table y; --`;
const QUOTE = 'a"b';
function hostilePlan(): Plan {
  const plan = shapesPlan();
  const [a, b] = plan.design.arms;
  return {
    ...plan,
    id: EVIL,
    design: { ...plan.design, arms: [{ ...a!, name: QUOTE }, { ...b!, name: EVIL }], control: QUOTE },
    metrics: {
      primary: { ...plan.metrics.primary, name: EVIL, events: [EVIL] },
      guardrails: [{ ...plan.metrics.guardrails[0]!, name: QUOTE, events: [QUOTE, EVIL], perUnit: { counts: 'without-event', events: [EVIL], among: [QUOTE] } }],
      secondary: [],
    },
  } as Plan;
}
const hostileColumns = { unitId: EVIL, arm: QUOTE, exposedAt: `e'"\`t`, experiment: 'exp; --' };
const hostileEventColumns = { unitId: EVIL, event: QUOTE, occurredAt: 'o"t', value: "v'" };
const exposureRows = [
  { [EVIL]: 'u1', [QUOTE]: QUOTE, [`e'"\`t`]: '2026-11-10T10:00:00Z', 'exp; --': EVIL, [`seg'"`]: "a'b" },
  { [EVIL]: 'u2', [QUOTE]: EVIL, [`e'"\`t`]: '2026-11-10T11:00:00Z', 'exp; --': EVIL, [`seg'"`]: 'c' },
];
const eventRows = [
  { [EVIL]: 'u1', [QUOTE]: EVIL, 'o"t': '2026-11-11T10:00:00Z', "v'": '' },
  { [EVIL]: 'u2', [QUOTE]: QUOTE, 'o"t': '2026-11-11T10:00:00Z', "v'": '' },
];

function expectHostileResult(rows: (string | null)[][], columns: string[]) {
  const parsed = rowsFromResult({ columns, rows }, 'result');
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.problems));
  const byKey = new Map(parsed.rows.map((r) => [`${r.grain.value}|${r.arm.value}|${r.bucket.value}|${r.metric.value}`, r]));
  expect(byKey.get(`arm|${QUOTE}|null|${EVIL}`)?.sum_y.value).toMatch(/^1(\.0*)?$/);
  expect(byKey.get(`arm|${EVIL}|null|${EVIL}`)?.sum_y.value).toMatch(/^0(\.0*)?$/);
  expect(byKey.get(`segment|${QUOTE}|seg'": a'b|null`)?.units.value).toBe('1');
}

describe('hostile names run harmlessly', () => {
  let folder: string;
  beforeAll(() => {
    folder = mkdtempSync(join(tmpdir(), 'plumbline-evil-'));
  });
  afterAll(() => rmSync(folder, { recursive: true, force: true }));

  /**
   * Every plan name (plan id, arms, metrics, events: string literals) is hostile in every dialect. For
   * identifiers, node-sql-parser 5.4.0's PostgreSQL and Trino grammars do not read a doubled quote inside
   * "..." (both engines do: the PostgreSQL run below uses one), nor its BigQuery and Hive grammars an escaped
   * backtick inside `...`, so there the identifiers hold every other hostile character.
   */
  it.each(Object.entries(PARSER_DATABASE))('the %s query with hostile names parses as one SELECT (%s) and keeps the names whole', (dialect, database) => {
    const readable = (name: string) => (dialect === 'postgres' || dialect === 'trino' ? name.replace(/"/g, "'") : dialect === 'bigquery' || dialect === 'spark' ? name.replace(/`/g, "'") : name);
    const sql = query({
      plan: hostilePlan(),
      dialect: dialect as DialectName,
      dataThrough: '2026-11-19',
      exposures: {
        source: { table: `${EVIL}.${readable(QUOTE)}` },
        columns: Object.fromEntries(Object.entries(hostileColumns).map(([k, v]) => [k, readable(v)])) as typeof hostileColumns,
        segments: [readable(`seg'"`)],
      },
      events: { source: { table: EVIL }, columns: Object.fromEntries(Object.entries(hostileEventColumns).map(([k, v]) => [k, readable(v)])) as typeof hostileEventColumns },
    });
    const ast = new Parser().astify(sql, { database });
    const statements = Array.isArray(ast) ? ast : [ast];
    expect(statements).toHaveLength(1);
    expect(statements[0]!.type).toBe('select');
    // The metric names come back as string values of the parse: the literals ended where they should.
    const found = JSON.stringify(statements[0]);
    expect(found).not.toContain('"type":"drop"');
  });

  it('DuckDB reads files with hostile paths and columns, and table y survives', { timeout: 120_000 }, async () => {
    const dir = join(folder, EVIL);
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, 'exposures.csv'), toCsv(exposureRows, Object.keys(exposureRows[0]!)));
    writeFileSync(join(dir, 'events.csv'), toCsv(eventRows, Object.keys(eventRows[0]!)));
    const sql = query({
      plan: hostilePlan(),
      dialect: 'duckdb',
      dataThrough: '2026-11-19',
      exposures: { source: { files: [join(dir, 'exposures.csv')], format: 'csv' }, columns: hostileColumns, segments: [`seg'"`] },
      events: { source: { files: [join(dir, 'events.csv')], format: 'csv' }, columns: hostileEventColumns },
    });
    const { DuckDBInstance } = await import('@duckdb/node-api');
    const db = await DuckDBInstance.create(':memory:');
    const c = await db.connect();
    await c.run('SET threads = 1');
    await c.run('CREATE TABLE y (a INTEGER); INSERT INTO y VALUES (1)');
    const reader = await c.runAndReadAll(sql);
    expectHostileResult(reader.getRows().map((r) => r.map((v) => (v === null ? null : String(v)))), reader.columnNames());
    expect((await c.runAndReadAll('SELECT count(*) FROM y')).getRowsJS()).toEqual([[1n]]);
    c.closeSync();
    db.closeSync();
  });

  it.skipIf(!pg)('PostgreSQL reads tables with hostile names, and table y survives', async () => {
    const s = `"${pg!.schema}"`;
    const q = (name: string) => `"${name.replace(/"/g, '""')}"`;
    const run = async (sql: string) => (await pg!.client.query(sql)).rows;
    await run(`CREATE TABLE ${s}.y (a integer); INSERT INTO ${s}.y VALUES (1)`);
    await run(`CREATE TABLE ${s}.${q(QUOTE)} (${Object.keys(exposureRows[0]!).map((c) => `${q(c)} ${c === `e'"\`t` ? 'timestamptz' : 'text'}`).join(', ')})`);
    await run(`CREATE TABLE ${s}.${q(EVIL)} (${Object.keys(eventRows[0]!).map((c) => `${q(c)} ${c === 'o"t' ? 'timestamptz' : c === "v'" ? 'double precision' : 'text'}`).join(', ')})`);
    const lit = (v: string) => (v === '' ? 'NULL' : `'${v.replace(/'/g, "''")}'`);
    for (const r of exposureRows) await run(`INSERT INTO ${s}.${q(QUOTE)} VALUES (${Object.values(r).map(lit).join(', ')})`);
    for (const r of eventRows) await run(`INSERT INTO ${s}.${q(EVIL)} VALUES (${Object.values(r).map(lit).join(', ')})`);
    const sql = query({
      plan: hostilePlan(),
      dialect: 'postgres',
      dataThrough: '2026-11-19',
      exposures: { source: { table: `${pg!.schema}.${QUOTE}` }, columns: hostileColumns, segments: [`seg'"`] },
      events: { source: { table: `${pg!.schema}.${EVIL}` }, columns: hostileEventColumns },
    });
    const result = await runPostgresQuery(sql, { url: urlOf(pg!) });
    expectHostileResult(result.rows, result.columns);
    expect(await run(`SELECT count(*)::int AS n FROM ${s}.y`)).toEqual([{ n: 1 }]);
  });
});
