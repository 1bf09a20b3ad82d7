import fc from 'fast-check';
import { parse, stringify } from 'yaml';

/**
 * Generated repositories for the fuzzer: plan, registry and settings files grown from valid seeds by
 * structure-aware mutations (a field set to an extreme number, a wrong type, a long or deep value, a key
 * dropped), then written as YAML and sometimes damaged as text (bytes changed, YAML constructions spliced
 * in). Everything is drawn from one seed, so any case can be generated again.
 */

export interface SeedFiles {
  plans: string[];
  registry: string;
  settings: string;
}

export interface FuzzCase {
  /** path -> text at the change's base and head. */
  base: Map<string, string>;
  head: Map<string, string>;
  /** Plan files the case sizes by path. */
  planFiles: string[];
  prBody: string;
  prTitle: string;
  /** Besides validate, the one command this case runs, and its output format. */
  command: { name: 'list' | 'size' | 'digest' | 'check'; format: 'json' | 'text' | 'markdown' };
}

/** Numbers at the edges of what a double holds and of each field's range. */
const EXTREME_NUMBERS = [
  0, -0, 5e-324, -5e-324, 2.2250738585072014e-308, 1e-300, 1e-12, 1e-9, 1e-7, 1e-6, 0.000001, 0.001, 0.01, 0.5, 0.999999999, 1, 1.0000001, 2, 7, 20, 21, 29, 30, 99.99,
  100, 100.0001, 1000, 1e6, 1e7, 1e10, 1e11, 1e15, 1e16, 2 ** 53, 2 ** 53 + 2, 1e100, 1e300, 1e308, 1.7976931348623157e308, -1, -0.5, -1e308, -1e-300,
];
/** Scalars that YAML reads as something other than they look like. */
const TRICKY_SCALARS = ['.nan', '.inf', '-.inf', '.NaN', '0x10', '0o17', '1e400', '-1e400', '~', 'null', 'true', 'no', '', ' ', '2026-02-30', '2026-13-01', '9999-12-31', '0000-01-01', '1_000', '+12', '.5', '@x', '*a', '&a', '!x', '{}', '[]', '#', '- x', 'a: b', '"', "'", '\\', '\t', '\u0000', '\u202e', '\ud83d\ude00', 'é', 'NaN', 'Infinity'];

const number = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...EXTREME_NUMBERS) },
  { weight: 1, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  { weight: 1, arbitrary: fc.integer({ min: -1000, max: 100_000 }) },
  { weight: 1, arbitrary: fc.double({ min: 0, max: 1, noNaN: true }) },
);
const longText = fc.tuple(fc.constantFrom('x', 'a-', 'é', '-', ' ', 'ab'), fc.constantFrom(101, 201, 1_000, 40_000)).map(([unit, n]) => unit.repeat(Math.ceil(n / unit.length)).slice(0, n));
const shortText = fc.string({ maxLength: 12, unit: 'grapheme' });
const kebab = fc.stringMatching(/^[a-z0-9]{1,8}(?:-[a-z0-9]{1,6}){0,2}$/);

/** A replacement for any node of a parsed file. */
const replacement: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: number },
  { weight: 2, arbitrary: fc.constantFrom(...TRICKY_SCALARS) },
  { weight: 2, arbitrary: kebab },
  { weight: 1, arbitrary: shortText },
  { weight: 1, arbitrary: longText },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [1, 2], { a: 1 }) },
  { weight: 1, arbitrary: fc.integer({ min: 30, max: 400 }).map((depth) => nested(depth)) },
  { weight: 1, arbitrary: fc.array(kebab, { minLength: 0, maxLength: 8 }) },
);

function nested(depth: number): unknown {
  let value: unknown = 1;
  for (let i = 0; i < depth; i++) value = i % 2 ? [value] : { k: value };
  return value;
}

type Path = (string | number)[];

/** Every path to a node of a parsed value, iteratively. */
function pathsOf(value: unknown): Path[] {
  const out: Path[] = [];
  const stack: { path: Path; value: unknown }[] = [{ path: [], value }];
  while (stack.length) {
    const { path, value: v } = stack.pop()!;
    if (path.length) out.push(path);
    if (Array.isArray(v)) v.forEach((child, i) => stack.push({ path: [...path, i], value: child }));
    else if (v !== null && typeof v === 'object') for (const [k, child] of Object.entries(v)) stack.push({ path: [...path, k], value: child });
  }
  return out;
}

