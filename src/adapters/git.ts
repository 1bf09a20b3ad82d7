import { spawn } from 'node:child_process';
import { closeSync, constants, fstatSync, openSync, readSync } from 'node:fs';
import { join } from 'node:path';
import { ExternalError } from '../errors.js';
import type { ChangeSource, ChangedFile, RepoFiles, TextAtCommit } from '../ports.js';

/**
 * The review's view of git: the change between two commits of a local repository, and the trees
 * at both ends, read from git's objects, or from the working tree when head is checked out and
 * no tracked file differs from it (then the two are the same bytes).
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

/**
 * Head, base and what is checked out, in one git process when all three resolve (each git process
 * costs a fork of this one); one at a time otherwise, so an error names the ref at fault.
 */
async function resolveEnds(cwd: string, baseRef: string, headRef: string): Promise<{ head: string; baseTip: string; checkedOut: string }> {
  const together = await runGit(cwd, ['rev-parse', '--end-of-options', `${headRef}^{commit}`, `${baseRef}^{commit}`, 'HEAD'])
    // git before 2.43 echoes --end-of-options itself in this mode.
    .then((out) => out.toString('utf8').trim().split('\n').filter((line) => line !== '--end-of-options'))
    .catch(() => []);
  if (together.length === 3 && together.every((id) => /^[0-9a-f]{40,64}$/.test(id))) return { head: together[0]!, baseTip: together[1]!, checkedOut: together[2]! };
  const [head, baseTip] = await Promise.all([resolveCommit(cwd, headRef, '--head'), resolveCommit(cwd, baseRef, '--base')]);
  const checkedOut = (await runGit(cwd, ['rev-parse', '--verify', '--quiet', 'HEAD'], { allow: [1] })).toString('utf8').trim();
  return { head, baseTip, checkedOut };
}

/**
 * Which tracked files at a commit the working tree holds byte for byte: those the commit shares with
 * what is checked out (`differs` lists the rest, from `git diff-tree`) and the working tree does not
 * change (`dirty`, from `git diff HEAD`). Undefined when there is no working tree to read.
 */
interface WorkingTreeView {
  dirty: ReadonlySet<string>;
  differs: ReadonlySet<string>;
}

const nulList = (out: Buffer) => new Set(out.toString('utf8').split('\0').filter(Boolean));

