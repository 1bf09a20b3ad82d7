import { resolve } from 'node:path';
import { Command, CommanderError, Option } from 'commander';
import { createRepoFiles, writeFileAtomic } from '../adapters/files.js';
import { formatProblem, type Problem } from '../core/source/problem.js';
import { SRM_ALARM_P } from '../core/stats/choices.js';
import { BUG_REPORT_HINT, ExternalError, UsageError } from '../errors.js';
import { createCliOutput, type CliOutput } from './output.js';
import { addSizeOptions, requestFromFlags, type SizeFlags } from './size-command.js';
import type { CheckFlags } from './check-command.js';
import { VERSION } from '../version.js';

// Only the parser, the help and what every command shares load at start; each command imports
// what it uses when it runs, so `--version`, `--help` and `validate` never load git, the review,
// the statistics or the schema generator (see docs/decisions/0003-where-the-time-goes.md).

/** Exit codes, documented in --help and the README. */
export const EXIT = { ok: 0, findings: 1, usage: 2, internal: 3 } as const;

interface CommonOptions {
  cwd: string;
  config?: string;
  format: 'text' | 'json';
  color: boolean;
}

const formatOption = () => new Option('--format <format>', 'output format').choices(['text', 'json']).default('text');

function context(options: CommonOptions) {
  const output = createCliOutput({ noColorFlag: !options.color });
  const files = createRepoFiles(resolve(options.cwd));
  return { output, files, settingsPath: options.config, onProgress: output.progress };
}

function reportSettingsProblems(output: CliOutput, format: string, file: string, problems: Problem[]): number {
  if (format === 'json') output.out(JSON.stringify({ format: 'plumbline.settings-errors/1', settingsFile: file, problems }, null, 2));
  else output.err([`The settings file ${file} has errors:`, ...problems.map(formatProblem)].join('\n'));
  return EXIT.usage;
}

function parseNumbers(what: string, texts: readonly string[]): number[] {
  return texts.map((text) => {
    const value = Number(text);
    if (text.trim() === '' || !Number.isFinite(value)) throw new UsageError(`${what}: ${JSON.stringify(text)} is not a number`);
    return value;
  });
}

