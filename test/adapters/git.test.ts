import { execFileSync } from 'node:child_process';
import { readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { MAX_SCANNED_FILE_BYTES, openChange, parseNameStatus, parseTreeListing } from '../../src/adapters/git.js';
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
    writeFileSync(join(repo.root, 'src/a.ts'), 'edited but not committed\n');
    const change = await openChange(repo.root, 'main', 'change');
    expect(await change.filesAt('head').readText('src/a.ts')).toBe('one\n2\nthree\nfour\n');
    expect(await change.filesAt('base').readText('src/a.ts')).toBe('one\ntwo\nthree\n');
    expect(await change.filesAt('head').readText('nope.ts')).toBeUndefined();
    const streamed: string[] = [];
    await change.streamFiles('head', await change.trackedFiles('head'), (path, bytes) => streamed.push(`${path}:${bytes.length}`));
    // img.bin holds a NUL in its first bytes: binary, not code.
    expect(streamed).toEqual(['src/a.ts:17', 'src/keep.ts:5', 'src/new.ts:4']);
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

describe('streaming a tree: git objects and the working tree give the same files', () => {
  // Sizes around the pipe's 64 KiB chunks and the reader's 1 MiB buffer, so objects split across
  // chunks, several share one chunk, and the reused buffer has to grow.
  const big = (n: number, seed: string) => Array.from({ length: Math.ceil(n / seed.length) }, () => seed).join('').slice(0, n);
  const late = `${big(9000, 'text ')}\u0000 after the probe`;
  const files: Record<string, string> = {
    'a/empty.ts': '',
    'a/small.ts': 'track("x")\n',
    'a/with space.ts': 'spaced\n',
    'a/caf\u00e9.ts': 'accent\n',
    'b/chunk.ts': big(70_000, 'abc\n'),
    'b/large.ts': big(1_500_000, 'line of code\n'),
    'b/larger.ts': big(2_600_000, 'more code\n'),
    'c/binary-start.bin': `\u0000${big(200_000, 'x')}`,
    'c/binary-late.dat': late,
    'd/after.ts': 'last\n',
  };
  const repo = makeTwoCommitRepo(files, {});
  made.push(repo.root);

  const stream = async (checkedOut: boolean) => {
    execFileSync('git', ['checkout', '-q', checkedOut ? 'change' : 'main'], { cwd: repo.root });
    const change = await openChange(repo.root, repo.base, 'change');
    const seen: [string, string][] = [];
    await change.streamFiles('head', await change.trackedFiles('head'), (path, bytes) => seen.push([path, bytes.toString('utf8')]));
    return seen;
  };

  it('delivers every text file in path order with its exact bytes, skipping binaries and links', async () => {
    symlinkSync('../a/small.ts', join(repo.root, 'a/link.ts'));
    execFileSync('git', ['add', 'a/link.ts'], { cwd: repo.root });
    execFileSync('git', ['-c', 'user.name=T', '-c', 'user.email=t@e.invalid', 'commit', '-q', '-m', 'link'], { cwd: repo.root });
    const expected = Object.entries(files)
      .filter(([path]) => path !== 'c/binary-start.bin')
      .sort(([a], [b]) => (a < b ? -1 : 1));
    const fromObjects = await stream(false);
    expect(fromObjects.map(([p]) => p)).toEqual(expected.map(([p]) => p));
    expect(fromObjects).toEqual(expected);
    expect(await stream(true)).toEqual(fromObjects);
  });

  it('reads named files at the other end whatever their size', async () => {
    const change = await openChange(repo.root, repo.base, 'change');
    const [large, binary, missing] = await change.filesAt('base').readTexts(['b/large.ts', 'c/binary-start.bin', 'nope']);
    expect(large).toBe(readFileSync(join(repo.root, 'b/large.ts'), 'utf8'));
    expect(binary?.length).toBe(200_001);
    expect(missing).toBeUndefined();
  });
});

describe('a file over the scan size limit is skipped on both paths', () => {
  // The limit is ours (MAX_SCANNED_FILE_BYTES); the objects path learns a file's size from cat-file's header
  // ("<oid> blob <size>", git's documented batch output), the working-tree path from fstat.
  const files: Record<string, string> = { 'a/before.ts': 'before\n' };
  const changes: Record<string, string> = {
    'b/huge.ts': 'x'.repeat(MAX_SCANNED_FILE_BYTES + 1),
    'b/limit.ts': `${'y'.repeat(100_000)}\n`,
    'c/after.ts': 'after\n',
  };
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  it.each([
    ['head not checked out (git objects)', 'main'],
    ['head checked out (working tree)', 'change'],
  ])('%s', async (_, checkout) => {
    execFileSync('git', ['checkout', '-q', checkout], { cwd: repo.root });
    const change = await openChange(repo.root, repo.base, 'change');
    const seen: [string, number][] = [];
    await change.streamFiles('head', await change.trackedFiles('head'), (path, bytes) => seen.push([path, bytes.length]));
    expect(seen).toEqual([
      ['a/before.ts', 7],
      ['b/limit.ts', 100_001],
      ['c/after.ts', 6],
    ]);
  });
});

describe('a checkout that is not head: files head shares with it come from disk, the rest from objects', () => {
  const files: Record<string, string> = {
    'a/same.ts': 'same at both\n',
    'b/changed-on-main.ts': 'branch point\n',
    'c/dirty.ts': 'committed\n',
    'd/only-head.ts': 'head only\n',
    'e/last.ts': 'last\n',
  };
  const repo = makeTwoCommitRepo(files, {});
  made.push(repo.root);
  const git = (...args: string[]) => execFileSync('git', ['-c', 'user.name=T', '-c', 'user.email=t@e.invalid', ...args], { cwd: repo.root, encoding: 'utf8' });

  it('gives head’s bytes in path order, whatever the checkout holds', async () => {
    // main moves on (as the base of a pull request does); the checkout is main, with an edit, an untracked file and a deleted one.
    git('switch', '-q', 'main');
    writeFileSync(join(repo.root, 'b/changed-on-main.ts'), 'main moved on\n');
    git('rm', '-q', 'd/only-head.ts');
    git('commit', '-q', '-am', 'main moves');
    writeFileSync(join(repo.root, 'c/dirty.ts'), 'edited, not committed\n');
    writeFileSync(join(repo.root, 'a/untracked.ts'), 'not in any commit\n');
    rmSync(join(repo.root, 'e/last.ts'));
    const change = await openChange(repo.root, 'main', 'change');
    const tracked = await change.trackedFiles('head');
    // git's own answer: every blob of head's tree.
    const expected = git('ls-tree', '-r', '--name-only', 'change').split('\n').filter(Boolean).map((path) => [path, git('show', `change:${path}`)]);
    const seen: [string, string][] = [];
    await change.streamFiles('head', tracked, (path, bytes) => seen.push([path, bytes.toString('utf8')]));
    expect(seen).toEqual(expected);
    expect(await change.filesAt('head').readTexts(['c/dirty.ts', 'a/untracked.ts', 'd/only-head.ts', 'a/same.ts', 'e/last.ts'])).toEqual(['committed\n', undefined, 'head only\n', 'same at both\n', 'last\n']);
  });
});

describe('parseTreeListing', () => {
  it('keeps regular files as blobs, and lists links and submodules without reading them', () => {
    const out = Buffer.from(
      [
        '100644 blob 1111111111111111111111111111111111111111\tsrc/b.ts',
        '100755 blob 2222222222222222222222222222222222222222\tbin/run',
        '120000 blob 3333333333333333333333333333333333333333\tsrc/link.ts',
        '160000 commit 4444444444444444444444444444444444444444\tvendor/sub',
        '100644 blob 5555555555555555555555555555555555555555\tsrc/a b.ts',
      ].join('\0') + '\0',
    );
    const listing = parseTreeListing(out);
    expect(listing.paths).toEqual(['bin/run', 'src/a b.ts', 'src/b.ts', 'src/link.ts', 'vendor/sub']);
    expect([...listing.blobs]).toEqual([
      ['src/b.ts', { oid: '1111111111111111111111111111111111111111' }],
      ['bin/run', { oid: '2222222222222222222222222222222222222222' }],
      ['src/a b.ts', { oid: '5555555555555555555555555555555555555555' }],
    ]);
  });
});
