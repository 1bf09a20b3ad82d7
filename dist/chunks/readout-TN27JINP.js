#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatP,
  statePValue
} from "./chunk-YHYDL5HF.js";
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
var P_DECIMALS = 4;
var formatP2 = (p) => formatP(p, P_DECIMALS);
function renderSrmText(check, observed, threshold) {
  const total = observed.reduce((a, b) => a + b, 0);
  const rows = observed.map((o, i) => [
    `arm ${i + 1}`,
    `${(check.expected[i] / total * 100).toFixed(1)}%`,
    formatCount(o),
    formatExpected(check.expected[i]),
    `${(o / total * 100).toFixed(2)}%`
  ]);
  const verdict = check.mismatch ? `Sample ratio mismatch: ${statePValue(check.pValue, P_DECIMALS)} (alarm below ${threshold}). Do not read the results: find out why assignment or logging lost units first.` : `No sample ratio mismatch: ${statePValue(check.pValue, P_DECIMALS)} (alarm below ${threshold}).`;
  return [formatTable(["ARM", "PLANNED", "OBSERVED", "EXPECTED", "SHARE"], rows), "", `chi-square = ${formatStatistic(check.statistic)} on ${check.degreesOfFreedom} df. ${verdict}`].join("\n");
}
function formatExpected(n) {
  return n < 1e15 ? n.toLocaleString("en-US", { maximumFractionDigits: 1 }) : formatCount(n);
}
function formatStatistic(x) {
  return x < 1e9 ? x.toFixed(3) : x.toExponential(3);
}
function renderAdjustedText(pValues, adjusted, q) {
  const { benjaminiHochberg: bh, holm, bonferroni } = adjusted;
  const rows = pValues.map((p, i) => [String(i + 1), formatP2(p), formatP2(bh[i]), bh[i] <= q ? "yes" : "no", formatP2(holm[i]), holm[i] <= q ? "yes" : "no", formatP2(bonferroni[i]), bonferroni[i] <= q ? "yes" : "no"]);
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
