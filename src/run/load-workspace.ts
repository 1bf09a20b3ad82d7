import { SETTINGS_FILE_NAMES, loadSettings } from '../core/config/load.js';
import { planSearchRoots } from '../core/config/plan-files.js';
import type { Settings } from '../core/config/schema.js';
import { loadPlan, type LoadedPlan } from '../core/plan/load.js';
import { buildRegistry, loadRegistryFile, type Registry } from '../core/registry/load.js';
import type { RegistryEntry } from '../core/registry/schema.js';
import { formatProblem, sortProblems, type Problem } from '../core/source/problem.js';
import { UsageError } from '../errors.js';
import type { ProgressReporter, RepoFiles } from '../ports.js';
import type { FieldPath, SourceLocationFinder } from '../core/source/yaml-source.js';

export interface LoadWorkspaceOptions {
  files: RepoFiles;
  /** Settings file to use; default: the first of `.plumbline.yml`, `.plumbline.yaml` that exists, else none. */
  settingsPath?: string;
  onProgress?: ProgressReporter;
}

/** Everything Plumbline knows about a repository's experiments, with every problem found on the way. */
export interface Workspace {
  settings: Settings;
  /** The settings file that was read, if any. */
  settingsFile?: string;
  /** Where a setting is written in it (its nearest written parent when absent), and whether it is written at all. */
  locateSetting: SourceLocationFinder;
  isSettingWritten: (path: FieldPath) => boolean;
  planFiles: string[];
  plans: LoadedPlan[];
  registry: Registry;
  /** Problems in plan and registry files (errors and warnings), sorted by file and line. */
  problems: Problem[];
}

export type WorkspaceResult = { ok: true; workspace: Workspace } | { ok: false; settingsProblems: Problem[]; settingsFile: string };

/**
 * Reads the settings, every plan and every registry file. Problems in plans and registry files
 * are returned as data; problems in the settings file stop here (it is configuration: exit 2).
 */
export async function loadWorkspace(options: LoadWorkspaceOptions): Promise<WorkspaceResult> {
  const { files } = options;
  const { text: settingsText, file: settingsFile } = await readSettingsText(files, options.settingsPath);
  const settingsResult = loadSettings(settingsText, settingsFile ?? SETTINGS_FILE_NAMES[0]!);
  if (!settingsResult.ok) return { ok: false, settingsProblems: settingsResult.errors, settingsFile: settingsFile! };
  const settings = settingsResult.settings;

  const planFiles = await findPlanFiles(files, settings.planPaths);
  const problems: Problem[] = [];
  const plans: LoadedPlan[] = [];
  const texts = await files.readTexts(planFiles);
  for (const [index, file] of planFiles.entries()) {
    options.onProgress?.(index, planFiles.length, 'plans');
    const result = loadPlan(texts[index] ?? '', file);
    problems.push(...(result.ok ? [] : result.errors), ...result.warnings);
    if (result.ok) plans.push(result.loaded);
  }
  options.onProgress?.(planFiles.length, planFiles.length, 'plans');

  const extra: RegistryEntry[] = [];
  for (const [index, file] of settings.registryFiles.entries()) {
    const text = await files.readText(file);
    if (text === undefined) {
      return {
        ok: false,
        settingsFile: settingsFile ?? SETTINGS_FILE_NAMES[0]!,
        settingsProblems: [
          {
            severity: 'error',
            code: 'settings/registry-missing',
            ...settingsResult.locate(['registries', index]),
            field: `registries[${index}]`,
            message: `the registry file ${file} does not exist`,
            expected: 'a path relative to the repository root',
          },
        ],
      };
    }
    const result = loadRegistryFile(text, file);
    if (result.ok) extra.push(...result.entries);
    problems.push(...(result.ok ? result.warnings : result.errors));
  }

  const { registry, problems: registryProblems } = buildRegistry(plans, extra);
  problems.push(...registryProblems);
  return {
    ok: true,
    workspace: {
      settings,
      ...(settingsFile ? { settingsFile } : {}),
      locateSetting: settingsResult.locate,
      isSettingWritten: settingsResult.isWritten,
      planFiles,
      plans,
      registry,
      problems: sortProblems(problems),
    },
  };
}

/** Plumbline's own files (plans, registry files, settings): never scanned as code. */
export function ownFilesOf(workspace: Workspace): Set<string> {
  return new Set([...workspace.planFiles, ...workspace.settings.registryFiles, ...(workspace.settingsFile ? [workspace.settingsFile] : [])]);
}

/** For use cases that cannot go on without settings: an invalid settings file becomes a usage error. */
export async function requireWorkspace(options: LoadWorkspaceOptions): Promise<Workspace> {
  const loaded = await loadWorkspace(options);
  if (!loaded.ok) {
    throw new UsageError(`the settings file ${loaded.settingsFile} has errors:\n${loaded.settingsProblems.map(formatProblem).join('\n')}`, 'run plumbline validate');
  }
  return loaded.workspace;
}

async function readSettingsText(files: RepoFiles, named: string | undefined): Promise<{ text?: string; file?: string }> {
  if (named) {
    const text = await files.readText(named);
    if (text === undefined) throw new UsageError(`the settings file ${named} does not exist`, 'check the --config path; it is relative to --cwd');
    return { text, file: named };
  }
  for (const candidate of SETTINGS_FILE_NAMES) {
    const text = await files.readText(candidate);
    if (text !== undefined) return { text, file: candidate };
  }
  return {};
}

async function findPlanFiles(files: RepoFiles, planPaths: readonly string[]): Promise<string[]> {
  const found = new Set<string>();
  for (const root of planSearchRoots(planPaths)) {
    for (const path of await files.listFiles(root.folder)) {
      if (root.matches(path)) found.add(path);
    }
  }
  return [...found].sort();
}

