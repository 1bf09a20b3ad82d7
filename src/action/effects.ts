import type { AnnotationProperties } from '@actions/core';
import type { Review } from '../core/review/build-review.js';
import type { PullRequestEvent } from '../run/action-review.js';

/** GitHub shows only so many annotations of each kind per step; the rest are counted in one notice. */
export const ANNOTATIONS_PER_KIND = 10;

export interface Annotation {
  kind: 'error' | 'warning' | 'notice';
  message: string;
  properties: AnnotationProperties;
}

/** One annotation per located finding, at its file and line, capped per kind. */
export function annotationsFor(review: Review): Annotation[] {
  const kindOf = { block: 'error', warn: 'warning', note: 'notice' } as const;
  const out: Annotation[] = [];
  const left: Record<string, number> = {};
  for (const f of review.findings) {
    const kind = kindOf[f.severity];
    if (!f.file) continue;
    if (out.filter((a) => a.kind === kind).length >= ANNOTATIONS_PER_KIND) {
      left[kind] = (left[kind] ?? 0) + 1;
      continue;
    }
    out.push({ kind, message: neutralizeCommands(`${f.message} Fix: ${f.fix}`), properties: { title: `Plumbline ${f.code}`, file: f.file, ...(f.line ? { startLine: f.line } : {}) } });
  }
  const hidden = Object.values(left).reduce((a, b) => a + b, 0);
  if (hidden) out.push({ kind: 'notice', message: `${hidden} more finding(s) are not annotated; all are in the job summary.`, properties: { title: 'Plumbline' } });
  return out;
}

/** Text from plans must not start a workflow command of its own in the log. */
export function neutralizeCommands(text: string): string {
  return text.replace(/::/g, ':\u200b:');
}

export function shouldFail(review: Review, failOn: 'block' | 'warn' | 'never'): boolean {
  if (failOn === 'never') return false;
  return review.counts.block > 0 || (failOn === 'warn' && review.counts.warn > 0);
}

interface ContextLike {
  eventName: string;
  payload: { pull_request?: { number?: number; title?: string; body?: string | null; labels?: { name?: string }[]; base?: { sha?: string }; head?: { sha?: string; ref?: string } } };
  serverUrl: string;
  repo: { owner: string; repo: string };
}

/** The pull request of a pull_request event, or undefined for any other event. */
export function pullRequestEvent(context: ContextLike): PullRequestEvent | undefined {
  const pr = context.payload.pull_request;
  if (!pr?.number || !pr.base?.sha || !pr.head?.sha) return undefined;
  return {
    number: pr.number,
    baseSha: pr.base.sha,
    headSha: pr.head.sha,
    info: {
      ...(pr.title ? { title: pr.title } : {}),
      ...(pr.body ? { body: pr.body } : {}),
      labels: (pr.labels ?? []).map((l) => l.name ?? '').filter(Boolean),
      ...(pr.head.ref ? { branch: pr.head.ref } : {}),
    },
    repoUrl: `${context.serverUrl}/${context.repo.owner}/${context.repo.repo}`,
  };
}
