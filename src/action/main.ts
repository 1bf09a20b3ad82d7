import { join } from 'node:path';
import * as core from '@actions/core';
import * as github from '@actions/github';
import { writeFileAtomic } from '../adapters/files.js';
import { createGitHub } from '../adapters/github.js';
import { reviewJson } from '../core/review/report-schema.js';
import { BUG_REPORT_HINT, ExternalError, UsageError } from '../errors.js';
import { reviewPullRequest, type PullRequestEvent } from '../run/action-review.js';
import { publishWeeklyDigest } from '../run/action-digest.js';
import { closingLine, planAnnotations, pullRequestEvent, shouldFail } from './effects.js';
import { readActionSettings } from './settings.js';

/** The Action: inputs -> settings -> review -> comment, annotations, summary, outputs, exit status. */
async function main(): Promise<void> {
  const settings = readActionSettings((name) => core.getInput(name));
  const { context } = github;
  const mode = settings.mode === 'auto' ? (context.eventName.startsWith('pull_request') ? 'review' : 'digest') : settings.mode;
  const workspace = process.env.GITHUB_WORKSPACE ?? process.cwd();
  const port = createGitHub({ token: settings.token, owner: context.repo.owner, repo: context.repo.repo, baseUrl: context.apiUrl, requestBudget: settings['request-budget'], maxRateLimitWait: settings['rate-limit-wait'] });
  if (mode === 'digest') {
    const digest = await publishWeeklyDigest({ github: port, workspace, botLogin: settings['bot-login'], now: new Date(), ...(settings.config ? { settingsPath: settings.config } : {}) });
    const reportPath = join(process.env.RUNNER_TEMP ?? workspace, 'plumbline-digest.json');
    await writeFileAtomic(reportPath, `${JSON.stringify(digest.json, null, 2)}\n`, { overwrite: true });
    if (digest.problem) core.warning(digest.problem);
    core.setOutput('verdict', 'digest');
    core.setOutput('report', reportPath);
    await core.summary.addRaw(digest.markdown).write();
    return;
  }
  const event: PullRequestEvent | undefined = pullRequestEvent(context);
  if (!event) throw new UsageError(`mode review needs a pull_request event; this run was started by ${context.eventName}`, 'run the review on: pull_request, or set mode: digest');
  const result = await reviewPullRequest({ event, github: port, workspace, comment: settings.comment, botLogin: settings['bot-login'], ...(settings.config ? { settingsPath: settings.config } : {}) });
  if ('settingsProblems' in result) throw new UsageError(`the settings file has errors:\n${result.settingsProblems}`, 'run plumbline validate locally');

  const reportPath = join(process.env.RUNNER_TEMP ?? workspace, 'plumbline-review.json');
  await writeFileAtomic(reportPath, `${JSON.stringify(reviewJson(result.review), null, 2)}\n`, { overwrite: true });
  core.setOutput('verdict', result.review.verdict);
  core.setOutput('blocking', result.review.counts.block);
  core.setOutput('warnings', result.review.counts.warn);
  core.setOutput('notes', result.review.counts.note);
  core.setOutput('known', result.review.counts.known);
  core.setOutput('report', reportPath);
  await core.summary.addRaw(result.summary).write();
  // Annotations come last, after everything that could still fail, so that a failure's own error line cannot push errors past GitHub's limit.
  const fails = shouldFail(result.review, settings['fail-on']);
  const closing = fails ? closingLine(result.review) : undefined;
  for (const a of planAnnotations(result.review, { notices: result.notices, warnings: result.commentProblem ? [result.commentProblem] : [], ...(closing ? { closing } : {}) })) core[a.kind](a.message, a.properties);
  if (fails) process.exitCode = core.ExitCode.Failure;
}

main().catch((error: unknown) => {
  if (error instanceof UsageError || error instanceof ExternalError) {
    core.setFailed(`${error.message}${error.hint ? ` (${error.hint})` : ''}`);
    return;
  }
  core.setFailed(`internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n${BUG_REPORT_HINT}`);
});
