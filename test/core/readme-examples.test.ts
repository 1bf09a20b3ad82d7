import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadSettings } from '../../src/core/config/load.js';
import { loadPlan } from '../../src/core/plan/load.js';

// The README's examples are what new users copy first; they must load as shown.
const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
const yamlBlocks = [...readme.matchAll(/```yaml\n([\s\S]*?)```/g)].map((m) => m[1]!);

describe('README examples', () => {
  it('the plan example loads without errors or warnings', () => {
    const plan = yamlBlocks.find((b) => b.includes('hypothesis:'));
    expect(plan).toBeDefined();
    const result = loadPlan(plan!, 'README.md');
    expect(result.ok).toBe(true);
    expect(result.warnings).toEqual([]);
  });

  it('the settings example loads', () => {
    const settings = yamlBlocks.find((b) => b.includes('group-surfaces:'));
    expect(settings).toBeDefined();
    const result = loadSettings(settings!, 'README.md');
    expect(result.ok ? [] : result.errors).toEqual([]);
  });
});