function setAt(root: unknown, path: Path, next: unknown, remove: boolean): unknown {
  if (path.length === 0) return next;
  const parent = path.slice(0, -1).reduce<unknown>((v, k) => (v as Record<string | number, unknown>)[k], root) as Record<string | number, unknown> | unknown[];
  const key = path[path.length - 1]!;
  if (remove) {
    if (Array.isArray(parent)) parent.splice(Number(key), 1);
    else delete parent[key as string];
  } else (parent as Record<string | number, unknown>)[key] = next;
  return root;
}

/** Structure-aware mutations: each picks a node by index and replaces, removes or duplicates it. */
const mutation = fc.record({
  at: fc.nat(),
  op: fc.constantFrom('replace', 'replace', 'replace', 'remove', 'add-key', 'copy'),
  value: replacement,
  key: fc.oneof(kebab, fc.constantFrom('id', 'daily-units', 'weight', 'relative', 'absolute', 'mean', 'sd', 'rate', 'cluster', 'arms', 'interim-looks')),
});

type Mutation = typeof mutation extends fc.Arbitrary<infer T> ? T : never;

function mutate(value: unknown, mutations: readonly Mutation[]): unknown {
  let root = structuredClone(value);
  for (const m of mutations) {
    const paths = pathsOf(root);
    if (paths.length === 0) return m.value;
    const path = paths[m.at % paths.length]!;
    if (m.op === 'replace') root = setAt(root, path, structuredClone(m.value), false);
    else if (m.op === 'remove') root = setAt(root, path, undefined, true);
    else if (m.op === 'copy') {
      const other = paths[(m.at * 7 + 3) % paths.length]!;
      const source = other.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)?.[k], root);
      if (!other.slice(0, path.length).every((k, i) => k === path[i])) root = setAt(root, path, structuredClone(source), false);
    } else {
      const parent = path.slice(0, -1).reduce<unknown>((v, k) => (v as Record<string | number, unknown>)[k], root);
      if (parent && typeof parent === 'object' && !Array.isArray(parent)) (parent as Record<string, unknown>)[m.key] = structuredClone(m.value);
    }
  }
  return root;
}

/** YAML written by hand rather than by a serializer: constructions a person or a tool may produce. */
const YAML_SNIPPETS = [
  'a: b: c', 'key\n  continued: x', '- stray', '? [a, b]\n: c', '&anchor x', '*anchor', '*missing', '!!binary aGVsbG8=', '!custom 1', '!!int x', '---', '...', '%YAML 1.2\n---', '"unclosed',
  "'unclosed", '{ a: 1', '[1, 2', '}', ']', '|\n  block', '>-\n  folded', '\tindented: 1', '   odd: 1', '#comment', 'x: &a [*a]', 'k: "\\q"', 'k: @handle', 'k: `tick`', 'a:\n- b\n - c',
  `deep: ${'['.repeat(300)}${']'.repeat(300)}`, `deep: ${'{a: '.repeat(150)}1${'}'.repeat(150)}`, 'a: 1\na: 2', 'k: .nan', 'k: .inf', 'k: 0x1F', 'k: 1e999', '\ufeffbom: 1', 'k: "\\u0000"',
  `aliases: &x [1,1,1,1,1,1,1,1,1]\nb: &y [*x,*x,*x,*x,*x,*x,*x,*x]\nc: [*y,*y,*y,*y,*y,*y,*y,*y]`,
];

const textDamage = fc.oneof(
  fc.record({ kind: fc.constant('insert' as const), at: fc.nat(), text: fc.oneof(fc.constantFrom(...YAML_SNIPPETS), fc.string({ maxLength: 4, unit: 'binary' })) }),
  fc.record({ kind: fc.constant('delete' as const), at: fc.nat(), length: fc.integer({ min: 1, max: 40 }) }),
  fc.record({ kind: fc.constant('line' as const), at: fc.nat(), text: fc.constantFrom(...YAML_SNIPPETS) }),
  fc.record({ kind: fc.constant('indent' as const), at: fc.nat(), by: fc.constantFrom(-2, -1, 1, 2, 3) }),
);

type Damage = typeof textDamage extends fc.Arbitrary<infer T> ? T : never;

function damage(text: string, damages: readonly Damage[]): string {
  let out = text;
  for (const d of damages) {
    const at = out.length ? d.at % out.length : 0;
    if (d.kind === 'insert') out = out.slice(0, at) + d.text + out.slice(at);
    else if (d.kind === 'delete') out = out.slice(0, at) + out.slice(at + d.length);
    else {
      const lines = out.split('\n');
      const i = lines.length ? d.at % lines.length : 0;
      if (d.kind === 'line') lines.splice(i, 0, d.text);
      else lines[i] = d.by > 0 ? ' '.repeat(d.by) + (lines[i] ?? '') : (lines[i] ?? '').slice(-d.by);
      out = lines.join('\n');
    }
  }
  return out;
}

