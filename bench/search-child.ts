// Runs in its own process so its time and peak memory are its own:
//   search <repo> <names-file>   the event search step over the tracked files at HEAD
//   check <repo> <names-file> [base]   the whole review of base...bench (bench checked out)
import { readFileSync } from 'node:fs';
import { openChange } from '../src/adapters/git.js';
import { createNameScanner } from '../src/core/scan/name-scan.js';
import { BUILTIN_LOG_PATTERNS, compilePatterns } from '../src/core/scan/patterns.js';

const [mode, root, namesFile, baseBranch = 'main'] = process.argv.slice(2) as [string, string, string, string?];
const names = readFileSync(namesFile, 'utf8').split('\n').filter(Boolean);

if (mode === 'search') {
  const change = await openChange(root, 'HEAD', 'HEAD');
  const scanner = createNameScanner(names, compilePatterns(BUILTIN_LOG_PATTERNS));
  await change.streamFiles('head', await change.trackedFiles('head'), (path, bytes) => scanner.scanFile(path, bytes));
  const first: Record<string, string> = {};
  for (const [name, hits] of scanner.results()) if (hits.first) first[name] = `${hits.first.file}:${hits.first.line}`;
  console.log(JSON.stringify({ first, maxRssKiB: process.resourceUsage().maxRSS }));
} else {
  // The review of main...bench, with bench checked out, as in a CI run. Imported here: the search alone must not pay
  // for loading the review's code (zod, yaml, the statistics, the checks).
  const { reviewChange } = await import('../src/run/review-change.js');
  const outcome = await reviewChange({ change: await openChange(root, baseBranch, 'bench') });
  if (outcome.kind !== 'review') throw new Error('settings');
  const events = outcome.review.plans[0]?.events ?? [];
  console.log(JSON.stringify({ events: events.length, found: events.filter((e) => e.location).length, maxRssKiB: process.resourceUsage().maxRSS }));
}
