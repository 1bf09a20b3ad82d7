import { readFile } from 'node:fs/promises';
import { Option, type Command } from 'commander';
import { writeFileAtomic } from '../adapters/files.js';
import { EXIT, context, reportSettingsProblems, type CommonOptions, type SetExit, type CliDeps } from './common.js';
import { resolve } from 'node:path';
import type { PullRequestInfo } from '../core/review/context.js';
import { ExternalError, UsageError } from '../errors.js';

/** The `check` command's pull-request options, from flags and an optional JSON file. */
export interface CheckFlags {
  base?: string;
  head: string;
  title?: string;
  body?: string;
  bodyFile?: string;
  label: string[];
  branch?: string;
  prJson?: string;
  repoUrl?: string;
  format: 'text' | 'json' | 'markdown';
  output?: string;
  today?: string;
}

/**
 * Reads pull-request details: flags win over the JSON file. The file may be a GitHub pull-request
 * object (labels as objects, branch as head.ref) or the plain shape { title, body, labels, branch }.
 */
export async function pullRequestInfo(flags: CheckFlags, cwd: string): Promise<PullRequestInfo> {
  let fromFile: PullRequestInfo = {};
  if (flags.prJson) {
    let parsed: unknown;
    try {
      parsed = JSON.parse(await readFile(resolve(cwd, flags.prJson), 'utf8'));
    } catch (error) {
      throw new UsageError(`--pr-json ${flags.prJson} is not a readable JSON file (${error instanceof Error ? error.message : String(error)})`, 'give { "title": ..., "body": ..., "labels": [...], "branch": ... } or a pull-request object');
    }
    fromFile = fromJson(parsed, flags.prJson);
  }
  let body = flags.body ?? fromFile.body;
  if (flags.bodyFile) {
    try {
      body = await readFile(resolve(cwd, flags.bodyFile), 'utf8');
    } catch (error) {
      throw new ExternalError(`cannot read --body-file ${flags.bodyFile}`, undefined, { cause: error });
    }
  }
  const labels = flags.label.length ? flags.label : fromFile.labels;
  return {
    ...((flags.title ?? fromFile.title) !== undefined ? { title: flags.title ?? fromFile.title } : {}),
    ...(body !== undefined ? { body } : {}),
    ...(labels ? { labels } : {}),
    ...((flags.branch ?? fromFile.branch) !== undefined ? { branch: flags.branch ?? fromFile.branch } : {}),
  };
}

function fromJson(value: unknown, file: string): PullRequestInfo {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) throw new UsageError(`--pr-json ${file}: expected a JSON object`);
  const record = value as Record<string, unknown>;
  const pr = (record.pull_request && typeof record.pull_request === 'object' ? record.pull_request : record) as Record<string, unknown>;
  const text = (v: unknown, field: string) => {
    if (v === undefined || v === null) return undefined;
    if (typeof v !== 'string') throw new UsageError(`--pr-json ${file}: ${field} must be text`);
    return v;
  };
  const labels = Array.isArray(pr.labels)
    ? pr.labels.map((l, i) => {
        const name = typeof l === 'string' ? l : l && typeof l === 'object' ? (l as { name?: unknown }).name : undefined;
        if (typeof name !== 'string') throw new UsageError(`--pr-json ${file}: labels[${i}] must be a name or an object with a name`);
        return name;
      })
    : undefined;
  const headRef = pr.head && typeof pr.head === 'object' ? (pr.head as { ref?: unknown }).ref : undefined;
  const title = text(pr.title, 'title');
  const body = text(pr.body, 'body');
  const branch = text(pr.branch ?? headRef, 'branch');
  return { ...(title !== undefined ? { title } : {}), ...(body !== undefined ? { body } : {}), ...(labels ? { labels } : {}), ...(branch !== undefined ? { branch } : {}) };
}

/** `plumbline check --base <ref>`: the pull-request review of a change. */
export function addCheckCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('check')
    .description('review a change between two commits: plans, sizing, collisions, logging; exits 1 when something blocks')
    .requiredOption('--base <ref>', 'the commit the change is compared with (its merge base with head is used), e.g. origin/main')
    .option('--head <ref>', 'the commit with the change', 'HEAD')
    .option('--title <text>', 'pull-request title')
    .option('--body <text>', 'pull-request description (may name plans by id or path)')
    .option('--body-file <file>', 'read the description from a file')
    .option('--label <name>', 'a pull-request label (repeatable)', (value: string, all: string[]) => [...all, value], [] as string[])
    .option('--branch <name>', 'the pull request’s branch')
    .option('--pr-json <file>', 'pull-request details as JSON: a GitHub pull-request object or { title, body, labels, branch }')
    .option('--repo-url <url>', 'repository web address, for links to files in Markdown, e.g. https://github.com/acme/shop')
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'json', 'markdown']).default('text'))
    .option('--output <file>', 'also write the JSON report to this file')
    .option('--today <date>', 'the day to judge running tests by, YYYY-MM-DD (default: today in the settings’ time zone)')
    .action(async (flags: CheckFlags) => {
      const options = program.opts<CommonOptions>();
      const { output } = context({ ...options, format: 'text' }, deps);
      const cwd = resolve(options.cwd);
      // git starts on the change while this process compiles the review's code (and forks cheaply, its heap still small).
      const opening = deps.openChange(cwd, flags.base!, flags.head);
      opening.catch(() => undefined); // awaited below, after the options are checked
      const [{ isCalendarDate }, { reviewChange }] = await Promise.all([import('../core/source/fields.js'), import('../run/review-change.js')]);
      if (flags.today !== undefined && !isCalendarDate(flags.today)) throw new UsageError(`--today ${JSON.stringify(flags.today)} is not a date`, 'write it as YYYY-MM-DD, e.g. --today 2026-12-01');
      const pr = await pullRequestInfo(flags, cwd);
      const change = await opening;
      const refNames = { base: `--base ${flags.base!}`, head: `--head ${flags.head}` };
      const outcome = await reviewChange({ change, pr, refNames, onProgress: output.progress, ...(deps.history ? { history: deps.history(cwd) } : {}), ...(options.config ? { settingsPath: options.config } : {}), ...(flags.today ? { today: flags.today } : {}) });
      if (outcome.kind === 'settings-invalid') return setExit(reportSettingsProblems(output, flags.format, outcome.settingsFile, outcome.problems));
      const { review } = outcome;
      // Only the renderers this run prints with are loaded.
      const reportJson = async () => JSON.stringify((await import('../core/review/report-schema.js')).reviewJson(review), null, 2);
      if (flags.output) await writeFileAtomic(resolve(cwd, flags.output), `${await reportJson()}\n`, { overwrite: true });
      const repoUrl = flags.repoUrl?.replace(/\/+$/, '');
      if (flags.format === 'json') output.out(await reportJson());
      else if (flags.format === 'markdown') output.out((await import('../core/report/review-markdown.js')).renderReviewMarkdown(review, repoUrl ? { repoUrl } : {}));
      else output.out((await import('../core/report/review-text.js')).renderReviewText(review, { color: output.color }));
      setExit(review.verdict === 'blocked' ? EXIT.findings : EXIT.ok);
    });
}