/** One file: a seed, some mutations, written as YAML (sometimes in flow style), sometimes damaged as text. */
function fileArbitrary(seedTexts: readonly string[]): fc.Arbitrary<{ text: string; value: unknown }> {
  const seeds = seedTexts.map((t) => parse(t, { logLevel: 'silent' }) as unknown);
  return fc
    .record({
      seed: fc.nat({ max: seedTexts.length - 1 }),
      mutations: fc.array(mutation, { minLength: 0, maxLength: 4 }),
      flow: fc.boolean(),
      damages: fc.oneof({ weight: 4, arbitrary: fc.constant([] as Damage[]) }, { weight: 1, arbitrary: fc.array(textDamage, { minLength: 1, maxLength: 3 }) }),
    })
    .map(({ seed, mutations, flow, damages }) => {
      const value = mutate(seeds[seed], mutations);
      let text: string;
      try {
        text = stringify(value, { aliasDuplicateObjects: false, lineWidth: 0, ...(flow ? { collectionStyle: 'flow' as const } : {}) });
      } catch {
        // The serializer recurses; past its depth, JSON (which is YAML) is written instead.
        text = JSON.stringify(value);
      }
      return { text: damage(text, damages), value };
    });
}

/** Code that evaluates the flags the plans name, so the review links the plans and sizes them. */
function codeTouching(values: readonly unknown[]): string {
  const keys = new Set<string>();
  for (const value of values) {
    const flags = value !== null && typeof value === 'object' ? (value as { flags?: unknown }).flags : undefined;
    if (Array.isArray(flags)) for (const f of flags) if (typeof f === 'string' && f.length < 300) keys.add(f);
  }
  return [...keys].map((k, i) => `export const f${i} = client.getBooleanValue(${JSON.stringify(k)}, true);`).join('\n') + '\ntrack("checkout_completed");\n';
}

export function caseArbitrary(seeds: SeedFiles): fc.Arbitrary<FuzzCase> {
  return fc
    .record({
      plans: fc.array(fileArbitrary(seeds.plans), { minLength: 1, maxLength: 4 }),
      keptPlans: fc.nat({ max: 2 }),
      registry: fc.option(fileArbitrary([seeds.registry]), { nil: undefined }),
      settings: fc.option(fileArbitrary([seeds.settings]), { nil: undefined }),
      body: fc.oneof(fc.constant(''), shortText, longText, fc.constantFrom('Relates to checkout-wallet-first and experiments/p0.yaml.', 'x'.repeat(40_000))),
      title: fc.constantFrom('fix: cart totals', 'feat: wallet', 'Checkout', ''),
      command: fc.record({ name: fc.constantFrom('list' as const, 'size' as const, 'digest' as const, 'check' as const, 'check' as const), format: fc.constantFrom('json' as const, 'text' as const, 'markdown' as const) }),
    })
    .map(({ plans, keptPlans, registry, settings, body, title, command }) => {
      const base = new Map<string, string>([['src/app.ts', 'export const nothing = 1;\n']]);
      const head = new Map<string, string>();
      // Some valid seed plans stay as they are, so mutated plans collide and link with real ones.
      seeds.plans.slice(0, keptPlans).forEach((text, i) => base.set(`experiments/seed-${i}.yaml`, text));
      base.set('registry/partner-tests.yaml', seeds.registry);
      base.set('.plumbline.yml', seeds.settings);
      for (const [path, text] of base) head.set(path, text);
      plans.forEach(({ text }, i) => head.set(`experiments/p${i}.yaml`, text));
      if (registry !== undefined) head.set('registry/partner-tests.yaml', registry.text);
      if (settings !== undefined) head.set('.plumbline.yml', settings.text);
      head.set('src/app.ts', codeTouching(plans.map((p) => p.value)));
      const mentioned = body + (body.length < 1000 ? plans.map((_, i) => ` experiments/p${i}.yaml`).join('') : '');
      return { base, head, planFiles: plans.map((_, i) => `experiments/p${i}.yaml`).slice(0, 2), prBody: mentioned, prTitle: title, command: command.name === 'list' && command.format === 'markdown' ? { ...command, format: 'text' } : command };
    });
}