export function buildProgram(setExit: (code: number) => void): Command {
  const program = new Command('plumbline')
    .description('Experiment hygiene for code review: validate plans, list the registry, size and check changes.')
    .version(VERSION)
    .option('-C, --cwd <dir>', 'repository root', '.')
    .option('-c, --config <file>', 'settings file, relative to the repository (default: .plumbline.yml if present)')
    .option('--no-color', 'never colour the output (NO_COLOR is respected too)')
    .showHelpAfterError()
    .exitOverride()
    .addHelpText('after', '\nExit codes: 0 fine, 1 blocking findings or invalid plans, 2 usage, settings or environment error, 3 internal error (a bug).');

  program
    .command('validate')
    .description('check every plan file, registry file and the settings file')
    .addOption(formatOption())
    .action(async (local: { format: 'text' | 'json' }) => {
      const options = { ...program.opts<CommonOptions>(), ...local };
      const { output, ...ports } = context(options);
      const [{ validateRepository }, { renderValidationText, validationJson }] = await Promise.all([import('../run/validate.js'), import('../core/report/validation.js')]);
      const outcome = await validateRepository(ports);
      if (outcome.kind === 'settings-invalid') return setExit(reportSettingsProblems(output, options.format, outcome.settingsFile, outcome.problems));
      const { report } = outcome;
      output.out(options.format === 'json' ? JSON.stringify(validationJson(report), null, 2) : renderValidationText(report, { color: output.color }));
      setExit(report.errors > 0 ? EXIT.findings : EXIT.ok);
    });

  program
    .command('list')
    .description('show the registry of tests: state, surface, window, owners')
    .addOption(formatOption())
    .addOption(new Option('--state <state>', 'only tests in this state').choices(['draft', 'live', 'on-hold', 'concluded']))
    .action(async (local: { format: 'text' | 'json'; state?: string }) => {
      const options = { ...program.opts<CommonOptions>(), ...local };
      const { output, ...ports } = context(options);
      const [{ loadWorkspace }, { registryJson, renderRegistryText }] = await Promise.all([import('../run/load-workspace.js'), import('../core/report/registry-list.js')]);
      const loaded = await loadWorkspace(ports);
      if (!loaded.ok) return setExit(reportSettingsProblems(output, options.format, loaded.settingsFile, loaded.settingsProblems));
      const { workspace } = loaded;
      const registry = { entries: workspace.registry.entries.filter((e) => !local.state || e.state === local.state) };
      const skippedFiles = new Set(workspace.problems.filter((p) => p.severity === 'error').map((p) => p.file)).size;
      output.out(options.format === 'json' ? JSON.stringify(registryJson(registry), null, 2) : renderRegistryText(registry, { color: output.color, skippedFiles }));
      setExit(EXIT.ok);
    });

  program
    .command('new')
    .description('write a new commented draft plan for a feature flag')
    .argument('<flag-key>', 'the feature-flag key the test reads')
    .option('--id <id>', 'plan id (default: from the flag key)')
    .option('--owner <handle>', 'owner, e.g. @ana-lima')
    .option('--surface <path>', 'surface path, e.g. checkout/payment')
    .option('--out <file>', 'where to write it (default: <plans folder>/<id>.yaml)')
    .option('--today <date>', 'today as YYYY-MM-DD (default: the system date, UTC)')
    .option('--force', 'replace an existing file', false)
    .option('--stdout', 'print the plan instead of writing it', false)
    .action(async (flagKey: string, local: { id?: string; owner?: string; surface?: string; out?: string; today?: string; force: boolean; stdout: boolean }) => {
      const options = program.opts<CommonOptions>();
      const { output, ...ports } = context({ ...options, format: 'text' });
      const today = local.today ?? new Date().toISOString().slice(0, 10);
      const [{ isCalendarDate }, { scaffoldPlan }] = await Promise.all([import('../core/source/fields.js'), import('../run/scaffold.js')]);
      if (!isCalendarDate(today)) throw new UsageError(`--today ${JSON.stringify(today)} is not a date`, 'write it as YYYY-MM-DD, e.g. --today 2026-12-01');
      const result = await scaffoldPlan({ ...ports, ...local, flagKey, today });
      if (local.stdout) return output.out(result.text);
      await writeFileAtomic(resolve(options.cwd, result.path), result.text, { overwrite: local.force });
      output.out(`Wrote ${result.path} (plan ${result.id}). Fill it in, then run: plumbline validate`);
    });

  addSizeOptions(
    program
      .command('size')
      .description('size a test: units per arm, days, power and detectable effect by the planned end')
      .argument('[plan]', 'plan id or plan file; omit to describe a metric with --kind and the flags below'),
  ).action(async (planName: string | undefined, flags: SizeFlags) => {
    const options = program.opts<CommonOptions>();
    const { output, ...ports } = context({ ...options, format: 'text' });
    if (planName && flags.kind) throw new UsageError('name a plan or give --kind, not both');
    const [{ sizeFromRequest, sizeNamedPlan }, { renderSizingMarkdown, renderSizingText, sizingJson }] = await Promise.all([import('../run/size.js'), import('../core/report/sizing.js')]);
    const outcome = planName ? await sizeNamedPlan({ ...ports, plan: planName }) : sizeFromRequest(requestFromFlags(flags));
    if (!planName && !outcome.sizing.metrics[0]!.result.ok) {
      const { error } = outcome.sizing.metrics[0]!.result;
      throw new UsageError(`cannot size this metric: ${error.input}: ${error.message}`);
    }
    if (flags.format === 'json') output.out(JSON.stringify(sizingJson(outcome.sizing, outcome.context), null, 2));
    else if (flags.format === 'markdown') output.out(renderSizingMarkdown(outcome.sizing, { ...outcome.context, power: outcome.power }));
    else output.out(renderSizingText(outcome.sizing, outcome.context));
    setExit(EXIT.ok);
  });

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
    .action(async (flags: CheckFlags) => {
      const options = program.opts<CommonOptions>();
      const { output } = context({ ...options, format: 'text' });
      const cwd = resolve(options.cwd);
      const [{ pullRequestInfo }, { openChange }, { reviewChange }, { reviewJson }, { renderReviewMarkdown }, { renderReviewText }] = await Promise.all([
        import('./check-command.js'),
        import('../adapters/git.js'),
        import('../run/review-change.js'),
        import('../core/review/report-schema.js'),
        import('../core/report/review-markdown.js'),
        import('../core/report/review-text.js'),
      ]);
      const pr = await pullRequestInfo(flags, cwd);
      const change = await openChange(cwd, flags.base!, flags.head);
      const outcome = await reviewChange({ change, pr, onProgress: output.progress, ...(options.config ? { settingsPath: options.config } : {}) });
      if (outcome.kind === 'settings-invalid') return setExit(reportSettingsProblems(output, flags.format, outcome.settingsFile, outcome.problems));
      const { review } = outcome;
      if (flags.output) await writeFileAtomic(resolve(cwd, flags.output), `${JSON.stringify(reviewJson(review), null, 2)}\n`, { overwrite: true });
      const repoUrl = flags.repoUrl?.replace(/\/+$/, '');
      if (flags.format === 'json') output.out(JSON.stringify(reviewJson(review), null, 2));
      else if (flags.format === 'markdown') output.out(renderReviewMarkdown(review, repoUrl ? { link: (path, line) => `${repoUrl}/blob/${review.head}/${encodeURI(path)}#L${line}` } : {}));
      else output.out(renderReviewText(review, { color: output.color }));
      setExit(review.verdict === 'blocked' ? EXIT.findings : EXIT.ok);
    });

  program
    .command('digest')
    .description('the weekly digest: tests past their end, ending soon, stale drafts, long holds, collisions, flags without plans')
    .option('--today <date>', 'the day to judge by, YYYY-MM-DD (default: today in the settings’ time zone, UTC unless set)')
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'json', 'markdown']).default('text'))
    .action(async (local: { today?: string; format: string }) => {
      const options = program.opts<CommonOptions>();
      const { output, ...ports } = context({ ...options, format: 'text' });
      const [{ isCalendarDate }, { digestRepository }, { DIGEST_JSON_FORMAT, renderDigestMarkdown, renderDigestText }] = await Promise.all([
        import('../core/source/fields.js'),
        import('../run/digest.js'),
        import('../core/report/digest-markdown.js'),
      ]);
      if (local.today !== undefined && !isCalendarDate(local.today)) throw new UsageError(`--today ${JSON.stringify(local.today)} is not a date`, 'write it as YYYY-MM-DD, e.g. --today 2026-12-01');
      const { digest } = await digestRepository({ files: ports.files, now: new Date(), ...(ports.settingsPath ? { settingsPath: ports.settingsPath } : {}), ...(local.today ? { today: local.today } : {}) });
      if (local.format === 'json') output.out(JSON.stringify({ format: DIGEST_JSON_FORMAT, ...digest }, null, 2));
      else if (local.format === 'markdown') output.out(renderDigestMarkdown(digest));
      else output.out(renderDigestText(digest));
      setExit(EXIT.ok);
    });

  program
    .command('srm')
    .description('sample ratio mismatch: do the units seen per arm fit the planned weights?')
    .argument('<counts...>', 'units observed in each arm, control first, e.g. 50412 49288')
    .option('--weights <weights>', 'planned weights, e.g. 50,50 (default: equal)')
    .option('--threshold <p>', 'alarm below this p-value', String(SRM_ALARM_P))
    .addOption(formatOption())
    .action(async (counts: string[], local: { weights?: string; threshold: string; format: string }) => {
      const [{ sampleRatioMismatch }, { SRM_JSON_FORMAT, renderSrmText }] = await Promise.all([import('../core/stats/srm.js'), import('../core/report/readout.js')]);
      const observed = parseNumbers('counts', counts);
      const weights = local.weights ? parseNumbers('weights', local.weights.split(',')) : observed.map(() => 1);
      const threshold = parseNumbers('threshold', [local.threshold])[0]!;
      const check = sampleRatioMismatch(observed, weights, threshold);
      if (!check.ok) throw new UsageError(`${check.error.input}: ${check.error.message}`);
      const output = createCliOutput({ noColorFlag: true });
      output.out(local.format === 'json' ? JSON.stringify({ format: SRM_JSON_FORMAT, observed, weights, threshold, ...check.value }, null, 2) : renderSrmText(check.value, observed, weights, threshold));
      setExit(check.value.mismatch ? EXIT.findings : EXIT.ok);
    });

  program
    .command('adjust')
    .description('adjust p-values for multiple comparisons (Benjamini-Hochberg and Bonferroni)')
    .argument('<p-values...>', 'p-values, e.g. 0.001 0.02 0.04')
    .option('--q <level>', 'false discovery rate (and family-wise level) to compare with', '0.05')
    .addOption(formatOption())
    .action(async (values: string[], local: { q: string; format: string }) => {
      const [{ benjaminiHochberg, bonferroniAdjust }, { ADJUST_JSON_FORMAT, renderAdjustedText }] = await Promise.all([import('../core/stats/multiple-testing.js'), import('../core/report/readout.js')]);
      const p = parseNumbers('p-values', values);
      const q = parseNumbers('q', [local.q])[0]!;
      const bh = benjaminiHochberg(p);
      const bonferroni = bonferroniAdjust(p);
      if (!bh.ok) throw new UsageError(`${bh.error.input}: ${bh.error.message}`);
      if (!bonferroni.ok) throw new UsageError(`${bonferroni.error.input}: ${bonferroni.error.message}`);
      const output = createCliOutput({ noColorFlag: true });
      output.out(
        local.format === 'json'
          ? JSON.stringify({ format: ADJUST_JSON_FORMAT, q, pValues: p, benjaminiHochberg: bh.value, bonferroni: bonferroni.value }, null, 2)
          : renderAdjustedText(p, bh.value, bonferroni.value, q),
      );
      setExit(EXIT.ok);
    });

  program
    .command('schema')
    .description('print the JSON Schema of a file format, for editors and other tools')
    .addArgument(new Command().createArgument('[format]', 'plan, registry or settings').choices(['plan', 'registry', 'settings']).default('plan'))
    .action(async (which: 'plan' | 'registry' | 'settings') => {
      const schema =
        which === 'plan'
          ? (await import('../core/plan/json-schema.js')).planJsonSchema()
          : which === 'registry'
            ? (await import('../core/registry/load.js')).registryJsonSchema()
            : (await import('../core/config/load.js')).settingsJsonSchema();
      process.stdout.write(`${JSON.stringify(schema, null, 2)}\n`);
    });

  return program;
}

/** Runs the CLI and returns its exit code; the single place where errors are reported. */
export async function runCli(argv: string[]): Promise<number> {
  let exitCode: number = EXIT.ok;
  const program = buildProgram((code) => (exitCode = code));
  try {
    await program.parseAsync(argv);
    return exitCode;
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and --version are successes; every other parser complaint is a usage error (already printed).
      return error.exitCode === 0 ? EXIT.ok : EXIT.usage;
    }
    if (error instanceof UsageError) {
      process.stderr.write(`plumbline: ${error.message}${error.hint ? `\n  hint: ${error.hint}` : ''}\n`);
      return EXIT.usage;
    }
    if (error instanceof ExternalError) {
      // The environment failed (a file system or git error): not the user's plans, so not exit 1.
      const cause = error.cause instanceof Error ? `\n  cause: ${error.cause.message}` : '';
      process.stderr.write(`plumbline: ${error.message}${cause}${error.hint ? `\n  hint: ${error.hint}` : ''}\n`);
      return EXIT.usage;
    }
    const detail = error instanceof Error ? (error.stack ?? error.message) : String(error);
    process.stderr.write(`plumbline: internal error: ${detail}\n${BUG_REPORT_HINT}\n`);
    return EXIT.internal;
  }
}
