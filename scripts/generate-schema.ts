// Writes everything generated from a single source: JSON Schemas and reference pages from the zod
// schemas, and the README's Action inputs and outputs tables from action.yml.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { generatedSchemaFiles } from '../src/core/schemas.js';
import { withActionReference } from '../src/core/report/action-reference.js';

for (const [path, text] of Object.entries(generatedSchemaFiles())) {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
  console.log(`wrote ${path}`);
}
const readme = readFileSync('README.md', 'utf8');
const updated = withActionReference(readme, readFileSync('action.yml', 'utf8'));
if (updated !== readme) {
  writeFileSync('README.md', updated);
  console.log('updated the Action reference in README.md');
}
