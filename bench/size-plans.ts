// Benchmark: sizing every plan of a generated registry, and a K = 10 sequential design, beside a
// plain loop of normal quantile calls measured in the same run.
import { loadPlan } from '../src/core/plan/load.js';
import type { Plan } from '../src/core/plan/schema.js';
import { normalQuantile } from '../src/core/stats/distributions.js';
import { sizePlan } from '../src/core/stats/plan-sizing.js';
import { integrateInflation } from '../src/core/stats/sequential.js';
import { generatePlanText } from './generate-plans.js';

const COUNT = 2000;

function time(run: () => unknown, rounds = 3): number {
  const times: number[] = [];
  for (let i = 0; i < rounds; i++) {
    const start = process.hrtime.bigint();
    run();
    times.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  return times.sort((a, b) => a - b)[Math.floor(rounds / 2)]!;
}

export interface SizingFigures {
  count: number;
  metrics: number;
  failures: number;
  quantileLoopMs: number;
  sizingMs: number;
  sequentialMs: Record<string, number>;
}

export function benchSizing(): SizingFigures {
  const plans: Plan[] = Array.from({ length: COUNT }, (_, i) => {
    const r = loadPlan(generatePlanText(i), `bench-${i}.yaml`);
    if (!r.ok) throw new Error('generated plan did not load');
    return r.loaded.plan;
  });
  let metrics = 0;
  let failures = 0;
  const sizeAll = () => {
    metrics = 0;
    failures = 0;
    for (const plan of plans) {
      for (const m of sizePlan(plan).metrics) {
        metrics++;
        if (!m.result.ok) failures++;
      }
    }
  };
  let sink = 0;
  const quantiles = () => {
    for (let i = 1; i <= COUNT; i++) sink += normalQuantile(i / (COUNT + 1));
  };
  quantiles();
  sizeAll(); // warm-up
  const quantileLoopMs = time(quantiles, 7);
  const sizingMs = time(sizeAll, 3);
  const sequentialMs: Record<string, number> = {};
  for (const kind of ['obrien-fleming-spending', 'pocock-spending', 'obrien-fleming', 'pocock'] as const) {
    sequentialMs[kind] = time(() => integrateInflation({ kind, looks: 10, alpha: 0.05, sides: 2 }, 0.8), 3);
  }
  if (sink === 0.5) console.log('');
  return { count: COUNT, metrics, failures, quantileLoopMs, sizingMs, sequentialMs };
}
