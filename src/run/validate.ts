import type { ValidationReport } from '../core/report/validation.js';
import { loadWorkspace, type LoadWorkspaceOptions } from './load-workspace.js';
import type { Problem } from '../core/source/problem.js';

export type ValidateOutcome =
  | { kind: 'report'; report: ValidationReport }
  | { kind: 'settings-invalid'; settingsFile: string; problems: Problem[] };

/** Checks every plan, registry file and the settings file of a repository. */
export async function validateRepository(options: LoadWorkspaceOptions): Promise<ValidateOutcome> {
  const loaded = await loadWorkspace(options);
  if (!loaded.ok) return { kind: 'settings-invalid', settingsFile: loaded.settingsFile, problems: loaded.settingsProblems };
  const { workspace } = loaded;
  return {
    kind: 'report',
    report: {
      ...(workspace.settingsFile ? { settingsFile: workspace.settingsFile } : {}),
      planFiles: workspace.planFiles.length,
      validPlans: workspace.plans.length,
      registryFiles: workspace.settings.registryFiles.length,
      registryEntries: workspace.registry.entries.length,
      errors: workspace.problems.filter((p) => p.severity === 'error').length,
      warnings: workspace.problems.filter((p) => p.severity === 'warning').length,
      problems: workspace.problems,
    },
  };
}
