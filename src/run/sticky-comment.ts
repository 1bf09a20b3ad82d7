import type { GitHubPort } from '../ports.js';
import { keepOldest } from './keep-oldest.js';

export interface StickyResult {
  action: 'created' | 'updated' | 'unchanged';
  id: number;
  /** Copies left by racing runs, deleted so that one comment remains. */
  removedDuplicates: number;
}

/**
 * Keeps exactly one comment of ours on a pull request: found by the hidden marker and the bot's
 * login across all pages, created once, then updated in place. Two runs racing may each create
 * one; both then keep the oldest and delete the rest, so one survives either way.
 */
export async function upsertStickyComment(options: { github: GitHubPort; issue: number; marker: string; body: string; botLogin: string }): Promise<StickyResult> {
  const { github, issue, marker, body, botLogin } = options;
  const { keep, extra, created } = await keepOldest({
    list: async () => (await github.listComments(issue)).filter((c) => c.author === botLogin && c.body.startsWith(marker)),
    create: () => github.createComment(issue, body),
  });
  const action: StickyResult['action'] = created ? 'created' : keep.body === body ? 'unchanged' : 'updated';
  if (keep.body !== body) await github.updateComment(keep.id, body);
  for (const duplicate of extra) await github.deleteComment(duplicate.id);
  return { action, id: keep.id, removedDuplicates: extra.length };
}
