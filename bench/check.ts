// Benchmark of what users wait for, each figure a median of interleaved rounds beside a reference
// measured in the same loop (so a busy machine slows both):
//   start:  `--version`, `--help` and `validate` on a tiny repository and on 2,000 plans, beside `node -e 0`
//           (and beside reading + yaml.parse of the same plans for the 2,000-plan row);
//   check:  the whole `plumbline check` with head checked out and not (git objects), at 1x, 2x and 4x the
//           generated tree, beside `rg -j1 -F -c` for the same names over the same files; peak memory.
// Options: --scales 1,2,4  --rounds 5  --names 50  --busy (one CPU-bound process competes the whole time).
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { generatePlanText } from './generate-plans.js';
import { eventNames, scanRepo } from './scan-repo.js';

export interface Timed {
  ms: number;
  /** Peak resident memory of the process tree, KiB (from GNU time), when available. */
  rssKiB?: number;
  status: number | null;
  /** What the command wrote to stderr (progress lines, errors). */
  stderr: string;
}

const GNU_TIME = spawnSync('/usr/bin/time', ['-f', '%M', 'true']).status === 0;

/** Runs a command to completion and times it; with GNU time present, also its peak memory. */
export function timed(command: string, args: string[], options: { cwd?: string } = {}): Timed {
  const rssFile = join(tmpdir(), `plumbline-rss-${process.pid}`);
  const [cmd, argv] = GNU_TIME ? ['/usr/bin/time', ['-f', '%M', '-o', rssFile, command, ...args]] : [command, args];
  const start = process.hrtime.bigint();
  const run = spawnSync(cmd, argv, { cwd: options.cwd, stdio: ['ignore', 'ignore', 'pipe'], maxBuffer: 1 << 26 });
  const ms = Number(process.hrtime.bigint() - start) / 1e6;
  const rssKiB = GNU_TIME ? Number(readFileSync(rssFile, 'utf8').trim().split('\n').pop()) : undefined;
  return { ms, status: run.status, stderr: run.stderr?.toString() ?? '', ...(rssKiB !== undefined && Number.isFinite(rssKiB) ? { rssKiB } : {}) };
}

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** Runs every named command once per round, in a rotating order, and keeps each one's times. */
export function interleave(rounds: number, commands: Record<string, () => Timed>): Record<string, Timed[]> {
  const names = Object.keys(commands);
  const results: Record<string, Timed[]> = Object.fromEntries(names.map((n) => [n, []]));
  for (let round = 0; round < rounds; round++) {
    for (let k = 0; k < names.length; k++) {
      const name = names[(k + round) % names.length]!;
      const result = commands[name]!();
      if (result.status !== 0 && !name.startsWith('rg')) throw new Error(`${name} exited ${result.status}`);
      results[name]!.push(result);
    }
  }
  return results;
}

const GIT_ENV = { ...process.env, GIT_AUTHOR_NAME: 'b', GIT_AUTHOR_EMAIL: 'b@b.invalid', GIT_COMMITTER_NAME: 'b', GIT_COMMITTER_EMAIL: 'b@b.invalid' };

/** Branch `bench` = main plus a plan naming `names` (one exposure event, the rest metric events). */
export function commitPlanBranch(root: string, names: readonly string[]): void {
  const plan = {
    id: 'bench-plan', title: 'Bench', owners: ['@bench'], flags: ['bench-flag'], state: 'draft',
    window: { start: '2026-11-02', end: '2026-11-29' },
    hypothesis: { change: 'x', because: 'y', 'expected-direction': 'increase' },
    unit: { randomization: 'user' }, surface: { path: 'bench/area' },
    exposure: { event: names[0] },
    metrics: { primary: { name: 'p', kind: 'proportion', baseline: { rate: 0.2 }, events: names.slice(1) } },
    design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 10000 },
    decisions: { win: 'a', flat: 'b', loss: 'c', 'guardrail-breach': 'd' },
  };
  const git = (...args: string[]) => execFileSync('git', args, { cwd: root, env: GIT_ENV, stdio: 'pipe' });
  git('checkout', '-q', '-B', 'bench', 'main');
  mkdirSync(join(root, 'experiments'), { recursive: true });
  writeFileSync(join(root, 'experiments', 'bench.yaml'), JSON.stringify(plan, null, 1));
  git('add', 'experiments/bench.yaml');
  git('commit', '-q', '-m', `plan naming ${names.length} events`);
  git('checkout', '-q', 'main');
}

/** A CPU-bound process on one core for the length of a measurement, as another CI job would be. */
function startBusy(): () => void {
  const child = spawn(process.execPath, ['-e', 'for (;;) {}'], { stdio: 'ignore' });
  return () => child.kill();
}

export interface CheckRow {
  scale: number;
  files: number;
  megabytes: number;
  names: number;
  rgMs: number;
  checkedOutMs: number;
  objectsMs: number;
  checkedOutRssMiB?: number;
  objectsRssMiB?: number;
}

