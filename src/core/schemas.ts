import { settingsJsonSchema } from './config/load.js';
import { planJsonSchema } from './plan/json-schema.js';
import { registryJsonSchema } from './registry/load.js';
import { renderSchemaReference } from './report/schema-reference.js';
import { reviewReportSchema } from './review/report-schema.js';
import { z } from 'zod';

/**
 * Every generated artefact of the file formats: JSON Schemas for editors and other tools, and
 * the reference pages in docs/. `npm run schema` writes them; a test fails when they are stale.
 */
export function generatedSchemaFiles(): Record<string, string> {
  const json = (value: unknown) => `${JSON.stringify(value, null, 2)}\n`;
  return {
    'schema/plan.schema.json': json(planJsonSchema()),
    'schema/registry.schema.json': json(registryJsonSchema()),
    'schema/settings.schema.json': json(settingsJsonSchema()),
    'schema/review-report.schema.json': json({
      $id: 'https://plumbline.dev/schema/review-report.schema.json',
      title: 'Plumbline review report',
      ...z.toJSONSchema(reviewReportSchema, { target: 'draft-2020-12' }),
    }),
    'docs/plan-reference.md': renderSchemaReference(
      planJsonSchema(),
      'Plan file reference',
      'One YAML file per experiment, under `experiments/` by default. Put `# yaml-language-server: $schema=<path to plan.schema.json>` on the first line for completion and checking in editors that use the YAML language server. Keys are kebab-case; dates are `YYYY-MM-DD` (UTC calendar days, both ends included); shares are fractions (0.05 is 5%).',
    ),
    'docs/settings-reference.md': renderSchemaReference(
      settingsJsonSchema(),
      'Settings file reference',
      'Optional: `.plumbline.yml` at the repository root (or `--config FILE`). With no file, every default below applies.',
    ),
    'docs/registry-reference.md': renderSchemaReference(
      registryJsonSchema(),
      'Registry file reference',
      'Lists tests defined outside this repository’s plans (listed under `registries:` in the settings file), so collisions and logging dependencies are checked against them too.',
    ),
  };
}
