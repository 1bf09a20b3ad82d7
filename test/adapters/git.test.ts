import { execFileSync } from 'node:child_process';
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openChange, parseNameStatus } from '../../src/adapters/git.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';

const made: string[] = [];
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })));

describe('openChange on a real repository', () => {
  const files = { 'src/a.ts': 'one\ntwo\nthree\n', 'src/keep.ts': 'same\n', 'docs/caf\u00e9.md': 'accent\n', 'img.bin': '\u0000\u0001binary' };
  const repo = makeTwoCommitRepo(files, { 'src/a.ts': 'one\n2\nthree\nfour\n', 'src/new.ts': 'new\n', 'docs/caf\u00e9.md': null });
  made.push(repo.root);

  it('resolves both ends and lists the changed files', async () => {
    const change = await openChange(repo.root, 'main', 'change');
    expect(change.base).toBe(repo.base);
    expect(change.head).toBe(repo.head);
    expect(await change.changedFiles()).toEqual([
      { path: 'docs/caf\u00e9.md', status: 'deleted' },
      { path: 'src/a.ts', status: 'modified' },
      { path: 'src/new.ts', status: 'added' },
    ]);
  });

  it('reads files at either end from git objects, not from the working tree', async () => {
    const change = await openChange(repo.root, 'main', 'change');
    writeFileSync(join(repo.root, 'src/a.ts'), 'edited but not committed\n');
    expect(await change.filesAt('head').readText('src/a.ts')).toBe('one\n2\nthree\nfour\n');
    expect(await change.filesAt('base').readText('src/a.ts')).toBe('one\ntwo\nthree\n');
    expect(await change.filesAt('head').readText('nope.ts')).toBeUndefined();
    const streamed: string[] = [];
    await change.streamFiles('head', await change.trackedFiles('head'), (path, bytes) => streamed.push(`${path}:${bytes.length}`));
    expect(streamed).toEqual(['img.bin:8', 'src/a.ts:17', 'src/keep.ts:5', 'src/new.ts:4']);
    execFileSync('git', ['checkout', '--', 'src/a.ts'], { cwd: repo.root });
  });

  it('compares from the merge base, as a pull request does', async () => {
    // A commit on main after the branch point must not show up as part of the change.
    execFileSync('git', ['switch', '-q', 'main'], { cwd: repo.root });
    writeFileSync(join(repo.root, 'later.ts'), 'later\n');
    execFileSync('git', ['add', '-A'], { cwd: repo.root });
    execFileSync('git', ['-c', 'user.name=T', '-c', 'user.email=t@e.invalid', 'commit', '-q', '-m', 'later'], { cwd: repo.root });
    const change = await openChange(repo.root, 'main', 'change');
    expect(change.base).toBe(repo.base);
    expect((await change.changedFiles()).map((f) => f.path)).not.toContain('later.ts');
  });

  it('names the fix when a ref is missing', async () => {
    await expect(openChange(repo.root, 'origin/main', 'HEAD')).rejects.toThrow('--base origin/main is not a commit in this repository');
  });
});

describe('parseNameStatus', () => {
  it('reads renames with their old path', () => {
    expect(parseNameStatus('R087\0old/a.ts\0new/a.ts\0M\0b.ts\0')).toEqual([
      { path: 'new/a.ts', status: 'renamed', previousPath: 'old/a.ts' },
      { path: 'b.ts', status: 'modified' },
    ]);
  });
});
