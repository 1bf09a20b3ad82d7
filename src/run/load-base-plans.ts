import type { ChangeSource } from '../ports.js';
import { UsageError } from '../errors.js';
import { loadWorkspace, type Workspace } from './load-workspace.js';

/**
 * The workspace (plans, registry entries, settings) as it was at the change's base commit, read with the settings of that
 * commit, so the review can see what a change does to a test that has already started. A base whose
 * settings do not load (or that has no settings file where head names one) gives no base plans: the
 * head's own checks still run, and that base could not have had a valid running plan anyway.
 */
export async function loadBaseWorkspace(change: ChangeSource, settingsPath?: string): Promise<Workspace | undefined> {
  try {
    const loaded = await loadWorkspace({ files: change.filesAt('base'), ...(settingsPath ? { settingsPath } : {}) });
    return loaded.ok ? loaded.workspace : undefined;
  } catch (error) {
    if (error instanceof UsageError) return undefined;
    throw error;
  }
}
