import { resolve } from 'node:path';
import { Option } from 'commander';
import { createRepoFiles } from '../adapters/files.js';
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

export function context(options: CommonOptions) {
  const output = createCliOutput({ noColorFlag: !options.color });
  const files = createRepoFiles(resolve(options.cwd));
  return { output, files, settingsPath: options.config, onProgress: output.progress };
}

export function reportSettingsProblems(output: CliOutput, format: string, file: string, problems: Problem[]): number {
  if (format === 'json') output.out(JSON.stringify({ format: 'plumbline.settings-errors/1', settingsFile: file, problems }, null, 2));
  else output.err([`The settings file ${file} has errors:`, ...problems.map(formatProblem)].join('\n'));
  return EXIT.usage;
}

export function parseNumbers(what: string, texts: readonly string[]): number[] {
  return texts.map((text) => {
    const value = Number(text);
    if (text.trim() === '' || !Number.isFinite(value)) throw new UsageError(`${what}: ${JSON.stringify(text)} is not a number`);
    return value;
  });
}
