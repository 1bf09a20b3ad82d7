import { readFileSync, rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { withActionReference } from '../../src/core/report/action-reference.js';
import { startFakeGitHub } from '../helpers/fake-github.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE_TOUCHED, cleanPlan, planYaml } from '../review/scenarios.js';
import { pullRequestEvent, runAction } from './run-action.js';

const root = new URL('../../', import.meta.url);
const read = (path: string) => readFileSync(new URL(path, root), 'utf8');
const readme = read('README.md');
const action = parse(read('action.yml')) as { inputs: Record<string, unknown>; runs: { using: string; main: string } };

/** An example workflow of the README, as a user copies it. */
function readmeWorkflow(file = 'experiment-review.yml'): { text: string; value: any } {
  const block = [...readme.matchAll(/```yaml\n([\s\S]*?)```/g)].map((m) => m[1]!).find((b) => b.startsWith(`# .github/workflows/${file}`));
  if (!block) throw new Error(`the README lost its ${file} workflow`);
  return { text: block, value: parse(block) };
}

const made: string[] = [];
afterAll(() => made.forEach((r) => rmSync(r, { recursive: true, force: true })));

describe('the Action as documented', () => {
  it('declares the node24 runtime and the bundled entry', () => {
    expect(action.runs).toEqual({ using: 'node24', main: 'dist/index.js' });
  });

  it('keeps the README’s inputs and outputs tables generated from action.yml', () => {
    expect(withActionReference(readme, read('action.yml'))).toBe(readme);
  });

  it('gives a least-privilege workflow: nothing at the top, read code and write pull requests in the job, no persisted credentials', () => {
    const { value } = readmeWorkflow();
    expect(value.permissions).toEqual({});
    expect(value.jobs.review.permissions).toEqual({ contents: 'read', 'pull-requests': 'write' });
    const [checkout, plumbline] = value.jobs.review.steps;
    // The head commit itself, so the review reads the working tree (docs/decisions/0003).
    expect(checkout.with).toEqual({ ref: '${{ github.event.pull_request.head.sha }}', 'fetch-depth': 0, 'persist-credentials': false });
    expect(Object.keys(plumbline.with).every((name) => name in action.inputs)).toBe(true);
    expect(value.concurrency.group).toContain('github.event.pull_request.number');
    expect(Object.keys(value.on)).toEqual(['pull_request']);
  });

  it('runs this repository’s own review workflow as the README shows it, with uses: ./', () => {
    const { text } = readmeWorkflow();
    const own = read('.github/workflows/review.yml');
    const strip = (t: string) => t.split('\n').filter((l) => !l.startsWith('#')).join('\n').replace(/uses: \S*plumbline\S*|uses: \.\//, 'uses: <plumbline>').trim();
    expect(strip(own)).toBe(strip(text));
  });

  it('gives a digest workflow with a weekly schedule, a manual trigger, a concurrency group and only issues: write', () => {
    const { value, text } = readmeWorkflow('experiment-digest.yml');
    expect(Object.keys(value.on).sort()).toEqual(['schedule', 'workflow_dispatch']);
    expect(value.on.schedule[0].cron).toBe('0 7 * * 1');
    expect(value.permissions).toEqual({});
    expect(value.jobs.digest.permissions).toEqual({ issues: 'write' });
    expect(value.concurrency.group).toBe('plumbline-digest');
    expect(value.jobs.digest.steps[1].with).toEqual({ mode: 'digest' });
    const strip = (t: string) => t.split('\n').filter((l) => !l.startsWith('#')).join('\n').replace(/uses: \S*plumbline\S*|uses: \.\//, 'uses: <plumbline>').trim();
    expect(strip(read('.github/workflows/digest.yml'))).toBe(strip(text));
  });

  it('works with the README’s inputs on a pull request that blocks', async () => {
    const repo = makeTwoCommitRepo(baseFiles(), { 'experiments/good.yaml': planYaml(cleanPlan({ decisions: {} })), 'src/cart.ts': CART_CODE_TOUCHED });
    made.push(repo.root);
    const github = await startFakeGitHub();
    try {
      const step = readmeWorkflow().value.jobs.review.steps[1];
      const inputs = Object.fromEntries(Object.entries(step.with as Record<string, unknown>).map(([k, v]) => [k, String(v)]));
      const run = await runAction({ github, workspace: repo.root, event: pullRequestEvent({ owner: github.owner, repo: github.repo, number: 3, base: repo.base, head: repo.head }), inputs });
      expect(run.status).toBe(1);
      expect(run.outputs.verdict).toBe('blocked');
      expect(github.refused).toEqual([]);
    } finally {
      await github.close();
    }
  });
});
