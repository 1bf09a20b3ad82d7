/**
 * The fuzzer: `npm run fuzz -- [--runs N] [--seed N] [--time-limit MS] [--replay I] [--dump DIR]`.
 *
 * Generates repositories (plan, registry and settings files grown from the demo's by structure-aware
 * mutations, extreme numbers, damaged bytes and hand-written YAML) and runs each through the CLI itself,
 * in process: the real command-line program with files and the git change held in memory. It fails on an
 * internal error, a NaN, Infinity, ∞, n/a or null where a number belongs in any format, a problem without
 * file, line and field, and a command that takes more CPU time than the limit. Case I of seed S is always the same
 * repository: `--replay I --dump DIR` writes it out to run the installed CLI on.
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import fc from 'fast-check';
import { runCli } from '../src/cli/main.js';
import { caseArbitrary, type FuzzCase, type SeedFiles } from './fuzz/generate.js';
import { memoryChange, memoryFiles } from './fuzz/memory-repo.js';
import { checkOutput, signatureOf, type Failure } from './fuzz/oracles.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  if (at < 0) return fallback;
  const value = Number(process.argv[at + 1]);
  if (!Number.isSafeInteger(value) || value < 0) {
    console.error(`fuzz: --${name} needs a whole number; got ${process.argv[at + 1]}`);
    process.exit(2);
  }
  return value;
}

const runs = option('runs', 2_000);
const seed = option('seed', 1);
/** CPU milliseconds one command may take; the slowest valid repositories take well under a second. */
const timeLimitMs = option('time-limit', 5_000);
const replay = process.argv.includes('--replay') ? option('replay', 0) : undefined;
const dumpAt = process.argv.indexOf('--dump');
const dump = dumpAt >= 0 ? process.argv[dumpAt + 1] : undefined;

function seeds(): SeedFiles {
  const demo = join(root, 'demo/repo');
  const plans = readdirSync(join(demo, 'experiments')).sort().map((f) => readFileSync(join(demo, 'experiments', f), 'utf8'));
  return { plans, registry: readFileSync(join(demo, 'registry/partner-tests.yaml'), 'utf8'), settings: readFileSync(join(demo, '.plumbline.yml'), 'utf8') };
}

const arbitrary = caseArbitrary(seeds());
/** Case i of a seed, on its own: any case can be replayed without generating the ones before it. */
const caseAt = (i: number): FuzzCase => fc.sample(arbitrary, { seed: (seed * 1_000_003 + i) | 0, numRuns: 1 })[0]!;

/**
 * The commands a case runs, as a user would type them: validate (every problem must be located), then
 * one of list, size, digest and check in one format. One command per case keeps a case cheap, so a run
 * covers more files; over many cases every command meets every format.
 */
function commandsOf(c: FuzzCase): { argv: string[]; format: string }[] {
  const { name, format } = c.command;
  const formatArgs = ['--format', format];
  const second =
    name === 'list'
      ? ['list', ...formatArgs]
      : name === 'size'
        ? ['size', c.planFiles[0]!, ...formatArgs]
        : name === 'digest'
          ? ['digest', '--today', '2026-12-08', ...formatArgs]
          : ['check', '--base', 'main', '--title', c.prTitle, '--body', c.prBody, ...formatArgs];
  return [
    { argv: ['validate', '--format', 'json'], format: 'json' },
    { argv: second, format },
  ];
}

async function runCase(c: FuzzCase): Promise<Failure[]> {
  const inputText = [...c.head.values(), c.prBody, c.prTitle].join('\n');
  const failures: Failure[] = [];
  for (const { argv, format } of commandsOf(c)) {
    let stdout = '';
    let stderr = '';
    // CPU time, not wall time: on a shared machine the wall clock measures the neighbours.
    const started = process.cpuUsage();
    const exit = await runCli(['node', 'plumbline', '-C', '/repo', ...argv], {
      files: () => memoryFiles(c.head),
      openChange: async () => memoryChange(c.base, c.head),
      write: { out: (t) => void (stdout += t), err: (t) => void (stderr += t) },
    });
    const used = process.cpuUsage(started);
    const ms = (used.user + used.system) / 1000;
    failures.push(...checkOutput({ command: argv[0]!, format, exit, stdout, stderr, ms, timeLimitMs, inputText }));
  }
  return failures;
}

function dumpCase(c: FuzzCase, folder: string): void {
  for (const [side, files] of [['base', c.base], ['head', c.head]] as const) {
    for (const [path, text] of files) {
      mkdirSync(dirname(join(folder, side, path)), { recursive: true });
      writeFileSync(join(folder, side, path), text);
    }
  }
  writeFileSync(join(folder, 'pr.json'), JSON.stringify({ title: c.prTitle, body: c.prBody }, null, 2));
  console.log(`wrote ${folder}/base and ${folder}/head (commit them as two commits to run plumbline check), and pr.json`);
}

async function main(): Promise<void> {
  if (replay !== undefined) {
    const c = caseAt(replay);
    if (dump) dumpCase(c, dump);
    const failures = await runCase(c);
    for (const f of failures) console.log(`${f.kind}: ${f.detail}`);
    process.exitCode = failures.length ? 1 : 0;
    return;
  }
  const found = new Map<string, { count: number; first: number; detail: string }>();
  const started = performance.now();
  let lastReport = started;
  for (let i = 0; i < runs; i++) {
    for (const failure of await runCase(caseAt(i))) {
      const signature = signatureOf(failure);
      const seen = found.get(signature);
      if (seen) seen.count++;
      else {
        found.set(signature, { count: 1, first: i, detail: failure.detail });
        console.log(`case ${i}: ${failure.kind}: ${failure.detail}`);
      }
    }
    const now = performance.now();
    if (now - lastReport > 30_000) {
      console.log(`… ${i + 1} of ${runs} cases, ${((now - started) / 1000).toFixed(0)} s`);
      lastReport = now;
    }
  }
  const seconds = (performance.now() - started) / 1000;
  console.log(`\n${runs} cases (seed ${seed}) in ${seconds.toFixed(1)} s (${(runs / seconds).toFixed(1)} cases/s).`);
  if (found.size === 0) {
    console.log('No failures.');
    return;
  }
  console.log(`${found.size} kinds of failure:`);
  for (const [signature, { count, first }] of [...found].sort((a, b) => b[1].count - a[1].count)) {
    console.log(`  ${count}× ${signature}\n     replay: npm run fuzz -- --seed ${seed} --replay ${first} --dump /tmp/case-${first}`);
  }
  process.exitCode = 1;
}

await main();
