#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  fail,
  ok
} from "./chunk-X2H4NLT2.js";

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
function holmAdjust(pValues) {
  if (pValues.some((p) => !(p >= 0 && p <= 1))) return fail("p-values", "every p-value must lie in [0, 1]");
  const m = pValues.length;
  const order = pValues.map((p, i) => ({ p, i })).sort((a, b) => a.p - b.p);
  const adjusted = new Array(m);
  let running = 0;
  order.forEach(({ p, i }, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * p));
    adjusted[i] = running;
  });
  return ok(adjusted);
}
function adjustPValues(pValues) {
  const bh = benjaminiHochberg(pValues);
  const holm = holmAdjust(pValues);
  const bonferroni = bonferroniAdjust(pValues);
  if (!bh.ok) return bh;
  if (!holm.ok) return holm;
  if (!bonferroni.ok) return bonferroni;
  return ok({ benjaminiHochberg: bh.value, holm: holm.value, bonferroni: bonferroni.value });
}

export {
  benjaminiHochberg,
  bonferroniAdjust,
  holmAdjust,
  adjustPValues
};
