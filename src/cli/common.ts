import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { Option } from 'commander';
import { createRepoFiles } from '../adapters/files.js';
import type { ChangeSource, CommitFiles, RepoFiles } from '../ports.js';
import { DECIMAL_TEXT } from '../core/source/decimal.js';
import { formatProblem, type Problem } from '../core/source/problem.js';
import { UsageError } from '../errors.js';
import { createCliOutput, type CliOutput } from './output.js';

/** What every command module shares: exit codes, the global options, the per-command context. */

/** Exit codes, documented in --help and the README. */
export const EXIT = { ok: 0, findings: 1, usage: 2, internal: 3 } as const;

export type SetExit = (code: number) => void;

export interface CommonOptions {
  cwd: string;
  config?: string;
  format: 'text' | 'json';
  color: boolean;
}

export const formatOption = () => new Option('--format <format>', 'output format').choices(['text', 'json']).default('text');

/**
 * What the commands reach outside the process through. The defaults are the real ones; the fuzzer
 * (scripts/fuzz.ts) runs the very same program over files in memory and captures what it prints.
 */
export interface CliDeps {
  files(root: string): RepoFiles;
  openChange(root: string, base: string, head: string): Promise<ChangeSource>;
  /** Files at past commits (a plan as it was at launch); absent, readouts use today's plan and say so. */
  history?(root: string): CommitFiles;
  write?: { out(text: string): void; err(text: string): void };
}

/** The repository folder must exist: a mistyped -C would otherwise read as an empty, all-clear repository. */
function existingRepoFiles(root: string): RepoFiles {
  if (!existsSync(root) || !statSync(root).isDirectory()) throw new UsageError(`the repository folder ${root} does not exist`, 'check -C/--cwd');
  return createRepoFiles(root);
}

/** git is loaded only by the command that opens a change, so the other commands start without it. */
export const REAL_DEPS: CliDeps = {
  files: existingRepoFiles,
  openChange: async (...args) => (await import('../adapters/git.js')).openChange(...args),
  history: (root) => ({ fileAt: async (commit, path) => (await import('../adapters/git.js')).readFileAtCommit(root, commit, path) }),
};

export function context(options: CommonOptions, deps: CliDeps) {
  const output = createCliOutput({ noColorFlag: !options.color, ...(deps.write ? { write: deps.write } : {}) });
  const files = deps.files(resolve(options.cwd));
  return { output, files, settingsPath: options.config, onProgress: output.progress };
}

export function reportSettingsProblems(output: CliOutput, format: string, file: string, problems: Problem[]): number {
  if (format === 'json') output.out(JSON.stringify({ format: 'plumbline.settings-errors/1', settingsFile: file, problems }, null, 2));
  else output.err([`The settings file ${file} has errors:`, ...problems.map(formatProblem)].join('\n'));
  return EXIT.usage;
}

/** Plain decimal numbers only (core/source/decimal.ts). */
export const DECIMAL = DECIMAL_TEXT;

export function parseNumbers(what: string, texts: readonly string[]): number[] {
  return texts.map((text) => {
    const value = Number(text);
    if (!DECIMAL.test(text.trim()) || !Number.isFinite(value)) throw new UsageError(`${what}: ${JSON.stringify(text)} is not a number`, 'write a plain decimal number, e.g. 0.05 or 50412');
    return value;
  });
}

