// The scheduled totals workflow of the README (and its copy under docs/workflows/) against GitHub's rules for
// workflows, and the pull-request workflows against the promise that they need no credentials.
import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { buildProgram } from '../../src/cli/main.js';

const root = new URL('../../', import.meta.url);
const read = (path: string) => readFileSync(new URL(path, root), 'utf8');
const readme = read('README.md');
const exampleFile = 'docs/workflows/experiment-totals.yml';

/** A workflow of the README, as a user copies it: the yaml block that starts with its file name. */
function readmeBlock(file: string): string {
  const block = [...readme.matchAll(/```yaml\n([\s\S]*?)```/g)].map((m) => m[1]!).find((b) => b.startsWith(`# .github/workflows/${file}`));
  if (!block) throw new Error(`the README lost its ${file} workflow`);
  return block;
}

interface Step {
  uses?: string;
  run?: string;
  env?: Record<string, string>;
  with?: Record<string, unknown>;
  name?: string;
}
interface Workflow {
  on: Record<string, unknown>;
  permissions: unknown;
  concurrency?: { group: string; 'cancel-in-progress': boolean };
  jobs: Record<string, { permissions: unknown; environment?: string; steps: Step[] }>;
}

const text = readmeBlock('experiment-totals.yml');
const workflow = parse(text) as Workflow;
const steps = Object.values(workflow.jobs).flatMap((job) => job.steps);

/** `${{ secrets.NAME }}` references in a text. */
const secretsIn = (t: string) => [...t.matchAll(/\$\{\{\s*secrets\.([A-Za-z_][A-Za-z0-9_]*)\s*\}\}/g)].map((m) => m[1]!);

describe('the scheduled totals workflow', () => {
  it('is the same in the README and in docs/workflows/experiment-totals.yml', () => {
    expect(read(exampleFile)).toBe(text);
    expect(parse(read(exampleFile))).toEqual(workflow);
  });

  // GitHub, "Events that trigger workflows" (schedule: runs on the default branch's latest commit; workflow_dispatch:
  // by hand): https://docs.github.com/actions/using-workflows/events-that-trigger-workflows
  it('runs on a schedule and by hand only, never on a pull request', () => {
    expect(Object.keys(workflow.on).sort()).toEqual(['schedule', 'workflow_dispatch']);
    const [schedule] = workflow.on.schedule as { cron: string }[];
    expect(schedule!.cron.split(/\s+/)).toHaveLength(5);
    expect(workflow.concurrency).toEqual({ group: 'plumbline-totals', 'cancel-in-progress': false });
  });

  // GitHub, "Assigning permissions to jobs" / "Controlling permissions for GITHUB_TOKEN": `permissions: {}` disables
  // every scope, and "if you specify the access for any of these scopes, all of those that are not specified are set
  // to none": https://docs.github.com/en/actions/using-jobs/assigning-permissions-to-jobs
  it('asks for least privilege: nothing at the top, contents and pull requests write in the one job, nothing more', () => {
    expect(workflow.permissions).toEqual({});
    expect(Object.keys(workflow.jobs)).toEqual(['totals']);
    expect(workflow.jobs.totals!.permissions).toEqual({ contents: 'write', 'pull-requests': 'write' });
  });

  // GitHub, "Security hardening for GitHub Actions", using third-party actions: pinning an action to a full-length
  // commit SHA is the only way to use it as an immutable release:
  // https://docs.github.com/en/actions/security-guides/security-hardening-for-github-actions#using-third-party-actions
  it('pins every action to a full commit SHA, with its release beside it', () => {
    const uses = steps.filter((s) => s.uses).map((s) => s.uses!);
    expect(uses.length).toBeGreaterThan(0);
    for (const ref of uses) {
      expect(ref).toMatch(/^[\w.-]+\/[\w.-]+@[0-9a-f]{40}$/);
      expect(text).toMatch(new RegExp(`uses: ${ref.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')} # v\\d+\\.\\d+\\.\\d+`));
    }
    const checkout = steps.find((s) => s.uses?.startsWith('actions/checkout@'));
    expect(checkout?.with?.['persist-credentials']).toBe(false);
    // plumbline totals finds the plan's commit at launch in the history: a shallow clone has none.
    expect(checkout?.with?.['fetch-depth']).toBe(0);
  });

  it('gives the warehouse secrets to the totals step alone, from an environment, and the workflow token to the pull-request step alone', () => {
    expect(workflow.jobs.totals!.environment).toBe('warehouse');
    const withSecrets = steps.filter((s) => secretsIn(JSON.stringify(s)).length > 0);
    expect(withSecrets.map((s) => s.name)).toEqual(['Arm totals of every plan whose readout is due']);
    expect(withSecrets[0]!.run).toContain('plumbline totals');
    expect(secretsIn(JSON.stringify(withSecrets[0]!.env)).length).toBe(secretsIn(text).length);
    const tokenSteps = steps.filter((s) => JSON.stringify(s).includes('github.token'));
    expect(tokenSteps.map((s) => s.name)).toEqual(['Open or update the pull request']);
    expect(tokenSteps[0]!.run).not.toContain('npx plumbline');
  });

  // GitHub, "Security hardening for GitHub Actions", script injections (from memory): an expression inside `run:` is
  // pasted into the script before the shell sees it; pass values through `env:` instead.
  it('puts no ${{ }} expression inside a run script', () => {
    for (const step of steps) expect(step.run ?? '').not.toContain('${{');
  });

  // GitHub, "GITHUB_TOKEN": events triggered by the workflow token, other than workflow_dispatch and
  // repository_dispatch, create no workflow run: https://docs.github.com/actions/concepts/security/github_token
  it('tells the reader that the totals pull request does not start the review by itself', () => {
    const section = readme.slice(readme.indexOf('### Arm totals on a schedule'), readme.indexOf('### Bug fixes'));
    expect(section).toMatch(/start no other workflow/);
    expect(section).toMatch(/close and reopen it/);
  });

  it('opens one pull request from a fixed branch, or updates it by pushing to that branch', () => {
    const pr = steps.find((s) => s.name === 'Open or update the pull request')!.run!;
    expect(pr).toMatch(/git push --force origin "HEAD:refs\/heads\/\$branch"/);
    expect(pr).toMatch(/gh pr list --head "\$branch" --state open/);
    expect(pr).toMatch(/gh pr create --head "\$branch"/);
  });
});

