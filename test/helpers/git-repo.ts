import { afterAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { readFileAtCommit } from '../../src/adapters/git.js';
import type { CommitFiles } from '../../src/ports.js';

const ENV = {
  ...process.env,
  GIT_AUTHOR_NAME: 'Test',
  GIT_AUTHOR_EMAIL: 'test@example.invalid',
  GIT_COMMITTER_NAME: 'Test',
  GIT_COMMITTER_EMAIL: 'test@example.invalid',
  GIT_CONFIG_NOSYSTEM: '1',
  GIT_CONFIG_GLOBAL: '/dev/null',
};

export interface TwoCommitRepo {
  root: string;
  base: string;
  head: string;
}

/** Written in a change's text, stands for the base commit's id (e.g. a totals file's plan-commit). */
export const BASE_COMMIT = '{{base-commit}}';
/** Stands for the id of the launch commit (makeTwoCommitRepo's `launch` option) in the base's and the change's texts. */
export const LAUNCH_COMMIT = '{{launch-commit}}';

/**
 * A real git repository in a temporary folder with two commits: `base` holding `files`, and `head`
 * where each entry of `changes` replaces a file (or deletes it when null; BASE_COMMIT in its text becomes the base's id).
 */
export function makeTwoCommitRepo(files: Record<string, string>, changes: Record<string, string | null>, options: { launch?: Record<string, string> } = {}): TwoCommitRepo {
  const root = mkdtempSync(join(tmpdir(), 'plumbline-git-'));
  const git = (...args: string[]) => execFileSync('git', args, { cwd: root, env: ENV, encoding: 'utf8' }).trim();
  const write = (path: string, text: string) => {
    mkdirSync(dirname(join(root, path)), { recursive: true });
    writeFileSync(join(root, path), text);
  };
  git('init', '-q', '-b', 'main');
  // An earlier commit, e.g. a plan as its test launched; LAUNCH_COMMIT in later texts becomes its id.
  let launch = LAUNCH_COMMIT;
  if (options.launch) {
    for (const [path, text] of Object.entries(options.launch)) write(path, text);
    git('add', '-A');
    git('commit', '-q', '--allow-empty', '-m', 'launch');
    launch = git('rev-parse', 'HEAD');
  }
  for (const [path, text] of Object.entries(files)) write(path, text.replaceAll(LAUNCH_COMMIT, launch));
  git('add', '-A');
  git('commit', '-q', '--allow-empty', '-m', 'base');
  const base = git('rev-parse', 'HEAD');
  git('switch', '-q', '-c', 'change');
  for (const [path, text] of Object.entries(changes)) {
    if (text === null) rmSync(join(root, path));
    else write(path, text.replaceAll(BASE_COMMIT, base).replaceAll(LAUNCH_COMMIT, launch));
  }
  git('add', '-A');
  git('commit', '-q', '--allow-empty', '-m', 'head');
  return { root, base, head: git('rev-parse', 'HEAD') };
}

/** makeTwoCommitRepo for one test file: every repository it makes is removed after the file's tests. */
export function twoCommitRepos(): (files: Record<string, string>, changes: Record<string, string | null>) => TwoCommitRepo {
  const made: string[] = [];
  afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })));
  return (files, changes) => {
    const r = makeTwoCommitRepo(files, changes);
    made.push(r.root);
    return r;
  };
}

/** The repository's history as the CLI gives it to a review (the plan at a readout's plan-commit). */
export function historyOf(root: string): CommitFiles {
  return { fileAt: (commit, path) => readFileAtCommit(root, commit, path) };
}
