import type { Settings } from '../config/schema.js';
import type { LoadedPlan } from '../plan/load.js';
import type { Registry } from '../registry/load.js';
import type { RegistryEntry } from '../registry/schema.js';
import type { FlagTouch } from '../scan/flag-touches.js';
import type { Location, NameHits } from '../scan/name-scan.js';
import type { Problem } from '../source/problem.js';
import type { PlanSizing } from '../stats/plan-sizing.js';
import type { Readout } from '../readout/build-readout.js';
import type { Finding } from './finding.js';
import type { KeptArm } from './kept-arm.js';

/** What the pull request says about itself; every field optional (a local run may know none). */
export interface PullRequestInfo {
  title?: string;
  body?: string;
  labels?: string[];
  branch?: string;
}

export type LinkReason = 'named in the description' | 'plan file changed' | 'flag touched' | 'readout changed';

export interface LinkedPlan {
  loaded: LoadedPlan;
  reasons: LinkReason[];
  sizing: PlanSizing;
  /**
   * The readout of the plan's totals, or why there is none: the file its recorded outcome names, else a
   * totals file the change adds or edits, else (when the change ends the test) its latest totals file.
   */
  readout?: { file: string; readout?: Readout; problem?: string; source: ReadoutSource };
  /** When the change removes the last read of the plan's flags: which flags, and the arm the code keeps. */
  ending?: { flags: string[]; kept: KeptArm };
}

/** Where a plan's readout comes from: its recorded outcome, a totals file in the change, or the latest one in the repository. */
export type ReadoutSource = 'outcome' | 'changed' | 'latest';

/** Everything a check may look at. Built by the review use case; checks only read it. */
export interface ReviewContext {
  settings: Settings;
  pr: PullRequestInfo;
  /** Plans this change is about. */
  linked: LinkedPlan[];
  /** Plan files that do not load and that the change adds or edits, or whose flags (`flags`, read leniently) it touches. */
  invalidPlanFiles: { file: string; problems: Problem[]; flags?: string[] }[];
  /** Warnings from loading every plan and registry file (a renamed key, a default taken), as validate reports them. */
  fileWarnings: readonly Problem[];
  /** Paths the change adds or edits. */
  changedPaths: string[];
  /** Flags the change touches in code or in flag definition files. */
  touches: FlagTouch[];
  registry: Registry;
  /** First locations at head of every event that a linked or running plan names. */
  events: ReadonlyMap<string, NameHits>;
  /** Events of running plans that the change deletes from a line (quoted), with where. */
  removedEvents: ReadonlyMap<string, Location>;
  /** The review's day (YYYY-MM-DD): whether a test has started or passed its planned end. */
  today: string;
  /** Changed text files: their path on each side, the changed line numbers and the text on each side. */
  changedCode: readonly ChangedCode[];
  /** Text at head of the changed files and of the files where linked plans log exposure, by path. */
  codeAtHead: ReadonlyMap<string, string>;
  /** First locations at head of every flag key a started test reads (product code only, comments left out). */
  flagsAtHead: ReadonlyMap<string, NameHits>;
  /** Plans and registry entries as they were at the base commit, to see what a change does to a started test. */
  baseEntries: readonly RegistryEntry[];
  /** Set when the base commit's files could not be read: why. Then `baseEntries` is empty and nothing is compared with the base. */
  baseUnreadable?: string;
}

export interface ChangedCode {
  path: string;
  /** Where the file was at the base commit (differs on a rename). */
  basePath: string;
  added: readonly number[];
  removed: readonly number[];
  head?: string;
  base?: string;
}

/** A check reads the context and says what it found, at the code's default severity. */
export type Check = (context: ReviewContext) => Omit<Finding, 'severity'>[];
