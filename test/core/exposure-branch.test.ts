import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { findCalls } from '../../src/core/scan/calls.js';
import { exposureInOneArm } from '../../src/core/scan/exposure-branch.js';
import { flagReadsOf } from '../../src/core/scan/flag-touches.js';
import { BUILTIN_FLAG_PATTERNS, BUILTIN_LOG_PATTERNS, compilePatterns } from '../../src/core/scan/patterns.js';

const flagPatterns = compilePatterns(BUILTIN_FLAG_PATTERNS);
const logPatterns = compilePatterns(BUILTIN_LOG_PATTERNS);
const check = (text: string, path: string, key: string, event: string) =>
  exposureInOneArm(
    text,
    path,
    flagReadsOf(text, path, flagPatterns, new Set([key])),
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

  // The key held in a constant, and reads a formatter split over lines, in each language the flag patterns cover.
  it.each([
    ['TypeScript: the key in a constant', 'a.ts', "const FLAG = 'k';\nfunction f(client) {\n  if (client.getBooleanValue(FLAG, false)) {\n    track('seen');\n  }\n}\n", 'branch:3:4'],
    ['TypeScript: a chained read split over lines, in the if', 'a.ts', "function f(client) {\n  if (client\n    .getBooleanValue(\n      'k', false)) {\n    track('seen');\n  }\n}\n", 'branch:2:5'],
    ['TypeScript: a chained read split over lines, assigned', 'a.ts', "function f(client) {\n  const on = client\n    .getBooleanValue(\n      'k', false);\n  if (on) {\n    track('seen');\n  }\n}\n", 'branch:5:6'],
    ['TypeScript: a split read, then an early return', 'a.ts', "function f(client) {\n  const arm = await client\n    .getStringValue(\n      'k', 'control');\n  if (arm === 'control') return;\n  track('seen');\n}\n", 'early-return:5:6'],
    ['Python: the key in a constant', 'a.py', "FLAG = 'k'\ndef f(client):\n    on = client.get_boolean_value(FLAG, False)\n    if on:\n        track('seen')\n", 'branch:4:5'],
    ['Python: a split read', 'a.py', "def f(client):\n    on = client.get_boolean_value(\n        'k',\n        False,\n    )\n    if not on:\n        return None\n    track('seen')\n", 'early-return:6:8'],
    ['Go: the key in a constant, two results', 'a.go', 'package x\n\nconst Flag = "k"\n\nfunc f(ctx context.Context, client *openfeature.Client) {\n\ton, _ := client.BooleanValue(ctx, Flag, false, evalCtx)\n\tif on {\n\t\tanalytics.Track(ctx, "seen")\n\t}\n}\n', 'branch:7:8'],
    ['Go: a split read, then an early return', 'a.go', 'package x\n\nfunc f(ctx context.Context, client *openfeature.Client) error {\n\tarm, err := client.\n\t\tStringValue(\n\t\t\tctx, "k", "control", evalCtx)\n\tif arm == "control" {\n\t\treturn err\n\t}\n\tanalytics.Track(ctx, "seen")\n\treturn nil\n}\n', 'early-return:7:10'],
    ['Kotlin: the key in an object constant', 'a.kt', 'object Flags {\n    const val FLAG = "k"\n}\n\nfun f(client: Client) {\n    val on = client.getBooleanValue(Flags.FLAG, false)\n    if (on) {\n        track("seen")\n    }\n}\n', 'branch:7:8'],
    ['Kotlin: a split read, then an early return', 'a.kt', 'fun f(client: Client) {\n    val arm = client\n        .getStringValue(\n            "k", "control")\n    if (arm == "control") return\n    track("seen")\n}\n', 'early-return:5:6'],
    ['Java: a constant and a split read', 'A.java', 'class A {\n  static final String FLAG = "k";\n  void f(Client client) {\n    boolean on = client\n        .getBooleanValue(\n            FLAG, false);\n    if (on) {\n      track("seen");\n    }\n  }\n}\n', 'branch:7:8'],
  ])('%s', (_name, path, code, expected) => expect(check(code, path, 'k', 'seen')).toEqual([expected]));

  it.each([
    ['Go: logged before the branch', 'a.go', 'package x\n\nconst Flag = "k"\n\nfunc f(ctx context.Context, client *openfeature.Client) {\n\ton, _ := client.BooleanValue(ctx, Flag, false, evalCtx)\n\tanalytics.Track(ctx, "seen")\n\tif on {\n\t\tx()\n\t}\n}\n'],
    ['Kotlin: a branch on something else', 'a.kt', 'fun f(client: Client, user: User) {\n    val on = client\n        .getBooleanValue("k", false)\n    if (user.isNew) {\n        track("seen")\n    }\n}\n'],
    ['TypeScript: a constant that holds another key', 'a.ts', "const FLAG = 'other';\nfunction f(client) {\n  if (client.getBooleanValue(FLAG, false)) {\n    track('seen');\n  }\n}\n"],
  ])('not for %s', (_name, path, code) => expect(check(code, path, 'k', 'seen')).toEqual([]));

  it.each([
    ['logged before the branch', "function f(c) {\n  track('seen');\n  if (c.getBooleanValue('k', false)) {\n    x();\n  }\n}\n"],
    ['a branch on something else', "function f(c, u) {\n  const on = c.getBooleanValue('k', false);\n  if (u.isNew) {\n    track('seen');\n  }\n}\n"],
    ['the read in another function', "function g(c) {\n  return c.getBooleanValue('k', false);\n}\nfunction f(on) {\n  if (on) {\n    track('seen');\n  }\n}\n"],
    ['a return after the call', "function f(c) {\n  const on = c.getBooleanValue('k', false);\n  track('seen');\n  if (!on) return;\n}\n"],
  ])('not for %s', (_name, code) => expect(check(code, 'a.ts', 'k', 'seen')).toEqual([]));
});
