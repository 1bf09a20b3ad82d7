import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import type { Plan } from '../../src/core/plan/schema.js';
import { keptArm } from '../../src/core/review/kept-arm.js';
import { BUILTIN_FLAG_PATTERNS, compilePatterns } from '../../src/core/scan/patterns.js';
import { cleanPlan, planYaml } from '../review/scenarios.js';

const patterns = compilePatterns(BUILTIN_FLAG_PATTERNS);

function plan(overrides: Record<string, unknown> = {}): Plan {
  const loaded = loadPlan(planYaml(cleanPlan(overrides)), 'experiments/good.yaml');
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.loaded.plan;
}

/** The arm kept when `base` becomes `head`, the flag read being on `line` of the base text. */
function kept(base: string, head: string | undefined, line: number, p = plan()) {
  const code = [{ path: 'src/a.ts', basePath: 'src/a.ts', added: [], removed: [line], base, ...(head !== undefined ? { head } : {}) }];
  return keptArm(p, [{ file: 'src/a.ts', line }], code, patterns);
}

const TERNARY = `export function options(saved: string[]) {
  const walletFirst = flags.getBooleanValue('good-flag', false);
  return walletFirst ? [...saved, 'card'] : ['card', ...saved];
}
`;
const IF_ELSE = `export function cart(client, track) {
  if (client.getBooleanValue('good-flag', false)) {
    track('order_done');
    showBadge();
  } else {
    track('order_old');
  }
}
`;

describe('which arm a change keeps when it removes a flag read', () => {
  it.each([
    ['a ternary on a variable, the true branch kept', TERNARY, TERNARY.replace(/ {2}const walletFirst.*\n/, '').replace("walletFirst ? [...saved, 'card'] : ['card', ...saved]", "[...saved, 'card']"), 2, 'treatment'],
    ['a ternary on a variable, the false branch kept', TERNARY, TERNARY.replace(/ {2}const walletFirst.*\n/, '').replace("walletFirst ? [...saved, 'card'] : ['card', ...saved]", "['card', ...saved]"), 2, 'control'],
    ['if/else on the call, the if body kept', IF_ELSE, "export function cart(client, track) {\n  track('order_done');\n  showBadge();\n}\n", 2, 'treatment'],
    ['if/else on the call, the else body kept', IF_ELSE, "export function cart(client, track) {\n  track('order_old');\n}\n", 2, 'control'],
    ['a negated condition swaps the arms', IF_ELSE.replace('if (client', 'if (!client'), "export function cart(client, track) {\n  track('order_old');\n}\n", 2, 'treatment'],
    ['an if without else, its body gone', "function f() {\n  if (isEnabled('good-flag')) {\n    showBadge();\n  }\n  done();\n}\n", 'function f() {\n  done();\n}\n', 2, 'control'],
    ['an if without else, hard-coded true', "function f() {\n  if (isEnabled('good-flag')) {\n    showBadge();\n  }\n  done();\n}\n", 'function f() {\n  if (true) {\n    showBadge();\n  }\n  done();\n}\n', 2, 'treatment'],
  ])('%s', (_name, base, head, line, arm) => {
    const result = kept(base, head, line);
    expect(result).toEqual({ arm, where: { file: 'src/a.ts', line } });
  });

  it('names a string arm compared with the value', () => {
    const p = plan({ design: { arms: [{ name: 'off', weight: 0.5 }, { name: 'percent', weight: 0.5 }], control: 'off', 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000 } });
    const base = "function tips(total) {\n  const variant = flags.getStringValue('good-flag', 'off');\n  return variant === 'percent' ? [total * 0.05] : [];\n}\n";
    expect(kept(base, 'function tips(total) {\n  return [total * 0.05];\n}\n', 2, p)).toMatchObject({ arm: 'percent' });
    expect(kept(base, 'function tips(total) {\n  return [];\n}\n', 2, p)).toMatchObject({ arm: 'off' });
  });

  it.each([
    ['both branches still there', TERNARY, TERNARY.replace("flags.getBooleanValue('good-flag', false)", 'config.walletFirst'), 2],
    ['the value is only passed on', "function f() {\n  render(flags.getBooleanValue('good-flag', false));\n}\n", 'function f() {\n  render(true);\n}\n', 2],
    ['the file is deleted', TERNARY, undefined, 2],
  ])('could not tell: %s', (_name, base, head, line) => {
    expect(kept(base, head, line)).toHaveProperty('unknown');
  });
});
