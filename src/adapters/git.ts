import { spawn } from 'node:child_process';
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { join } from 'node:path';
import { ExternalError } from '../errors.js';
import type { ChangeSource, ChangedFile, RepoFiles } from '../ports.js';

/**
 * The review's view of git: the change between two commits of a local repository, and the trees
 * at both ends, read from git's objects (never from the working tree, which may differ from head).
 */

interface RunOptions {
  input?: string;
  /** Exit codes other than 0 that still count as success. */
  allow?: number[];
}

function runGit(cwd: string, args: string[], options: RunOptions = {}): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    // Neutralise user configuration that would change what we parse.
    const child = spawn('git', ['-c', 'core.quotePath=false', '-c', 'diff.noprefix=false', '-c', 'color.ui=false', ...args], {
      cwd,
      stdio: ['pipe', 'pipe', 'pipe'],
    });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('error', (error) =>
      reject(new ExternalError('cannot run git', 'install git and make sure it is on the PATH', { cause: error })),
    );
    child.on('close', (code) => {
      if (code === 0 || options.allow?.includes(code ?? -1)) resolve(Buffer.concat(out));
      else {
        const stderr = Buffer.concat(err).toString('utf8').trim();
        reject(new ExternalError(`git ${args.join(' ')} failed: ${stderr || `exit code ${code}`}`, hintFor(stderr)));
      }
    });
    // git may exit before reading its input (most commands never read it); its exit code tells.
    child.stdin.on('error', () => undefined);
    child.stdin.end(options.input ?? '');
  });
}

function hintFor(stderr: string): string | undefined {
  if (/not a git repository/i.test(stderr)) return 'run plumbline inside a git repository, or pass --cwd';
  if (/unknown revision|bad revision|Needed a single revision|invalid object name/i.test(stderr)) {
    return 'check --base and --head; in a shallow clone (actions/checkout fetches one commit by default) fetch more history, e.g. fetch-depth: 0';
  }
  return undefined;
}

async function resolveCommit(cwd: string, ref: string, flag: string): Promise<string> {
  try {
    return (await runGit(cwd, ['rev-parse', '--verify', '--end-of-options', `${ref}^{commit}`])).toString('utf8').trim();
  } catch (error) {
    const hint = error instanceof ExternalError ? error.hint : undefined;
    throw new ExternalError(`${flag} ${ref} is not a commit in this repository`, hint ?? 'check the ref name', { cause: error });
  }
}

/** Opens the change base...head: from their merge base to head, as a pull request shows it. */
export async function openChange(repoDir: string, baseRef: string, headRef: string): Promise<ChangeSource> {
  const [head, baseTip] = await Promise.all([resolveCommit(repoDir, headRef, '--head'), resolveCommit(repoDir, baseRef, '--base')]);
  const mergeBase = (await runGit(repoDir, ['merge-base', baseTip, head], { allow: [1] })).toString('utf8').trim();
  const base = mergeBase || baseTip;
  const commitOf = (side: 'base' | 'head') => (side === 'base' ? base : head);

  // When head is what is checked out and no tracked file differs from it (the usual case in CI),
  // its files are read straight from the working tree, which is faster than inflating objects.
  const checkedOutIsHead = (async () => {
    const current = (await runGit(repoDir, ['rev-parse', '--verify', '--quiet', 'HEAD'], { allow: [1] })).toString('utf8').trim();
    if (current !== head) return false;
    // Exit code 1: some tracked file differs from HEAD.
    return runGit(repoDir, ['diff', '--quiet', 'HEAD', '--']).then(
      () => true,
      () => false,
    );
  })();
  const trackedCache = new Map<string, Promise<string[]>>();
  const trackedFiles = (side: 'base' | 'head') => {
    const commit = commitOf(side);
    let cached = trackedCache.get(commit);
    if (!cached) {
      // The index lists the same files as head's tree when head is checked out clean, and faster.
      cached = (side === 'head' ? checkedOutIsHead : Promise.resolve(false))
        .then((clean) => runGit(repoDir, clean ? ['ls-files', '-z'] : ['ls-tree', '-r', '-z', '--name-only', commit]))
        .then((out) => out.toString('utf8').split('\0').filter(Boolean).sort());
      trackedCache.set(commit, cached);
    }
    return cached;
  };

  const streamFiles = async (side: 'base' | 'head', paths: readonly string[], onFile: (path: string, bytes: Buffer) => void) => {
    if (side === 'head' && (await checkedOutIsHead)) return readWorkingTree(repoDir, paths, onFile);
    return catFiles(repoDir, commitOf(side), paths, onFile);
  };

  const filesAt = (side: 'base' | 'head'): RepoFiles => {
    const readTexts = async (paths: readonly string[]) => {
      const found = new Map<string, string>();
      await streamFiles(side, paths, (path, bytes) => found.set(path, bytes.toString('utf8')));
      return paths.map((p) => found.get(p));
    };
    return {
      async listFiles(folder) {
        const prefix = folder === '' || folder === '.' ? '' : `${folder.replace(/\/+$/, '')}/`;
        return (await trackedFiles(side)).filter((p) => p.startsWith(prefix));
      },
      async readText(path) {
        return (await readTexts([path]))[0];
      },
      readTexts,
    };
  };

  return {
    base,
    head,
    async changedFiles() {
      const out = (await runGit(repoDir, ['diff', '--name-status', '-z', '-M', base, head])).toString('utf8');
      return parseNameStatus(out);
    },
    async diff() {
      return (await runGit(repoDir, ['diff', '--unified=0', '--no-ext-diff', '--no-textconv', '-M', '--src-prefix=a/', '--dst-prefix=b/', base, head])).toString('utf8');
    },
    filesAt,
    streamFiles,
    trackedFiles,
  };
}

