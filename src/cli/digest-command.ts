import { Option, type Command } from 'commander';
import { UsageError } from '../errors.js';
import { EXIT, context, type CommonOptions, type SetExit, type CliDeps } from './common.js';

/** `plumbline digest`: the weekly digest of the registry. */
export function addDigestCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('digest')
    .description('the weekly digest: tests past their end, ending soon, stale drafts, long holds, collisions, flags without plans')
    .option('--today <date>', 'the day to judge by, YYYY-MM-DD (default: today in the settings’ time zone, UTC unless set)')
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'json', 'markdown']).default('text'))
    .action(async (local: { today?: string; format: string }) => {
      const options = program.opts<CommonOptions>();
      const { output, ...ports } = context({ ...options, format: 'text' }, deps);
      const [{ DIGEST_JSON_FORMAT, renderDigestMarkdown, renderDigestText }, { isCalendarDate }, { digestRepository }] = await Promise.all([
        import('../core/report/digest-markdown.js'),
        import('../core/source/fields.js'),
        import('../run/digest.js'),
      ]);
      if (local.today !== undefined && !isCalendarDate(local.today)) throw new UsageError(`--today ${JSON.stringify(local.today)} is not a date`, 'write it as YYYY-MM-DD, e.g. --today 2026-12-01');
      const { digest } = await digestRepository({ files: ports.files, now: new Date(), ...(ports.settingsPath ? { settingsPath: ports.settingsPath } : {}), ...(local.today ? { today: local.today } : {}) });
      if (local.format === 'json') output.out(JSON.stringify({ format: DIGEST_JSON_FORMAT, ...digest }, null, 2));
      else if (local.format === 'markdown') output.out(renderDigestMarkdown(digest));
      else output.out(renderDigestText(digest));
      setExit(EXIT.ok);
    });
}
