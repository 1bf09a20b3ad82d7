import { getOctokit } from '@actions/github';
import type { Octokit } from '@octokit/core';
import { retry } from '@octokit/plugin-retry';
import { throttling } from '@octokit/plugin-throttling';
import { ExternalError } from '../errors.js';
import type { GitHubPort, IssueComment, PullRequestFile, RepoIssue } from '../ports.js';

/** A GitHub API failure with its HTTP status, so callers can tell a read-only token (403) from the rest. */
export class GitHubError extends ExternalError {
  constructor(
    message: string,
    readonly status: number | undefined,
    hint?: string,
    options?: { cause?: unknown },
  ) {
    super(message, hint, options);
  }
}

export interface GitHubOptions {
  token: string;
  owner: string;
  repo: string;
  /** API root, e.g. https://api.github.com or a GitHub Enterprise Server's /api/v3. */
  baseUrl: string;
  /** Most HTTP requests one run may make, retries included; beyond it every request fails (a runaway loop costs no rate limit). */
  requestBudget: number;
  /** Longest wait, in seconds, that one rate limit may ask for; a longer one ends the run with a message instead. */
  maxRateLimitWait: number;
  /** How often one request is retried after a rate limit before giving up. */
  rateLimitRetries?: number;
}

/** GitHub's files API stops listing a pull request's files after this many. */
export const PULL_REQUEST_FILES_CAP = 3000;

const HINTS: Record<number, string> = {
  401: 'the token is not valid: check the token input',
  403: 'the token lacks a permission: the workflow needs `permissions: pull-requests: write` (a pull request from a fork only ever gets a read-only token)',
  404: 'the repository or pull request was not found with this token',
  422: 'GitHub refused the request body',
};

/**
 * The retry plugin retries network failures and 5xx only: every 4xx is final, except rate limits,
 * which are the throttling plugin's (it waits what retry-after or x-ratelimit-reset says).
 */
const EVERY_4XX = Array.from({ length: 100 }, (_, i) => 400 + i);
const SERVER_ERROR_RETRIES = 2;

/**
 * Counts every HTTP request against the budget. Registered before the retry and throttling
 * plugins, so its hook sits inside theirs and sees each attempt, retries included. It throws an
 * error without an HTTP status, which neither plugin retries.
 */
function requestBudget(budget: number) {
  return (octokit: Octokit) => {
    let sent = 0;
    octokit.hook.wrap('request', (request, options) => {
      sent++;
      if (sent > budget) {
        throw new GitHubError(`this run has used its budget of ${budget} GitHub requests (retries count too)`, undefined, 'raise the request-budget input if the repository really needs more');
      }
      return request(options);
    });
    return {};
  };
}

