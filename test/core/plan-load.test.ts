import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { parse } from 'yaml';
import { loadPlan, PLAN_LIMITS } from '../../src/core/plan/load.js';
import { formatFieldPath } from '../../src/core/source/check-written.js';
import { readYaml } from '../../src/core/source/yaml-source.js';
import { loadRegistryFile } from '../../src/core/registry/load.js';
import type { Problem } from '../../src/core/source/problem.js';

const fixture = (name: string) => readFileSync(new URL(`../fixtures/plans/${name}`, import.meta.url), 'utf8');

function errorsOf(name: string): Problem[] {
  const result = loadPlan(fixture(name), name);
  expect(result.ok, `${name} should not load`).toBe(false);
  return result.ok ? [] : result.errors;
}

describe('loadPlan accepts valid plans', () => {
  it('applies every default to the minimal plan', () => {
    const result = loadPlan(fixture('valid/minimal.yaml'), 'valid/minimal.yaml');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { plan } = result.loaded;
    expect(plan.design).toEqual({
      arms: [
        { name: 'control', weight: 50 },
        { name: 'treatment', weight: 50 },
      ],
      control: 'control',
      alpha: 0.05,
      power: 0.8,
      sides: 2,
      trafficShare: 1,
      interimLooks: 0,
      interimBoundary: 'obrien-fleming-spending',
      prePeriodCorrelation: 0,
    });
    expect(plan.unit).toEqual({ randomization: 'user', analysis: 'user' });
    expect(plan.exposure).toEqual({ reach: 1 });
    expect(plan.metrics.primary).toMatchObject({ name: 'conversion', direction: 'increase', directionAssumed: false });
    expect(result.loaded.line).toBe(2);
    expect(result.warnings.map((w) => w.code)).toEqual(['plan/decisions-missing']);
  });

  it('maps every written key of the full plan to its camelCase field', () => {
    const result = loadPlan(fixture('valid/full.yaml'), 'valid/full.yaml');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { plan } = result.loaded;
    expect(plan.hypothesis).toEqual({ change: 'Two changes shipped together.', because: 'They only make sense together.', direction: 'decrease' });
    expect(plan.surface.trafficSplit).toEqual({ name: 'board-core', range: { start: 0, end: 40 } });
    expect(plan.amendments).toEqual([{ date: '2026-11-20', changed: 'power 0.8 -> 0.9', reason: 'Traffic doubled after the app release.' }]);
    expect(plan.outcome).toMatchObject({ date: '2026-12-20', reason: 'Shipped the compact layout.' });
    expect(plan.design).toMatchObject({
      control: 'baseline',
      alpha: 0.01,
      power: 0.9,
      sides: 1,
      minDetectableEffect: { absolute: 3 },
      dailyUnits: 1500,
      trafficShare: 0.4,
      interimLooks: 3,
      prePeriodCorrelation: 0.6,
      cluster: { meanSize: 6.5, icc: 0.08, sizeCv: 0.7 },
    });
    expect(plan.decisions.guardrailBreach).toBe('Stop the test.');
    expect(plan.decisions.launchRegardless?.reason).toMatch(/screen sizes/);
    expect(plan.metrics.guardrails[0]).toMatchObject({ kind: 'ratio', direction: 'decrease', tolerance: { absolute: 0.01 } });
    expect(plan.bundleRationale).toMatch(/card size/);
    expect(result.warnings).toEqual([]);
  });

  it('takes the traffic share from the traffic-split range when none is written', () => {
    const text = fixture('valid/full.yaml').replace('  traffic-share: 0.4\n', '');
    const result = loadPlan(text, 'full.yaml');
    expect(result.ok && result.loaded.plan.design.trafficShare).toBe(0.4);
  });
});

