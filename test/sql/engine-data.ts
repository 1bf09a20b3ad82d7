import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestPostgres } from '../helpers/postgres.js';
import type { EventRow, ExposureRow } from '../helpers/reference-totals.js';

/** Raw rows written as the files DuckDB reads (CSV with a header; Parquet through DuckDB itself). */

const csvField = (v: unknown) => {
  if (v === null || v === undefined) return '';
  const text = v instanceof Date ? v.toISOString() : String(v);
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
};

export function toCsv(rows: readonly Record<string, unknown>[], columns: readonly string[]): string {
  return [columns.map(csvField).join(","), ...rows.map((r) => columns.map((c) => csvField(r[c])).join(','))].join('\n') + '\n';
}

export interface DataFiles {
  folder: string;
  exposuresCsv: string;
  eventsCsv: string;
  exposuresParquet: string;
  eventsParquet: string;
}

/** Writes both tables as CSV and as Parquet (timestamps as TIMESTAMP WITH TIME ZONE) into a new temporary folder. */
export async function writeDataFiles(data: { exposures: readonly ExposureRow[]; events: readonly EventRow[] }, exposureColumns: readonly string[]): Promise<DataFiles> {
  const folder = mkdtempSync(join(tmpdir(), 'plumbline-sql-'));
  const files = {
    folder,
    exposuresCsv: join(folder, 'exposures.csv'),
    eventsCsv: join(folder, 'events.csv'),
    exposuresParquet: join(folder, 'exposures.parquet'),
    eventsParquet: join(folder, 'events.parquet'),
  };
  writeFileSync(files.exposuresCsv, toCsv(data.exposures as unknown as Record<string, unknown>[], exposureColumns));
  writeFileSync(files.eventsCsv, toCsv(data.events as unknown as Record<string, unknown>[], ['unit_id', 'event', 'occurred_at', 'value']));
  const { DuckDBInstance } = await import('@duckdb/node-api');
  const db = await DuckDBInstance.create(':memory:');
  const c = await db.connect();
  const q = (s: string) => `'${s.replace(/'/g, "''")}'`;
  const segmentCasts = exposureColumns.filter((c) => !['unit_id', 'arm', 'exposed_at', 'experiment'].includes(c)).map((c) => `, CAST("${c}" AS VARCHAR) AS "${c}"`).join('');
  await c.run(
    `COPY (SELECT CAST(unit_id AS VARCHAR) AS unit_id, CAST(arm AS VARCHAR) AS arm, CAST(exposed_at AS TIMESTAMPTZ) AS exposed_at, CAST(experiment AS VARCHAR) AS experiment${segmentCasts} FROM read_csv(${q(files.exposuresCsv)}, header = true, all_varchar = true)) TO ${q(files.exposuresParquet)} (FORMAT parquet)`,
  );
  await c.run(
    `COPY (SELECT CAST(unit_id AS VARCHAR) AS unit_id, CAST(event AS VARCHAR) AS event, CAST(occurred_at AS TIMESTAMPTZ) AS occurred_at, CAST(value AS DOUBLE) AS value FROM read_csv(${q(files.eventsCsv)}, header = true, all_varchar = true)) TO ${q(files.eventsParquet)} (FORMAT parquet)`,
  );
  c.closeSync();
  db.closeSync();
  return files;
}

/** The test schema's connection as a URL for the PostgreSQL adapter (the host may be a socket folder). */
export function urlOf(p: TestPostgres): string {
  const e = encodeURIComponent;
  return `postgres://${e(p.env.PGUSER ?? '')}${p.env.PGPASSWORD ? `:${e(p.env.PGPASSWORD)}` : ''}@${e(p.env.PGHOST ?? '')}:${p.env.PGPORT}/${e(p.env.PGDATABASE ?? '')}`;
}
