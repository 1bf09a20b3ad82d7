#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  chiSquareUpper
} from "./chunk-B52SKDPA.js";
import {
  SRM_ALARM_P
} from "./chunk-BXF2RWJM.js";
import {
  fail,
  ok
} from "./chunk-X2H4NLT2.js";

// src/core/stats/srm.ts
var MAX_UNIT_COUNT = Number.MAX_SAFE_INTEGER;
function isUnitCount(n) {
  return Number.isInteger(n) && n >= 0 && n <= MAX_UNIT_COUNT;
}
function sampleRatioMismatch(observed, weights, threshold = SRM_ALARM_P) {
  if (observed.length !== weights.length) return fail("arms", `${observed.length} observed counts for ${weights.length} planned arms`);
  if (observed.length < 2) return fail("arms", "a ratio needs at least two arms");
  if (!observed.every(isUnitCount)) return fail("observed", `observed counts must be whole numbers from 0 to ${MAX_UNIT_COUNT}`);
  if (weights.some((w) => !(w > 0) || !Number.isFinite(w))) return fail("weights", "planned weights must be finite and above 0");
  const total = observed.reduce((a, b) => a + b, 0);
  if (total === 0) return fail("observed", "no units observed yet");
  if (!(threshold > 0 && threshold < 1)) return fail("threshold", "the alarm threshold must be a p-value strictly between 0 and 1");
  const largest = Math.max(...weights);
  const shares = weights.map((w) => w / largest);
  const shareSum = shares.reduce((a, b) => a + b, 0);
  const expected = shares.map((s) => total * s / shareSum);
  const statistic = observed.reduce((sum, o, i) => sum + (o - expected[i]) ** 2 / expected[i], 0);
  if (!Number.isFinite(statistic) || expected.some((e) => !(e > 0))) return fail("weights", "the planned weights are too far apart: an arm expects next to no units, and the test cannot be computed");
  const degreesOfFreedom = observed.length - 1;
  const pValue = chiSquareUpper(statistic, degreesOfFreedom);
  if (!Number.isFinite(pValue)) return fail("observed", "the chi-square p-value cannot be computed for these counts");
  return ok({ statistic, degreesOfFreedom, pValue, expected, mismatch: pValue < threshold });
}

export {
  MAX_UNIT_COUNT,
  isUnitCount,
  sampleRatioMismatch
};
