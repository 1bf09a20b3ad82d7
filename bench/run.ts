// `npm run bench`: every benchmark, each reported as a ratio against a reference measured in the same run.
import { benchPlanLoading } from './load-plans.js';

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

const loading = await benchPlanLoading();
console.log(`Plan loading: ${loading.count.toLocaleString('en')} generated plans, median of 7 rounds`);
report('in memory', loading.memory, loading.count, 'yaml.parse of each text', 'loadPlan (parse, validate, rules)', 2);
report('from disk', loading.disk, loading.count, 'read each file + yaml.parse', 'loadWorkspace (find, read, load)', 2);
process.exitCode = missed ? 1 : 0;
