import type { LoadedPlan } from '../core/plan/load.js';
import { formatProblem } from '../core/source/problem.js';
import { UsageError } from '../errors.js';
import type { Workspace } from './load-workspace.js';

/** A plan of the workspace named by id or by file path; a usage error that says what is known otherwise. */
export function findNamedPlan(workspace: Workspace, name: string, then: string): LoadedPlan {
  const wanted = name.replace(/^\.\//, '');
  const found = workspace.plans.find((p) => p.plan.id === wanted || p.file === wanted);
  if (found) return found;
  // A plan that does not load has no id to match; its file is found by path, or by the name plans are written under
  // (`<id>.yaml`, as `plumbline new` writes them).
  const fileName = (file: string) => file.slice(file.lastIndexOf('/') + 1).replace(/\.ya?ml$/, '');
  const brokenFile = [...new Set(workspace.problems.filter((p) => p.severity === 'error').map((p) => p.file))].find((file) => file === wanted || fileName(file) === wanted);
  if (brokenFile) {
    const broken = workspace.problems.filter((p) => p.file === brokenFile && p.severity === 'error');
    throw new UsageError(`${brokenFile} has errors:\n${broken.map(formatProblem).join('\n')}`, `fix them, then ${then} again`);
  }
  const known = workspace.plans.map((p) => p.plan.id);
  throw new UsageError(`no plan "${wanted}" in this repository`, known.length ? `known plans: ${known.join(', ')}` : 'create one with plumbline new <flag-key>');
}