export function parseNameStatus(out: string): ChangedFile[] {
  const parts = out.split('\0').filter((p) => p !== '');
  const files: ChangedFile[] = [];
  for (let i = 0; i < parts.length; ) {
    const code = parts[i++]!;
    if (code.startsWith('R') || code.startsWith('C')) {
      const previousPath = parts[i++]!;
      const path = parts[i++]!;
      files.push({ path, status: 'renamed', previousPath });
    } else {
      const path = parts[i++]!;
      files.push({ path, status: code === 'A' ? 'added' : code === 'D' ? 'deleted' : 'modified' });
    }
  }
  return files;
}

/**
 * Streams blobs through one `git cat-file --batch` process: a header line per object
 * ("<oid> blob <size>" or "<name> missing"), then the bytes and a newline.
 */
function catFiles(cwd: string, commit: string, paths: readonly string[], onFile: (path: string, bytes: Buffer) => void): Promise<void> {
  // The batch protocol is line-based: a path holding a newline cannot be asked for (and is never a plan or source file worth scanning).
  const asked = paths.filter((p) => !p.includes('\n'));
  if (asked.length === 0) return Promise.resolve();
  return new Promise((resolve, reject) => {
    const child = spawn('git', ['cat-file', '--batch'], { cwd, stdio: ['pipe', 'pipe', 'pipe'] });
    let index = 0;
    let pending: Buffer = Buffer.alloc(0);
    /** The object being read: its size, and whether it is a file to hand on (trees and submodules are not). */
    let current: { size: number; deliver: boolean } | undefined;
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => {
      pending = pending.length ? Buffer.concat([pending, chunk]) : chunk;
      for (;;) {
        if (!current) {
          const newline = pending.indexOf(10);
          if (newline < 0) return;
          const header = pending.subarray(0, newline).toString('utf8');
          pending = pending.subarray(newline + 1);
          if (header.endsWith(' missing') || header.endsWith(' ambiguous')) {
            index++;
            continue;
          }
          const size = Number(header.slice(header.lastIndexOf(' ') + 1));
          current = { size: Number.isFinite(size) ? size : 0, deliver: header.includes(' blob ') };
        }
        if (pending.length < current.size + 1) return;
        if (current.deliver) onFile(asked[index]!, pending.subarray(0, current.size));
        pending = pending.subarray(current.size + 1);
        index++;
        current = undefined;
      }
    });
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('error', (error) => reject(new ExternalError('cannot run git', 'install git and make sure it is on the PATH', { cause: error })));
    child.on('close', (code) => {
      if (code === 0) resolve();
      else reject(new ExternalError(`git cat-file failed: ${Buffer.concat(err).toString('utf8').trim()}`));
    });
    child.stdin.on('error', () => undefined);
    child.stdin.end(asked.map((p) => `${commit}:${p}\n`).join(''));
  });
}

/**
 * Reads tracked files from the working tree in path order into one reused buffer: the scan keeps
 * no file, so nothing needs a buffer of its own, and 50 MB of code costs no garbage collection.
 */
async function readWorkingTree(root: string, paths: readonly string[], onFile: (path: string, bytes: Buffer) => void): Promise<void> {
  let buffer = Buffer.allocUnsafe(1 << 20);
  for (const path of paths) {
    let fd: number | undefined;
    try {
      fd = openSync(join(root, path), 'r');
      const size = fstatSync(fd).size;
      if (size > buffer.length) buffer = Buffer.allocUnsafe(Math.max(size, buffer.length * 2));
      let read = 0;
      while (read < size) {
        const n = readSync(fd, buffer, read, size - read, read);
        if (n === 0) break;
        read += n;
      }
      onFile(path, buffer.subarray(0, read));
    } catch {
      // A tracked path that is not a readable file here (a submodule, a broken link) holds no code to scan.
    } finally {
      if (fd !== undefined) closeSync(fd);
    }
  }
}
