import { buildReadout } from '../core/readout/build-readout.js';
import type { LinkedPlan } from '../core/review/context.js';
import { loadTotals } from '../core/totals/load.js';
import type { RepoFiles } from '../ports.js';

/**
 * For each linked plan that records an outcome, reads the totals file the outcome names (at head)
 * and computes the readout again, so the review can compare what was recorded with what the rule gives.
 */
export async function attachReadouts(linked: LinkedPlan[], head: RepoFiles): Promise<void> {
  for (const l of linked) {
    const file = l.loaded.plan.outcome?.totals;
    if (!file) continue;
    const text = await head.readText(file);
    if (text === undefined) {
      l.readout = { file, problem: `the totals file ${file} named by the outcome is not in the repository` };
      continue;
    }
    const loaded = loadTotals(text, file, l.loaded.plan);
    l.readout = loaded.ok ? { file, readout: buildReadout(l.loaded.plan, loaded.totals) } : { file, problem: `${file} cannot be read out: ${loaded.errors.map((e) => `line ${e.line}: ${e.field}: ${e.message}`).join('; ')}` };
  }
}
