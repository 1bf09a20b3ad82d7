import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { findCalls } from '../../src/core/scan/calls.js';
import { exposureInOneArm } from '../../src/core/scan/exposure-branch.js';
import { BUILTIN_FLAG_PATTERNS, BUILTIN_LOG_PATTERNS, compilePatterns } from '../../src/core/scan/patterns.js';

const flagPatterns = compilePatterns(BUILTIN_FLAG_PATTERNS);
const logPatterns = compilePatterns(BUILTIN_LOG_PATTERNS);
const check = (text: string, path: string, key: string, event: string) =>
  exposureInOneArm(
    text,
    path,
    findCalls(text, path, flagPatterns).filter((s) => s.groups.key === key),
    findCalls(text, path, logPatterns).filter((s) => s.groups.event === event),
  ).map((f) => `${f.kind}:${f.condition.line}:${f.exposure.line}`);

describe('exposure logged in one arm only', () => {
  it('keeps the demo’s clean plan clean: its exposure is logged in every arm', () => {
    expect(check(readFileSync('demo/repo/src/basket/summary.ts', 'utf8'), 'src/basket/summary.ts', 'basket-reorder-shortcut', 'reorder_shortcut_shown')).toEqual([]);
  });

  it.each([
    ['inside the if on the read itself', "function f(c) {\n  if (c.getBooleanValue('k', false)) {\n    track('seen');\n  }\n}\n", 'branch:2:3'],
    ['in the else of a branch on the variable', "function f(c) {\n  const on = c.getBooleanValue('k', false);\n  if (on) {\n    x();\n  } else {\n    track('seen');\n  }\n}\n", 'branch:3:6'],
    ['in a switch on the variant', "function f(c) {\n  const v = c.getStringValue('k', 'off');\n  switch (v) {\n    case 'on':\n      track('seen');\n  }\n}\n", 'branch:3:5'],
    ['after an early return', "function f(c) {\n  const v = c.getStringValue('k', 'off');\n  if (v === 'off') return [];\n  track('seen');\n}\n", 'early-return:3:4'],
  ])('%s', (_name, code, expected) => expect(check(code, 'a.ts', 'k', 'seen')).toEqual([expected]));

  it.each([
    ['logged before the branch', "function f(c) {\n  track('seen');\n  if (c.getBooleanValue('k', false)) {\n    x();\n  }\n}\n"],
    ['a branch on something else', "function f(c, u) {\n  const on = c.getBooleanValue('k', false);\n  if (u.isNew) {\n    track('seen');\n  }\n}\n"],
    ['the read in another function', "function g(c) {\n  return c.getBooleanValue('k', false);\n}\nfunction f(on) {\n  if (on) {\n    track('seen');\n  }\n}\n"],
    ['a return after the call', "function f(c) {\n  const on = c.getBooleanValue('k', false);\n  track('seen');\n  if (!on) return;\n}\n"],
  ])('not for %s', (_name, code) => expect(check(code, 'a.ts', 'k', 'seen')).toEqual([]));
});