/** Opens the change base...head: from their merge base to head, as a pull request shows it. */
export async function openChange(repoDir: string, baseRef: string, headRef: string): Promise<ChangeSource> {
  // Started together, so git works on all three while the first answers: the ends, their merge base
  // (git resolves the refs itself; asked again by id below if this fails), and which tracked files
  // the working tree changes (it fails where there is no checkout: then nothing is read from disk).
  const speculative = !baseRef.startsWith('-') && !headRef.startsWith('-');
  const mergeBaseOfRefs = speculative ? runGit(repoDir, ['merge-base', baseRef, headRef], { allow: [1] }).catch(() => undefined) : Promise.resolve(undefined);
  const dirtyPaths = runGit(repoDir, ['diff', '--name-only', '-z', '--no-renames', 'HEAD', '--']).then(nulList, () => undefined);
  const { head, baseTip, checkedOut } = await resolveEnds(repoDir, baseRef, headRef);
  const mergeBase = ((await mergeBaseOfRefs) ?? (await runGit(repoDir, ['merge-base', baseTip, head], { allow: [1] }))).toString('utf8').trim();
  const base = mergeBase || baseTip;
  const commitOf = (side: 'base' | 'head') => (side === 'base' ? base : head);

  // Head's files that are the same bytes in the working tree are read from disk, which is faster
  // than inflating objects: all of them when head is checked out clean (the usual case in CI), and
  // all but those head does not share with the checkout otherwise (actions/checkout's default, the
  // merge commit, differs from head only where the base moved on).
  const headView: Promise<WorkingTreeView | undefined> = dirtyPaths.then(async (dirty) => {
    if (!dirty || !checkedOut) return undefined;
    if (checkedOut === head) return { dirty, differs: new Set<string>() };
    const differs = await runGit(repoDir, ['diff-tree', '-r', '-z', '--no-renames', '--name-only', checkedOut, head]).then(nulList, () => undefined);
    return differs ? { dirty, differs } : undefined;
  });
  const checkedOutIsHead = headView.then((view) => view !== undefined && view.differs.size === 0 && view.dirty.size === 0 && checkedOut === head);
  const onDisk = async (side: 'base' | 'head'): Promise<((path: string) => boolean) | undefined> => {
    const view = side === 'head' ? await headView : undefined;
    return view ? (path) => !view.dirty.has(path) && !view.differs.has(path) : undefined;
  };

  const listings = new Map<string, Promise<TreeListing>>();
  const listingOf = (commit: string) => {
    let listing = listings.get(commit);
    if (!listing) {
      // No sizes (`-l`): git would read every object's header for them, 5x the listing's time on a large tree;
      // cat-file's own header gives the size of each file it is asked for, and the too-large ones are skipped there.
      listing = runGit(repoDir, ['ls-tree', '-r', '-z', '--full-tree', commit]).then(parseTreeListing);
      listings.set(commit, listing);
    }
    return listing;
  };
  const trackedCache = new Map<string, Promise<string[]>>();
  const trackedFiles = (side: 'base' | 'head') => {
    const commit = commitOf(side);
    let cached = trackedCache.get(commit);
    if (!cached) {
      // The index lists the same files as head's tree when head is checked out clean, and faster.
      cached = (side === 'head' ? checkedOutIsHead : Promise.resolve(false)).then(async (clean) =>
        clean ? (await runGit(repoDir, ['ls-files', '-z'])).toString('utf8').split('\0').filter(Boolean).sort() : (await listingOf(commit)).paths,
      );
      trackedCache.set(commit, cached);
    }
    return cached;
  };
  // One folder at the base (plans, registries): a listing of that folder only, not of the whole tree.
  const folderListings = new Map<string, Promise<string[]>>();
  const filesBelow = (side: 'base' | 'head', prefix: string) => {
    const commit = commitOf(side);
    if (prefix === '' || side === 'head' || listings.has(commit)) return trackedFiles(side).then((all) => all.filter((p) => p.startsWith(prefix)));
    const key = `${commit}\0${prefix}`;
    let cached = folderListings.get(key);
    if (!cached) {
      cached = runGit(repoDir, ['--literal-pathspecs', 'ls-tree', '-r', '-z', '--full-tree', commit, '--', prefix]).then((out) => parseTreeListing(out).paths.filter((p) => p.startsWith(prefix)));
      folderListings.set(key, cached);
    }
    return cached;
  };

  const streamFiles = async (side: 'base' | 'head', paths: readonly string[], onFile: (path: string, bytes: Buffer) => void) => {
    if (side === 'head' && (await checkedOutIsHead)) return readWorkingTreeSync(repoDir, paths, onFile, { codeOnly: true });
    // Blob ids and sizes from one listing: git then reads each object directly instead of walking
    // trees per path, and files too large to be code are never asked for.
    const [listing, fromDisk] = await Promise.all([listingOf(commitOf(side)), onDisk(side)]);
    const requests: BlobRequest[] = [];
    const wanted: { path: string; disk: boolean }[] = [];
    for (const path of paths) {
      const blob = listing.blobs.get(path);
      if (!blob) continue;
      const disk = fromDisk?.(path) ?? false;
      wanted.push({ path, disk });
      if (!disk) requests.push({ path, spec: blob.oid, at: wanted.length - 1 });
    }
    // Files read from disk are handed on between the objects, so every file still comes in path order.
    let next = 0;
    const diskUpTo = (end: number) => {
      const run: string[] = [];
      for (; next < end; next++) if (wanted[next]!.disk) run.push(wanted[next]!.path);
      if (run.length) readWorkingTreeSync(repoDir, run, onFile, { codeOnly: true });
    };
    await catFiles(repoDir, requests, (path, bytes, request) => {
      diskUpTo(request.at!);
      next = request.at! + 1;
      onFile(path, bytes);
    }, { skipBinary: true, maxBytes: MAX_SCANNED_FILE_BYTES });
    diskUpTo(wanted.length);
  };

  const filesAt = (side: 'base' | 'head'): RepoFiles => {
    const readTexts = async (paths: readonly string[]) => {
      const found = new Map<string, string>();
      const keep = (path: string, bytes: Buffer) => found.set(path, bytes.toString('utf8'));
      const fromDisk = await onDisk(side);
      // Only tracked paths come from disk: an untracked file in the checkout is not part of head.
      // A path the listing does not hold is not in the commit at all.
      const tracked = fromDisk ? new Set(await trackedFiles(side)) : undefined;
      const disk = tracked ? paths.filter((p) => tracked.has(p) && fromDisk!(p)) : [];
      const fromGit = tracked ? paths.filter((p) => tracked.has(p) && !fromDisk!(p)) : paths;
      // The rest, a few named files: git resolves each path itself, so no listing of the whole tree is needed.
      const requests = fromGit.map((path) => ({ path, spec: `${commitOf(side)}:${path}` }));
      readWorkingTreeSync(repoDir, disk, keep, { codeOnly: false });
      await catFiles(repoDir, requests, keep, { skipBinary: false });
      return paths.map((p) => found.get(p));
    };
    return {
      async listFiles(folder) {
        const prefix = folder === '' || folder === '.' ? '' : `${folder.replace(/\/+$/, '')}/`;
        return filesBelow(side, prefix);
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
    baseTip,
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

/** Opening for reading without following a symbolic link (the objects path skips links too). */
const NO_FOLLOW_READ = constants.O_RDONLY | constants.O_NOFOLLOW;

/** Files larger than this are not scanned: at 16 MiB a file is data or a generated bundle, not code someone wrote. */
export const MAX_SCANNED_FILE_BYTES = 16 * 1024 * 1024;
/** How far a file is probed for a NUL byte to call it binary (git's own heuristic looks as far). */
const BINARY_PROBE_BYTES = 8000;

interface TreeListing {
  /** Every file path (blobs and submodules), sorted as the working-tree path sorts them. */
  paths: string[];
  /** Regular files and executables only: symbolic links and submodules hold no code of their own. */
  blobs: Map<string, { oid: string }>;
}

/** Parses `git ls-tree -r -z`: "<mode> <type> <oid>\t<path>\0" per entry (with `-l`, a size before the tab, ignored). */
export function parseTreeListing(out: Buffer): TreeListing {
  const paths: string[] = [];
  const blobs = new Map<string, { oid: string }>();
  for (const entry of out.toString('utf8').split('\0')) {
    const tab = entry.indexOf('\t');
    if (tab < 0) continue;
    const [mode, type, oid] = entry.slice(0, tab).split(/ +/);
    const path = entry.slice(tab + 1);
    paths.push(path);
    if (type === 'blob' && oid && (mode === '100644' || mode === '100755')) blobs.set(path, { oid });
  }
  return { paths: paths.sort(), blobs };
}

interface BlobRequest {
  path: string;
  /** What `git cat-file --batch` is asked for: a blob id, or "<commit>:<path>". */
  spec: string;
  /** The caller's own position for the file, handed back with its bytes. */
  at?: number;
}

/**
 * Streams objects through one `git cat-file --batch` process: a header line per object
 * ("<oid> <type> <size>" or "<spec> missing"), then the bytes and a newline. Each file is handed
 * on as soon as its last byte arrives, so the caller's work overlaps git's inflating. A file that
 * fits in the chunk that brought it is passed without copying; one spread over chunks is copied
 * once into a reused buffer (never re-concatenated). With `skipBinary`, a file whose first
 * 8,000 bytes hold a NUL is dropped as soon as that is known, its remaining bytes never copied.
 * The bytes passed to `onFile` are valid only during the call.
 */
function catFiles(
  cwd: string,
  requests: readonly BlobRequest[],
  onFile: (path: string, bytes: Buffer, request: BlobRequest) => void,
  options: { skipBinary: boolean; maxBytes?: number },
): Promise<void> {
  // The batch protocol is line-based: a spec holding a newline cannot be asked for.
  const asked = requests.filter((r) => !r.spec.includes('\n'));
  if (asked.length === 0) return Promise.resolve();
  return new Promise((resolve, reject) => {
    const child = spawn('git', ['cat-file', '--batch', '--buffer'], { cwd, stdio: ['pipe', 'pipe', 'pipe'] });
    let failed: unknown;
    let index = 0;
    let header = '';
    /** Bytes of the current object still to come; -1 while reading a header, 0 when only its newline is left. */
    let remaining = -1;
    let size = 0;
    let deliver = false;
    let filled = 0;
    let probed = false;
    let spill = Buffer.allocUnsafe(1 << 20);
    const err: Buffer[] = [];

    const consume = (chunk: Buffer) => {
      let at = 0;
      while (at < chunk.length) {
        if (remaining === -1) {
          const newline = chunk.indexOf(10, at);
          if (newline < 0) {
            header += chunk.toString('latin1', at);
            return;
          }
          header += chunk.toString('latin1', at, newline);
          at = newline + 1;
          const fields = header.split(' ');
          const absent = header.endsWith(' missing') || header.endsWith(' ambiguous');
          header = '';
          if (absent || fields.length !== 3) {
            index++; // "<spec> missing" (a spec may hold spaces): nothing follows
            continue;
          }
          size = Number(fields[2]);
          remaining = size;
          filled = 0;
          // A file over `maxBytes` streams past uncopied, like a binary one.
          deliver = fields[1] === 'blob' && size <= (options.maxBytes ?? Infinity);
          probed = !options.skipBinary;
          // A whole object inside this chunk goes on without a copy.
          if (deliver && at + size < chunk.length && chunk[at + size] === 10) {
            const bytes = chunk.subarray(at, at + size);
            if (probed || !looksBinaryStart(bytes)) onFile(asked[index]!.path, bytes, asked[index]!);
            at += size + 1;
            index++;
            remaining = -1;
            continue;
          }
          if (deliver && size > spill.length) spill = Buffer.allocUnsafe(Math.max(size, spill.length * 2));
          // Back to the loop's test: the header may have ended the chunk, and an empty object's
          // newline may come only with the next chunk.
          continue;
        }
        if (remaining > 0) {
          const n = Math.min(remaining, chunk.length - at);
          if (deliver) {
            chunk.copy(spill, filled, at, at + n);
            filled += n;
            if (!probed && filled >= Math.min(size, BINARY_PROBE_BYTES)) {
              probed = true;
              if (looksBinaryStart(spill.subarray(0, filled))) deliver = false;
            }
          }
          at += n;
          remaining -= n;
          continue;
        }
        // remaining === 0: the newline after the object.
        at++;
        if (deliver) onFile(asked[index]!.path, spill.subarray(0, size), asked[index]!);
        index++;
        remaining = -1;
      }
    };

    child.stdout.on('data', (chunk: Buffer) => {
      if (failed !== undefined) return;
      try {
        consume(chunk);
      } catch (error) {
        failed = error;
        child.kill();
      }
    });
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('error', (error) => reject(new ExternalError('cannot run git', 'install git and make sure it is on the PATH', { cause: error })));
    child.on('close', (code) => {
      if (failed !== undefined) reject(failed);
      else if (code === 0) resolve();
      else reject(new ExternalError(`git cat-file failed: ${Buffer.concat(err).toString('utf8').trim() || `exit code ${code}`}`));
    });
    child.stdin.on('error', () => undefined);
    child.stdin.end(asked.map((r) => `${r.spec}\n`).join(''));
  });
}

/** True when the start of a file holds a NUL byte, the test git itself uses for "binary". */
function looksBinaryStart(bytes: Buffer): boolean {
  return bytes.subarray(0, BINARY_PROBE_BYTES).indexOf(0) !== -1;
}

/**
 * Reads tracked files from the working tree in path order into one reused buffer: the scan keeps
 * no file, so nothing needs a buffer of its own, and 50 MB of code costs no garbage collection.
 * With `codeOnly`, skips what the objects path skips for the scan: symbolic links (never
 * followed), files over the size limit, and files whose first 8,000 bytes hold a NUL.
 */
let readBuffer = Buffer.allocUnsafe(1 << 20);

/** Synchronous reads, one file after another: a thread-pool round trip per call would cost more than the read. */
function readWorkingTreeSync(root: string, paths: readonly string[], onFile: (path: string, bytes: Buffer) => void, options: { codeOnly: boolean }): void {
  for (const path of paths) {
    let fd: number | undefined;
    try {
      fd = openSync(join(root, path), options.codeOnly ? NO_FOLLOW_READ : 'r');
      const size = fstatSync(fd).size;
      if (options.codeOnly && size > MAX_SCANNED_FILE_BYTES) continue;
      if (size > readBuffer.length) readBuffer = Buffer.allocUnsafe(Math.max(size, readBuffer.length * 2));
      let read = 0;
      while (read < size) {
        const n = readSync(fd, readBuffer, read, size - read, read);
        if (n === 0) break;
        read += n;
      }
      const bytes = readBuffer.subarray(0, read);
      if (!options.codeOnly || !looksBinaryStart(bytes)) onFile(path, bytes);
    } catch {
      // A tracked path that is not a readable regular file here (a submodule, a link) holds no code to scan.
    } finally {
      if (fd !== undefined) closeSync(fd);
    }
  }
}

/**
 * A file's text as it was at a commit, for the readout's "rule as registered at launch": `path` is
 * relative to `dir`, which may lie below the repository's root. Says why when there is none: not a
 * repository, a commit this clone does not have (a shallow clone, a mistyped id), or no such file then.
 */
export async function readFileAtCommit(dir: string, commit: string, path: string): Promise<TextAtCommit> {
  const inRepository = await runGit(dir, ['rev-parse', '--is-inside-work-tree'], { allow: [128] }).then(
    (out) => out.toString('utf8').trim() === 'true',
    () => false,
  );
  if (!inRepository) return { found: false, reason: 'no-repository' };
  const full = (await runGit(dir, ['rev-parse', '--verify', '--quiet', '--end-of-options', `${commit}^{commit}`], { allow: [1, 128] })).toString('utf8').trim();
  if (!/^[0-9a-f]{40,64}$/.test(full)) return { found: false, reason: 'no-commit' };
  // `<commit>:./path` is resolved from the current folder, so -C into a sub-folder still finds the file.
  const blob = (await runGit(dir, ['rev-parse', '--verify', '--quiet', '--end-of-options', `${full}:./${path}`], { allow: [1, 128] })).toString('utf8').trim();
  if (!/^[0-9a-f]{40,64}$/.test(blob)) return { found: false, reason: 'no-file', commit: full };
  const text = (await runGit(dir, ['cat-file', 'blob', blob])).toString('utf8');
  return { found: true, text, commit: full };
}

/**
 * The commit of a plan at launch, for a totals file's plan-commit: the oldest commit whose change to the
 * file wrote `state: live` (the test went live there), checked against the file at that commit; else the
 * latest commit that touched the file. Undefined when git has no commit of the file (new, or not a repository).
 */
export async function planCommitAtLaunch(repoDir: string, file: string): Promise<{ commit: string; how: 'went-live' | 'latest' } | undefined> {
  const git = (args: string[]) => runGit(repoDir, args).then((out) => out.toString('utf8').trim(), () => '');
  const candidates = (await git(['log', '--format=%H', '--reverse', '-G', '^state:[[:space:]]*live', '--', file])).split('\n').filter(Boolean);
  for (const commit of candidates) {
    const text = await git(['show', `${commit}:./${file}`]);
    if (/^state:[ \t]*live\b/m.test(text)) return { commit, how: 'went-live' };
  }
  const latest = await git(['log', '-1', '--format=%H', '--', file]);
  return latest ? { commit: latest, how: 'latest' } : undefined;
}
