import { DIGEST_MARKER, mergeDigestBody } from '../core/report/digest-markdown.js';
import type { GitHubPort, RepoIssue } from '../ports.js';
import { keepOldest } from './keep-oldest.js';

/** Issues are told apart by number. */
const withId = (issue: RepoIssue) => ({ ...issue, id: issue.number });

export const DIGEST_TITLE = 'Plumbline weekly digest';

/**
 * Keeps one open digest issue: found by its label and hidden marker (pull requests skipped),
 * created the first week, then updated with this week's block while text people added around it
 * stays. Two racing runs may each create one; both then keep the oldest and close the rest.
 */
export async function publishDigest(options: { github: GitHubPort; label: string; block: string; botLogin: string }): Promise<{ action: 'created' | 'updated'; number: number; closedDuplicates: number }> {
  const { github, label, block, botLogin } = options;
  const { keep, extra, created } = await keepOldest({
    list: async () => (await github.listIssues(label)).filter((i) => i.author === botLogin && i.body.includes(DIGEST_MARKER)).map(withId),
    create: async () => withId(await github.createIssue(DIGEST_TITLE, block, [label])),
  });
  const body = mergeDigestBody(keep.body, block);
  if (body !== keep.body) await github.updateIssue(keep.number, { body });
  for (const duplicate of extra) await github.updateIssue(duplicate.number, { state: 'closed' });
  return { action: created ? 'created' : 'updated', number: keep.number, closedDuplicates: extra.length };
}
