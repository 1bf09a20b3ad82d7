// Builds a demo pull request as a real git repository: demo/repo committed as main (its tests launched there,
// so arm totals name that commit as plan-commit, as a data job would), then the files under demo/<overlay>/
// laid over it and committed as the head. Prints nothing; returns the repository's path and commits.
import { execFileSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const ENV = { GIT_AUTHOR_NAME: 'Demo', GIT_AUTHOR_EMAIL: 'demo@bramblecart.invalid', GIT_COMMITTER_NAME: 'Demo', GIT_COMMITTER_EMAIL: 'demo@bramblecart.invalid', GIT_AUTHOR_DATE: '2026-11-30T09:00:00Z', GIT_COMMITTER_DATE: '2026-11-30T09:00:00Z' };

/**
 * `overlay`: the folder under demo/ whose src/, experiments/ and readouts/ (those it has) are laid over demo/repo as the head commit.
 * `record`: then record a readout's outcome in the plan with `plumbline readout --record` (dist/cli.js) before committing.
 */
export function buildDemoChange(overlay = 'change', branch = 'feature/slot-nudge', options = {}) {
  const root = mkdtempSync(join(tmpdir(), 'plumbline-demo-'));
  const git = (...args) => execFileSync('git', args, { cwd: root, encoding: 'utf8', env: { ...process.env, ...ENV } }).trim();
  git('init', '-q', '-b', 'main');
  cpSync('demo/repo', root, { recursive: true });
  git('add', '-A');
  git('commit', '-q', '-m', 'Bramblecart as on main');
  // The data job writes the commit each test launched at; in this history that is the first commit.
  const launch = git('rev-parse', '--short=7', 'HEAD');
  const readouts = join(root, 'readouts');
  if (existsSync(readouts)) {
    for (const name of readdirSync(readouts).filter((n) => n.endsWith('.totals.yaml'))) {
      const path = join(readouts, name);
      writeFileSync(path, readFileSync(path, 'utf8').replace(/^plan-commit: .*$/m, `plan-commit: ${launch}`));
    }
    git('add', '-A');
    git('commit', '-q', '-m', 'Arm totals from the data job');
  }
  const base = git('rev-parse', 'HEAD');
  git('switch', '-q', '-c', branch);
  for (const folder of ['src', 'experiments', 'readouts']) {
    if (existsSync(`demo/${overlay}/${folder}`)) cpSync(`demo/${overlay}/${folder}`, join(root, folder), { recursive: true });
  }
  if (options.record) {
    const { plan, totals, decidedBy, today } = options.record;
    execFileSync(process.execPath, [join(process.cwd(), 'dist/cli.js'), '-C', root, 'readout', plan, '--totals', totals, '--record', '--decided-by', decidedBy, '--today', today], { stdio: 'ignore' });
    // The author marks the test concluded beside the outcome recorded.
    const planPath = join(root, 'experiments', `${plan}.yaml`);
    writeFileSync(planPath, readFileSync(planPath, 'utf8').replace(/^state: live$/m, 'state: concluded'));
  }
  git('add', '-A');
  git('commit', '-q', '-m', `the ${overlay} pull request`);
  return { root, base, head: git('rev-parse', 'HEAD'), cleanup: () => rmSync(root, { recursive: true, force: true }) };
}

/** The demo pull request that ships the winner of checkout-wallet-first: the outcome recorded, the flag removed. */
export function buildShipDemo() {
  return buildDemoChange('ship', 'ship/wallet-first', {
    record: { plan: 'checkout-wallet-first', totals: 'readouts/checkout-wallet-first.totals.yaml', decidedBy: '@ines-carvalho', today: '2026-12-08' },
  });
}
