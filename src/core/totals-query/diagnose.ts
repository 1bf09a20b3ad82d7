import type { FieldPath } from '../source/yaml-source.js';
import { from, type QuerySource, type TotalsQueryInput } from './build-query.js';
import { DIALECT, type DialectName } from './dialects.js';

/**
 * When the totals query fails on the data (a column the settings name is not there, a value that does not
 * convert), these queries find what to tell the user: the columns a source has, the first value of a column
 * that does not convert and the file it is in, and DuckDB's own CSV reader's line for it. Text only.
 */

export type DataTable = 'exposures' | 'events';

/** A column the settings name: which table, which setting (its path in the settings file), which column. */
export interface ColumnSetting {
  table: DataTable;
  path: FieldPath;
  column: string;
  /** How the query converts the column: a time, a number, or text (which always converts). */
  as: 'time' | 'number' | 'text';
}

/** Every column the query reads, with the setting that names it. */
export function columnSettings(input: Pick<TotalsQueryInput, 'exposures' | 'events'>): ColumnSetting[] {
  const x = input.exposures.columns;
  const e = input.events.columns;
  return [
    { table: 'exposures', path: ['data', 'exposures', 'unit-id'], column: x.unitId, as: 'text' },
    { table: 'exposures', path: ['data', 'exposures', 'arm'], column: x.arm, as: 'text' },
    { table: 'exposures', path: ['data', 'exposures', 'exposed-at'], column: x.exposedAt, as: 'time' },
    ...(x.experiment !== undefined ? [{ table: 'exposures', path: ['data', 'exposures', 'experiment'], column: x.experiment, as: 'text' } as const] : []),
    ...input.exposures.segments.map((column, i) => ({ table: 'exposures', path: ['data', 'exposures', 'segments', i], column, as: 'text' }) as const),
    { table: 'events', path: ['data', 'events', 'unit-id'], column: e.unitId, as: 'text' },
    { table: 'events', path: ['data', 'events', 'event'], column: e.event, as: 'text' },
    { table: 'events', path: ['data', 'events', 'occurred-at'], column: e.occurredAt, as: 'time' },
    { table: 'events', path: ['data', 'events', 'value'], column: e.value, as: 'number' },
  ];
}

/** No rows, only the source's column names. */
export function describeSourceSql(dialect: DialectName, source: QuerySource): string {
  return `SELECT * FROM ${from(DIALECT[dialect], source, 'source')} LIMIT 0`;
}

/** The type the totals query converts a column to, in DuckDB (the same casts as build-query's dialect). */
const DUCKDB_TYPE = { time: 'TIMESTAMPTZ', number: 'DECIMAL(38, 6)' } as const;

/** DuckDB: the first file and value of a column that does not convert as the totals query converts it. */
export function firstBadValueSql(source: { files: string[]; format: 'parquet' | 'csv' }, column: string, as: 'time' | 'number'): string {
  const d = DIALECT.duckdb;
  const list = `[${source.files.map((f) => d.string(f)).join(', ')}]`;
  const reader = source.format === 'parquet' ? `read_parquet(${list}, union_by_name = true, filename = true)` : `read_csv(${list}, header = true, union_by_name = true, all_varchar = true, filename = true)`;
  const c = d.identifier(column);
  return `SELECT filename, CAST(${c} AS VARCHAR) AS value FROM ${reader} WHERE ${c} IS NOT NULL AND TRY_CAST(${c} AS ${DUCKDB_TYPE[as]}) IS NULL LIMIT 1`;
}

/**
 * DuckDB: one CSV file read with the column's type declared, so DuckDB's CSV reader itself fails at the
 * bad value and says its line. Times are declared TIMESTAMP: declared TIMESTAMPTZ, DuckDB 1.5 reads an
 * out-of-range time as NULL instead of failing.
 */
export function typedCsvReadSql(file: string, column: string, as: 'time' | 'number'): string {
  const d = DIALECT.duckdb;
  return `SELECT COUNT(${d.identifier(column)}) FROM read_csv([${d.string(file)}], header = true, types = {${d.string(column)}: '${as === 'time' ? 'TIMESTAMP' : 'DOUBLE'}'})`;
}

/**
 * What an engine said about the data when a query failed on it, as facts the run layer can place: a column
 * the query names that the data does not have, or a value that does not convert (with the file, line and
 * column when the engine said them; never guessed).
 */
export type DataFault =
  | { kind: 'missing-column'; column: string }
  | { kind: 'bad-value'; column?: string; value?: string; file?: string; line?: number; type?: string };
