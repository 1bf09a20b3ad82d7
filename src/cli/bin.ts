import nodeModule from 'node:module';

// Node 22.1 and later keep V8's compiled code between runs (in the system's temporary folder), so
// a second start parses nothing; older Nodes have no such switch and start as before.
(nodeModule as { enableCompileCache?: () => unknown }).enableCompileCache?.();
const { runCli } = await import('./main.js');
process.exitCode = await runCli(process.argv);