describe('the pull-request workflows of the README', () => {
  // The review reads committed files only: the workflow may use the automatic token and nothing else.
  it.each(['experiment-review.yml'])('%s references no secret but GITHUB_TOKEN and no environment', (file) => {
    const block = readmeBlock(file);
    expect(secretsIn(block).filter((name) => name !== 'GITHUB_TOKEN')).toEqual([]);
    const value = parse(block) as Workflow;
    expect(Object.keys(value.on)).toEqual(['pull_request']);
    for (const job of Object.values(value.jobs)) {
      expect(job.environment).toBeUndefined();
      expect(JSON.stringify(job.steps)).not.toMatch(/secrets\.(?!GITHUB_TOKEN\b)/);
    }
  });
});

/** Shell words of a command line: quotes removed, variables kept as written (e.g. `$plan`). */
function shellWords(line: string): string[] {
  const words: string[] = [];
  let word = '';
  let inWord = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i]!;
    if (c === "'" || c === '"') {
      const end = line.indexOf(c, i + 1);
      word += line.slice(i + 1, end);
      i = end;
      inWord = true;
    } else if (/\s/.test(c)) {
      if (inWord) words.push(word);
      word = '';
      inWord = false;
    } else {
      word += c;
      inWord = true;
    }
  }
  if (inWord) words.push(word);
  return words;
}

