import { scanMatcher } from '../core/config/scan-files.js';
import { buildDigest, type Digest } from '../core/digest/build-digest.js';
import type { Settings } from '../core/config/schema.js';
import type { Location } from '../core/scan/name-scan.js';
import { findCalls } from '../core/scan/calls.js';
import { flagPatternsOf } from '../core/scan/patterns.js';
import { flagKeyOf } from '../core/scan/flag-touches.js';
import type { RepoFiles } from '../ports.js';
import { ownFilesOf, requireWorkspace } from './load-workspace.js';

/** Today's calendar date in a time zone (the digest's day boundary), from the caller's clock. */
export function todayIn(timeZone: string, now: Date): string {
  // The default zone needs no time-zone data: loading ICU's for one date costs a review tens of milliseconds.
  if (timeZone === 'UTC') return now.toISOString().slice(0, 10);
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

/** Every flag key the code evaluates, with its first place, from the flag-call patterns over the scanned files. */
export async function flagsInCode(files: RepoFiles, settings: Settings, skip: ReadonlySet<string>): Promise<Map<string, Location>> {
  const patterns = flagPatternsOf(settings);
  const inScope = scanMatcher(settings.scan);
  const paths = (await files.listFiles('')).filter((p) => inScope(p) && !skip.has(p));
  const found = new Map<string, Location>();
  const texts = await files.readTexts(paths);
  paths.forEach((path, i) => {
    const text = texts[i];
    if (text === undefined || text.includes('\0')) return;
    for (const site of findCalls(text, path, patterns)) {
      const key = flagKeyOf(text, site);
      if (key && !found.has(key)) found.set(key, { file: path, line: site.valueLine, column: site.column });
    }
  });
  return found;
}

/** The digest of a repository's registry as of `today` (or today in the settings' time zone). */
export async function digestRepository(options: { files: RepoFiles; settingsPath?: string; today?: string; now: Date }): Promise<{ digest: Digest; settings: Settings }> {
  const workspace = await requireWorkspace({ files: options.files, ...(options.settingsPath ? { settingsPath: options.settingsPath } : {}) });
  const { settings } = workspace;
  const skip = ownFilesOf(workspace);
  const digest = buildDigest({
    registry: workspace.registry,
    today: options.today ?? todayIn(settings.digest.timeZone, options.now),
    settings,
    flagsInCode: await flagsInCode(options.files, settings, skip),
  });
  return { digest, settings };
}
