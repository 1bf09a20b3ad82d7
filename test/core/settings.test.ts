import { describe, expect, it } from 'vitest';
import { defaultSettings, loadSettings } from '../../src/core/config/load.js';

describe('loadSettings', () => {
  it('works with no file at all', () => {
    const result = loadSettings(undefined, '.plumbline.yml');
    expect(result.ok).toBe(true);
    expect(result.ok && result.settings.planPaths).toEqual(['experiments']);
    expect(defaultSettings().builtinPatterns).toBe(true);
    expect(defaultSettings().scan.exclude).toContain('**/node_modules/**');
  });

  it('treats a file of only comments as all defaults', () => {
    const result = loadSettings('# nothing set yet\n', '.plumbline.yml');
    expect(result.ok && result.settings).toEqual(defaultSettings());
  });

  it('maps kebab-case keys to the settings object', () => {
    const result = loadSettings(
      [
        'plans: [plans, "services/*/experiments/**"]',
        'registries: [ops/tests.yaml]',
        'flag-calls: [\'isOn\\(\\s*"(?<key>[\\w.-]+)"\']',
        'group-surfaces: [teams/board]',
        'exempt-flags: [kill-payments]',
        'severity: { plan-missing: block, window-short: off }',
      ].join('\n'),
      '.plumbline.yml',
    );
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.settings).toMatchObject({
      planPaths: ['plans', 'services/*/experiments/**'],
      registryFiles: ['ops/tests.yaml'],
      flagCalls: ['isOn\\(\\s*"(?<key>[\\w.-]+)"'],
      groupSurfaces: ['teams/board'],
      exemptFlags: ['kill-payments'],
      severity: { 'plan-missing': 'block', 'window-short': 'off' },
    });
  });

  // Lines are those of the text given to loadSettings.
  it.each([
    ['a pattern that does not compile', "flag-calls:\n  - 'isOn\\((?<key>'\n", 'settings/invalid-value', 2, 'flag-calls[0]', /does not compile/],
    ['a pattern without the named group', "log-calls:\n  - 'track\\(\"(\\w+)\"'\n", 'settings/invalid-value', 2, 'log-calls[0]', /no \(\?<event>\.\.\.\) group/],
    ['a misspelt key', 'plans: [experiments]\nexempt-flag: [x]\n', 'settings/unknown-key', 2, 'exempt-flag', /did you mean "exempt-flags"/],
    ['a severity that does not exist', 'severity:\n  plan-missing: error\n', 'settings/invalid-value', 2, 'severity.plan-missing', /not one of the allowed values/],
    ['a surface path with capitals', 'group-surfaces: [Teams/Board]\n', 'settings/invalid-value', 1, 'group-surfaces[0]', /expected format/],
    ['a wrong type', 'builtin-patterns: sometimes\n', 'settings/invalid-value', 1, 'builtin-patterns', /wrong type/],
  ])('%s', (_name, text, code, line, field, message) => {
    const result = loadSettings(text, '.plumbline.yml');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const problem = result.errors[0]!;
    expect(problem).toMatchObject({ code, file: '.plumbline.yml', line, field });
    expect(`${problem.message} ${problem.expected ?? ''}`).toMatch(message);
  });
});
