import { posix } from 'node:path';
import picomatch from 'picomatch';
import { addDays } from '../core/calendar.js';
import { lineOfKey, type LoadedPlan } from '../core/plan/load.js';
import type { DataSource } from '../core/config/schema.js';
import { formatProblem, type Problem } from '../core/source/problem.js';
import { loadTotals } from '../core/totals/load.js';
import { buildTotalsQuery, type QuerySource, type TotalsQueryInput } from '../core/totals-query/build-query.js';
import { columnSettings } from '../core/totals-query/diagnose.js';
import type { DialectName } from '../core/totals-query/dialects.js';
import type { SpecProblem } from '../core/totals-query/metric-spec.js';
import { parseResultRows, rowsFromResult, type ResultRow } from '../core/totals-query/rows-csv.js';
import { countOf } from '../core/report/numbers.js';
import { rowsToTotals } from '../core/totals-query/rows-to-totals.js';
import type { WrittenTotals } from '../core/totals/schema.js';
import type { QueryProgress, QueryResult } from '../adapters/sql/result.js';
import { DataFaultError, UsageError } from '../errors.js';
import { findNamedPlan } from './find-plan.js';
import { explainDataFault } from './totals-data-fault.js';
import { pathInRepository } from './repo-path.js';
import { requireWorkspace, type LoadWorkspaceOptions } from './load-workspace.js';

/**
 * `plumbline totals`: the plan's totals query, printed (--sql), run where the data is (DuckDB over files,
 * PostgreSQL), or its result read back (--from-rows), then the arm-totals file. The engines and git are
 * passed in, so this module never loads DuckDB, pg or git itself.
 */

export type Engine = 'duckdb' | 'postgres';

export interface TotalsOptions extends LoadWorkspaceOptions {
  plan: string;
  /** Absolute path of the repository root; file paths are relative to it. */
  root: string;
  engine: Engine;
  /** Print the query for this dialect instead of running it. */
  sqlDialect?: DialectName;
  /** A folder or glob of exposures*.parquet|csv and events*.parquet|csv (or a folder per table), relative to the root or absolute. */
  data?: string;
  /** The query's result saved as CSV, relative to the root. */
  fromRows?: string;
  /** The last day of data (UTC); default: the plan's end or yesterday, whichever is earlier. */
  through?: string;
  /** The day today (UTC), for the default of `through`. */
  today: string;
  /** The totals file to write, relative to the root; default readouts/<plan-id>.totals.yaml. */
  out?: string;
  /** The plan's commit at launch, when given; else git is asked. */
  planCommit?: string;
  findPlanCommit(file: string): Promise<{ commit: string; how: 'went-live' | 'latest' } | undefined>;
  runQuery(engine: Engine, sql: string, settings: { memoryLimit: string; threads?: number; progress?: QueryProgress }): Promise<QueryResult>;
  progress?: QueryProgress;
}

export type TotalsOutcome =
  | { kind: 'sql'; sql: string; dialect: DialectName; dataThrough: string }
  | {
      kind: 'totals';
      planId: string;
      /** Where the totals file goes, relative to the root. */
      out: string;
      text: string;
      totals: WrittenTotals;
      dataThrough: string;
      planCommit: string;
      planCommitHow: 'given' | 'went-live' | 'latest';
      /** Exposure rows of the plan with no exposure time, left out (also said in the notes and in a warning). */
      untimed: { units: number; rows: number };
      warnings: Problem[];
    };

/** A table's data: a file named for it (`exposures.parquet`, `events-2026-11.csv`) or any file in a folder named for it. */
const DATA_NAME = /^(exposures|events)[^/]*$/i;
const DATA_FORMAT = /\.(parquet|csv)$/i;

/**
 * Which table a listed data file belongs to, from its path below the `--data` folder: the file's own name
 * (`exposures.parquet`) or its first folder (`exposures/date=2026-11-09/part-0.parquet`, as exports are often
 * partitioned). Other files are not data.
 */
function tableOf(pathBelow: string): { kind: 'exposures' | 'events'; format: 'parquet' | 'csv' } | undefined {
  const format = DATA_FORMAT.exec(pathBelow)?.[1]?.toLowerCase() as 'parquet' | 'csv' | undefined;
  if (!format) return undefined;
  const parts = pathBelow.split('/');
  const named = parts.length === 1 ? parts[0]!.replace(DATA_FORMAT, '') : parts[0]!;
  const m = DATA_NAME.exec(named);
  return m ? { kind: m[1]!.toLowerCase() as 'exposures' | 'events', format } : undefined;
}

