import { readFileSync } from 'node:fs';
import nodeModule from 'node:module';
import { VERSION } from '../version.js';

const args = process.argv.slice(2);
const canned = args.length <= 2 ? cannedHelp(args) : undefined;
if (args.length === 1 && (args[0] === '--version' || args[0] === '-V')) {
  // Printing the version needs no parser: answer before loading one (commander would print the same).
  process.stdout.write(`${VERSION}\n`);
} else if (canned !== undefined) {
  process.stdout.write(canned);
} else {
  // Node 22.1 and later keep V8's compiled code between runs (in the system's temporary folder), so
  // a second start parses nothing; older Nodes have no such switch and start as before.
  (nodeModule as { enableCompileCache?: () => unknown }).enableCompileCache?.();
  const { runCli } = await import('./main.js');
  process.exitCode = await runCli(process.argv);
}

/**
 * `--help` and `<command> --help` (or `-h`) print what the parser printed for the very same words when dist/ was
 * built (help.json beside the bundle, written by scripts/build.mjs; help is always 80 columns wide, so it does not
 * depend on the terminal). Loading the parser and every command's options costs more than Node's own start; the
 * text cannot go stale, as the build check rebuilds it. Run from the sources, there is no help.json and the parser
 * answers.
 */
function cannedHelp(words: readonly string[]): string | undefined {
  const [first, second] = words;
  const isHelp = (word: string | undefined) => word === '--help' || word === '-h';
  const command = words.length === 1 && isHelp(first) ? '' : words.length === 2 && isHelp(second) && /^[a-z]+$/.test(first ?? '') ? first! : undefined;
  if (command === undefined) return undefined;
  try {
    const texts = JSON.parse(readFileSync(new URL('./help.json', import.meta.url), 'utf8')) as Record<string, unknown>;
    const text = Object.hasOwn(texts, command) ? texts[command] : undefined;
    return typeof text === 'string' ? text : undefined;
  } catch {
    return undefined;
  }
}
