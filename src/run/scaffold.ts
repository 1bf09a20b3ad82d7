import { posix } from 'node:path';
import { renderPlanScaffold, planIdFromFlag } from '../core/plan/scaffold.js';
import { loadPlan } from '../core/plan/load.js';
import { formatProblem } from '../core/source/problem.js';
import { UsageError } from '../errors.js';
import { requireWorkspace, type LoadWorkspaceOptions } from './load-workspace.js';

export interface ScaffoldRequest extends LoadWorkspaceOptions {
  flagKey: string;
  id?: string;
  owner?: string;
  surface?: string;
  /** Target path relative to the repository; default: `<first plans folder>/<id>.yaml`. */
  out?: string;
  today: string;
}

/** What the entry point should write: the path and the text of the new plan. */
export interface ScaffoldResult {
  path: string;
  text: string;
  id: string;
}

const INSTALLED_SCHEMA = 'node_modules/plumbline/schema/plan.schema.json';

/** Prepares a new draft plan for a flag; the entry point writes it (effects stay at the edge). */
export async function scaffoldPlan(request: ScaffoldRequest): Promise<ScaffoldResult> {
  const workspace = await requireWorkspace(request);
  const id = request.id ?? planIdFromFlag(request.flagKey);
  const taken = workspace.registry.entries.find((entry) => entry.id === id);
  if (taken) throw new UsageError(`a plan with id "${id}" already exists in ${taken.file}:${taken.line}`, 'choose another id with --id');

  const firstPlans = workspace.settings.planPaths[0] ?? 'experiments';
  const folder = /[*?[{]/.test(firstPlans) || /\.ya?ml$/.test(firstPlans) ? 'experiments' : firstPlans.replace(/\/+$/, '');
  const path = request.out ?? posix.join(folder, `${id}.yaml`);
  const schemaPath = posix.relative(posix.dirname(path), INSTALLED_SCHEMA);
  const text = renderPlanScaffold({
    flagKey: request.flagKey,
    id,
    today: request.today,
    schemaPath,
    ...(request.owner ? { owner: request.owner } : {}),
    ...(request.surface ? { surface: request.surface } : {}),
  });

  // The scaffold must load as written; if an option made it invalid, say which before writing anything.
  const check = loadPlan(text, path);
  if (!check.ok) {
    throw new UsageError(`the new plan would not be valid:\n${check.errors.map(formatProblem).join('\n')}`, 'check --id, --owner, --surface and the flag key');
  }
  return { path, text, id };
}
