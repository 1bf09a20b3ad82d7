#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  chiSquareUpper
} from "./chunk-54OF2UQO.js";
import {
  SRM_ALARM_P
} from "./chunk-BXF2RWJM.js";
import {
  fail,
  ok
} from "./chunk-X2H4NLT2.js";

// src/core/stats/srm.ts
function sampleRatioMismatch(observed, weights, threshold = SRM_ALARM_P) {
  if (observed.length !== weights.length) return fail("arms", `${observed.length} observed counts for ${weights.length} planned arms`);
  if (observed.length < 2) return fail("arms", "a ratio needs at least two arms");
  if (observed.some((n) => !(n >= 0) || !Number.isFinite(n))) return fail("observed", "observed counts must be finite and not negative");
  if (weights.some((w) => !(w > 0) || !Number.isFinite(w))) return fail("weights", "planned weights must be above 0");
  const total = observed.reduce((a, b) => a + b, 0);
  if (total === 0) return fail("observed", "no units observed yet");
  const weightSum = weights.reduce((a, b) => a + b, 0);
  const expected = weights.map((w) => total * w / weightSum);
  const statistic = observed.reduce((sum, o, i) => sum + (o - expected[i]) ** 2 / expected[i], 0);
  const degreesOfFreedom = observed.length - 1;
  const pValue = chiSquareUpper(statistic, degreesOfFreedom);
  return ok({ statistic, degreesOfFreedom, pValue, expected, mismatch: pValue < threshold });
}

export {
  sampleRatioMismatch
};