/** The data files of a folder (exposures*.parquet|csv and events*.parquet|csv, or folders so named) or of a glob. */
async function dataFiles(options: TotalsOptions, spec: string): Promise<{ exposures: QuerySource; events: QuerySource }> {
  // An absolute path (exports often live outside the repository) is listed relative to the repository, like any other.
  const entry = pathInRepository(options.root, spec).replace(/\/+$/, '');
  const scan = picomatch.scan(entry);
  const folder = scan.isGlob ? scan.base : entry;
  const listed = await options.files.listFiles(folder === '.' ? '' : folder);
  if (!listed.length) throw new UsageError(`--data ${spec}: no such folder, or no files in it`, 'give the folder the exports are in (an absolute path, or one relative to the repository), or a glob of the files');
  const prefix = folder === '.' || folder === '' ? '' : `${folder}/`;
  const glob = scan.isGlob ? picomatch(entry, { dot: false }) : undefined;
  const found = { exposures: [] as string[], events: [] as string[] };
  const formats = { exposures: new Set<string>(), events: new Set<string>() };
  for (const path of listed) {
    if (!path.startsWith(prefix) || (glob && !glob(path))) continue;
    // A glob names the files itself, so only their names tell the table; a folder may hold a folder per table.
    const table = tableOf(glob ? posix.basename(path) : path.slice(prefix.length));
    if (!table) continue;
    found[table.kind].push(posix.join(options.root, path));
    formats[table.kind].add(table.format);
  }
  const source = (kind: 'exposures' | 'events'): QuerySource => {
    if (!found[kind].length) throw new UsageError(`--data ${spec}: no ${kind} files (${kind}*.parquet or ${kind}*.csv, or a folder ${kind}/ of them)`, `put the exports in ${spec} named ${kind}.parquet (or ${kind}-*.csv, or ${kind}/part-*.parquet), or set data.${kind}.files in the settings`);
    if (formats[kind].size > 1) throw new UsageError(`--data ${spec}: the ${kind} files mix Parquet and CSV`, 'keep one format per table');
    return { files: found[kind].sort(), format: [...formats[kind]][0] as 'parquet' | 'csv' };
  };
  return { exposures: source('exposures'), events: source('events') };
}

/** A settings source as the query reads it: files become absolute globs (DuckDB expands them). */
function settingsSource(source: DataSource | undefined, kind: 'exposures' | 'events', root: string): QuerySource {
  if (!source) throw new UsageError(`the settings do not say where the ${kind} are`, `set data.${kind}.table (or .files) in the settings file, or pass --data <folder>; see docs/totals-from-sql.md`);
  if ('table' in source) return source;
  const format = source.format ?? (/\.parquet$/i.test(source.files) ? 'parquet' : /\.csv$/i.test(source.files) ? 'csv' : undefined);
  if (!format) throw new UsageError(`data.${kind}.files: cannot tell the format of ${source.files}`, `set data.${kind}.format: parquet (or csv)`);
  return { files: [posix.join(root, source.files)], format };
}

function located(loaded: LoadedPlan, problems: SpecProblem[]): string {
  return problems
    .map((p) => formatProblem({ severity: 'error', code: 'totals-query/plan', file: loaded.file, line: lineOfKey(loaded, p.path), column: 1, field: p.path.join('.'), message: p.message, expected: p.expected }))
    .join('\n');
}

