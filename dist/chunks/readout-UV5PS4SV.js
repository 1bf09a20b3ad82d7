#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatTable
} from "./chunk-D7CL2H7J.js";
import {
  formatCount
} from "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";

// src/core/report/readout.ts
var SRM_JSON_FORMAT = "plumbline.srm/1";
var ADJUST_JSON_FORMAT = "plumbline.adjusted-p/1";
function formatP(p) {
  if (p < 1e-12) return "< 1e-12";
  return p < 1e-3 ? p.toExponential(2) : p.toFixed(4);
}
function renderSrmText(check, observed, weights, threshold) {
  const total = observed.reduce((a, b) => a + b, 0);
  const weightSum = weights.reduce((a, b) => a + b, 0);
  const rows = observed.map((o, i) => [
    `arm ${i + 1}`,
    `${(weights[i] / weightSum * 100).toFixed(1)}%`,
    formatCount(o),
    formatCount(check.expected[i]),
    `${(o / total * 100).toFixed(2)}%`
  ]);
  const verdict = check.mismatch ? `Sample ratio mismatch: p = ${formatP(check.pValue)} < ${threshold}. Do not read the results: find out why assignment or logging lost units first.` : `No sample ratio mismatch: p = ${formatP(check.pValue)} (alarm below ${threshold}).`;
  return [formatTable(["ARM", "PLANNED", "OBSERVED", "EXPECTED", "SHARE"], rows), "", `chi-square = ${check.statistic.toFixed(3)} on ${check.degreesOfFreedom} df. ${verdict}`].join("\n");
}
function renderAdjustedText(pValues, adjusted, q) {
  const { benjaminiHochberg: bh, holm, bonferroni } = adjusted;
  const rows = pValues.map((p, i) => [String(i + 1), formatP(p), formatP(bh[i]), bh[i] <= q ? "yes" : "no", formatP(holm[i]), holm[i] <= q ? "yes" : "no", formatP(bonferroni[i]), bonferroni[i] <= q ? "yes" : "no"]);
  const found = (list) => list.filter((x) => x <= q).length;
  return [
    formatTable(["#", "P", "BH-ADJUSTED", `BH \u2264 ${q}`, "HOLM", `HOLM \u2264 ${q}`, "BONFERRONI", `BONF \u2264 ${q}`], rows),
    "",
    `At ${q}: Benjamini-Hochberg (false discovery rate) finds ${found(bh)} of ${pValues.length} significant; Holm (any false alarm, step-down) finds ${found(holm)}; Bonferroni (any false alarm) finds ${found(bonferroni)}.`
  ].join("\n");
}
export {
  ADJUST_JSON_FORMAT,
  SRM_JSON_FORMAT,
  renderAdjustedText,
  renderSrmText
};
