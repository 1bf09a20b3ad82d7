#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  fail
} from "./chunk-X2H4NLT2.js";

// src/core/stats/finite-sizing.ts
var SUSPECTS = [
  { figure: /duration|days|weeks|powerByDay/, input: "daily-units", name: "the number of days" },
  { figure: /clusters|designEffect/, input: "cluster", name: "the number of groups" },
  { figure: /perArm|totalUnits|units/, input: "effect", name: "the number of units" },
  { figure: /power|detectable/, input: "effect", name: "the power" },
  { figure: /./, input: "baseline", name: "a figure" }
];
function firstNonFinite(value) {
  const stack = [{ at: "", value }];
  while (stack.length > 0) {
    const { at, value: current } = stack.pop();
    if (typeof current === "number") {
      if (!Number.isFinite(current)) return at;
    } else if (current !== null && typeof current === "object") {
      const entries = Array.isArray(current) ? current.map((v, i) => [String(i), v]) : Object.entries(current);
      for (const [key, child] of entries.reverse()) stack.push({ at: at ? `${at}.${key}` : key, value: child });
    }
  }
  return void 0;
}
function finiteSizing(sizing) {
  return {
    ...sizing,
    metrics: sizing.metrics.map((entry) => {
      if (!entry.result.ok) return entry;
      const at = firstNonFinite(entry.result.value);
      if (at === void 0) return entry;
      const suspect = SUSPECTS.find((s) => s.figure.test(at));
      return {
        ...entry,
        result: fail(suspect.input, `${suspect.name} overflows for these inputs (${at}); bring ${suspect.input} and the other figures into the ranges in docs/plan-limits.md`)
      };
    })
  };
}

export {
  firstNonFinite,
  finiteSizing
};
