import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runDuckDbQuery } from '../../src/adapters/sql/duckdb.js';
import { runPostgresQuery } from '../../src/adapters/sql/postgres.js';
import type { DataFault } from '../../src/core/totals-query/diagnose.js';
import { DataFaultError } from '../../src/errors.js';
import { explainDataFault } from '../../src/run/totals-data-fault.js';
import { columnSettings } from '../../src/core/totals-query/diagnose.js';
import { postgresForThisFile } from '../helpers/postgres.js';
import { urlOf } from './engine-data.js';

/**
 * What the engines say when the totals query fails on the data, read into facts (adapters/sql/engine-faults.ts)
 * from the installed DuckDB and, when one is reachable, a real PostgreSQL server: the patterns are checked
 * against the engines' own wording, never against text written here.
 */

const folder = mkdtempSync(join(tmpdir(), 'plumbline-faults-'));
const pg = await postgresForThisFile('faults');
afterAll(() => rmSync(folder, { recursive: true, force: true }));

async function duckFault(sql: string): Promise<DataFault> {
  try {
    await runDuckDbQuery(sql, { memoryLimit: '256MB', threads: 1 });
  } catch (error) {
    if (error instanceof DataFaultError) return error.fault;
    throw error;
  }
  throw new Error('the query ran');
}

describe('DuckDB’s errors as facts', () => {
  const csv = join(folder, 'events.csv');
  writeFileSync(csv, 'unit_id,event,occurred_at,value\nu1,a,2026-11-09T10:00:00Z,1.5\nu2,b,2026-11-09T11:00:00Z,n/a\n');

  it('a column the query names and the file lacks', async () => {
    expect(await duckFault(`SELECT "amount" FROM read_csv(['${csv}'], header = true)`)).toEqual({ kind: 'missing-column', column: 'amount' });
  });

  it('a value its CSV reader cannot convert: the line, column, value and file DuckDB gives', async () => {
    expect(await duckFault(`SELECT COUNT("value") FROM read_csv(['${csv}'], header = true, types = {'value': 'DOUBLE'})`)).toEqual({ kind: 'bad-value', line: 3, column: 'value', value: 'n/a', type: 'DOUBLE', file: csv });
  });

  it('a cast that fails in the query: the source column and the value, and no line (DuckDB gives none)', async () => {
    expect(await duckFault(`SELECT CAST("value" AS DECIMAL(38, 6)) FROM read_csv(['${csv}'], header = true)`)).toEqual({ kind: 'bad-value', column: 'value', value: 'n/a' });
  });

  it('a value in a Parquet file: the file and the value, placed at the setting naming the column, and no line (Parquet has none)', async () => {
    const parquet = join(folder, 'events.parquet');
    await runDuckDbQuery(`COPY (SELECT * FROM read_csv(['${csv}'], header = true, all_varchar = true)) TO '${parquet}' (FORMAT parquet)`, { memoryLimit: '256MB' });
    const exposures = { files: [parquet], format: 'parquet' as const };
    const fault = await duckFault(`SELECT CAST("value" AS DECIMAL(38, 6)) FROM read_parquet(['${parquet}'])`);
    const explained = await explainDataFault(fault, {
      engine: 'duckdb',
      sources: { exposures, events: { files: [parquet], format: 'parquet' } },
      columns: columnSettings({ exposures: { source: exposures, columns: { unitId: 'unit_id', arm: 'arm', exposedAt: 'exposed_at' }, segments: [] }, events: { source: exposures, columns: { unitId: 'unit_id', event: 'event', occurredAt: 'occurred_at', value: 'value' } } }),
      locateSetting: () => ({ file: '.plumbline.yml', line: 4, column: 5 }),
      isSettingWritten: () => true,
      root: folder,
      run: (sql) => runDuckDbQuery(sql, { memoryLimit: '256MB' }),
    });
    expect(explained?.message).toBe('a value in the data is not what the totals query reads:\nevents.parquet: error: column "value": "n/a" does not convert (expected a number, e.g. 42.5, or an empty field for none; the column of data.events.value, .plumbline.yml:4)');
  });
});

describe.skipIf(!pg)('PostgreSQL’s errors as facts', () => {
  it('an undefined column (SQLSTATE 42703) names the column', async () => {
    await pg!.client.query(`CREATE TABLE "${pg!.schema}".exposures (unit_id text, arm text)`);
    try {
      await runPostgresQuery(`SELECT "user_id" FROM "${pg!.schema}".exposures`, { url: urlOf(pg!) });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(DataFaultError);
      expect((error as DataFaultError).fault).toEqual({ kind: 'missing-column', column: 'user_id' });
    }
  });
});
