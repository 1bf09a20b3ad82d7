// Builds the demo change as a real git repository: demo/repo committed as the base, then the
// files under demo/change/ laid over it and committed as the head. Prints the repository path.
import { execFileSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** `overlay`: the folder under demo/ whose src/ (and experiments/, if any) is laid over demo/repo as the head commit. */
export function buildDemoChange(overlay = 'change', branch = 'feature/slot-nudge') {
  const root = mkdtempSync(join(tmpdir(), 'plumbline-demo-'));
  const git = (...args) =>
    execFileSync('git', args, {
      cwd: root,
      encoding: 'utf8',
      env: { ...process.env, GIT_AUTHOR_NAME: 'Demo', GIT_AUTHOR_EMAIL: 'demo@bramblecart.invalid', GIT_COMMITTER_NAME: 'Demo', GIT_COMMITTER_EMAIL: 'demo@bramblecart.invalid', GIT_AUTHOR_DATE: '2026-11-30T09:00:00Z', GIT_COMMITTER_DATE: '2026-11-30T09:00:00Z' },
    }).trim();
  git('init', '-q', '-b', 'main');
  cpSync('demo/repo', root, { recursive: true });
  git('add', '-A');
  git('commit', '-q', '-m', 'Bramblecart as on main');
  const base = git('rev-parse', 'HEAD');
  git('switch', '-q', '-c', branch);
  for (const folder of ['src', 'experiments']) {
    if (existsSync(`demo/${overlay}/${folder}`)) cpSync(`demo/${overlay}/${folder}`, join(root, folder), { recursive: true });
  }
  git('add', '-A');
  git('commit', '-q', '-m', `the ${overlay} pull request`);
  return { root, base, head: git('rev-parse', 'HEAD'), cleanup: () => rmSync(root, { recursive: true, force: true }) };
}
