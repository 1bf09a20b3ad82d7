// `npm run bench`: every benchmark, each reported beside a reference measured in the same run.
import { execFileSync } from 'node:child_process';
import { cpus, loadavg, totalmem } from 'node:os';
import { benchPlanLoading } from './load-plans.js';
import { benchSizing } from './size-plans.js';

const perPlan = (ms: number, count: number) => `${((ms * 1000) / count).toFixed(0)} µs/plan`;
let missed = 0;

function report(label: string, figures: { referenceMs: number; subjectMs: number }, count: number, reference: string, subject: string, target: number): void {
  const ratio = figures.subjectMs / figures.referenceMs;
  if (ratio > target) missed++;
  console.log(`  ${label}`);
  console.log(`    ${reference.padEnd(34)} ${figures.referenceMs.toFixed(0).padStart(6)} ms  (${perPlan(figures.referenceMs, count)})`);
  console.log(`    ${subject.padEnd(34)} ${figures.subjectMs.toFixed(0).padStart(6)} ms  (${perPlan(figures.subjectMs, count)})`);
  console.log(`    ratio ${ratio.toFixed(2)}x (target: at most ${target}x) ${ratio <= target ? 'met' : 'MISSED'}`);
}

const only = process.argv[2];
/** `npm run bench -- scan /path/to/repo` searches a tree of your own instead of the generated one. */
const tree = process.argv[3]?.startsWith('--') ? undefined : process.argv[3];
/** `--scales 1,2,4`, `--rounds 5`, `--names 50`, `--busy` for the check and start parts. */
const flag = (name: string) => {
  const at = process.argv.indexOf(`--${name}`);
  return at === -1 ? undefined : (process.argv[at + 1] ?? '');
};
const rounds = Number(flag('rounds') ?? 5);
const busy = process.argv.includes('--busy');
/** `--node /path/to/node`: run Plumbline (and the `node -e 0` reference) with another Node, e.g. Node 24. */
const node = flag('node') ?? process.execPath;
const nodeVersion = execFileSync(node, ['--version'], { encoding: 'utf8' }).trim();
const scales = (flag('scales') ?? '1,2,4').split(',').map(Number);
/** The machine's size and its load average when a heading is printed. */
const machine = () => `${cpus().length} CPUs, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, load ${loadavg().map((l) => l.toFixed(2)).join(' ')}`;
const x = (ratio: number) => `${ratio.toFixed(2)}x`;

if (!only || only === 'load') {
  const loading = await benchPlanLoading();
  console.log(`Plan loading: ${loading.count.toLocaleString('en')} generated plans, median of 7 rounds`);
  report('in memory', loading.memory, loading.count, 'yaml.parse of each text', 'loadPlan (parse, validate, rules)', 2);
  report('from disk', loading.disk, loading.count, 'read each file + yaml.parse', 'loadWorkspace (find, read, load)', 2);
}

if (!only || only === 'size') {
  const s = benchSizing();
  const ratio = s.sizingMs / s.quantileLoopMs;
  console.log(`\nSizing: ${s.count.toLocaleString('en')} generated plans, ${s.metrics.toLocaleString('en')} metrics (primary and guardrails; ${s.failures} could not be sized)`);
  console.log(`    ${'2,000 normal quantile calls'.padEnd(34)} ${s.quantileLoopMs.toFixed(2).padStart(8)} ms`);
  console.log(`    ${'sizePlan on every plan'.padEnd(34)} ${s.sizingMs.toFixed(0).padStart(8)} ms  (${perPlan(s.sizingMs, s.count)}; ${ratio.toFixed(0)}x the quantile loop)`);
  console.log('  K = 10 sequential design (boundaries and inflation factor at 80% power)');
  for (const [kind, ms] of Object.entries(s.sequentialMs)) {
    console.log(`    ${kind.padEnd(34)} ${ms.toFixed(0).padStart(8)} ms  (${(ms / s.quantileLoopMs).toFixed(0)}x the quantile loop)`);
  }
}
process.exitCode = missed ? 1 : 0;