// Each row: fixture, problem code, line, column (0 = not checked), field, message, and parts of expected/found.
// Lines and columns are those of the fixture file as written.
const invalidCases: [string, string, number, number, string, RegExp, RegExp?][] = [
  ['bad-yaml', 'plan/bad-yaml', 18, 0, '', /not valid YAML: a quoted value is never closed/],
  ['wrong-type', 'plan/invalid-value', 4, 9, 'owners', /has the wrong type/, /expected a list of owners.*found the text "@test-owner"/],
  ['impossible-date', 'plan/invalid-value', 7, 18, 'window.start', /is not valid/, /exists in the calendar; found the text "2026-02-30"/],
  ['date-format', 'plan/invalid-value', 7, 18, 'window.start', /expected format/, /YYYY-MM-DD.*found the text "02\/11\/2026"/],
  ['end-before-start', 'plan/window-order', 7, 35, 'window.end', /ends \(2026-11-02\) before it starts \(2026-11-30\)/, /on or after 2026-11-30/],
  ['alpha-out-of-range', 'plan/invalid-value', 19, 10, 'design.alpha', /out of range/, /strictly between 0 and 1.*found the number 1\.5/],
  ['alpha-zero', 'plan/invalid-value', 19, 10, 'design.alpha', /out of range/, /found the number 0$/],
  ['power-out-of-range', 'plan/invalid-value', 19, 10, 'design.power', /out of range/, /power strictly between 0 and 1.*found the number 80/],
  ['baseline-zero', 'plan/invalid-value', 16, 23, 'metrics.primary.baseline.rate', /out of range/, /found the number 0$/],
  ['baseline-one', 'plan/invalid-value', 16, 23, 'metrics.primary.baseline.rate', /out of range/, /found the number 1$/],
  ['baseline-percent', 'plan/invalid-value', 16, 23, 'metrics.primary.baseline.rate', /out of range/, /found the number 12$/],
  ['nan-rate', 'plan/invalid-value', 16, 23, 'metrics.primary.baseline.rate', /wrong type/, /NaN, which is not a finite number/],
  ['weight-zero', 'plan/invalid-value', 21, 34, 'design.arms[1].weight', /out of range/, /weight above 0.*found the number 0/],
  ['weight-negative', 'plan/invalid-value', 20, 32, 'design.arms[0].weight', /out of range/, /found the number -1/],
  ['no-primary', 'plan/missing-field', 13, 3, 'metrics.primary', /required field is missing/, /one primary metric/],
  ['several-primary', 'plan/primary-metric-count', 14, 5, 'metrics.primary', /exactly one primary metric/, /not 2; move the others under secondary/],
  ['empty-primary-list', 'plan/primary-metric-count', 13, 12, 'metrics.primary', /exactly one primary metric/, /the list is empty/],
  ['unknown-key', 'plan/unknown-key', 3, 1, 'titel', /unknown key "titel"; did you mean "title"\?/],
  ['unknown-nested-key', 'plan/unknown-key', 9, 3, 'hypothesis.expected-directon', /did you mean "expected-direction"\?/],
  ['bad-metric-kind', 'plan/invalid-value', 15, 11, 'metrics.primary.kind', /not one of the allowed kinds/, /proportion, mean or ratio; found the text "percentage"/],
  ['duplicate-key', 'plan/duplicate-key', 4, 1, 'title', /^`title` is written twice in the same mapping \(first on line 3\)$/, /each key once/],
  ['unclosed-brace', 'plan/bad-yaml', 16, 15, 'metrics.primary.baseline', /^this is not valid YAML: this \{ is never closed$/, /^expected \} after the last item/],
  ['two-documents', 'plan/several-documents', 18, 1, '', /more than one YAML document/],
  ['not-a-mapping', 'plan/invalid-value', 2, 1, '', /wrong type/, /a plan: a mapping.*found a list of 2 items/],
  ['empty', 'plan/invalid-value', 1, 1, '', /the file is empty/],
  ['alias-bomb', 'plan/too-many-aliases', 1, 1, '', /too many aliases/, /at most 100 alias expansions/],
  ['oversized', 'plan/too-large', 1, 1, '', /over the limit of 262144 bytes/],
];

