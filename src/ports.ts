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
}

/** Reports progress of long work; the CLI draws it only on a terminal. */
export type ProgressReporter = (done: number, total: number, what: string) => void;
