import { spawnSync } from 'node:child_process';

/**
 * GitHub's own Markdown renderer with the extensions github.com turns on (Debian package cmark-gfm).
 * `--unsafe` passes raw HTML through, as github.com's pipeline does before its sanitizer: without
 * it cmark-gfm drops every raw tag and an injected one could not be seen.
 */
const ARGS = ['--unsafe', '-e', 'table', '-e', 'autolink', '-e', 'strikethrough', '-e', 'tagfilter'];

export function hasCmarkGfm(): boolean {
  return spawnSync('cmark-gfm', ['--version'], { encoding: 'utf8' }).status === 0;
}

/** In CI, .ci/run installs cmark-gfm and the escaping checks must run: a missing renderer fails loudly there. */
export function requireCmarkInCi(): boolean {
  const available = hasCmarkGfm();
  if (!available && process.env.CI) throw new Error('cmark-gfm is not installed, but CI must render the comment with it: .ci/run installs it with apt-get');
  return available;
}

/** The HTML GitHub's renderer makes of a Markdown text (before GitHub's own sanitizing and mention linking). */
export function renderGfm(markdown: string): string {
  const run = spawnSync('cmark-gfm', ARGS, { input: markdown, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (run.status !== 0) throw new Error(`cmark-gfm failed: ${run.stderr}`);
  return run.stdout;
}
