import type { AnnotationProperties } from '@actions/core';
import type { Review } from '../core/review/build-review.js';
import type { PullRequestEvent } from '../run/action-review.js';

/** GitHub shows at most this many annotations of each kind (error, warning, notice) per step. */
export const ANNOTATIONS_PER_KIND = 10;

type Kind = 'error' | 'warning' | 'notice';
const KINDS: readonly Kind[] = ['error', 'warning', 'notice'];

export interface Annotation {
  kind: Kind;
  message: string;
  properties: AnnotationProperties;
}

/**
 * Every annotation a review run writes, in order: the run's own notices and warnings, one per
 * located finding, a notice counting the findings left out, and the closing error when the run
 * fails. Each kind stays within GitHub's limit with all of these counted, so none is dropped
 * silently; the run's own lines go first, findings fill the rest. Untrusted text needs no
 * treatment here: @actions/core escapes messages and properties when it writes the command.
 */
export function planAnnotations(review: Review, run: { notices: readonly string[]; warnings: readonly string[]; closing?: string }): Annotation[] {
  const kindOf = { block: 'error', warn: 'warning', note: 'notice' } as const;
  const own: Annotation[] = [...run.notices.map((message) => ({ kind: 'notice' as const, message, properties: {} })), ...run.warnings.map((message) => ({ kind: 'warning' as const, message, properties: {} }))];
  const closing: Annotation[] = run.closing ? [{ kind: 'error', message: run.closing, properties: {} }] : [];
  const room = Object.fromEntries(KINDS.map((k) => [k, ANNOTATIONS_PER_KIND - [...own, ...closing].filter((a) => a.kind === k).length])) as Record<Kind, number>;
  const located = review.findings.filter((f) => f.file);
  const wanted = (k: Kind) => located.filter((f) => kindOf[f.severity] === k).length;
  // The notice that counts what was left out needs a place of its own.
  if (KINDS.some((k) => wanted(k) > room[k])) room.notice--;
  const shown: Annotation[] = [];
  let left = 0;
  for (const f of located) {
    const kind = kindOf[f.severity];
    if (room[kind] <= 0) {
      left++;
      continue;
    }
    room[kind]--;
    // GitHub places an annotation's line in the head commit; a line of the base commit (a removed line) marks the file only, and says which line it was.
    const atBase = f.side === 'base';
    const where = atBase && f.line ? `Line ${f.line} at the base commit: ` : '';
    shown.push({ kind, message: `${where}${f.message} Fix: ${f.fix}`, properties: { title: `Plumbline ${f.code}`, file: f.file!, ...(f.line && !atBase ? { startLine: f.line } : {}) } });
  }
  const more: Annotation[] = left ? [{ kind: 'notice', message: `${left} more ${left === 1 ? 'finding is' : 'findings are'} not annotated (GitHub shows ${ANNOTATIONS_PER_KIND} of each kind per step); all are in the job summary.`, properties: { title: 'Plumbline' } }] : [];
  return [...own, ...shown, ...more, ...closing];
}

/**
 * Whether the job fails. Every finding counts here, known ones too: a blocking finding that held before
 * the change still blocks its merge (review.counts counts only what the change introduces).
 */
export function shouldFail(review: Review, failOn: 'block' | 'warn' | 'never'): boolean {
  if (failOn === 'never') return false;
  return review.findings.some((f) => f.severity === 'block' || (failOn === 'warn' && f.severity === 'warn'));
}

/** The closing error of a failed job: every blocking finding, those that held before the change included. */
export function closingLine(review: Review): string {
  const blocking = review.findings.filter((f) => f.severity === 'block').length;
  const warnings = review.findings.filter((f) => f.severity === 'warn').length;
  const what = blocking ? `${blocking} blocking finding${blocking === 1 ? '' : 's'}` : `${warnings} warning${warnings === 1 ? '' : 's'}`;
  return `Plumbline: ${what}; see the summary or the pull-request comment.`;
}

interface ContextLike {
  eventName: string;
  payload: { pull_request?: { number?: number; changed_files?: number; title?: string; body?: string | null; labels?: { name?: string }[]; base?: { sha?: string }; head?: { sha?: string; ref?: string } } };
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
    ...(typeof pr.changed_files === 'number' ? { changedFiles: pr.changed_files } : {}),
  };
}
