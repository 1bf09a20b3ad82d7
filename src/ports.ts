/**
 * The small interfaces the use cases need from the outside world. Adapters implement them;
 * tests pass simple in-memory versions. Nothing in src/core imports this file's implementations.
 */

/** Read access to a repository's files, relative to its root, with '/' separators. */
export interface RepoFiles {
  /** Every file below `folder` (recursively), skipping `.git` and `node_modules`; [] when the folder does not exist. */
  listFiles(folder: string): Promise<string[]>;
  /** The file's text, or undefined when it does not exist. */
  readText(path: string): Promise<string | undefined>;
  /** Several files at once, in the order asked (an adapter may read them in one pass). */
  readTexts(paths: readonly string[]): Promise<(string | undefined)[]>;
}

/** One file of a change between two commits. */
export interface ChangedFile {
  path: string;
  status: 'added' | 'modified' | 'deleted' | 'renamed';
  /** For renames: where the file was. */
  previousPath?: string;
}

/** What the review needs from git: a change between two commits, and the trees at both ends. */
export interface ChangeSource {
  /** Full commit ids of the two ends; `base` is the merge base, as a pull request compares. */
  base: string;
  head: string;
  changedFiles(): Promise<ChangedFile[]>;
  /** `git diff --unified=0` between the two ends, as text. */
  diff(): Promise<string>;
  /** The repository's files at `head` (or `base`), for plans, settings and the code scan. */
  filesAt(side: 'base' | 'head'): RepoFiles;
  /** Every tracked file at the ref, with its bytes, streamed in path order. */
  streamFiles(side: 'base' | 'head', paths: readonly string[], onFile: (path: string, bytes: Buffer) => void): Promise<void>;
  /** Every tracked path at the ref. */
  trackedFiles(side: 'base' | 'head'): Promise<string[]>;
}

/** Reports progress of long work; the CLI draws it only on a terminal. */
export type ProgressReporter = (done: number, total: number, what: string) => void;
