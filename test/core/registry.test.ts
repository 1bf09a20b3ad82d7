import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadPlan, type LoadedPlan } from '../../src/core/plan/load.js';
import { buildRegistry, loadRegistryFile } from '../../src/core/registry/load.js';

const fixture = (name: string) => readFileSync(new URL(`../fixtures/plans/${name}`, import.meta.url), 'utf8');
function loaded(name: string, file = name): LoadedPlan {
  const result = loadPlan(fixture(name), file);
  if (!result.ok) throw new Error(`${name} did not load`);
  return result.loaded;
}

describe('buildRegistry', () => {
  it('reports an id used in two plan files at the later file, naming the first', () => {
    const first = loaded('duplicate-ids/first.yaml');
    const second = loaded('duplicate-ids/second.yaml');
    const { registry, problems } = buildRegistry([second, first], []);
    expect(registry.entries.map((e) => e.file)).toEqual(['duplicate-ids/first.yaml']);
    expect(problems).toEqual([
      expect.objectContaining({
        severity: 'error',
        code: 'registry/duplicate-id',
        file: 'duplicate-ids/second.yaml',
        line: 3,
        field: 'id',
        message: 'id "minimal-plan" is already used by duplicate-ids/first.yaml:2',
      }),
    ]);
  });

  it('reports an id shared by a plan and a registry file', () => {
    const plan = loaded('valid/minimal.yaml', 'experiments/minimal.yaml');
    const file = loadRegistryFile(
      'tests:\n  - id: minimal-plan\n    title: Elsewhere\n    owners: ["@x"]\n    state: live\n    flags: [f]\n    surface: { path: a }\n',
      'registry/other.yaml',
    );
    expect(file.ok).toBe(true);
    const { problems } = buildRegistry([plan], file.ok ? file.entries : []);
    expect(problems[0]).toMatchObject({ file: 'registry/other.yaml', line: 2, code: 'registry/duplicate-id' });
  });

  it('collects the events a plan depends on: exposure and every metric', () => {
    const full = loaded('valid/full.yaml');
    const { registry } = buildRegistry([full], []);
    expect(registry.entries[0]!.events).toEqual(['board_opened', 'card_created', 'client_error', 'session_started', 'board_shared']);
    expect(registry.entries[0]!.trafficShare).toBe(0.4);
  });
});

describe('loadRegistryFile', () => {
  it('locates problems inside the tests list', () => {
    const result = loadRegistryFile('tests:\n  - id: a-test\n    title: A\n    owners: []\n', 'registry/x.yaml');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors).toContainEqual(expect.objectContaining({ field: 'tests[0].owners', line: 4, message: 'has too few items' }));
    expect(result.errors).toContainEqual(expect.objectContaining({ field: 'tests[0].state', message: 'required field is missing' }));
  });

  it('suggests the known key for a typo', () => {
    const result = loadRegistryFile('test:\n  - id: a\n', 'r.yaml');
    expect(result.ok ? [] : result.errors).toContainEqual(expect.objectContaining({ code: 'registry/unknown-key', message: 'unknown key "test"; did you mean "tests"?' }));
  });
});
