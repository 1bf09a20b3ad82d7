import { readFile } from 'node:fs/promises';
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
