import nodeModule from 'node:module';
import { VERSION } from '../version.js';

const args = process.argv.slice(2);
if (args.length === 1 && (args[0] === '--version' || args[0] === '-V')) {
  // Printing the version needs no parser: answer before loading one (commander would print the same).
  process.stdout.write(`${VERSION}\n`);
} else {
  // Node 22.1 and later keep V8's compiled code between runs (in the system's temporary folder), so
  // a second start parses nothing; older Nodes have no such switch and start as before.
  (nodeModule as { enableCompileCache?: () => unknown }).enableCompileCache?.();
  const { runCli } = await import('./main.js');
  process.exitCode = await runCli(process.argv);
}