describe('loadPlan reports each invalid input with file, line, field and expectation', () => {
  it.each(invalidCases)('%s', (name, code, line, column, field, message, detail) => {
    const file = `invalid/${name}.yaml`;
    const problems = errorsOf(file);
    const problem = problems.find((p) => p.code === code);
    expect(problem, `problems: ${JSON.stringify(problems)}`).toBeDefined();
    expect(problem!.file).toBe(file);
    expect(problem!.line).toBe(line);
    if (column) expect(problem!.column).toBe(column);
    expect(problem!.field).toBe(field);
    expect(problem!.message).toMatch(message);
    if (detail) expect(`expected ${problem!.expected ?? ''}; found ${problem!.found ?? ''}`.replace(/; found $/, '')).toMatch(detail);
  });

  it('never throws, whatever the bytes', () => {
    for (const text of ['', '\u0000\u0001', ':', '[', '{a: [}', 'id: x\n  - y', '*a', '&a [*a]', 'x: !!binary ZZZ', '? [a]\n: b']) {
      const result = loadPlan(text, 'odd.yaml');
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.errors.length).toBeGreaterThan(0);
    }
  });

  it('gives a mistyped key the closest known one, but not an unrelated word', () => {
    const typo = errorsOf('invalid/unknown-key.yaml').find((p) => p.code === 'plan/unknown-key');
    expect(typo?.message).toContain('did you mean "title"');
    const unrelated = loadPlan(fixture('valid/minimal.yaml').replace('title:', 'colour: red\ntitle:'), 'x.yaml');
    const problem = unrelated.ok ? undefined : unrelated.errors.find((p) => p.code === 'plan/unknown-key');
    expect(problem?.message).toBe('unknown key "colour"');
  });
});

describe('cross-field rules', () => {
  const base = fixture('valid/full.yaml');
  const codesFor = (text: string) => {
    const result = loadPlan(text, 'x.yaml');
    return [...(result.ok ? [] : result.errors), ...result.warnings].map((p) => `${p.severity}:${p.code}:${p.field}`);
  };

  it.each([
    ['a control arm that is not an arm', base.replace('control: baseline', 'control: nobody'), 'error:plan/unknown-control-arm:design.control'],
    ['an arm listed twice', base.replace('name: roomy', 'name: compact'), 'error:plan/duplicate-arm:design.arms[2].name'],
    ['an empty range', base.replace('range: { start: 0, end: 40 }', 'range: { start: 40, end: 40 }'), 'error:plan/empty-range:surface.traffic-split.range'],
    ['more traffic than the range', base.replace('traffic-share: 0.4', 'traffic-share: 0.5'), 'error:plan/traffic-beyond-range:design.traffic-share'],
    ['a metric name used twice', base.replace('name: boards-shared', 'name: time-to-first-card'), 'error:plan/duplicate-metric:metrics.secondary[0].name'],
    ['a guardrail with no direction', base.replace('      direction: decrease\n      tolerance', '      tolerance'), 'warning:plan/direction-assumed:metrics.guardrails[0].direction'],
    ['a guardrail with no tolerance', base.replace('      tolerance: { absolute: 0.01 }\n', ''), 'warning:plan/tolerance-missing:metrics.guardrails[0].tolerance'],
    ['a group unit with no cluster figures', base.replace('  cluster: { mean-size: 6.5, icc: 0.08, size-cv: 0.7 }\n', ''), 'warning:plan/cluster-missing:design.cluster'],
    ['cluster figures for individual units', base.replace('randomization: team', 'randomization: user'), 'warning:plan/cluster-unused:design.cluster'],
    ['a live plan with no start', base.replace('window: { start: 2026-11-02, end: 2026-11-29 }', 'window: { end: 2026-11-29 }'), 'warning:plan/start-missing:window'],
    ['readiness for a platform outside the population', base.replace('ready: { platforms: [web, ios]', 'ready: { platforms: [web, android]'), 'warning:plan/ready-unknown-target:population.ready.platforms[1]'],
    ['a plan overlapping itself', base.replace('overlaps-with: [other-plan]', 'overlaps-with: [full-plan]'), 'warning:plan/overlaps-itself:surface.overlaps-with[0]'],
    ['launch-regardless without a guardrail rule', base.replace('  guardrail-breach: Stop the test.\n', ''), 'warning:plan/decisions-missing:decisions'],
  ])('%s', (_name, text, expected) => {
    expect(codesFor(text)).toContain(expected);
  });

  it('needs no cluster figures when groups are both randomized and analysed', () => {
    const text = base.replace('randomization: team, analysis: user', 'randomization: team').replace('  cluster: { mean-size: 6.5, icc: 0.08, size-cv: 0.7 }\n', '');
    expect(codesFor(text).filter((c) => c.includes('cluster'))).toEqual([]);
  });

  it('does not ask for win, flat and loss rules when the plan launches regardless', () => {
    const text = base.replace(/  win: .*\n  flat: .*\n  loss: .*\n/, '');
    expect(codesFor(text).filter((c) => c.includes('decisions-missing'))).toEqual([]);
  });
});

