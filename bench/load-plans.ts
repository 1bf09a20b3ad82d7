// Benchmark: loading and validating plans against plain YAML parsing of the same files, in one process.
import { mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'yaml';
import { createRepoFiles } from '../src/adapters/files.js';
import { loadPlan } from '../src/core/plan/load.js';
import { loadWorkspace } from '../src/run/load-workspace.js';
import { generatePlanText } from './generate-plans.js';

const COUNT = 2000;
const ROUNDS = 7;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

async function time(run: () => unknown): Promise<number> {
  const start = process.hrtime.bigint();
  await run();
  return Number(process.hrtime.bigint() - start) / 1e6;
}

/** Times `subject` and `reference` alternately over several rounds; medians. */
async function compare(reference: () => unknown, subject: () => unknown): Promise<{ referenceMs: number; subjectMs: number }> {
  await reference();
  await subject(); // warm-up: JIT and the JSON Schema cache
  const referenceTimes: number[] = [];
  const subjectTimes: number[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    // Alternate the order so neither side always runs on a warmer heap.
    if (round % 2 === 0) {
      referenceTimes.push(await time(reference));
      subjectTimes.push(await time(subject));
    } else {
      subjectTimes.push(await time(subject));
      referenceTimes.push(await time(reference));
    }
  }
  return { referenceMs: median(referenceTimes), subjectMs: median(subjectTimes) };
}

export interface PlanLoadingFigures {
  count: number;
  memory: { referenceMs: number; subjectMs: number };
  disk: { referenceMs: number; subjectMs: number };
}

export async function benchPlanLoading(): Promise<PlanLoadingFigures> {
  const texts = Array.from({ length: COUNT }, (_, i) => generatePlanText(i));
  const invalid = texts.filter((t, i) => !loadPlan(t, `bench-${i}.yaml`).ok).length;
  if (invalid) throw new Error(`${invalid} generated plans did not load; the generator is broken`);

  const memory = await compare(
    () => texts.forEach((t) => parse(t)),
    () => texts.forEach((t, i) => loadPlan(t, `experiments/bench-plan-${i}.yaml`)),
  );

  const root = mkdtempSync(join(tmpdir(), 'plumbline-bench-'));
  try {
    mkdirSync(join(root, 'experiments'));
    texts.forEach((t, i) => writeFileSync(join(root, 'experiments', `bench-plan-${i}.yaml`), t));
    const files = createRepoFiles(root);
    const disk = await compare(
      () => readdirSync(join(root, 'experiments')).forEach((f) => parse(readFileSync(join(root, 'experiments', f), 'utf8'))),
      async () => {
        const result = await loadWorkspace({ files });
        if (!result.ok || result.workspace.plans.length !== COUNT) throw new Error('the workspace did not load every plan');
      },
    );
    return { count: COUNT, memory, disk };
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}
