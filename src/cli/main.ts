import { Command, CommanderError } from 'commander';
import { BUG_REPORT_HINT, ExternalError, UsageError } from '../errors.js';
import { VERSION } from '../version.js';
import { addAdjustCommand } from './adjust-command.js';
import { addCheckCommand } from './check-command.js';
import { EXIT, REAL_DEPS, type CliDeps } from './common.js';
import { addDigestCommand } from './digest-command.js';
import { addListCommand } from './list-command.js';
import { addNewCommand } from './new-command.js';
import { addReadoutCommand } from './readout-command.js';
import { addSchemaCommand } from './schema-command.js';
import { addSizeCommand } from './size-command.js';
import { addSrmCommand } from './srm-command.js';
import { addTotalsCommand } from './totals-command.js';
import { addValidateCommand } from './validate-command.js';

export { EXIT, type CliDeps } from './common.js';

/** The program: global options, then each command from its own module, in the order --help lists them. */
export function buildProgram(setExit: (code: number) => void, deps: CliDeps = REAL_DEPS): Command {
  const program = new Command('plumbline')
    .description('Experiment hygiene for code review: validate plans, list the registry, size and check changes.')
    .version(VERSION)
    .option('-C, --cwd <dir>', 'repository root', '.')
    .option('-c, --config <file>', 'settings file, relative to the repository (default: .plumbline.yml if present)')
    .option('--no-color', 'never colour the output (NO_COLOR is respected too)')
    // Always 80 columns, whatever the terminal: `--help` is answered from text written at build time (see bin.ts).
    .configureHelp({ helpWidth: 80 })
    .showHelpAfterError()
    .exitOverride()
    // Wrapped by hand: commander wraps descriptions to helpWidth, not the text added after them.
    .addHelpText(
      'after',
      [
        '',
        'Exit codes: 0 fine, 1 blocking findings or invalid plans, 2 usage, settings or',
        'environment error, 3 internal error (a bug).',
      ].join('\n'),
    );

  addValidateCommand(program, setExit, deps);
  addListCommand(program, setExit, deps);
  addNewCommand(program, setExit, deps);
  addSizeCommand(program, setExit, deps);
  addCheckCommand(program, setExit, deps);
  addDigestCommand(program, setExit, deps);
  addSrmCommand(program, setExit, deps);
  addAdjustCommand(program, setExit, deps);
  addSchemaCommand(program, setExit, deps);
  addReadoutCommand(program, setExit, deps);
  addTotalsCommand(program, setExit, deps);

  return program;
}
/**
 * `plumbline valdate --help` and `plumbline help valdate`: commander would print the program's help (the second
 * on stderr, exit 2) without saying that no such command exists. Asked without the help, commander names the unknown
 * command and suggests the closest one, which is what the user needs.
 */
function withoutHelpForUnknownCommand(argv: readonly string[], program: Command): string[] {
  const [node = '', script = '', ...words] = argv;
  const known = new Set(program.commands.flatMap((c) => [c.name(), ...c.aliases()]));
  const valued = new Set(program.options.filter((o) => o.required || o.optional).flatMap((o) => [o.short, o.long].filter((f): f is string => f !== undefined)));
  let at = 0;
  while (at < words.length && words[at]!.startsWith('-') && words[at] !== '--') at += valued.has(words[at]!) ? 2 : 1;
  const first = words[at];
  if (first === undefined || known.has(first)) return [...argv];
  if (first === 'help') {
    const asked = words[at + 1];
    return asked !== undefined && !asked.startsWith('-') && !known.has(asked) ? [node, script, ...words.slice(0, at), asked] : [...argv];
  }
  if (first.startsWith('-')) return [...argv];
  return [node, script, ...words.filter((w, i) => i <= at || (w !== '--help' && w !== '-h'))];
}

/** Runs the CLI and returns its exit code; the single place where errors are reported. */
export async function runCli(argv: string[], deps: CliDeps = REAL_DEPS): Promise<number> {
  let exitCode: number = EXIT.ok;
  const program = buildProgram((code) => (exitCode = code), deps);
  const stderr = (text: string) => (deps.write ? deps.write.err(text) : process.stderr.write(text));
  try {
    await program.parseAsync(withoutHelpForUnknownCommand(argv, program));
    return exitCode;
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and --version are successes; every other parser complaint is a usage error (already printed).
      return error.exitCode === 0 ? EXIT.ok : EXIT.usage;
    }
    if (error instanceof UsageError) {
      stderr(`plumbline: ${error.message}${error.hint ? `\n  hint: ${error.hint}` : ''}\n`);
      return EXIT.usage;
    }
    if (error instanceof ExternalError) {
      // The environment failed (a file system or git error): not the user's plans, so not exit 1.
      const cause = error.cause instanceof Error ? `\n  cause: ${error.cause.message}` : '';
      stderr(`plumbline: ${error.message}${cause}${error.hint ? `\n  hint: ${error.hint}` : ''}\n`);
      return EXIT.usage;
    }
    const detail = error instanceof Error ? (error.stack ?? error.message) : String(error);
    stderr(`plumbline: internal error: ${detail}\n${BUG_REPORT_HINT}\n`);
    return EXIT.internal;
  }
}
