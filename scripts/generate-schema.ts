// Writes the JSON Schemas and reference pages generated from the zod schemas.
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { generatedSchemaFiles } from '../src/core/schemas.js';

for (const [path, text] of Object.entries(generatedSchemaFiles())) {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
  console.log(`wrote ${path}`);
}