describe('renamed keys', () => {
  const full = fixture('valid/full.yaml');
  const oldStyle = full.replace('traffic-split: { name: board-core, range: { start: 0, end: 40 } }', 'exclusion-group: { name: board-core, slice: { from: 0, to: 40 } }');

  it('still loads surface.exclusion-group, as the same traffic split, with a warning at the key naming traffic-split', () => {
    expect(oldStyle).not.toBe(full);
    const result = loadPlan(oldStyle, 'old.yaml');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const current = loadPlan(full, 'full.yaml');
    expect(result.loaded.plan).toEqual(current.ok && current.loaded.plan);
    expect(result.warnings).toEqual([
      expect.objectContaining({
        severity: 'warning',
        code: 'plan/renamed-key',
        file: 'old.yaml',
        line: 15,
        column: 3,
        field: 'surface.exclusion-group',
        message: expect.stringMatching(/"exclusion-group" is the old name of "traffic-split".*range: \{ start, end \}/),
        expected: 'traffic-split: { name: checkout-core, range: { start: 0, end: 50 } }',
      }),
    ]);
  });

  it('refuses both names at once, at the old one', () => {
    const both = full.replace('  traffic-split:', '  exclusion-group: { name: board-core, slice: { from: 0, to: 40 } }\n  traffic-split:');
    const result = loadPlan(both, 'both.yaml');
    expect(result.ok).toBe(false);
    expect(result.ok ? [] : result.errors.map((p) => `${p.code}:${p.field}:${p.line}:${p.expected}`)).toEqual([
      expect.stringMatching(/^plan\/invalid-value:surface\.exclusion-group:15:traffic-split only; exclusion-group is its old name/),
    ]);
  });

  it('still loads the old key in a registry file, with a warning at each entry’s key', () => {
    const text = [
      'tests:',
      '  - id: partner-banner',
      '    title: Banner',
      '    owners: ["@partners"]',
      '    state: live',
      '    flags: [banner]',
      '    surface: { path: checkout, exclusion-group: { name: checkout-core, slice: { from: 50, to: 100 } } }',
    ].join('\n');
    const result = loadRegistryFile(text, 'registry/partners.yaml');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.entries[0]?.surface.trafficSplit).toEqual({ name: 'checkout-core', range: { start: 50, end: 100 } });
    expect(result.warnings.map((w) => `${w.file}:${w.line}:${w.column}:${w.code}:${w.field}`)).toEqual([
      'registry/partners.yaml:7:32:registry/renamed-key:tests[0].surface.exclusion-group',
    ]);
    const current = loadRegistryFile(text.replace('exclusion-group: { name: checkout-core, slice: { from: 50, to: 100 } }', 'traffic-split: { name: checkout-core, range: { start: 50, end: 100 } }'), 'x.yaml');
    expect(current.ok && current.warnings).toEqual([]);
  });

  it('keeps the old key in the committed JSON Schema, marked deprecated, so editors accept old files', () => {
    // Ajv (an independent JSON Schema implementation) reads the committed schema, not the zod one.
    const schema = JSON.parse(readFileSync(new URL('../../schema/plan.schema.json', import.meta.url), 'utf8'));
    const validate = new Ajv2020({ strict: false }).compile(schema);
    expect(validate(parse(oldStyle))).toBe(true);
    expect(validate(parse(full))).toBe(true);
    expect(schema.properties.surface.properties['exclusion-group'].deprecated).toBe(true);
    expect(schema.properties.surface.properties['traffic-split'].deprecated).toBeUndefined();
  });

  it('treats ranges as half-open: [0, 50) and [50, 100) take no unit twice', () => {
    const empty = loadPlan(full.replace('range: { start: 0, end: 40 }', 'range: { start: 40, end: 40 }'), 'x.yaml');
    expect(empty.ok).toBe(false);
  });
});