if (!only || only === 'scan') {
  const { benchScan } = await import('./scan.js');
  for (const scale of tree ? [1] : scales) {
    const s = await benchScan(tree, { scale, rounds: Number(flag('rounds') ?? 3), node });
    console.log(`\nEvent search at ${tree ? 'the given tree' : `${scale}x`}: ${s.files.toLocaleString('en')} tracked files, ${s.megabytes.toFixed(0)} MB; median of ${flag('rounds') ?? 3} rounds, each a fresh process (${nodeVersion}; ${machine()})`);
    if (!s.rgAvailable) console.log('  ripgrep (rg) is not installed: apt-get install ripgrep to compare');
    for (const r of s.rows) {
      const searchRatio = r.searchMs / r.rgMs;
      const checkRatio = r.checkMs / r.rgMs;
      const searchTarget = r.names === 50 ? 3 : 2;
      const rss = r.checkRss / 1024;
      const ok = searchRatio <= searchTarget && checkRatio <= 3 && (r.names !== 2000 || rss <= 150) && r.correct;
      if (!ok) missed++;
      console.log(`  ${String(r.names).padStart(4)} names: rg -j1 -F -c ${r.rgMs.toFixed(0)} ms | search ${r.searchMs.toFixed(0)} ms (${searchRatio.toFixed(2)}x, target ${searchTarget}x) | plumbline check ${r.checkMs.toFixed(0)} ms (${checkRatio.toFixed(2)}x, target 3x) | peak RSS search ${(r.searchRss / 1024).toFixed(0)} MiB, check ${rss.toFixed(0)} MiB${r.names === 2000 ? ' (target 150)' : ''} | first locations ${r.correct ? 'correct' : 'WRONG'} (${r.sampled} sampled) ${ok ? 'met' : 'MISSED'}`);
    }
  }
  process.exitCode = missed ? 1 : 0;
}

if (!only || only === 'start') {
  const { benchStart } = await import('./check.js');
  console.log(`\nStart-up: median of ${rounds} interleaved rounds${busy ? ', one CPU-bound process competing' : ''} (${nodeVersion}; ${machine()})`);
  for (const r of benchStart({ rounds, busy, node })) {
    const ratio = r.subjectMs / r.referenceMs;
    if (ratio > r.target) missed++;
    console.log(`  ${r.what.padEnd(36)} ${r.subjectMs.toFixed(0).padStart(6)} ms | ${r.reference} ${r.referenceMs.toFixed(0)} ms | ${x(ratio)} (target ${r.target}x) ${ratio <= r.target ? 'met' : 'MISSED'}`);
  }
  process.exitCode = missed ? 1 : 0;
}

if (!only || only === 'check') {
  const { benchCheck } = await import('./check.js');
  const names = Number(flag('names') ?? 50);
  console.log(`\nThe whole check, head checked out and not (git objects), beside rg -j1 -F -c: median of ${rounds} interleaved rounds${busy ? ', one CPU-bound process competing' : ''} (${nodeVersion}; ${machine()})`);
  for (const r of benchCheck({ scales, rounds, names, busy, node })) {
    const co = r.checkedOutMs / r.rgMs;
    const obj = r.objectsMs / r.rgMs;
    const paths = r.objectsMs / r.checkedOutMs;
    const ok = co <= 3 && obj <= 3 && paths <= 1.5;
    if (!ok) missed++;
    const mem = r.checkedOutRssMiB !== undefined ? ` | peak ${r.checkedOutRssMiB.toFixed(0)} / ${r.objectsRssMiB?.toFixed(0)} MiB` : '';
    console.log(
      `  ${r.scale}x (${r.files.toLocaleString('en')} files, ${r.megabytes.toFixed(0)} MB, ${r.names} names): rg ${r.rgMs.toFixed(0)} ms | checked out ${r.checkedOutMs.toFixed(0)} ms (${x(co)}) | objects ${r.objectsMs.toFixed(0)} ms (${x(obj)}; ${x(paths)} the checked-out path, target 1.5x)${mem} ${ok ? 'met' : 'MISSED'}`,
    );
  }
  process.exitCode = missed ? 1 : 0;
}

// Only when asked for by name: it generates gigabytes of Parquet on its first run (then cached under .bench/).
if (only === 'totals') {
  const { benchTotals, reportTotals } = await import('./totals.js');
  const options = { scale: Number(flag('scale') ?? 1), rounds: Number(flag('rounds') ?? 3), memoryLimit: flag('memory-limit') ?? '1.5GiB' };
  if (!(options.scale > 0)) throw new Error('--scale must be a number above 0, e.g. 0.01');
  if (reportTotals(await benchTotals(options), options)) missed++;
  process.exitCode = missed ? 1 : 0;
}
