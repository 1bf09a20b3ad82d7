// `npm run demo`: runs Plumbline on the built-in Bramblecart demo repository (demo/repo) and prints
// what a user would see. Findings in the demo are the point, so they do not fail this script;
// a usage or internal error (exit code 2 or more) does.
import { spawnSync } from 'node:child_process';
import { buildDemoChange, buildShipDemo } from './demo-change.mjs';

const steps = [
  { title: 'Validate every plan, registry file and the settings file', args: ['validate'] },
  { title: 'The registry of tests', args: ['list'] },
  { title: 'Sizing a clean plan', args: ['size', 'basket-reorder-shortcut'] },
  { title: 'Sizing a plan that logs exposure too early in the journey', args: ['size', 'search-suggestions-v2'] },
  { title: 'Sizing a test that randomizes households', args: ['size', 'shared-list-invite'] },
  { title: 'The weekly digest, as of a week from now', args: ['digest', '--today', '2026-12-08'] },
];

let broken = false;
for (const step of steps) {
  const command = ['plumbline', '-C', 'demo/repo', ...step.args].join(' ');
  process.stdout.write(`\n== ${step.title}\n$ ${command}\n\n`);
  const run = spawnSync(process.execPath, ['dist/cli.js', '-C', 'demo/repo', ...step.args], { stdio: 'inherit' });
  process.stdout.write(`\n(exit code ${run.status})\n`);
  if (run.status === null || run.status >= 2) broken = true;
}
// The main job: the review of a pull request, built as a real git repository from demo/change/.
const change = buildDemoChange();
try {
  const args = ['-C', change.root, 'check', '--base', 'main', '--head', 'feature/slot-nudge', '--pr-json', `${process.cwd()}/demo/change/pull-request.json`, '--format', 'markdown', '--today', '2026-12-01'];
  process.stdout.write(`\n== The pull-request review: the comment Plumbline posts\n$ plumbline ${args.slice(2).join(' ').replace(process.cwd() + '/', '')}\n\n`);
  const run = spawnSync(process.execPath, ['dist/cli.js', ...args], { stdio: 'inherit' });
  process.stdout.write(`\n(exit code ${run.status}: 1 means a blocking finding, which fails the check)\n`);
  if (run.status === null || run.status >= 2) broken = true;
} finally {
  change.cleanup();
}
// A bug fix without a flag: the review nudges towards a small check test.
const fix = buildDemoChange('bugfix', 'fix/reorder-count');
try {
  const args = ['-C', fix.root, 'check', '--base', 'main', '--head', 'fix/reorder-count', '--pr-json', `${process.cwd()}/demo/bugfix/pull-request.json`, '--format', 'markdown', '--today', '2026-12-01'];
  process.stdout.write(`\n== A bug fix without a flag: the nudge\n$ plumbline ${args.slice(2).join(' ').replace(process.cwd() + '/', '')}\n\n`);
  const run = spawnSync(process.execPath, ['dist/cli.js', ...args], { stdio: 'inherit' });
  process.stdout.write(`\n(exit code ${run.status})\n`);
  if (run.status === null || run.status >= 2) broken = true;
} finally {
  fix.cleanup();
}
// The pull request that ships a winner: checkout-wallet-first passed its planned end; its outcome is recorded
// with `plumbline readout --record` and the flag read removed, keeping saved wallets first.
const ship = buildShipDemo();
try {
  const args = ['-C', ship.root, 'check', '--base', 'main', '--head', 'ship/wallet-first', '--pr-json', `${process.cwd()}/demo/ship/pull-request.json`, '--format', 'markdown', '--today', '2026-12-08'];
  process.stdout.write(`\n== Shipping the winner: the readout in the comment\n$ plumbline readout checkout-wallet-first --totals readouts/checkout-wallet-first.totals.yaml --record --decided-by @ines-carvalho --today 2026-12-08\n$ plumbline ${args.slice(2).join(' ').replace(process.cwd() + '/', '')}\n\n`);
  const run = spawnSync(process.execPath, ['dist/cli.js', ...args], { stdio: 'inherit' });
  process.stdout.write(`\n(exit code ${run.status})\n`);
  if (run.status === null || run.status >= 2) broken = true;
} finally {
  ship.cleanup();
}
process.exitCode = broken ? 1 : 0;
