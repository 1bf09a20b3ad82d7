import { Command } from 'commander';
import { settingsJsonSchema } from '../core/config/load.js';
import { planJsonSchema } from '../core/plan/json-schema.js';
import { registryJsonSchema } from '../core/registry/load.js';
import { totalsJsonSchema } from '../core/totals/load.js';
import type { CliDeps, SetExit } from './common.js';

/** `plumbline schema [format]`: the JSON Schema of a file format. */
export function addSchemaCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('schema')
    .description('print the JSON Schema of a file format, for editors and other tools')
    .addArgument(new Command().createArgument('[format]', 'plan, registry, settings or totals (arm totals for a readout)').choices(['plan', 'registry', 'settings', 'totals']).default('plan'))
    .action((which: 'plan' | 'registry' | 'settings' | 'totals') => {
      const schema = which === 'plan' ? planJsonSchema() : which === 'registry' ? registryJsonSchema() : which === 'settings' ? settingsJsonSchema() : totalsJsonSchema();
      const text = `${JSON.stringify(schema, null, 2)}\n`;
      if (deps.write) deps.write.out(text);
      else process.stdout.write(text);
    });
}
