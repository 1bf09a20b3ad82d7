import { Option, type Command } from 'commander';
import { EXIT, context, formatOption, reportSettingsProblems, type CommonOptions, type SetExit, type CliDeps } from './common.js';

/** `plumbline list`: the registry of tests. */
export function addListCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('list')
    .description('show the registry of tests: state, surface, window, owners')
    .addOption(formatOption())
    .addOption(new Option('--state <state>', 'only tests in this state').choices(['draft', 'live', 'on-hold', 'concluded']))
    .action(async (local: { format: 'text' | 'json'; state?: string }) => {
      const options = { ...program.opts<CommonOptions>(), ...local };
      const { output, ...ports } = context(options, deps);
      const [{ registryJson, renderRegistryText }, { loadWorkspace }] = await Promise.all([import('../core/report/registry-list.js'), import('../run/load-workspace.js')]);
      const loaded = await loadWorkspace(ports);
      if (!loaded.ok) return setExit(reportSettingsProblems(output, options.format, loaded.settingsFile, loaded.settingsProblems));
      const { workspace } = loaded;
      const registry = { entries: workspace.registry.entries.filter((e) => !local.state || e.state === local.state) };
      const skippedFiles = new Set(workspace.problems.filter((p) => p.severity === 'error').map((p) => p.file)).size;
      output.out(options.format === 'json' ? JSON.stringify(registryJson(registry), null, 2) : renderRegistryText(registry, { color: output.color, skippedFiles, ...(workspace.planFiles.length === 0 ? { noPlanFiles: workspace.settingsFile ? { settingsFile: workspace.settingsFile } : {} } : {}) }));
      setExit(EXIT.ok);
    });
}
