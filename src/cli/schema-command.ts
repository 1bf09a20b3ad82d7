import { Command } from 'commander';
import type { CliDeps, SetExit } from './common.js';

/** `plumbline schema [format]`: the JSON Schema of a file format. */
export function addSchemaCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('schema')
    .description('print the JSON Schema of a file format, for editors and other tools')
    .addArgument(new Command().createArgument('[format]', 'plan, registry, settings or totals (arm totals for a readout)').choices(['plan', 'registry', 'settings', 'totals']).default('plan'))
    .action(async (which: 'plan' | 'registry' | 'settings' | 'totals') => {
      // Only the asked format's loader (and the schema generator) is loaded.
      const schema =
        which === 'plan'
          ? (await import('../core/plan/json-schema.js')).planJsonSchema()
          : which === 'registry'
            ? (await import('../core/registry/load.js')).registryJsonSchema()
            : which === 'settings'
              ? (await import('../core/config/load.js')).settingsJsonSchema()
              : (await import('../core/totals/load.js')).totalsJsonSchema();
      const text = `${JSON.stringify(schema, null, 2)}\n`;
      if (deps.write) deps.write.out(text);
      else process.stdout.write(text);
    });
}