function describeWait(seconds: number): string {
  return seconds >= 120 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} seconds`;
}

/**
 * GitHubPort over the Octokit of @actions/github, which keeps the runner's proxy settings
 * (HTTPS_PROXY, HTTP_PROXY, NO_PROXY): no `request` option is passed, since one would replace
 * those defaults. Rate limits wait exactly as long as GitHub says, up to `maxRateLimitWait`.
 */
export function createGitHub(options: GitHubOptions): GitHubPort {
  const retries = options.rateLimitRetries ?? 3;
  // Set when a rate limit asked for a wait longer than allowed, to explain the failure it causes.
  let refusedWait: { reason: string; hint: string } | undefined;
  const onLimit = (kind: string) => (after: number, _options: unknown, _octokit: unknown, retryCount: number) => {
    if (after > options.maxRateLimitWait) {
      refusedWait = { reason: `GitHub's ${kind} asks to wait ${describeWait(after)}, longer than the ${options.maxRateLimitWait} seconds this run may wait`, hint: 're-run the job later, or raise the rate-limit-wait input' };
      return false;
    }
    if (retryCount >= retries) {
      refusedWait = { reason: `GitHub's ${kind} still held after ${retries} waits`, hint: 're-run the job later; other workflows may be using the same token heavily' };
      return false;
    }
    return true;
  };
  const octokit = getOctokit(
    options.token,
    {
      baseUrl: options.baseUrl,
      retry: { doNotRetry: EVERY_4XX, retries: SERVER_ERROR_RETRIES },
      throttle: { onRateLimit: onLimit('rate limit'), onSecondaryRateLimit: onLimit('secondary rate limit') },
    },
    requestBudget(options.requestBudget),
    retry,
    throttling,
  );
  const repo = { owner: options.owner, repo: options.repo };

  const wrap = async <T>(what: string, run: () => Promise<T>): Promise<T> => {
    try {
      return await run();
    } catch (error) {
      if (error instanceof GitHubError) throw error;
      if (refusedWait) {
        const { reason, hint } = refusedWait;
        refusedWait = undefined;
        // No status: a rate limit is not a missing permission, so callers do not mistake it for one.
        throw new GitHubError(`GitHub: ${what} stopped: ${reason}`, undefined, hint, { cause: error });
      }
      const status = typeof error === 'object' && error !== null && 'status' in error ? Number((error as { status: unknown }).status) : undefined;
      const message = error instanceof Error ? error.message : String(error);
      throw new GitHubError(`GitHub: ${what} failed${status ? ` (HTTP ${status})` : ''}: ${message}`, status, status ? HINTS[status] : undefined, { cause: error });
    }
  };

  const toComment = (c: { id: number; body?: string | null; user?: { login: string } | null; created_at: string }): IssueComment => ({
    id: c.id,
    body: c.body ?? '',
    author: c.user?.login ?? '',
    createdAt: c.created_at,
  });

  const toIssue = (i: { number: number; body?: string | null; user?: { login: string } | null; created_at: string }): RepoIssue => ({
    number: i.number,
    body: i.body ?? '',
    author: i.user?.login ?? '',
    createdAt: i.created_at,
  });

  return {
    listComments: (issue) =>
      wrap('listing comments', async () => {
        const all = await octokit.paginate(octokit.rest.issues.listComments, { ...repo, issue_number: issue, per_page: 100 });
        return all.map(toComment);
      }),
    createComment: (issue, body) => wrap('creating a comment', async () => toComment((await octokit.rest.issues.createComment({ ...repo, issue_number: issue, body })).data)),
    updateComment: (id, body) =>
      wrap('updating a comment', async () => {
        await octokit.rest.issues.updateComment({ ...repo, comment_id: id, body });
      }),
    deleteComment: (id) =>
      wrap('deleting a comment', async () => {
        try {
          await octokit.rest.issues.deleteComment({ ...repo, comment_id: id });
        } catch (error) {
          if ((error as { status?: number }).status !== 404) throw error;
        }
      }),
    listIssues: (label) =>
      wrap('listing issues', async () => {
        const all = await octokit.paginate(octokit.rest.issues.listForRepo, { ...repo, labels: label, state: 'open', per_page: 100 });
        return all.filter((i) => !i.pull_request).map(toIssue);
      }),
    createIssue: (title, body, labels) => wrap('creating an issue', async () => toIssue((await octokit.rest.issues.create({ ...repo, title, body, labels })).data)),
    updateIssue: (number, change) =>
      wrap('updating an issue', async () => {
        await octokit.rest.issues.update({ ...repo, issue_number: number, ...change });
      }),
    listPullRequestFiles: (pullRequest) =>
      wrap('listing pull-request files', async () => {
        const all = await octokit.paginate(octokit.rest.pulls.listFiles, { ...repo, pull_number: pullRequest, per_page: 100 });
        const files: PullRequestFile[] = all.map((f) => ({
          path: f.filename,
          status: f.status,
          ...(f.previous_filename ? { previousPath: f.previous_filename } : {}),
          ...(f.patch ? { patch: f.patch } : {}),
        }));
        return { files, capped: files.length >= PULL_REQUEST_FILES_CAP };
      }),
  };
}
