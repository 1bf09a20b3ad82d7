// Benchmark: the event search step and the whole check, beside ripgrep over the same tracked files and names.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'esbuild';
import { commitPlanBranch } from './check.js';
import { givenTree, scanRepo } from './scan-repo.js';

function wall(command: string, args: string[], options: { cwd?: string; input?: string } = {}): { ms: number; stdout: string; status: number | null } {
  const start = process.hrtime.bigint();
  const run = spawnSync(command, args, { cwd: options.cwd, encoding: 'utf8', maxBuffer: 1 << 28, input: options.input });
  return { ms: Number(process.hrtime.bigint() - start) / 1e6, stdout: run.stdout, status: run.status };
}

function median(values: number[]): number {
  return [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
}

/** Branch `bench` = main plus a plan that names every event, checked out as CI would have it. */
function checkOutPlanBranch(root: string, names: readonly string[]): void {
  commitPlanBranch(root, names);
  execFileSync('git', ['checkout', '-q', 'bench'], { cwd: root, stdio: 'pipe' });
}

export interface ScanFigures {
  files: number;
  megabytes: number;
  scale: number;
  rows: { names: number; rgMs: number; searchMs: number; checkMs: number; searchRss: number; checkRss: number; correct: boolean; sampled: number }[];
  rgAvailable: boolean;
}

export interface ScanOptions {
  /** Multiple of the generated tree (ignored for a given tree). */
  scale: number;
  rounds: number;
  /** The Node binary that runs Plumbline (default: this one). */
  node: string;
}

export async function benchScan(tree: string | undefined, options: ScanOptions): Promise<ScanFigures> {
  const repo = tree ? givenTree(tree) : scanRepo(options.scale);
  // A run stopped midway (or the check benchmark) can leave the generated tree on the plan branch: start from main.
  if (!tree && execFileSync('git', ['rev-parse', '--abbrev-ref', 'HEAD'], { cwd: repo.root, encoding: 'utf8' }).trim() === 'bench') {
    execFileSync('git', ['checkout', '-q', 'main'], { cwd: repo.root, stdio: 'pipe' });
  }
  const tracked = execFileSync('git', ['ls-files', '-z'], { cwd: repo.root, encoding: 'utf8', maxBuffer: 1 << 26 }).split('\0').filter(Boolean);
  const rgAvailable = spawnSync('rg', ['--version']).status === 0;
  const startBranch = execFileSync('git', ['rev-parse', '--abbrev-ref', 'HEAD'], { cwd: repo.root, encoding: 'utf8' }).trim();
  if (execFileSync('git', ['status', '--porcelain', '--untracked-files=no'], { cwd: repo.root, encoding: 'utf8' }).trim()) {
    throw new Error(`${repo.root} has uncommitted changes; the benchmark commits on a branch of its own and needs a clean tree`);
  }
  const work = mkdtempSync(join(tmpdir(), 'plumbline-scan-'));
  // The child runs the real search code (bundled like dist/, without a TypeScript loader in the way).
  const child = join(work, 'search-child.mjs');
  await build({ entryPoints: ['bench/search-child.ts'], bundle: true, platform: 'node', format: 'esm', outfile: child, logLevel: 'warning', banner: { js: "import { createRequire } from 'node:module'; const require = createRequire(import.meta.url);" } });
  const rows: ScanFigures['rows'] = [];
  try {
    for (const count of [50, 500, 2000] as const) {
      const names = repo.names[count];
      const namesFile = join(work, `names-${count}.txt`);
      writeFileSync(namesFile, `${names.join('\n')}\n`);
      const listFile = join(work, 'files.txt');
      writeFileSync(listFile, tracked.join('\n'));
      const rgTimes: number[] = [];
      const searchTimes: number[] = [];
      const checkTimes: number[] = [];
      let searchRss = 0;
      let checkRss = 0;
      let correct = true;
      let sampled = 0;
      for (let round = 0; round < options.rounds; round++) {
        if (rgAvailable) rgTimes.push(wall('rg', ['-j1', '-F', '-c', '-f', namesFile, ...tracked], { cwd: repo.root }).ms);
        const search = wall(options.node, [child, 'search', repo.root, namesFile]);
        const result = JSON.parse(search.stdout);
        searchTimes.push(search.ms);
        searchRss = Math.max(searchRss, result.maxRssKiB);
        checkOutPlanBranch(repo.root, names);
        const check = wall(options.node, ['dist/cli.js', '-C', repo.root, 'check', '--base', startBranch, '--head', 'bench', '--format', 'json']);
        if (check.status !== 0) throw new Error(`check exited ${check.status}`);
        checkTimes.push(check.ms);
        checkRss = Math.max(checkRss, JSON.parse(wall(options.node, [child, 'check', repo.root, namesFile, startBranch]).stdout).maxRssKiB);
        execFileSync('git', ['checkout', '-q', 'main'], { cwd: repo.root });
        if (round === 0) {
          // Verify first locations for a sample of names with a plain indexOf over the files in order.
          const sample = names.filter((_, i) => i % Math.max(1, Math.floor(names.length / 25)) === 0);
          sampled = sample.length;
          // One pass over the files, every sampled name looked for in each until found.
          const expectedOf = new Map<string, string>();
          const pending = new Set(sample);
          for (const path of tracked) {
            if (pending.size === 0) break;
            const text = readFileSync(join(repo.root, path));
            for (const name of pending) {
              const at = text.indexOf(name);
              if (at < 0) continue;
              expectedOf.set(name, `${path}:${text.subarray(0, at).toString('utf8').split('\n').length}`);
              pending.delete(name);
            }
          }
          for (const name of sample) {
            const expected = expectedOf.get(name);
            const got = result.first[name] as string | undefined;
            if (got !== expected) {
              correct = false;
              console.error(`  wrong first location for ${name}: got ${got}, expected ${expected}`);
            }
          }
        }
      }
      rows.push({ names: count, rgMs: rgAvailable ? median(rgTimes) : NaN, searchMs: median(searchTimes), checkMs: median(checkTimes), searchRss, checkRss, correct, sampled });
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
    execFileSync('git', ['checkout', '-q', startBranch], { cwd: repo.root });
  }
  return { scale: options.scale, files: tracked.length, megabytes: repo.bytes / (1024 * 1024), rows, rgAvailable };
}
