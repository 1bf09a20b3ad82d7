import { rmSync } from 'node:fs';
import { afterAll, afterEach } from 'vitest';
import { startFakeGitHub, type FakeGitHubModes } from '../helpers/fake-github.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles } from '../review/scenarios.js';
import { pullRequestEvent } from './run-action.js';

/**
 * For a test file of the bundled Action: `setup` makes a two-commit repository (the demo's base
 * files plus `changes`), a fake GitHub with `modes` and pull request 7's event. Servers close after
 * each test, repositories go at the end; `track` registers what a test builds by hand.
 */
export function actionScenarios() {
  const made: string[] = [];
  const servers: { close(): Promise<void> }[] = [];
  afterEach(async () => {
    for (const s of servers.splice(0)) await s.close();
  });
  afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })));
  return {
    track(item: { root: string } | { close(): Promise<void> }) {
      if ('root' in item) made.push(item.root);
      else servers.push(item);
    },
    async setup(changes: Record<string, string | null>, modes: FakeGitHubModes = {}) {
      const repo = makeTwoCommitRepo(baseFiles(), changes);
      made.push(repo.root);
      const github = await startFakeGitHub({ modes });
      servers.push(github);
      const event = pullRequestEvent({ owner: github.owner, repo: github.repo, number: 7, base: repo.base, head: repo.head });
      return { repo, github, event };
    },
  };
}
