import { recordOutcome } from '../core/plan/record-outcome.js';
import type { Readout } from '../core/readout/build-readout.js';
import { formatProblem, type Problem } from '../core/source/problem.js';
import { UsageError } from '../errors.js';
import type { CommitFiles } from '../ports.js';
import { readTotalsAgainstPlan } from './read-totals.js';
import { findNamedPlan } from './find-plan.js';
import { requireWorkspace, type LoadWorkspaceOptions } from './load-workspace.js';

export interface ReadoutOptions extends LoadWorkspaceOptions {
  plan: string;
  /** The arm-totals file, relative to the repository root. */
  totals: string;
  /** With a decider and a day, the plan's text with the outcome block written. */
  record?: { decidedBy: string; recordedOn: string };
  /** The repository's history, to read the plan as it was at the totals' plan-commit; without it, today's plan is used and the readout says so. */
  history?: CommitFiles;
}

export interface ReadoutOutcome {
  readout: Readout;
  planFile: string;
  warnings: Problem[];
  /** The plan's new text, when recording. */
  recordedText?: string;
}

/** Reads a test out: the plan from the repository, the totals file checked against it, the readout computed. */
export async function readOutPlan(options: ReadoutOptions): Promise<ReadoutOutcome> {
  const workspace = await requireWorkspace(options);
  const found = findNamedPlan(workspace, options.plan, 'read out');
  const text = await options.files.readText(options.totals);
  if (text === undefined) throw new UsageError(`the totals file ${options.totals} does not exist`, 'the path is relative to --cwd (the repository root)');
  const loaded = await readTotalsAgainstPlan({ plan: found.plan, planFile: found.file, totalsFile: options.totals, totalsText: text, ...(options.history ? { history: options.history } : {}) });
  if (!loaded.ok) {
    throw new UsageError(`${options.totals} cannot be read out:\n${[...loaded.errors, ...loaded.warnings].map(formatProblem).join('\n')}`, 'see docs/totals-reference.md for the format');
  }
  const { readout } = loaded;
  const outcome: ReadoutOutcome = { readout, planFile: found.file, warnings: loaded.warnings };
  if (options.record) {
    const planText = await options.files.readText(found.file);
    if (planText === undefined) throw new UsageError(`the plan file ${found.file} disappeared while reading`);
    const recorded = recordOutcome(planText, readout, { ...options.record, totalsFile: options.totals });
    if (!recorded.ok) throw new UsageError(`nothing recorded: ${recorded.reason}`);
    outcome.recordedText = recorded.text;
  }
  return outcome;
}
