import type { TextAtCommit } from './core/plan/launch-rule.js';

export type { TextAtCommit };

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
  /**
   * The commit the base ref names, before its merge base with head is taken, when known (git). When `base`
   * equals `head` but `baseTip` does not, head is an ancestor of the base ref: the change is empty, and the
   * refs were probably given the wrong way round.
   */
  baseTip?: string;
  changedFiles(): Promise<ChangedFile[]>;
  /** `git diff --unified=0` between the two ends, as text. */
  diff(): Promise<string>;
  /** The repository's files at `head` (or `base`), for plans, settings and the code scan. */
  filesAt(side: 'base' | 'head'): RepoFiles;
  /**
   * The named files at the ref that hold code, with their bytes, streamed in path order: binary files (a NUL in the
   * first 8,000 bytes), symbolic links and files over 16 MiB are skipped. The bytes are valid only during the call.
   */
  streamFiles(side: 'base' | 'head', paths: readonly string[], onFile: (path: string, bytes: Buffer) => void): Promise<void>;
  /** Every tracked path at the ref. */
  trackedFiles(side: 'base' | 'head'): Promise<string[]>;
  /** Set when the files at `base` cannot be read (the pull-request files API gives patches only): why, in a few words. */
  baseUnreadable?: string;
}

/** Files at any commit of the repository's history (a plan as it was when its test launched). */
export interface CommitFiles {
  /** `path` relative to the repository folder Plumbline runs in. */
  fileAt(commit: string, path: string): Promise<TextAtCommit>;
}

/** Reports progress of long work; the CLI draws it only on a terminal. */
export type ProgressReporter = (done: number, total: number, what: string) => void;

/** A comment on an issue or pull request, as the review needs it. */
export interface IssueComment {
  id: number;
  body: string;
  author: string;
  createdAt: string;
}

/** A file of a pull request as GitHub's files API lists it (`patch` is absent for binary or huge diffs). */
export interface PullRequestFile {
  path: string;
  status: 'added' | 'modified' | 'removed' | 'renamed' | 'copied' | 'changed' | 'unchanged';
  previousPath?: string;
  patch?: string;
}

/** The GitHub operations Plumbline needs, shaped by its needs rather than by the REST API. */
export interface GitHubPort {
  /** Every comment of the issue or pull request, across all pages. */
  listComments(issue: number): Promise<IssueComment[]>;
  createComment(issue: number, body: string): Promise<IssueComment>;
  updateComment(id: number, body: string): Promise<void>;
  /** Deleting a comment that is already gone is not an error. */
  deleteComment(id: number): Promise<void>;
  /** The pull request's files, 100 a page; `capped` when GitHub's 3,000-file limit cut the list. */
  listPullRequestFiles(pullRequest: number): Promise<{ files: PullRequestFile[]; capped: boolean }>;
  /** Open issues with the label, across all pages; pull requests (which the issues API also lists) left out. */
  listIssues(label: string): Promise<RepoIssue[]>;
  createIssue(title: string, body: string, labels: string[]): Promise<RepoIssue>;
  updateIssue(number: number, change: { body?: string; state?: 'open' | 'closed' }): Promise<void>;
}

export interface RepoIssue {
  number: number;
  body: string;
  author: string;
  createdAt: string;
}
