import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'yaml';
import webhookExamples from '@octokit/webhooks-examples/api.github.com/index.json' with { type: 'json' };
import { repoRoot } from '../cli/helpers.js';
import type { FakeGitHub } from '../helpers/fake-github.js';

/** The Node binary the bundled Action runs under: this one, or PLUMBLINE_NODE24 (set by .ci/run) for Node 24. */
export const actionNode = process.env.PLUMBLINE_NODE24 || process.execPath;

/** GitHub's own example payload of a `pull_request` `opened` event (npm @octokit/webhooks-examples), pointed at a test repository. */
export function pullRequestEvent(options: { owner: string; repo: string; number: number; base: string; head: string; body?: string; headRepo?: string; action?: string }) {
  const examples = (webhookExamples as { name: string; examples: { action?: string }[] }[]).find((e) => e.name === 'pull_request')!.examples;
  const example = structuredClone(examples.find((e) => e.action === (options.action ?? 'opened'))!) as Record<string, any>;
  example.number = options.number;
  example.pull_request.number = options.number;
  example.pull_request.base.sha = options.base;
  example.pull_request.head.sha = options.head;
  example.pull_request.body = options.body ?? null;
  example.repository.full_name = `${options.owner}/${options.repo}`;
  example.repository.name = options.repo;
  example.repository.owner.login = options.owner;
  if (options.headRepo) example.pull_request.head.repo.full_name = options.headRepo;
  return example;
}

export interface ActionRun {
  status: number | null;
  stdout: string;
  outputs: Record<string, string>;
  summary: string;
  /** Path of the JSON report the run wrote (the `report` output), parsed. */
  report?: unknown;
}

/** Runs dist/index.js as a runner would: event file, INPUT_* for every input (defaults from action.yml), output and summary files. */
export function runAction(options: { github: FakeGitHub; workspace: string; event: object; eventName?: string; inputs?: Record<string, string>; env?: Record<string, string> }): Promise<ActionRun> {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-runner-'));
  const eventPath = join(dir, 'event.json');
  writeFileSync(eventPath, JSON.stringify(options.event));
  const outputPath = join(dir, 'output');
  const summaryPath = join(dir, 'summary');
  writeFileSync(outputPath, '');
  writeFileSync(summaryPath, '');
  const action = parse(readFileSync(join(repoRoot, 'action.yml'), 'utf8')) as { inputs: Record<string, { default?: string }> };
  const inputs: Record<string, string> = {};
  for (const [name, spec] of Object.entries(action.inputs)) {
    const value = options.inputs?.[name] ?? (name === 'token' ? 'test-token' : (spec.default ?? ''));
    inputs[`INPUT_${name.replace(/ /g, '_').toUpperCase()}`] = value;
  }
  const env = {
    PATH: process.env.PATH ?? '',
    HOME: process.env.HOME ?? '',
    GITHUB_ACTIONS: 'true',
    CI: 'true',
    GITHUB_EVENT_NAME: options.eventName ?? 'pull_request',
    GITHUB_EVENT_PATH: eventPath,
    GITHUB_REPOSITORY: `${options.github.owner}/${options.github.repo}`,
    GITHUB_REPOSITORY_OWNER: options.github.owner,
    GITHUB_API_URL: options.github.url,
    GITHUB_SERVER_URL: 'https://github.com',
    GITHUB_GRAPHQL_URL: `${options.github.url}/graphql`,
    GITHUB_WORKSPACE: options.workspace,
    GITHUB_OUTPUT: outputPath,
    GITHUB_STEP_SUMMARY: summaryPath,
    RUNNER_TEMP: dir,
    ...inputs,
    ...options.env,
  };
  return new Promise((resolve) => {
    const child = spawn(actionNode, [join(repoRoot, 'dist/index.js')], { cwd: options.workspace, env });
    let stdout = '';
    child.stdout.on('data', (c: Buffer) => (stdout += c.toString('utf8')));
    child.stderr.on('data', (c: Buffer) => (stdout += c.toString('utf8')));
    child.on('close', (status) => {
      const outputs: Record<string, string> = {};
      // GITHUB_OUTPUT holds name<<delimiter / value / delimiter blocks.
      const text = readFileSync(outputPath, 'utf8');
      for (const m of text.matchAll(/^([^<\n]+)<<(\S+)\n([\s\S]*?)\n\2$/gm)) outputs[m[1]!] = m[3]!;
      const report = outputs.report ? (JSON.parse(readFileSync(outputs.report, 'utf8')) as unknown) : undefined;
      resolve({ status, stdout, outputs, summary: readFileSync(summaryPath, 'utf8'), ...(report !== undefined ? { report } : {}) });
    });
  });
}
