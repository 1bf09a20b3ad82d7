// `npm run bench -- totals`: arm totals from Parquet files at warehouse-export size, three ways in the same run, each
// in its own process (its time and peak memory its own), in interleaved rounds:
//   count:      SELECT count(*) over the same files (a bare scan: the floor)
//   hand:       a hand-written DuckDB query of the same aggregates (the reference the target is set against)
//   plumbline:  `plumbline totals <plan> --data <folder>` (node dist/cli.js), when the command exists
// Targets: plumbline within 1.2x the hand-written query, peak memory under 2 GiB, a progress line on stderr.
// Options: --scale 0.01 (a fraction of 10 million exposures and 50 million events), --rounds 3, --memory-limit 1.5GiB.
// The files are generated inside DuckDB (range() and hash-based columns) and cached under .bench/, keyed by size.
import { spawnSync } from 'node:child_process';
import { appendFileSync, cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { cpus, tmpdir, totalmem } from 'node:os';
import { join, resolve } from 'node:path';
import { parse } from 'yaml';
import { interleave, median, timed, type Timed } from './check.js';

/** The demo's overdue test: the plan the files are shaped for and `plumbline totals` reads. */
const PLAN = { id: 'checkout-wallet-first', repo: 'demo/repo', start: '2026-11-09', end: '2026-12-06', arms: ['control', 'treatment'], event: 'order_placed', metrics: ['payment-completed', 'payment-errors'] };
const FULL = { exposures: 10_000_000, events: 50_000_000 };
const WINDOW_SECONDS = 28 * 86_400;

export interface TotalsBenchOptions {
  scale: number;
  rounds: number;
  /** DuckDB's memory_limit for the hand-written query and the count: by default 1.5GiB, plumbline's own default (data.duckdb.memory-limit). */
  memoryLimit: string;
}

export interface Measured {
  ms: number;
  rssMiB?: number;
}

export interface TotalsBenchResult {
  exposures: number;
  events: number;
  megabytes: number;
  count: Measured;
  hand: Measured;
  /** Absent when the totals command is not in dist/cli.js. */
  plumbline?: Measured & { progressLine: boolean; sameUnits: boolean; detail: string };
  unavailable?: string;
}

const progress = (text: string) => process.stderr.write(`[bench totals] ${text}\n`);
const lit = (text: string) => `'${text.replaceAll("'", "''")}'`;

/** The files, generated once per size and kept under .bench/ (a `complete` marker guards against a half-written set). */
async function benchFiles(exposures: number, events: number): Promise<string> {
  const folder = resolve('.bench', `totals-v2-${exposures}-${events}`);
  if (existsSync(join(folder, 'complete'))) return folder;
  rmSync(folder, { recursive: true, force: true });
  mkdirSync(folder, { recursive: true });
  const started = Date.now();
  progress(`generating ${exposures.toLocaleString('en')} exposures and ${events.toLocaleString('en')} events as Parquet in ${folder} ...`);
  const { DuckDBInstance } = await import('@duckdb/node-api');
  const instance = await DuckDBInstance.create(':memory:', { memory_limit: '1536MB' });
  const connection = await instance.connect();
  // Units: 98% of the exposure rows are first exposures; the rest repeat a unit (a few of them in the other arm).
  const units = Math.max(1, Math.floor(exposures * 0.98));
  // Each column hashes its own integer (x * 16 + salt): DuckDB's hash(x, salt) folds the salt's hash into hash(x),
  // which left the arm and the platform of a unit correlated (a sample ratio mismatch in the generated data).
  const unitId = (expr: string) => `'u' || lpad((${expr})::VARCHAR, 10, '0')`;
  const armOf = (u: string) => `CASE WHEN hash(${u} * 16 + 1) % 2 = 0 THEN 'control' ELSE 'treatment' END`;
  const otherArm = (u: string) => `CASE WHEN hash(${u} * 16 + 1) % 2 = 0 THEN 'treatment' ELSE 'control' END`;
  await connection.run("SET TimeZone = 'UTC'");
  await connection.run(`
    COPY (
      WITH r AS (SELECT i, CASE WHEN i < ${units} THEN i ELSE hash(i * 16 + 11) % ${units} END AS u FROM range(${exposures}) t(i))
      SELECT ${unitId('u')} AS unit_id,
        CASE WHEN i >= ${units} AND hash(i * 16 + 12) % 20 = 0 THEN ${otherArm('u')}
             WHEN hash(u * 16 + 13) % 1000 = 0 THEN 'Treatment'
             ELSE ${armOf('u')} END AS arm,
        TIMESTAMPTZ '${PLAN.start} 00:00:00+00' + to_seconds((hash(u * 16 + 2) % ${WINDOW_SECONDS} + CASE WHEN i >= ${units} THEN hash(i * 16 + 14) % 86400 ELSE 0 END)::BIGINT) AS exposed_at,
        CASE WHEN hash(u * 16 + 15) % 10 = 0 THEN 'checkout-tip-prompt' ELSE '${PLAN.id}' END AS experiment,
        ['web', 'web', 'web', 'web', 'web', 'ios', 'ios', 'ios', 'android', 'android'][(hash(u * 16 + 3) % 10 + 1)::BIGINT] AS platform
      FROM r
    ) TO ${lit(join(folder, 'exposures.parquet'))} (FORMAT parquet)`);
  progress(`exposures written (${((Date.now() - started) / 1000).toFixed(0)} s)`);
  // Events from 28 days before the window (the pre-period) to 4 days after its end; 5% of values NULL.
  await connection.run(`
    COPY (
      SELECT ${unitId(`hash(j * 16 + 4) % ${units}`)} AS unit_id,
        CASE WHEN hash(j * 16 + 5) % 100 < 45 THEN '${PLAN.event}' WHEN hash(j * 16 + 5) % 100 < 47 THEN 'payment_failed'
             WHEN hash(j * 16 + 5) % 100 < 75 THEN 'basket_viewed' ELSE 'checkout_payment_viewed' END AS event,
        TIMESTAMPTZ '${PLAN.start} 00:00:00+00' - INTERVAL 28 DAY + to_seconds((hash(j * 16 + 6) % ${60 * 86_400})::BIGINT) AS occurred_at,
        CASE WHEN hash(j * 16 + 7) % 20 = 0 THEN NULL ELSE (hash(j * 16 + 8) % 20000) / 100.0 END AS value
      FROM range(${events}) t(j)
    ) TO ${lit(join(folder, 'events.parquet'))} (FORMAT parquet)`);
  connection.closeSync();
  instance.closeSync();
  writeFileSync(join(folder, 'complete'), '');
  progress(`generated in ${((Date.now() - started) / 1000).toFixed(0)} s`);
  return folder;
}

/** The last day of data `plumbline totals` takes by default, passed to it explicitly: min(the plan's end, yesterday UTC). */
function defaultDataThrough(): string {
  const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  return yesterday < PLAN.end ? yesterday : PLAN.end;
}

/**
 * The same aggregates by hand: first exposure per unit in the window, units in several arms excluded (and counted),
 * unknown arms counted; per unit, whether it placed an order after exposure (both demo metrics read order_placed);
 * n, Σy and Σy² per metric, per arm, per arm and day of first exposure, per arm and platform.
 */
export function handQuery(folder: string, dataThrough: string): string {
  const end = `(DATE '${dataThrough}' + INTERVAL 1 DAY)::TIMESTAMPTZ`;
  const arms = PLAN.arms.map(lit).join(', ');
  // Both of the demo plan's metrics are proportions over order_placed: one per-unit value, reported under each name.
  const metricList = `[${PLAN.metrics.map(lit).join(', ')}]`;
  return `
    SET TimeZone = 'UTC';
    WITH plan_rows AS (
      SELECT unit_id, arm, exposed_at, platform FROM read_parquet(${lit(join(folder, 'exposures.parquet'))})
      WHERE experiment = ${lit(PLAN.id)} AND unit_id IS NOT NULL
        AND exposed_at >= TIMESTAMPTZ '${PLAN.start} 00:00:00+00' AND exposed_at < ${end}
    ), units AS (
      SELECT unit_id, min(arm) AS arm, count(DISTINCT arm) AS arms, min(exposed_at) AS first_at, arg_min(platform, exposed_at) AS platform
      FROM plan_rows WHERE arm IN (${arms}) GROUP BY unit_id
    ), clean AS (SELECT * FROM units WHERE arms = 1),
    converted AS (
      SELECT DISTINCT e.unit_id FROM read_parquet(${lit(join(folder, 'events.parquet'))}) e JOIN clean c USING (unit_id)
      WHERE e.event = ${lit(PLAN.event)} AND e.occurred_at >= c.first_at AND e.occurred_at < ${end}
    ), per_unit AS (
      SELECT c.arm, c.first_at::DATE AS day, c.platform, (v.unit_id IS NOT NULL)::INTEGER AS y
      FROM clean c LEFT JOIN converted v USING (unit_id)
    ), sums AS (
      SELECT arm, day, platform, count(*) AS units, sum(y) AS sum_y, sum(y * y) AS sum_y2
      FROM per_unit GROUP BY GROUPING SETS ((arm), (arm, day), (arm, platform))
    ), metrics AS (SELECT unnest(${metricList}) AS metric)
    SELECT CASE WHEN day IS NOT NULL THEN 'day' WHEN platform IS NOT NULL THEN 'segment' ELSE 'arm' END AS grain, arm,
      coalesce(strftime(day, '%Y-%m-%d'), 'platform: ' || platform) AS bucket, m.metric, units, sum_y, sum_y2
    FROM sums CROSS JOIN metrics m
    UNION ALL SELECT 'excluded', NULL, 'several-arms', NULL, count(*), NULL, NULL FROM units WHERE arms > 1
    UNION ALL SELECT 'excluded', NULL, 'unknown-arm', NULL, count(*), NULL, NULL FROM plan_rows WHERE arm NOT IN (${arms})`;
}

const countQuery = (folder: string) =>
  `SELECT (SELECT count(*) FROM read_parquet(${lit(join(folder, 'exposures.parquet'))})) + (SELECT count(*) FROM read_parquet(${lit(join(folder, 'events.parquet'))})) AS n_rows`;

const measured = (runs: Timed[]): Measured => {
  const rss = runs.map((r) => r.rssKiB).filter((k): k is number => k !== undefined);
  return { ms: median(runs.map((r) => r.ms)), ...(rss.length ? { rssMiB: Math.max(...rss) / 1024 } : {}) };
};

/** Whether dist/cli.js has the totals command (it comes with the SQL totals work; rebuild dist/ after merging it). */
function totalsCommand(cli: string): string | undefined {
  const help = spawnSync(process.execPath, [cli, 'totals', '--help'], { encoding: 'utf8' });
  if (help.status === 0 && help.stdout.includes('--data')) return undefined;
  const why = existsSync('src/cli/totals-command.ts') ? 'dist/cli.js has no totals command yet: run npm run build' : 'the totals command is not in this branch';
  return `plumbline totals not available (${why})`;
}

export async function benchTotals(options: TotalsBenchOptions): Promise<TotalsBenchResult> {
  const exposures = Math.round(FULL.exposures * options.scale);
  const events = Math.round(FULL.events * options.scale);
  const folder = await benchFiles(exposures, events);
  const megabytes = readdirSync(folder).reduce((sum, f) => sum + statSync(join(folder, f)).size, 0) / 1e6;
  const work = mkdtempSync(join(tmpdir(), 'plumbline-bench-totals-'));
  try {
    const dataThrough = defaultDataThrough();
    writeFileSync(join(work, 'hand.sql'), handQuery(folder, dataThrough));
    writeFileSync(join(work, 'count.sql'), countQuery(folder));
    const child = resolve('bench', 'totals-child.mjs');
    const cli = resolve('dist', 'cli.js');
    const duck = (file: string) => () => timed(process.execPath, [child, join(work, file), options.memoryLimit]);
    const out = join(work, 'totals.yaml');
    // A copy of the demo repository whose settings read the experiment column and the platform segment, as the
    // hand-written query does; --progress asks for the progress line on stderr, drawn only on a terminal otherwise.
    const repo = join(work, 'repo');
    cpSync(PLAN.repo, repo, { recursive: true });
    appendFileSync(join(repo, '.plumbline.yml'), 'data:\n  exposures: { experiment: experiment, segments: [platform] }\n');
    // --data is relative to the repository: link the cached files in rather than copy gigabytes.
    symlinkSync(folder, join(repo, 'exports'));
    const plumblineArgs = [cli, '-C', repo, 'totals', PLAN.id, '--data', 'exports', '--through', dataThrough, '--plan-commit', '5e0c9a4', '--progress', '--out', out];
    const unavailable = totalsCommand(cli);

    // One untimed run of each, to warm the file cache and to check that plumbline and the hand query agree.
    progress('warm-up run and agreement check');
    const hand = JSON.parse(spawnSync(process.execPath, [child, join(work, 'hand.sql'), options.memoryLimit], { encoding: 'utf8', maxBuffer: 1 << 26 }).stdout) as { grain: string; arm: string; metric: string | null; units: string }[];
    const handUnits = Object.fromEntries(hand.filter((r) => r.grain === 'arm' && r.metric === PLAN.metrics[0]).map((r) => [r.arm, Number(r.units)]));
    let agreement: { same: boolean; detail: string } | undefined;
    if (!unavailable) {
      const first = spawnSync(process.execPath, plumblineArgs, { encoding: 'utf8' });
      if (first.status !== 0) throw new Error(`plumbline totals failed (exit ${first.status}): ${first.stderr}`);
      const file = parse(readFileSync(out, 'utf8')) as { arms?: Record<string, { units?: number }> };
      const theirs = Object.fromEntries(PLAN.arms.map((a) => [a, file.arms?.[a]?.units]));
      const same = PLAN.arms.every((a) => theirs[a] === handUnits[a]);
      agreement = { same, detail: `units per arm: hand ${JSON.stringify(handUnits)}, plumbline ${JSON.stringify(theirs)}` };
    }

    const commands: Record<string, () => Timed> = { count: duck('count.sql'), hand: duck('hand.sql') };
    if (!unavailable) commands.plumbline = () => timed(process.execPath, plumblineArgs);
    let round = 0;
    const withProgress = Object.fromEntries(
      Object.entries(commands).map(([name, run]) => [
        name,
        () => {
          progress(`round ${Math.floor(round++ / Object.keys(commands).length) + 1}/${options.rounds}: ${name}`);
          return run();
        },
      ]),
    );
    const runs = interleave(options.rounds, withProgress);
    const result: TotalsBenchResult = { exposures, events, megabytes, count: measured(runs.count!), hand: measured(runs.hand!) };
    if (unavailable) result.unavailable = unavailable;
    else {
      // The command's own progress: at least one line on stderr while it ran.
      const progressLine = runs.plumbline!.every((r) => r.stderr.trim().length > 0);
      result.plumbline = { ...measured(runs.plumbline!), progressLine, sameUnits: agreement!.same, detail: agreement!.detail };
    }
    return result;
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/** The lines `npm run bench -- totals` prints; true when a target is missed. */
export function reportTotals(r: TotalsBenchResult, options: TotalsBenchOptions): boolean {
  const mib = (m: Measured) => (m.rssMiB === undefined ? 'peak memory not measured (no GNU time)' : `peak ${m.rssMiB.toFixed(0)} MiB`);
  console.log(
    `\nArm totals from Parquet: ${r.exposures.toLocaleString('en')} exposures, ${r.events.toLocaleString('en')} events (${r.megabytes.toFixed(0)} MB of files); ` +
      `${cpus().length} cores, ${(totalmem() / 2 ** 30).toFixed(0)} GiB RAM; median of ${options.rounds} interleaved rounds, each a fresh process`,
  );
  console.log(`  ${'SELECT count(*) over the files'.padEnd(36)} ${r.count.ms.toFixed(0).padStart(7)} ms  ${mib(r.count)}`);
  console.log(`  ${`hand-written DuckDB query`.padEnd(36)} ${r.hand.ms.toFixed(0).padStart(7)} ms  ${mib(r.hand)} (memory_limit ${options.memoryLimit}); ${(r.hand.ms / r.count.ms).toFixed(1)}x the count`);
  if (!r.plumbline) {
    console.log(`  ${r.unavailable}: no figure`);
    return true;
  }
  const ratio = r.plumbline.ms / r.hand.ms;
  const underMemory = r.plumbline.rssMiB !== undefined && r.plumbline.rssMiB < 2048;
  const ok = ratio <= 1.2 && underMemory && r.plumbline.progressLine && r.plumbline.sameUnits;
  console.log(
    `  ${'plumbline totals'.padEnd(36)} ${r.plumbline.ms.toFixed(0).padStart(7)} ms  ${mib(r.plumbline)} | ${ratio.toFixed(2)}x the hand-written query (target 1.2x), ` +
      `memory target under 2048 MiB, progress on stderr ${r.plumbline.progressLine ? 'yes' : 'NO'}, ${r.plumbline.sameUnits ? 'same units per arm' : `UNITS DIFFER (${r.plumbline.detail})`} ${ok ? 'met' : 'MISSED'}`,
  );
  return !ok;
}