export async function computeTotals(options: TotalsOptions): Promise<TotalsOutcome> {
  const workspace = await requireWorkspace(options);
  const loaded = findNamedPlan(workspace, options.plan, 'compute its totals');
  const { plan } = loaded;
  const data = workspace.settings.data;
  const yesterday = addDays(options.today, -1);
  const dataThrough = options.through ?? (plan.window.end && plan.window.end < yesterday ? plan.window.end : yesterday);
  // Checked before any rows are read or any query runs: data that ends before the test starts holds no
  // exposure of it, and rows read back against such a date would each fail the totals' own checks.
  const start = plan.window.start;
  if (start && dataThrough < start) {
    const where = `${loaded.file}:${lineOfKey(loaded, ['window', 'start'])}`;
    throw new UsageError(
      options.through
        ? `--through ${dataThrough} is before ${plan.id} starts (window.start ${start}, ${where}); nothing written`
        : `${plan.id} starts on ${start} (window.start, ${where}): yesterday (${dataThrough}) is before it, so there is no data yet; nothing written`,
      `--through takes the last day of data, on or after ${start} (the day the query's first line names: "data through YYYY-MM-DD")`,
    );
  }

  let rows: readonly ResultRow[];
  /** Where the rows came from, as the notes say it after "from". */
  let source: string;
  if (options.fromRows) {
    const text = await options.files.readText(options.fromRows);
    if (text === undefined) throw new UsageError(`the rows file ${options.fromRows} does not exist`, 'the path is relative to --cwd (the repository root)');
    const parsed = parseResultRows(text, options.fromRows);
    if (!parsed.ok) throw new UsageError(`${options.fromRows} cannot be read:\n${parsed.problems.map(formatProblem).join('\n')}`, `save the query's result as CSV with its header row (plumbline totals ${plan.id} --sql --dialect <name> prints the query)`);
    rows = parsed.rows;
    source = `the query's result in ${options.fromRows}`;
  } else {
    const dialect = options.sqlDialect ?? options.engine;
    let sources: { exposures: QuerySource; events: QuerySource };
    if (options.data) {
      if (dialect !== 'duckdb') throw new UsageError(`--data reads files with DuckDB, not ${dialect}`, 'drop --engine/--dialect, or set data.exposures.table and data.events.table for a database');
      sources = await dataFiles(options, options.data);
    } else {
      sources = { exposures: settingsSource(data.exposures.source, 'exposures', options.root), events: settingsSource(data.events.source, 'events', options.root) };
    }
    const query: TotalsQueryInput = {
      plan,
      dialect,
      dataThrough,
      exposures: { source: sources.exposures, columns: data.exposures.columns, segments: data.exposures.segments },
      events: { source: sources.events, columns: data.events.columns },
      ...(data.prePeriodDays !== undefined ? { prePeriodDays: data.prePeriodDays } : {}),
      ...(data.metricWindowDays !== undefined ? { metricWindowDays: data.metricWindowDays } : {}),
    };
    const built = buildTotalsQuery(query);
    if (!built.ok) throw new UsageError(`no totals query can be written for ${plan.id}:\n${located(loaded, built.problems)}`, 'see docs/totals-from-sql.md');
    if (options.sqlDialect) return { kind: 'sql', sql: built.sql, dialect, dataThrough };
    const settings = { ...data.duckdb, ...(options.progress ? { progress: options.progress } : {}) };
    let result: QueryResult;
    try {
      result = await options.runQuery(options.engine, built.sql, settings);
    } catch (error) {
      if (!(error instanceof DataFaultError)) throw error;
      const explained = await explainDataFault(error.fault, {
        engine: options.engine,
        sources,
        columns: columnSettings(query),
        locateSetting: workspace.locateSetting,
        isSettingWritten: workspace.isSettingWritten,
        root: options.root,
        ...(options.data !== undefined ? { dataFlag: options.data } : {}),
        run: (sql) => options.runQuery(options.engine, sql, { ...data.duckdb }),
      });
      throw explained ?? error;
    }
    const fromEngine = rowsFromResult(result, `${options.engine} result`);
    if (!fromEngine.ok) throw new UsageError(`the ${options.engine} result is not the totals query's:\n${fromEngine.problems.map(formatProblem).join('\n')}`);
    rows = fromEngine.rows;
    source = options.engine === 'duckdb' ? `DuckDB over ${options.data ? `--data ${options.data}` : 'the files in the settings'}` : 'PostgreSQL';
  }

  let planCommit = options.planCommit;
  let planCommitHow: 'given' | 'went-live' | 'latest' = 'given';
  if (!planCommit) {
    const found = await options.findPlanCommit(loaded.file);
    if (!found) throw new UsageError(`git has no commit of ${loaded.file}, so the totals cannot name the plan they were computed for`, 'commit the plan first, or pass --plan-commit <sha>');
    planCommit = found.commit;
    planCommitHow = found.how;
  }
  const built = rowsToTotals({ plan, planCommit, dataThrough, rows, file: options.fromRows ?? source, notes: `Computed by plumbline totals from ${source}, data through ${dataThrough} (UTC).` });
  if (!built.ok) throw new UsageError(`the rows do not make totals for ${plan.id}:\n${built.problems.map(formatProblem).join('\n')}`);
  const out = (options.out ?? `readouts/${plan.id}.totals.yaml`).replace(/^\.\//, '');
  // Never replace another plan's totals: a mistyped --out would lose them.
  const existing = await options.files.readText(out);
  if (existing !== undefined) {
    const other = /^plan:[ \t]*["']?([^"'\s#]+)/m.exec(existing)?.[1];
    if (other !== plan.id) throw new UsageError(`${out} holds the totals of ${other ? `plan "${other}"` : 'something else'}, not ${plan.id}; nothing written`, 'choose another --out');
  }
  const checked = loadTotals(built.text, out, plan);
  if (!checked.ok) throw new UsageError(`the totals computed for ${plan.id} do not pass their own checks:\n${[...checked.errors].map(formatProblem).join('\n')}`);
  const warnings = [...checked.warnings];
  if (built.untimed.rows) {
    // Located where the reader can act: the rows file's line, or the setting that names the time column.
    const at = options.fromRows ? { file: options.fromRows, line: built.untimed.line ?? 1, column: 1 } : workspace.locateSetting(['data', 'exposures', 'exposed-at']);
    warnings.push({
      severity: 'warning',
      code: 'totals/no-exposure-time',
      ...at,
      field: options.fromRows ? 'bucket' : 'data.exposures.exposed-at',
      message: `${countOf(built.untimed.rows, 'exposure row')} of ${plan.id} (${countOf(built.untimed.units, 'unit')}) ${built.untimed.rows === 1 ? 'has' : 'have'} no exposure time: left out of every total, so a sample ratio check sees only the units with a time`,
      expected: `every exposure of ${plan.id} with its time in ${data.exposures.columns.exposedAt}`,
    });
  }
  return { kind: 'totals', planId: plan.id, out, text: built.text, totals: built.totals, dataThrough, planCommit, planCommitHow, untimed: { units: built.untimed.units, rows: built.untimed.rows }, warnings };
}
