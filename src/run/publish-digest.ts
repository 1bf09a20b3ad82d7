import { DIGEST_MARKER, mergeDigestBody } from '../core/report/digest-markdown.js';
import type { GitHubPort } from '../ports.js';

export const DIGEST_TITLE = 'Plumbline weekly digest';

/**
 * Keeps one open digest issue: found by its label and hidden marker (pull requests skipped),
 * created the first week, then updated with this week's block while text people added around it
 * stays. Two racing runs may each create one; both then keep the oldest and close the rest.
 */
export async function publishDigest(options: { github: GitHubPort; label: string; block: string; botLogin: string }): Promise<{ action: 'created' | 'updated'; number: number; closedDuplicates: number }> {
  const { github, label, block, botLogin } = options;
  const ours = async () =>
    (await github.listIssues(label)).filter((i) => i.author === botLogin && i.body.includes(DIGEST_MARKER)).sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.number - b.number);
  let found = await ours();
  const created = found.length === 0;
  if (created) {
    await github.createIssue(DIGEST_TITLE, block, [label]);
    found = await ours();
  }
  const [keep, ...extra] = found;
  if (!keep) throw new Error('the digest issue just created is not listed');
  const body = mergeDigestBody(keep.body, block);
  if (body !== keep.body) await github.updateIssue(keep.number, { body });
  for (const duplicate of extra) await github.updateIssue(duplicate.number, { state: 'closed' });
  return { action: created ? 'created' : 'updated', number: keep.number, closedDuplicates: extra.length };
}
