import { Command } from 'commander';
import { settingsJsonSchema } from '../core/config/load.js';
import { planJsonSchema } from '../core/plan/json-schema.js';
import { registryJsonSchema } from '../core/registry/load.js';
import type { CliDeps, SetExit } from './common.js';

/** `plumbline schema [format]`: the JSON Schema of a file format. */
export function addSchemaCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  program
    .command('schema')
    .description('print the JSON Schema of a file format, for editors and other tools')
    .addArgument(new Command().createArgument('[format]', 'plan, registry or settings').choices(['plan', 'registry', 'settings']).default('plan'))
    .action((which: 'plan' | 'registry' | 'settings') => {
      const schema = which === 'plan' ? planJsonSchema() : which === 'registry' ? registryJsonSchema() : settingsJsonSchema();
      process.stdout.write(`${JSON.stringify(schema, null, 2)}\n`);
    });
}
