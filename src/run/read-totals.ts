import { launchRule } from '../core/plan/launch-rule.js';
import type { Plan } from '../core/plan/schema.js';
import { buildReadout, type Readout } from '../core/readout/build-readout.js';
import { withLaunchRule } from '../core/readout/launch-note.js';
import type { Problem } from '../core/source/problem.js';
import { loadTotals } from '../core/totals/load.js';
import type { CommitFiles, RepoFiles } from '../ports.js';

export type TotalsReadResult = { ok: true; readout: Readout; warnings: Problem[] } | { ok: false; errors: Problem[]; warnings: Problem[] };

/**
 * A totals file read out against the rule registered at launch: the plan file as it was at the
 * totals' plan-commit (from git history, when there is one), compared with today's plan; the readout
 * applies the launch rule unless an amendment covers the difference, and says which rule it applied.
 */
export async function readTotalsAgainstPlan(options: { plan: Plan; planFile: string; totalsFile: string; totalsText: string; history?: CommitFiles }): Promise<TotalsReadResult> {
  const { plan, planFile, totalsFile, totalsText } = options;
  // First without the plan: the plan-commit decides which plan the totals are checked against.
  const bare = loadTotals(totalsText, totalsFile);
  if (!bare.ok) return bare;
  const commit = bare.totals.planCommit;
  const atLaunch = options.history ? await options.history.fileAt(commit, planFile) : ({ found: false, reason: 'no-history' } as const);
  const rule = launchRule(plan, planFile, commit, atLaunch);
  const loaded = loadTotals(totalsText, totalsFile, rule.plan);
  if (!loaded.ok) return loaded;
  return { ok: true, readout: withLaunchRule(buildReadout(rule.plan, loaded.totals), rule), warnings: loaded.warnings };
}

/** Where totals files are looked for: anything under a readouts/ folder, and *.totals.yaml anywhere. */
export const isTotalsPath = (path: string) => /\.ya?ml$/i.test(path) && (/(?:^|\/)readouts\//.test(path) || /\.totals\.ya?ml$/i.test(path));

/**
 * The latest totals file of each plan among the given texts (the latest data-through; on a tie, the last path in
 * code-unit order). Only files under the totals paths that read as totals count; with `wanted`, only those plans'.
 */
export function latestByPlan(texts: readonly { file: string; text: string | undefined }[], wanted?: ReadonlySet<string>): Map<string, { file: string; text: string }> {
  const latest = new Map<string, { file: string; text: string; through: string }>();
  for (const { file, text } of [...texts].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0))) {
    if (text === undefined || !isTotalsPath(file)) continue;
    // A cheap look first: most files name none of the plans wanted.
    if (wanted && ![...wanted].some((id) => text.includes(id))) continue;
    const loaded = loadTotals(text, file);
    if (!loaded.ok || (wanted && !wanted.has(loaded.totals.planId))) continue;
    const was = latest.get(loaded.totals.planId);
    if (!was || loaded.totals.dataThrough >= was.through) latest.set(loaded.totals.planId, { file, text, through: loaded.totals.dataThrough });
  }
  return new Map([...latest].map(([id, { file, text }]) => [id, { file, text }]));
}

/** The latest totals file of each of the plans among the repository's `paths`. */
export async function latestTotals(planIds: readonly string[], paths: readonly string[], files: RepoFiles): Promise<Map<string, { file: string; text: string }>> {
  if (planIds.length === 0) return new Map();
  const candidates = paths.filter(isTotalsPath);
  const texts = await files.readTexts(candidates);
  return latestByPlan(candidates.map((file, i) => ({ file, text: texts[i] })), new Set(planIds));
}