describe('hints for common slips', () => {
  it('says how to write a percentage typed as text', () => {
    const result = loadPlan(fixture('valid/minimal.yaml').replace('rate: 0.1', 'rate: "12.5%"'), 'x.yaml');
    expect(result.ok ? undefined : result.errors[0]?.found).toBe('the text "12.5%"; write 12.5% as 0.125');
  });

  it('accepts a byte-order mark and Windows line endings', () => {
    const text = `\uFEFF${fixture('valid/minimal.yaml').replace(/\n/g, '\r\n')}`;
    const result = loadPlan(text, 'x.yaml');
    expect(result.ok).toBe(true);
    expect(result.ok && result.loaded.line).toBe(2);
  });
});

describe('the line of every key', () => {
  // The oracle is the plain way: walk the loaded value and ask where each key and list item is written, one
  // lookup from the root per key; and the line found must hold the key's own name (common practice, no source).
  function keyLinesOneByOne(text: string): Map<string, number> {
    const read = readYaml(text, 'x.yaml', PLAN_LIMITS, 'plan');
    if (!read.ok) throw new Error('not YAML');
    const lines = new Map<string, number>();
    const walk = (value: unknown, path: (string | number)[]) => {
      if (Array.isArray(value)) {
        value.forEach((item, index) => {
          lines.set(formatFieldPath([...path, index]), read.source.locate([...path, index]).line);
          walk(item, [...path, index]);
        });
      } else if (value !== null && typeof value === 'object') {
        for (const [key, item] of Object.entries(value)) {
          lines.set(formatFieldPath([...path, key]), read.source.locateKey(path, key).line);
          walk(item, [...path, key]);
        }
      }
    };
    walk(read.source.value, []);
    return lines;
  }
  const plans = [
    ...readdirSync(new URL('../../demo/repo/experiments/', import.meta.url)).filter((f) => f.endsWith('.yaml')).map((f) => readFileSync(new URL(`../../demo/repo/experiments/${f}`, import.meta.url), 'utf8')),
    ...readdirSync(new URL('../fixtures/plans/valid/', import.meta.url)).map((f) => fixture(`valid/${f}`)),
    'id: a\nflow: { a: [1, { b: 2 }], "c d": x }\nlist:\n  - one\n  -\n  - k: v\n    j: [w]\n',
  ];
  it.each(plans.map((text, i) => [i, text] as const))('plan %i: one walk gives what one lookup per key gives', (_, text) => {
    const read = readYaml(text, 'x.yaml', PLAN_LIMITS, 'plan');
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const fast = read.source.keyLines();
    expect(fast.size).toBeGreaterThan(2);
    expect([...fast].sort()).toEqual([...keyLinesOneByOne(text)].sort());
    const textLines = text.split('\n');
    for (const [field, line] of fast) {
      const last = /(?:^|\.)([^.[\]]+)$/.exec(field)?.[1];
      if (last) expect(textLines[line - 1], field).toContain(last);
    }
  });

  it('a registry entry lists its keys relative to the entry', () => {
    const read = readYaml('tests:\n  - id: a\n    flags: [x]\n  - id: b\n    owners:\n      - "@me"\n', 'r.yaml', PLAN_LIMITS, 'registry');
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(Object.fromEntries(read.source.keyLines(['tests', 1]))).toEqual({ id: 4, owners: 5, 'owners[0]': 6 });
    expect(read.source.keyLines(['tests', 5]).size).toBe(0);
  });
});