export function benchCheck(options: { scales: number[]; rounds: number; names: number; busy: boolean; node: string }): CheckRow[] {
  const rows: CheckRow[] = [];
  const cli = join(process.cwd(), 'dist', 'cli.js');
  for (const scale of options.scales) {
    const repo = scanRepo(scale);
    const names = eventNames(2000).slice(0, options.names);
    commitPlanBranch(repo.root, names);
    const tracked = execFileSync('git', ['ls-tree', '-r', '-z', '--name-only', 'bench'], { cwd: repo.root, encoding: 'utf8', maxBuffer: 1 << 28 }).split('\0').filter(Boolean);
    const work = mkdtempSync(join(tmpdir(), 'plumbline-check-'));
    const namesFile = join(work, 'names.txt');
    writeFileSync(namesFile, `${names.join('\n')}\n`);
    const checkArgs = [cli, '-C', repo.root, 'check', '--base', 'main', '--head', 'bench', '--format', 'json'];
    const git = (...args: string[]) => execFileSync('git', args, { cwd: repo.root, stdio: 'pipe' });
    const stopBusy = options.busy ? startBusy() : () => undefined;
    try {
      const results = interleave(options.rounds, {
        // ripgrep reads the working tree; it is the same files either way.
        rg: () => timed('rg', ['-j1', '-F', '-c', '-f', namesFile, ...tracked], { cwd: repo.root }),
        checkedOut: () => {
          git('checkout', '-q', 'bench');
          return timed(options.node, checkArgs);
        },
        objects: () => {
          git('checkout', '-q', 'main');
          return timed(options.node, checkArgs);
        },
      });
      const rss = (r: Timed[]) => (r.every((t) => t.rssKiB !== undefined) ? Math.max(...r.map((t) => t.rssKiB!)) / 1024 : undefined);
      const checkedOutRssMiB = rss(results.checkedOut!);
      const objectsRssMiB = rss(results.objects!);
      rows.push({
        scale,
        files: tracked.length,
        megabytes: repo.bytes / 2 ** 20,
        names: names.length,
        rgMs: median(results.rg!.map((t) => t.ms)),
        checkedOutMs: median(results.checkedOut!.map((t) => t.ms)),
        objectsMs: median(results.objects!.map((t) => t.ms)),
        ...(checkedOutRssMiB !== undefined ? { checkedOutRssMiB } : {}),
        ...(objectsRssMiB !== undefined ? { objectsRssMiB } : {}),
      });
    } finally {
      stopBusy();
      git('checkout', '-q', 'main');
      rmSync(work, { recursive: true, force: true });
    }
  }
  return rows;
}

export interface StartRow {
  what: string;
  reference: string;
  referenceMs: number;
  subjectMs: number;
  target: number;
}

/** Start-up: --version, --help and validate (tiny repository, 2,000 plans) beside `node -e 0` and reading + parsing. */
export function benchStart(options: { rounds: number; busy: boolean; node: string }): StartRow[] {
  const cli = join(process.cwd(), 'dist', 'cli.js');
  const tiny = mkdtempSync(join(tmpdir(), 'plumbline-tiny-'));
  const many = mkdtempSync(join(tmpdir(), 'plumbline-plans-'));
  mkdirSync(join(tiny, 'experiments'));
  writeFileSync(join(tiny, 'experiments', 'one.yaml'), generatePlanText(0));
  mkdirSync(join(many, 'experiments'));
  for (let i = 0; i < 2000; i++) writeFileSync(join(many, 'experiments', `plan-${i}.yaml`), generatePlanText(i));
  // The reference for 2,000 plans: a bare Node process that lists, reads and yaml.parses the same files.
  const readParse = join(many, 'read-parse.mjs');
  writeFileSync(
    readParse,
    `import { readdirSync, readFileSync } from 'node:fs';\nimport YAML from ${JSON.stringify(join(process.cwd(), 'node_modules', 'yaml', 'dist', 'index.js'))};\nconst dir = ${JSON.stringify(join(many, 'experiments'))};\nfor (const f of readdirSync(dir)) YAML.parse(readFileSync(dir + '/' + f, 'utf8'));\n`,
  );
  const node = (...args: string[]) => () => timed(options.node, args);
  const stopBusy = options.busy ? startBusy() : () => undefined;
  try {
    const r = interleave(options.rounds, {
      bare: node('-e', '0'),
      version: node(cli, '--version'),
      help: node(cli, '--help'),
      validateTiny: node(cli, '-C', tiny, 'validate'),
      readParse: node(readParse),
      validateMany: node(cli, '-C', many, 'validate'),
    });
    const m = (name: string) => median(r[name]!.map((t) => t.ms));
    return [
      { what: '`plumbline --version`', reference: '`node -e 0`', referenceMs: m('bare'), subjectMs: m('version'), target: 1.5 },
      { what: '`plumbline --help`', reference: '`node -e 0`', referenceMs: m('bare'), subjectMs: m('help'), target: 1.5 },
      { what: '`plumbline validate`, one plan', reference: '`node -e 0`', referenceMs: m('bare'), subjectMs: m('validateTiny'), target: 1.5 },
      { what: '`plumbline validate`, 2,000 plans', reference: 'node: read + `yaml.parse` each', referenceMs: m('readParse'), subjectMs: m('validateMany'), target: 2 },
    ];
  } finally {
    stopBusy();
    rmSync(tiny, { recursive: true, force: true });
    rmSync(many, { recursive: true, force: true });
  }
}
