import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = fileURLToPath(new URL('../../', import.meta.url));
export const cliPath = join(repoRoot, 'dist/cli.js');

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** Runs the bundled CLI as a user would, in a clean environment without colour. */
export function runCli(args: string[], options: { cwd?: string; env?: Record<string, string> } = {}): CliRun {
  const result = spawnSync(process.execPath, [cliPath, ...args], {
    cwd: options.cwd ?? repoRoot,
    encoding: 'utf8',
    env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', ...options.env },
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** A fresh folder holding the given files (path -> text). */
export function makeRepo(files: Record<string, string>): string {
  const root = mkdtempSync(join(tmpdir(), 'plumbline-repo-'));
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(dirname(join(root, path)), { recursive: true });
    writeFileSync(join(root, path), text);
  }
  return root;
}
