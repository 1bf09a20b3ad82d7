#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  fail,
  ok
} from "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";

// src/core/stats/multiple-testing.ts
function benjaminiHochberg(pValues) {
  if (pValues.some((p) => !(p >= 0 && p <= 1))) return fail("p-values", "every p-value must lie in [0, 1]");
  const m = pValues.length;
  const order = pValues.map((p, i) => ({ p, i })).sort((a, b) => b.p - a.p);
  const adjusted = new Array(m);
  let running = 1;
  order.forEach(({ p, i }, rankFromTop) => {
    const rank = m - rankFromTop;
    running = Math.min(running, p * m / rank);
    adjusted[i] = running;
  });
  return ok(adjusted);
}
function bonferroniAdjust(pValues) {
  if (pValues.some((p) => !(p >= 0 && p <= 1))) return fail("p-values", "every p-value must lie in [0, 1]");
  return ok(pValues.map((p) => Math.min(1, p * pValues.length)));
}
export {
  benjaminiHochberg,
  bonferroniAdjust
};
