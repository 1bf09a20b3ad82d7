import type { ChangeSource, ChangedFile, GitHubPort } from '../ports.js';
import { createRepoFiles } from './files.js';

/**
 * A ChangeSource for runs without the history git needs: the changed files and their patches
 * come from the pull-request files API, the tree at head from the checked-out workspace. What
 * needs the base side (a flag definition file's old keys, a removed constant's value) is unknown.
 */
export async function openApiChange(options: { github: GitHubPort; pullRequest: number; workspace: string; base: string; head: string }): Promise<{ change: ChangeSource; capped: boolean; listed: number }> {
  const { files, capped } = await options.github.listPullRequestFiles(options.pullRequest);
  const disk = createRepoFiles(options.workspace);
  const changed: ChangedFile[] = files.map((f) => ({
    path: f.path,
    status: f.status === 'added' ? 'added' : f.status === 'removed' ? 'deleted' : f.status === 'renamed' ? 'renamed' : 'modified',
    ...(f.previousPath ? { previousPath: f.previousPath } : {}),
  }));
  const diff = files
    .filter((f) => f.patch !== undefined)
    .map((f) => {
      const from = f.status === 'added' ? '/dev/null' : `a/${f.previousPath ?? f.path}`;
      const to = f.status === 'removed' ? '/dev/null' : `b/${f.path}`;
      return `diff --git a/${f.previousPath ?? f.path} b/${f.path}\n--- ${from}\n+++ ${to}\n${f.patch}\n`;
    })
    .join('');
  const unknown = { listFiles: async () => [], readText: async () => undefined, readTexts: async (paths: readonly string[]) => paths.map(() => undefined) };
  const change: ChangeSource = {
    base: options.base,
    head: options.head,
    baseUnreadable: 'this run read the change through the pull-request files API (no git history was checked out), which gives patches, not the files at the base commit',
    changedFiles: async () => changed,
    diff: async () => diff,
    filesAt: (side) => (side === 'head' ? disk : unknown),
    trackedFiles: async (side) => (side === 'head' ? disk.listFiles('') : []),
    async streamFiles(side, paths, onFile) {
      if (side !== 'head') return;
      for (const path of paths) {
        const text = await disk.readText(path).catch(() => undefined);
        if (text !== undefined) onFile(path, Buffer.from(text, 'utf8'));
      }
    },
  };
  return { change, capped, listed: files.length };
}
