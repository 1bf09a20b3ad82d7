// `npm run bench`: every benchmark, each reported beside a reference measured in the same run.
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
