import { execFileSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { startFakeGitHub } from '../helpers/fake-github.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, CART_CODE_TOUCHED, cleanPlan, planYaml } from '../review/scenarios.js';
import { pullRequestEvent, runAction } from './run-action.js';
import { actionScenarios } from './scenarios.js';

const { setup, track } = actionScenarios();

const blockingChange = { 'experiments/good.yaml': planYaml(cleanPlan({ decisions: { win: 'Ship.' } })), 'src/cart.ts': CART_CODE_TOUCHED };
const MARKER = '<!-- plumbline:review -->';

describe('the bundled Action against a fake GitHub', () => {
  it('creates the comment on the first run and updates it in place on the next', async () => {
    const { repo, github, event } = await setup({ 'src/cart.ts': CART_CODE_TOUCHED });
    const first = await runAction({ github, workspace: repo.root, event });
    expect(first.status, first.stdout).toBe(0);
    expect(github.comments(7)).toHaveLength(1);
    expect(github.comments(7)[0]!.body.startsWith(MARKER)).toBe(true);
    expect(first.outputs).toMatchObject({ verdict: 'clear', blocking: '0', warnings: '0' });
    expect(first.summary).toContain('Plumbline: all clear');
    const id = github.comments(7)[0]!.id;
    const second = await runAction({ github, workspace: repo.root, event });
    expect(second.status).toBe(0);
    expect(github.comments(7).map((c) => c.id)).toEqual([id]);
    // Updated in place: one comment ever created, then edited; nothing deleted.
    const ops = github.requests.map((r) => r.operation ?? '');
    expect(ops.filter((o) => o.startsWith('POST ') && o.endsWith('/comments'))).toHaveLength(1);
    expect(ops.filter((o) => o.startsWith('DELETE '))).toHaveLength(0);
    expect(github.refused).toEqual([]);
  });

  it('fails on a blocking plan, with annotations at the plan file', async () => {
    const { repo, github, event } = await setup(blockingChange);
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status).toBe(1);
    // The annotation lands on the plan's decisions: key, where the fix goes.
    const decisionsLine = blockingChange['experiments/good.yaml']!.split('\n').findIndex((l) => l.startsWith('decisions:')) + 1;
    expect(decisionsLine).toBeGreaterThan(1);
    expect(run.stdout).toContain(`::error title=Plumbline decisions-missing,file=experiments/good.yaml,line=${decisionsLine}::No decision rule for flat, loss, guardrail-breach`);
    expect(run.outputs.verdict).toBe('blocked');
    expect(github.comments(7)[0]!.body).toContain('⛔ Plumbline: blocked');
    expect(github.refused).toEqual([]);
  });

  it('annotates each load warning of a plan it reviews once, as a warning that does not fail the run', async () => {
    const plan = planYaml(cleanPlan({ id: 'renamed', flags: ['renamed-flag'], state: 'draft', window: { start: '2027-01-04', end: '2027-01-31' }, surface: { path: 'shop/renamed', 'exclusion-group': { name: 'cart-core', slice: { from: 0, to: 50 } } } }));
    const keyLine = plan.split('\n').findIndex((l) => l.trimStart().startsWith('exclusion-group:')) + 1;
    const { repo, github, event } = await setup({ 'experiments/renamed.yaml': plan });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    const annotations = run.stdout.split('\n').filter((l) => l.includes('is the old name of'));
    expect(annotations).toEqual([expect.stringContaining(`::warning title=Plumbline file-warning,file=experiments/renamed.yaml,line=${keyLine}::surface.exclusion-group:`)]);
    expect(github.comments(7)[0]!.body.match(/is the old name of/g)).toHaveLength(1);
  });

  it('leaves one comment when two runs race', async () => {
    const { repo, github, event } = await setup({ 'src/cart.ts': CART_CODE_TOUCHED });
    await Promise.all([runAction({ github, workspace: repo.root, event }), runAction({ github, workspace: repo.root, event })]);
    expect(github.comments(7)).toHaveLength(1);
    expect(github.refused).toEqual([]);
  });

  it('keeps the oldest of duplicate comments and ignores comments by people that quote the marker', async () => {
    const { repo, github, event } = await setup({ 'src/cart.ts': CART_CODE_TOUCHED });
    github.addComment(7, `${MARKER}\nold copy`, 'github-actions[bot]');
    github.addComment(7, `${MARKER}\nnewer copy`, 'github-actions[bot]');
    github.addComment(7, `${MARKER}\nsomeone quoting it`, 'ana-lima');
    const oldest = github.comments(7)[0]!.id;
    await runAction({ github, workspace: repo.root, event });
    const left = github.comments(7);
    expect(left.map((c) => c.id)).toContain(oldest);
    expect(left.filter((c) => c.login === 'github-actions[bot]')).toHaveLength(1);
    expect(left.find((c) => c.login === 'ana-lima')).toBeDefined();
  });

  it('reads every page of comments to find its own', async () => {
    const { repo, github, event } = await setup({ 'src/cart.ts': CART_CODE_TOUCHED });
    for (let i = 0; i < 250; i++) github.addComment(7, `chatter ${i}`, 'someone');
    github.addComment(7, `${MARKER}\nmine, on page 3`, 'github-actions[bot]');
    await runAction({ github, workspace: repo.root, event });
    const ours = github.comments(7).filter((c) => c.body.startsWith(MARKER));
    expect(ours).toHaveLength(1);
    expect(ours[0]!.body).toContain('Plumbline: all clear');
    expect(github.requests.filter((r) => r.operation?.startsWith('GET') && r.path.includes('/comments')).length).toBeGreaterThanOrEqual(3);
  });

  it('says there is nothing left to check when a later push removes every flag change', async () => {
    const { repo, github, event } = await setup({ 'README.md': 'docs only\n' });
    github.addComment(7, `${MARKER}\n### ⛔ Plumbline: blocked`, 'github-actions[bot]');
    await runAction({ github, workspace: repo.root, event });
    expect(github.comments(7)[0]!.body).toContain('Plumbline: nothing to check');
  });

  it('degrades on a read-only token: summary and annotations, one warning naming the permission, exit on findings alone', async () => {
    const { repo, github, event } = await setup(blockingChange, { readOnly: true });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status).toBe(1);
    expect(run.stdout.match(/::warning::/g)).toHaveLength(1);
    expect(run.stdout).toContain('pull-requests: write');
    expect(run.summary).toContain('Plumbline: blocked');
    expect(github.comments(7)).toHaveLength(0);
  });

  it('reviews a pull request from a fork with its read-only token', async () => {
    const repo = makeTwoCommitRepo(baseFiles(), { 'src/cart.ts': CART_CODE_TOUCHED });
    track(repo);
    const github = await startFakeGitHub({ modes: { readOnly: true } });
    track(github);
    const event = pullRequestEvent({ owner: github.owner, repo: github.repo, number: 9, base: repo.base, head: repo.head, headRepo: 'someone-else/shop' });
    expect(event.pull_request.head.repo.full_name).not.toBe(event.repository.full_name);
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status).toBe(0);
    expect(run.outputs.verdict).toBe('clear');
    expect(run.stdout).toContain('Resource not accessible by integration');
    expect(github.refused).toEqual([]);
  });

  const dispatch = { inputs: {}, ref: 'refs/heads/main', repository: { full_name: 'bramblecart/shop' }, sender: { login: 'ana-lima' }, workflow: '.github/workflows/digest.yml' };
  const schedule = { schedule: '0 7 * * 1' };
  const DIGEST_MARKER = '<!-- plumbline:digest -->';

  it.each([
    ['workflow_dispatch', dispatch],
    ['schedule', schedule],
  ])('publishes the digest issue on a %s event: created the first week, updated the next, people’s text kept', async (eventName, event) => {
    const { repo, github } = await setup({});
    const first = await runAction({ github, workspace: repo.root, event, eventName });
    expect(first.status, first.stdout).toBe(0);
    expect(github.issues()).toHaveLength(1);
    const issue = github.issues()[0]!;
    expect(issue.labels).toEqual(['plumbline-digest']);
    expect(issue.body.startsWith(DIGEST_MARKER)).toBe(true);
    expect(issue.body).toContain('past its end');
    expect(first.summary).toContain('Plumbline weekly digest');
    issue.body = `Notes from the team: readouts on Thursday.\n\n${issue.body}\n\nPlease add your test here.`;
    const second = await runAction({ github, workspace: repo.root, event, eventName });
    expect(second.status).toBe(0);
    expect(github.issues()).toHaveLength(1);
    expect(github.issues()[0]!.body).toContain('Notes from the team: readouts on Thursday.');
    expect(github.issues()[0]!.body).toContain('Please add your test here.');
    expect(github.issues()[0]!.body.split(DIGEST_MARKER)).toHaveLength(2);
    expect(github.refused).toEqual([]);
  });

  it('leaves one open digest issue when two scheduled runs race, and never touches a pull request', async () => {
    const { repo, github } = await setup({});
    github.addIssue({ title: 'A pull request', body: `${DIGEST_MARKER}\nnot an issue`, labels: ['plumbline-digest'], login: 'github-actions[bot]', pullRequest: true });
    await Promise.all([runAction({ github, workspace: repo.root, event: schedule, eventName: 'schedule' }), runAction({ github, workspace: repo.root, event: schedule, eventName: 'schedule' })]);
    const open = github.issues().filter((i) => i.state === 'open' && !i.pullRequest);
    expect(open).toHaveLength(1);
    expect(github.issues().find((i) => i.pullRequest)!.body).toBe(`${DIGEST_MARKER}\nnot an issue`);
    expect(github.refused).toEqual([]);
  });

  it('writes the digest to the summary when the token cannot open issues', async () => {
    const { repo, github } = await setup({}, { readOnly: true });
    const run = await runAction({ github, workspace: repo.root, event: schedule, eventName: 'schedule' });
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('issues: write');
    expect(run.summary).toContain('Plumbline weekly digest');
  });

  it('refuses mode review on an event without a pull request', async () => {
    const { repo, github } = await setup({});
    const run = await runAction({ github, workspace: repo.root, event: { schedule: '0 7 * * 1' }, eventName: 'schedule', inputs: { mode: 'review' } });
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('mode review needs a pull_request event; this run was started by schedule');
  });

  it('waits out a secondary rate limit with retry-after', async () => {
    const { repo, github, event } = await setup({ 'src/cart.ts': CART_CODE_TOUCHED }, { secondaryLimit: { times: 1, status: 403, retryAfter: 1 } });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    expect(github.comments(7)).toHaveLength(1);
  });

  it('uses the pull-request files API when no git history is there', async () => {
    const { repo, github, event } = await setup({ 'src/new.ts': "client.getBooleanValue('api-flag', false);\n" });
    rmSync(`${repo.root}/.git`, { recursive: true, force: true });
    github.setPullRequestFiles(7, [{ filename: 'src/new.ts', status: 'added', patch: "@@ -0,0 +1 @@\n+client.getBooleanValue('api-flag', false);" }]);
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status).toBe(0);
    expect(run.outputs.warnings).toBe('1');
    expect(github.comments(7)[0]!.body).toContain('api-flag');
    expect(github.requests.some((r) => r.operation === 'GET /repos/{owner}/{repo}/pulls/{pull_number}/files')).toBe(true);
  });

  it('says in the comment that started tests were not compared with the base commit when only the files API is there', async () => {
    const head = planYaml(cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, alpha: 0.1 } }));
    const { repo, github, event } = await setup({ 'experiments/good.yaml': head });
    rmSync(`${repo.root}/.git`, { recursive: true, force: true });
    github.setPullRequestFiles(7, [{ filename: 'experiments/good.yaml', status: 'modified', patch: '@@ -24,0 +25 @@\n+  alpha: 0.1' }]);
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    const body = github.comments(7)[0]!.body;
    expect(body).toContain('base-unread');
    expect(body).toContain('The plans of 1 started test this change edits (good) were not compared with the base commit');
    expect(body).toContain('The base commit was not read because this run read the change through the pull-request files API');
    expect(body).toContain('fetch-depth: 0');
    expect(github.refused).toEqual([]);
  });

  it('keeps a huge review under the 65,536-character limit that GitHub enforces with 422', async () => {
    const calls = Array.from({ length: 900 }, (_, i) => `client.getBooleanValue('unplanned-flag-${i}', false);`).join('\n');
    const { repo, github, event } = await setup({ 'src/many.ts': `${calls}\n` }, { bodyLimit: 65536 });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    const body = github.comments(7)[0]!.body;
    expect(body.length).toBeLessThanOrEqual(65536);
    expect(body).toContain("Left out to fit GitHub's comment size limit");
    expect(run.outputs.warnings).toBe('900');
  });

  it('writes the full review of 40 plans to the job summary and says in the comment what it left out', async () => {
    const plans: Record<string, string> = {};
    for (let i = 0; i < 40; i++) {
      const plan = cleanPlan({
        id: `plan-${i}`,
        flags: [`flag-${i}`],
        surface: { path: `shop/area-${i}` },
        hypothesis: { change: 'A clearer cart.', 'expected-direction': 'increase' },
        metrics: {
          primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: [`never_logged_${i}`] },
          guardrails: [{ name: 'errors', kind: 'proportion', baseline: { rate: 0.02 }, events: ['cart_error'], direction: 'decrease', tolerance: { relative: 0.2 } }],
        },
      });
      plans[`experiments/plan-${i}.yaml`] = planYaml(plan);
    }
    const { repo, github, event } = await setup(plans);
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    const report = JSON.parse(readFileSync(run.outputs.report!, 'utf8')) as { findings: { code: string; plan?: string }[] };
    expect(report.findings.length).toBeGreaterThanOrEqual(80);
    // Every finding and every plan's sizing is in the summary, which is not cut.
    for (const f of report.findings) expect(run.summary).toContain(`**${f.code}** · \`${f.plan}\``);
    const sections = run.summary.split('\n#### Plan ').slice(1);
    expect(sections).toHaveLength(40);
    for (const section of sections) expect(section).toContain('<summary>Sizing and events</summary>');
    expect(run.summary).not.toContain('Left out to fit');
    // The comment fits and names what it left out, by count, and where it is.
    const body = github.comments(7)[0]!.body;
    expect(body.length).toBeLessThanOrEqual(65536);
    const note = /Left out to fit GitHub's comment size limit: (.*)\. They are in the job summary\./.exec(body);
    expect(note, body.slice(-500)).not.toBeNull();
    const tables = /the sizing and events tables of (\d+) plans/.exec(note![1]!);
    expect(Number(tables![1])).toBe(40 - (body.match(/<summary>Sizing and events<\/summary>/g) ?? []).length);
  });

  it('says the review is partial, in the verdict, the comment and the JSON report, when GitHub caps the file list at 3,000', async () => {
    const { repo, github, event } = await setup({ 'src/new.ts': 'export {};\n' });
    rmSync(`${repo.root}/.git`, { recursive: true, force: true });
    // GitHub's files API lists at most 3,000 files (REST docs, "List pull requests files"); the event still counts them all.
    event.pull_request.changed_files = 3100;
    github.setPullRequestFiles(7, Array.from({ length: 3100 }, (_, i) => ({ filename: `gen/file-${i}.ts`, status: 'added', patch: '@@ -0,0 +1 @@\n+export {};' })));
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    expect(run.stdout).toMatch(/::notice::GitHub lists at most 3,000 files of a pull request/);
    expect(github.requests.filter((r) => r.operation === 'GET /repos/{owner}/{repo}/pulls/{pull_number}/files')).toHaveLength(30);
    expect(run.outputs.verdict).toBe('partial');
    const body = github.comments(7)[0]!.body;
    expect(body).not.toContain('all clear');
    expect(body).not.toContain('nothing to check');
    expect(body).toContain('Partial review');
    expect(body).toContain('100 of its 3,100 changed files were not reviewed');
    expect(run.summary).toContain('Partial review');
    expect(run.report).toMatchObject({ verdict: 'partial', partial: { reviewedFiles: 3000, changedFiles: 3100 } });
  });

  it('names the workflow fix for a bad input before doing any work', async () => {
    const { repo, github, event } = await setup({});
    const run = await runAction({ github, workspace: repo.root, event, inputs: { 'fail-on': 'sometimes' } });
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('input fail-on: fail-on must be block, warn or never');
    expect(github.requests).toEqual([]);
  });
});

// Keep git's identity out of the tests' way.
execFileSync('git', ['--version']);
