import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { openChange, readFileAtCommit } from '../adapters/git.js';
import { openApiChange } from '../adapters/github-change.js';
import { GitHubError, PULL_REQUEST_FILES_CAP } from '../adapters/github.js';
import { formatCount } from '../core/report/numbers.js';
import { withUnseenFiles, type UnseenFiles } from '../core/review/coverage.js';
import { renderReviewMarkdown, renderReviewSummary } from '../core/report/review-markdown.js';
import type { Review } from '../core/review/build-review.js';
import type { PullRequestInfo } from '../core/review/context.js';
import type { ChangeSource, CommitFiles, GitHubPort } from '../ports.js';
import { REVIEW_MARKER } from '../core/report/review-markdown.js';
import { reviewChange } from './review-change.js';
import { upsertStickyComment, type StickyResult } from './sticky-comment.js';

/** What the pull-request event says about the change. */
export interface PullRequestEvent {
  number: number;
  baseSha: string;
  headSha: string;
  info: PullRequestInfo;
  repoUrl: string;
  /** The pull request's count of changed files, from the event, when given. */
  changedFiles?: number;
}

export interface ActionReviewResult {
  review: Review;
  /** The comment body, within GitHub's comment limit. */
  markdown: string;
  /** The job summary: the full report within the summary's own limit (it holds what the comment leaves out). */
  summary: string;
  comment?: StickyResult;
  /** Set when the comment could not be written (e.g. a fork's read-only token). */
  commentProblem?: string;
  /** Said once in the log, e.g. that the diff came from the API. */
  notices: string[];
}

/** Reviews a pull request in the Action: git when the history is there, the files API otherwise; then the sticky comment. */
export async function reviewPullRequest(options: {
  event: PullRequestEvent;
  github: GitHubPort;
  workspace: string;
  settingsPath?: string;
  comment: boolean;
  botLogin: string;
}): Promise<ActionReviewResult | { settingsProblems: string }> {
  const { event, github, workspace } = options;
  const notices: string[] = [];
  let change: ChangeSource | undefined;
  let unseen: UnseenFiles | undefined;
  if (existsSync(join(workspace, '.git'))) {
    change = await openChange(workspace, event.baseSha, event.headSha).catch((error: unknown) => {
      notices.push(`git cannot compare the two commits here (${error instanceof Error ? error.message : String(error)}); using the pull-request files API instead. Check out with fetch-depth: 0 to use git.`);
      return undefined;
    });
  }
  const usingGit = change !== undefined;
  if (!change) {
    const api = await openApiChange({ github, pullRequest: event.number, workspace, base: event.baseSha, head: event.headSha });
    if (api.capped && (event.changedFiles === undefined || event.changedFiles > api.listed)) {
      unseen = {
        reason: `GitHub lists at most ${formatCount(PULL_REQUEST_FILES_CAP)} files of a pull request and no git history was there to read the rest`,
        reviewedFiles: api.listed,
        ...(event.changedFiles !== undefined ? { changedFiles: event.changedFiles } : {}),
      };
      if (!existsSync(join(workspace, '.git'))) notices.push('GitHub lists at most 3,000 files of a pull request and no git history is checked out, so files past that are not reviewed. Check out with fetch-depth: 0.');
      else notices.push('GitHub lists at most 3,000 files of a pull request; files past that are not reviewed.');
    }
    change = api.change;
  }
  // With git history the plan at a readout's plan-commit can be read; through the files API it cannot, and the readout says so.
  const history: CommitFiles | undefined = usingGit ? { fileAt: (commit, path) => readFileAtCommit(workspace, commit, path) } : undefined;
  const outcome = await reviewChange({ change, pr: event.info, ...(history ? { history } : {}), ...(options.settingsPath ? { settingsPath: options.settingsPath } : {}) });
  if (outcome.kind === 'settings-invalid') return { settingsProblems: outcome.problems.map((p) => `${p.file}:${p.line}:${p.column}: ${p.field}: ${p.message}`).join('\n') };
  const review = unseen ? withUnseenFiles(outcome.review, unseen) : outcome.review;
  const markdown = renderReviewMarkdown(review, { repoUrl: event.repoUrl, fullReport: 'the job summary' });
  const summary = renderReviewSummary(review, { repoUrl: event.repoUrl, fullReport: "the JSON report (the Action's report output)" });
  if (!options.comment) return { review, markdown, summary, notices };
  try {
    const comment = await upsertStickyComment({ github, issue: event.number, marker: REVIEW_MARKER, body: markdown, botLogin: options.botLogin });
    return { review, markdown, summary, comment, notices };
  } catch (error) {
    if (error instanceof GitHubError && (error.status === 403 || error.status === 404)) {
      return { review, markdown, summary, notices, commentProblem: `${error.message}. ${error.hint ?? ''} The review is in the job summary and annotations instead.` };
    }
    throw error;
  }
}
