import { createRepoFiles } from '../adapters/files.js';
import { GitHubError } from '../adapters/github.js';
import { DIGEST_JSON_FORMAT, renderDigestMarkdown } from '../core/report/digest-markdown.js';
import type { GitHubPort } from '../ports.js';
import { digestRepository } from './digest.js';
import { publishDigest } from './publish-digest.js';

/** The scheduled run: the digest of the checked-out repository, published as its one digest issue. */
export async function publishWeeklyDigest(options: { github: GitHubPort; workspace: string; settingsPath?: string; botLogin: string; now: Date }): Promise<{ markdown: string; json: object; problem?: string }> {
  const files = createRepoFiles(options.workspace);
  const settingsPath = options.settingsPath ? { settingsPath: options.settingsPath } : {};
  const { digest, settings } = await digestRepository({ files, now: options.now, ...settingsPath });
  const markdown = renderDigestMarkdown(digest);
  const json = { format: DIGEST_JSON_FORMAT, ...digest };
  try {
    await publishDigest({ github: options.github, label: settings.digest.label, block: markdown, botLogin: options.botLogin });
    return { markdown, json };
  } catch (error) {
    if (error instanceof GitHubError && (error.status === 403 || error.status === 404)) {
      return { markdown, json, problem: `${error.message}. The digest workflow needs permissions: issues: write. The digest is in the job summary instead.` };
    }
    throw error;
  }
}