/** Every `plumbline …` command line: in the workflow's run scripts and in the README section's code spans. */
function plumblineCommandLines(): string[] {
  const lines: string[] = [];
  for (const step of steps) {
    for (const line of (step.run ?? '').split('\n')) {
      const at = line.indexOf('npx plumbline ');
      if (at !== -1) lines.push(line.slice(at + 'npx '.length).split(/\s+[>|;]\s*/)[0]!.trim());
    }
  }
  const section = readme.slice(readme.indexOf('### Arm totals on a schedule'), readme.indexOf('### Bug fixes'));
  // A code span may be broken over two lines of the README; a bare `plumbline totals` names the command, runs nothing.
  for (const m of section.matchAll(/`(plumbline [^`]+)`/g)) {
    const line = m[1]!.replace(/\s+/g, ' ');
    if (line.split(' ').length > 2) lines.push(line);
  }
  return lines;
}

/** The totals command as issue 12's contract fixes it, for when the command is not in this branch's program yet. */
const CONTRACT_TOTALS = { operands: 1, flags: ['--sql'], valued: { '--data': null, '--engine': ['duckdb', 'postgres'], '--dialect': null, '--from-rows': null, '--out': null } as Record<string, string[] | null> };

function checkAgainstContract(words: string[]): string | undefined {
  let operands = 0;
  for (let i = 0; i < words.length; i++) {
    const w = words[i]!;
    if (!w.startsWith('-')) operands++;
    else if (CONTRACT_TOTALS.flags.includes(w)) continue;
    else if (w in CONTRACT_TOTALS.valued) {
      const value = words[++i];
      if (value === undefined) return `${w} needs a value`;
      const choices = CONTRACT_TOTALS.valued[w];
      if (choices && !choices.includes(value)) return `${w} ${value} is not one of ${choices.join(', ')}`;
    } else return `unknown option ${w}`;
  }
  return operands === CONTRACT_TOTALS.operands ? undefined : `${operands} operands, expected ${CONTRACT_TOTALS.operands}`;
}

/** Parses a command line with the real program, without running it: the error commander would give, or undefined. */
function checkWithProgram(program: Command, words: string[]): string | undefined {
  let i = 0;
  while (words[i]?.startsWith('-')) {
    const option = program.options.find((o) => o.long === words[i] || o.short === words[i]);
    if (!option) return `unknown global option ${words[i]}`;
    i += option.required || option.optional ? 2 : 1;
  }
  const command = program.commands.find((c) => c.name() === words[i] || c.aliases().includes(words[i]!));
  if (!command) return `no command ${words[i]}`;
  command.exitOverride();
  command.configureOutput({ writeErr: () => undefined, writeOut: () => undefined });
  try {
    const { operands, unknown } = command.parseOptions(words.slice(i + 1));
    if (unknown.length) return `unknown option ${unknown[0]}`;
    const declared = command.registeredArguments;
    const least = declared.filter((a) => a.required).length;
    const most = declared.some((a) => a.variadic) ? Infinity : declared.length;
    if (operands.length < least || operands.length > most) return `${operands.length} operands, expected ${least} to ${most}`;
  } catch (error) {
    return (error as Error).message;
  }
  return undefined;
}

describe('the plumbline command lines of the totals workflow', () => {
  const program = buildProgram(() => undefined);
  program.exitOverride();
  const hasTotals = program.commands.some((c) => c.name() === 'totals');
  const lines = plumblineCommandLines();

  it('finds the command lines to check', () => {
    expect(lines.filter((l) => l.startsWith('plumbline totals')).length).toBeGreaterThanOrEqual(3);
    expect(lines).toContain('plumbline digest --format json');
  });

  it.each(lines)(`%s is accepted (${hasTotals ? 'by the real command-line program' : 'totals against the contract of issue 12, the rest by the real program'})`, (line) => {
    const words = shellWords(line).slice(1).map((w) => w.replace(/^<(\w[\w-]*)>$/, 'example-$1'));
    const error = words[0] === 'totals' && !hasTotals ? checkAgainstContract(words.slice(1)) : checkWithProgram(program, words);
    expect(error).toBeUndefined();
  });

  it('rejects a command line the program does not know (the check can fail)', () => {
    expect(checkWithProgram(program, ['digest', '--no-such-option'])).toBe('unknown option --no-such-option');
    expect(checkWithProgram(program, ['digest', '--format'])).toMatch(/argument missing/);
    expect(checkAgainstContract(['plan', '--engine', 'oracle'])).toMatch(/not one of/);
    expect(checkAgainstContract(['plan', '--warehouse', 'x'])).toMatch(/unknown option/);
  });
});
