import { resolve } from 'node:path';
import { Option, type Command } from 'commander';
import { writeFileAtomic } from '../adapters/files.js';
import { UsageError } from '../errors.js';
import { EXIT, context, type CommonOptions, type SetExit, type CliDeps } from './common.js';

export const TOTALS_JSON_FORMAT = 'plumbline.totals-run/1';
const DIALECT_NAMES = ['duckdb', 'postgres', 'trino', 'bigquery', 'snowflake', 'spark'];

interface TotalsFlags {
  data?: string;
  engine: 'duckdb' | 'postgres';
  sql: boolean;
  dialect?: string;
  fromRows?: string;
  through?: string;
  out?: string;
  url?: string;
  planCommit?: string;
  today?: string;
  progress: boolean;
  format: 'text' | 'json';
}

/** `plumbline totals <plan>`: the arm totals of a plan from the team's own data (docs/totals-from-sql.md). */
export function addTotalsCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('totals')
    .description('compute a plan’s arm totals where the data lives (DuckDB over files, PostgreSQL), print the query for another engine, or read its result back')
    .argument('<plan>', 'plan id or plan file')
    .option('--data <folder-or-glob>', 'files read by DuckDB: a folder of exposures*.parquet|csv and events*.parquet|csv, or a glob (default: data.* in the settings)')
    .addOption(new Option('--engine <engine>', 'where the query runs').choices(['duckdb', 'postgres']).default('duckdb'))
    .option('--url <url>', 'PostgreSQL connection URL (default: PLUMBLINE_DATABASE_URL, else the PG* variables)')
    .option('--sql', 'print the query instead of running it', false)
    // Checked in the action rather than by the parser, so the message can say what --dialect goes with.
    .option('--dialect <name>', `the SQL dialect printed with --sql: ${DIALECT_NAMES.join(', ')} (default: the engine)`)
    .option('--from-rows <csv>', 'read the query’s result from a CSV file (with its header row) instead of running it')
    .option('--through <date>', 'last day of data, YYYY-MM-DD, UTC (default: the plan’s end or yesterday, whichever is earlier)')
    .option('--out <file>', 'the totals file to write (default: readouts/<plan-id>.totals.yaml)')
    .option('--plan-commit <sha>', 'the plan’s commit at launch (default: from git: the commit where it went live)')
    .option('--today <date>', 'today, YYYY-MM-DD (default: the system date, UTC)')
    .option('--progress', 'show a progress line on stderr even when it is not a terminal', false)
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'json']).default('text'))
    .action(async (planName: string, flags: TotalsFlags) => {
      const options = program.opts<Omit<CommonOptions, 'format'>>();
      const { output, files } = context({ ...options, format: 'text' }, deps);
      const root = resolve(options.cwd);
      const [{ isCalendarDate }, { computeTotals }, { countOf, formatCount }, { pathInRepository }] = await Promise.all([import('../core/source/fields.js'), import('../run/totals.js'), import('../core/report/numbers.js'), import('../run/repo-path.js')]);
      for (const [flag, value] of [['--through', flags.through], ['--today', flags.today]] as const) {
        if (value !== undefined && !isCalendarDate(value)) throw new UsageError(`${flag} ${JSON.stringify(value)} is not a date`, `write it as YYYY-MM-DD, e.g. ${flag} 2026-12-06`);
      }
      if (flags.planCommit !== undefined && !/^[0-9a-f]{7,40}$/.test(flags.planCommit)) throw new UsageError(`--plan-commit ${JSON.stringify(flags.planCommit)} is not a commit id`, 'write 7 to 40 lower-case hexadecimal digits, e.g. --plan-commit 4b1d2e7');
      if (flags.dialect !== undefined && !DIALECT_NAMES.includes(flags.dialect)) throw new UsageError(`--dialect ${JSON.stringify(flags.dialect)} is not a dialect Plumbline writes`, `one of ${DIALECT_NAMES.join(', ')}; for another engine, start from the dialect closest to it`);
      if (flags.dialect && !flags.sql) throw new UsageError('--dialect goes with --sql', `plumbline totals ${planName} --sql --dialect ${flags.dialect}`);
      if (flags.sql && flags.fromRows) throw new UsageError('--sql prints the query; --from-rows reads its result: use one at a time');
      // The rows do not say how far their data runs; without the date the query was printed with, a readout of
      // data cut short would pass for one that reached the planned end.
      if (flags.fromRows && !flags.through) throw new UsageError('--from-rows needs --through: the last day the query’s data covers', `the date in the query's first line ("data through YYYY-MM-DD"), e.g. plumbline totals ${planName} --from-rows ${flags.fromRows} --through 2026-12-06`);
      const url = flags.url ?? process.env.PLUMBLINE_DATABASE_URL;
      // A progress line while the engine works: on a terminal, or when asked.
      const showProgress = flags.progress || (!deps.write && process.stderr.isTTY === true);
      let drawn = false;
      const progress = showProgress
        ? (fraction: number) => {
            process.stderr.write(`\rRunning the totals query: ${Math.round(fraction * 100)}%${flags.progress && !process.stderr.isTTY ? '\n' : ''}`);
            drawn = true;
          }
        : undefined;
      const outcome = await computeTotals({
        files,
        ...(options.config ? { settingsPath: options.config } : {}),
        plan: planName,
        root,
        engine: flags.engine,
        ...(flags.sql ? { sqlDialect: (flags.dialect ?? flags.engine) as 'duckdb' } : {}),
        ...(flags.data !== undefined ? { data: flags.data } : {}),
        ...(flags.fromRows !== undefined ? { fromRows: pathInRepository(root, flags.fromRows) } : {}),
        ...(flags.through ? { through: flags.through } : {}),
        today: flags.today ?? new Date().toISOString().slice(0, 10),
        ...(flags.out ? { out: pathInRepository(root, flags.out) } : {}),
        ...(flags.planCommit ? { planCommit: flags.planCommit } : {}),
        findPlanCommit: async (file) => (await import('../adapters/git.js')).planCommitAtLaunch(root, file),
        runQuery: async (engine, sql, settings) => {
          try {
            if (engine === 'postgres') return await (await import('../adapters/sql/postgres.js')).runPostgresQuery(sql, url ? { url } : {});
            return await (await import('../adapters/sql/duckdb.js')).runDuckDbQuery(sql, settings);
          } finally {
            if (drawn) process.stderr.write(process.stderr.isTTY ? '\r\u001b[2K' : '');
          }
        },
        ...(progress ? { progress } : {}),
      });
      if (outcome.kind === 'sql') {
        output.out(outcome.sql);
        setExit(EXIT.ok);
        return;
      }
      await writeFileAtomic(resolve(root, outcome.out), outcome.text, { overwrite: true });
      if (outcome.warnings.length) {
        const { formatProblem } = await import('../core/source/problem.js');
        output.err(outcome.warnings.map(formatProblem).join('\n'));
      }
      const excluded = outcome.totals.excluded ?? { 'several-arms': 0, 'unknown-arm': 0 };
      if (flags.format === 'json') {
        output.out(
          JSON.stringify(
            {
              format: TOTALS_JSON_FORMAT,
              plan: outcome.planId,
              out: outcome.out,
              dataThrough: outcome.dataThrough,
              planCommit: outcome.planCommit,
              planCommitFrom: outcome.planCommitHow,
              units: Object.fromEntries(Object.entries(outcome.totals.arms).map(([arm, t]) => [arm, t.units])),
              excluded: { severalArms: excluded['several-arms'] ?? 0, unknownArm: excluded['unknown-arm'] ?? 0 },
              noExposureTime: outcome.untimed,
            },
            null,
            2,
          ),
        );
      } else {
        const units = Object.entries(outcome.totals.arms).map(([arm, t]) => `${arm} ${formatCount(t.units)}`).join(', ');
        output.out(
          [
            `Wrote ${outcome.out}: ${outcome.planId}, data through ${outcome.dataThrough}; units ${units}.`,
            `Left out: ${countOf(excluded['several-arms'] ?? 0, 'unit')} in several arms, ${formatCount(excluded['unknown-arm'] ?? 0)} with an arm the plan does not have${outcome.untimed.rows ? `, ${countOf(outcome.untimed.rows, 'exposure row')} (${countOf(outcome.untimed.units, 'unit')}) with no exposure time` : ''}.`,
            `Plan commit ${outcome.planCommit.slice(0, 12)} (${outcome.planCommitHow === 'went-live' ? 'where the plan went live' : outcome.planCommitHow === 'latest' ? 'the latest commit of the plan file: no commit set it live' : 'given'}).`,
            `Next: plumbline readout ${outcome.planId} --totals ${outcome.out}`,
          ].join('\n'),
        );
      }
      setExit(EXIT.ok);
    });
}
