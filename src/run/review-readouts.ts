import type { LinkedPlan, ReadoutSource } from '../core/review/context.js';
import type { CommitFiles, RepoFiles } from '../ports.js';
import { latestTotals, readTotalsAgainstPlan } from './read-totals.js';

export interface AttachReadoutsOptions {
  /** The repository's history, to apply the rule as registered at each totals file's plan-commit. */
  history?: CommitFiles;
  /** Totals files the change adds or edits, by plan id (the latest of them when several). */
  changedTotals?: ReadonlyMap<string, string>;
  /** Every file at this side, where the latest totals of a test the change ends are looked for. */
  tracked?: readonly string[];
}

/**
 * Gives each linked plan the readout the review shows: the totals its recorded outcome names, else a
 * totals file the change adds or edits, else, when the change ends the test (removes its flag's last
 * read), its latest totals file in the repository. Each is read against the rule registered at launch.
 */
export async function attachReadouts(linked: LinkedPlan[], files: RepoFiles, options: AttachReadoutsOptions = {}): Promise<void> {
  const ending = linked.filter((l) => l.ending && !l.loaded.plan.outcome?.totals && !options.changedTotals?.has(l.loaded.plan.id)).map((l) => l.loaded.plan.id);
  const found = options.tracked && ending.length ? await latestTotals(ending, options.tracked, files) : new Map<string, { file: string; text: string }>();
  for (const l of linked) {
    const { plan, file: planFile } = l.loaded;
    const pick: { file: string; source: ReadoutSource; text?: string } | undefined = plan.outcome?.totals
      ? { file: plan.outcome.totals, source: 'outcome' }
      : options.changedTotals?.has(plan.id)
        ? { file: options.changedTotals.get(plan.id)!, source: 'changed' }
        : found.has(plan.id)
          ? { ...found.get(plan.id)!, source: 'latest' }
          : undefined;
    if (!pick) continue;
    const { file, source } = pick;
    const text = pick.text ?? (await files.readText(file));
    if (text === undefined) {
      l.readout = { file, source, problem: `the totals file ${file} named by the outcome is not in the repository` };
      continue;
    }
    const read = await readTotalsAgainstPlan({ plan, planFile, totalsFile: file, totalsText: text, ...(options.history ? { history: options.history } : {}) });
    l.readout = read.ok ? { file, source, readout: read.readout } : { file, source, problem: `${file} cannot be read out: ${read.errors.map((e) => `line ${e.line}: ${e.field}: ${e.message}`).join('; ')}` };
  }
}
