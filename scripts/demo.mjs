// `npm run demo`: runs Plumbline on the built-in Bramblecart demo repository (demo/repo) and prints
// what a user would see. Findings in the demo are the point, so they do not fail this script;
// a usage or internal error (exit code 2 or more) does.
import { spawnSync } from 'node:child_process';

const steps = [
  { title: 'Validate every plan, registry file and the settings file', args: ['validate'] },
  { title: 'The registry of tests', args: ['list'] },
  { title: 'Sizing a clean plan', args: ['size', 'basket-reorder-shortcut'] },
  { title: 'Sizing a plan that logs exposure too early in the journey', args: ['size', 'search-suggestions-v2'] },
  { title: 'Sizing a test that randomizes households', args: ['size', 'shared-list-invite'] },
];

let broken = false;
for (const step of steps) {
  const command = ['plumbline', '-C', 'demo/repo', ...step.args].join(' ');
  process.stdout.write(`\n== ${step.title}\n$ ${command}\n\n`);
  const run = spawnSync(process.execPath, ['dist/cli.js', '-C', 'demo/repo', ...step.args], { stdio: 'inherit' });
  process.stdout.write(`\n(exit code ${run.status})\n`);
  if (run.status === null || run.status >= 2) broken = true;
}
process.exitCode = broken ? 1 : 0;
