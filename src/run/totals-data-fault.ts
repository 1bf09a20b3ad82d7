import { posix } from 'node:path';
import picomatch from 'picomatch';
import { formatFieldPath } from '../core/source/check-written.js';
import { closestName } from '../core/source/closest-name.js';
import { formatProblem, type Problem } from '../core/source/problem.js';
import type { FieldPath, SourceLocationFinder } from '../core/source/yaml-source.js';
import type { QuerySource } from '../core/totals-query/build-query.js';
import { describeSourceSql, firstBadValueSql, typedCsvReadSql, type ColumnSetting, type DataFault, type DataTable } from '../core/totals-query/diagnose.js';
import type { QueryResult } from '../adapters/sql/result.js';
import { DataFaultError, UsageError } from '../errors.js';

/**
 * A totals query that failed on the data, told where the user can fix it: a missing column at the setting
 * that names it (file, line, field) with the columns the data has; a value that does not convert at its data
 * file, with the line and column where DuckDB's CSV reader says them. Asks the engine a few small questions
 * (the columns of a source, the first bad value of a column) through the same port the query ran on.
 */

export interface DataFaultContext {
  engine: 'duckdb' | 'postgres';
  sources: Record<DataTable, QuerySource>;
  columns: ColumnSetting[];
  locateSetting: SourceLocationFinder;
  isSettingWritten: (path: FieldPath) => boolean;
  /** The repository root: data files under it are named relative to it. */
  root: string;
  /** --data, when the files came from it rather than from the settings. */
  dataFlag?: string;
  run(sql: string): Promise<QueryResult>;
}

const EXPECTED = {
  time: 'a timestamp, ISO-8601 with an offset, e.g. 2026-11-09T23:30:00-05:00, or an empty field for none',
  number: 'a number, e.g. 42.5, or an empty field for none',
} as const;

/** The error to show for a fault, or undefined when it cannot be placed (the engine's own message stands). */
export async function explainDataFault(fault: DataFault, ctx: DataFaultContext): Promise<UsageError | undefined> {
  return fault.kind === 'missing-column' ? missingColumn(fault.column, ctx) : badValue(fault, ctx);
}

/** DuckDB matches names regardless of case, PostgreSQL quoted names exactly. */
const sameName = (ctx: DataFaultContext, a: string, b: string) => (ctx.engine === 'duckdb' ? a.toLowerCase() === b.toLowerCase() : a === b);

function sourceName(ctx: DataFaultContext, table: DataTable): string {
  const source = ctx.sources[table];
  if ('table' in source) return `the table ${source.table}`;
  return `the ${table} files (${ctx.dataFlag !== undefined ? `--data ${ctx.dataFlag}` : `data.${table}.files`})`;
}

async function columnsOf(ctx: DataFaultContext, table: DataTable): Promise<string[] | undefined> {
  try {
    return (await ctx.run(describeSourceSql(ctx.engine, ctx.sources[table]))).columns;
  } catch {
    return undefined;
  }
}

async function missingColumn(column: string, ctx: DataFaultContext): Promise<UsageError | undefined> {
  const named = ctx.columns.filter((c) => sameName(ctx, c.column, column));
  if (!named.length) return undefined;
  const described: Partial<Record<DataTable, string[]>> = {};
  for (const table of ['exposures', 'events'] as const) {
    const columns = await columnsOf(ctx, table);
    if (columns) described[table] = columns;
  }
  // The engine names the first missing column only: with the columns of both tables known, every setting
  // that names an absent one is reported at once. A name both tables use (unit_id) is at fault only where
  // it is missing; a table that could not be described keeps the setting the engine named.
  const absent = (c: ColumnSetting) => {
    const have = described[c.table];
    return have ? !have.some((h) => sameName(ctx, h, c.column)) : named.includes(c);
  };
  const lacking = ctx.columns.filter(absent);
  const problems: Problem[] = (lacking.length ? lacking : named).map((c) => {
    const field = formatFieldPath(c.path);
    const have = described[c.table];
    return {
      severity: 'error',
      code: 'totals/missing-column',
      ...ctx.locateSetting(c.path),
      field,
      message: `${sourceName(ctx, c.table)} ${'table' in ctx.sources[c.table] ? 'has' : 'have'} no column "${c.column}"${ctx.isSettingWritten(c.path) ? '' : ` (${field} is not set: "${c.column}" is its default)`}`,
      expected: have ? `one of the columns there: ${have.join(', ')}` : `the name of a column of the ${c.table}`,
    };
  });
  const hints = (lacking.length ? lacking : named).map((c) => {
    const have = described[c.table];
    const suggestion = have ? closestName(c.column, have) : undefined;
    const field = formatFieldPath(c.path);
    if (c.path.at(-1) === 'experiment') return `${field}: the column that holds the plan id, or false when every row is this plan’s`;
    return suggestion ? `${field}: ${suggestion}` : `${field}: the column that holds it`;
  });
  return new UsageError(`the data lacks ${problems.length === 1 ? 'a column the settings name' : `${problems.length} columns the settings name`}:\n${problems.map(formatProblem).join('\n')}`, `set in the settings file ${hints.join('; ')}`);
}

