import type { Command } from 'commander';
import { EXIT, context, formatOption, reportSettingsProblems, type CommonOptions, type SetExit, type CliDeps } from './common.js';

/** `plumbline validate`: every plan, registry and settings file checked. */
export function addValidateCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('validate')
    .description('check every plan file, registry file and the settings file')
    .addOption(formatOption())
    .action(async (local: { format: 'text' | 'json' }) => {
      const options = { ...program.opts<CommonOptions>(), ...local };
      const { output, ...ports } = context(options, deps);
      const [{ renderValidationText, validationJson }, { validateRepository }] = await Promise.all([import('../core/report/validation.js'), import('../run/validate.js')]);
      const outcome = await validateRepository(ports);
      if (outcome.kind === 'settings-invalid') return setExit(reportSettingsProblems(output, options.format, outcome.settingsFile, outcome.problems));
      const { report } = outcome;
      output.out(options.format === 'json' ? JSON.stringify(validationJson(report), null, 2) : renderValidationText(report, { color: output.color }));
      setExit(report.errors > 0 ? EXIT.findings : EXIT.ok);
    });
}
