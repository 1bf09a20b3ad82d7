import { readFileSync, readdirSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { generatedSchemaFiles } from '../../src/core/schemas.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { renderPlanScaffold } from '../../src/core/plan/scaffold.js';

const root = new URL('../../', import.meta.url);
const read = (path: string) => readFileSync(new URL(path, root), 'utf8');
const yamlFiles = (folder: string) =>
  readdirSync(new URL(folder, root))
    .filter((f) => /\.ya?ml$/.test(f))
    .map((f) => `${folder}/${f}`);

describe('generated schema files', () => {
  // The committed files are what editors and other tools read; they must be exactly what the zod schemas generate.
  it.each(Object.entries(generatedSchemaFiles()))('%s is up to date (run npm run schema)', (path, text) => {
    expect(read(path)).toBe(text);
  });
});

// Ajv is an independent JSON Schema implementation: it checks that the generated schema means what the zod schema means.
const ajv = new Ajv2020({ allErrors: true, strict: false });
const planValidator = ajv.compile(JSON.parse(read('schema/plan.schema.json')));
const registryValidator = ajv.compile(JSON.parse(read('schema/registry.schema.json')));
const settingsValidator = ajv.compile(JSON.parse(read('schema/settings.schema.json')));

describe('every example plan in the repository validates against the committed JSON Schema', () => {
  const examples = [...yamlFiles('demo/repo/experiments'), ...yamlFiles('test/fixtures/plans/valid')];
  it('finds the examples', () => expect(examples.length).toBeGreaterThanOrEqual(8));
  it.each(examples)('%s', (path) => {
    const text = read(path);
    expect(planValidator(parse(text)), JSON.stringify(planValidator.errors)).toBe(true);
    expect(loadPlan(text, path).ok).toBe(true);
  });

  it('the scaffold of `plumbline new`', () => {
    const text = renderPlanScaffold({ flagKey: 'checkout-wallet-first', today: '2026-12-01', schemaPath: 'x.json' });
    expect(planValidator(parse(text)), JSON.stringify(planValidator.errors)).toBe(true);
  });

  it('the demo registry and settings files', () => {
    expect(registryValidator(parse(read('demo/repo/registry/partner-tests.yaml'))), JSON.stringify(registryValidator.errors)).toBe(true);
    expect(settingsValidator(parse(read('demo/repo/.plumbline.yml'))), JSON.stringify(settingsValidator.errors)).toBe(true);
  });
});

describe('the JSON Schema rejects what the loader rejects field by field', () => {
  it.each([
    'unknown-key',
    'unknown-nested-key',
    'wrong-type',
    'alpha-out-of-range',
    'power-out-of-range',
    'baseline-zero',
    'baseline-one',
    'baseline-percent',
    'weight-zero',
    'weight-negative',
    'bad-metric-kind',
    'no-primary',
    'date-format',
  ])('%s', (name) => {
    const value = parse(read(`test/fixtures/plans/invalid/${name}.yaml`));
    expect(planValidator(value)).toBe(false);
  });
});