async function badValue(fault: Extract<DataFault, { kind: 'bad-value' }>, ctx: DataFaultContext): Promise<UsageError | undefined> {
  const converted = ctx.columns.filter((c): c is ColumnSetting & { as: 'time' | 'number' } => c.as !== 'text');
  let { file, line, value } = fault;
  let setting = fault.column !== undefined ? converted.find((c) => sameName(ctx, c.column, fault.column!) && (!file || isOf(ctx, c.table, file))) : undefined;
  if (!file && ctx.engine === 'duckdb') {
    // The cast failed somewhere in the files: find the first value that does not convert, and its file.
    for (const c of setting ? [setting] : converted) {
      const source = ctx.sources[c.table];
      if ('table' in source) continue;
      const found = await ctx.run(firstBadValueSql(source, c.column, c.as)).catch(() => undefined);
      const [badFile, badValue] = found?.rows[0] ?? [];
      if (!badFile) continue;
      [file, value, setting] = [badFile, badValue ?? undefined, c];
      if (source.format === 'csv') line = await csvLine(ctx, badFile, c, value);
      break;
    }
  }
  // Nothing to place it at (a database's conversion error names no column): the engine's own sentence stands.
  if (!setting && !file) return undefined;
  const where = file ? `${shown(ctx, file)}${line ? `:${line}` : ''}` : setting ? sourceName(ctx, setting.table) : 'the data';
  const column = setting?.column ?? fault.column;
  const at = setting ? ctx.locateSetting(setting.path) : undefined;
  const what = setting ? EXPECTED[setting.as] : 'a value the column’s type takes';
  const named = setting ? `; the column of ${formatFieldPath(setting.path)}${ctx.isSettingWritten(setting.path) ? `, ${at!.file}:${at!.line}` : ' (its default)'}` : '';
  const message = `${where}: error: ${column ? `column "${column}"` : 'a value'}: ${value !== undefined ? JSON.stringify(value) : 'a value'} does not convert (expected ${what}${named})`;
  return new UsageError(`a value in the data is not what the totals query reads:\n${message}`, 'correct the value at its source and export the data again, or leave the field empty for none');
}

/** Whether a file DuckDB named is one of a table's files. */
function isOf(ctx: DataFaultContext, table: DataTable, file: string): boolean {
  const source = ctx.sources[table];
  return !('table' in source) && source.files.some((pattern) => pattern === file || picomatch(pattern)(file));
}

/** DuckDB's CSV reader, made to read the column with its type, says the line of the bad value (if it is that value). */
async function csvLine(ctx: DataFaultContext, file: string, c: ColumnSetting & { as: 'time' | 'number' }, value: string | undefined): Promise<number | undefined> {
  try {
    await ctx.run(typedCsvReadSql(file, c.column, c.as));
  } catch (error) {
    if (error instanceof DataFaultError && error.fault.kind === 'bad-value' && error.fault.line !== undefined && error.fault.value === value) return error.fault.line;
  }
  return undefined;
}

/** A data file as the user would name it: relative to the repository when it is inside it. */
function shown(ctx: DataFaultContext, file: string): string {
  const relative = posix.relative(ctx.root, file);
  return relative.startsWith('..') || posix.isAbsolute(relative) ? file : relative;
}
