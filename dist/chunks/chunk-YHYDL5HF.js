#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatCount,
  formatRate,
  formatValue
} from "./chunk-ACAADDFF.js";

// src/core/report/readout-figures.ts
var VERDICT_LABEL = {
  win: "win",
  loss: "loss",
  flat: "flat",
  inconclusive: "inconclusive",
  "guardrail-breach": "guardrail breach",
  "not-read": "not read"
};
function formatP(p, decimals = 3) {
  if (p < 1e-12) return "< 1e-12";
  return p < 1e-3 ? p.toExponential(decimals - 2) : p.toFixed(decimals);
}
function statePValue(p, decimals = 3) {
  return p < 1e-12 ? "p < 1e-12" : `p = ${formatP(p, decimals)}`;
}
function sig(x, digits = 3) {
  if (x === 0) return "0";
  const text = Math.abs(x) < 1e-3 ? x.toExponential(2) : Number(x.toPrecision(digits)).toLocaleString("en-US", { maximumFractionDigits: 8 });
  return x > 0 ? `+${text}` : text;
}
function metricValue(read, value) {
  return read.kind === "proportion" ? formatRate(value) : formatValue(value);
}
function metricDifference(read, value) {
  return read.kind === "proportion" ? `${sig(value * 100)} pp` : sig(value, 4);
}
function intervalOf(read, interval) {
  const ends = read.kind === "proportion" ? [interval.low * 100, interval.high * 100] : [interval.low, interval.high];
  return `[${sig(ends[0])}, ${sig(ends[1])}]`;
}
function relativeText(value) {
  return `${sig(value * 100)}%`;
}
function armCells(read, arm) {
  const c = arm.comparison;
  if (!c) return [arm.arm, "\u2014", "\u2014", `not computed: ${arm.reason ?? "no data"}`, "", "", ""];
  const relative = c.relative ? `${relativeText(c.relative.value)} [${relativeText(c.relative.interval.low)}, ${relativeText(c.relative.interval.high)}]` : "none (control is 0)";
  return [
    arm.arm,
    `${metricValue(read, c.control.value)} (n ${formatCount(c.control.n)})`,
    `${metricValue(read, c.treatment.value)} (n ${formatCount(c.treatment.n)})`,
    `${metricDifference(read, c.difference)} ${intervalOf(read, c.interval)}`,
    relative,
    formatP(c.pValue),
    arm.adjustedP !== void 0 ? formatP(arm.adjustedP) : formatP(c.pValue)
  ];
}
function confidenceOf(read) {
  const c = read.arms.find((a) => a.comparison)?.comparison;
  return c ? `${Number((c.confidence * 100).toPrecision(4))}%` : "";
}
function guardrailClassText(arm, read) {
  if (!arm.guardrailClass || !arm.harm) return "not computed";
  const bound = `harm at most ${metricDifference(read, arm.harm.upperBound)}`;
  const tolerance = read.tolerance !== void 0 ? ` (tolerance ${metricDifference(read, read.tolerance).replace(/^\+/, "")})` : " (no tolerance registered)";
  if (arm.guardrailClass === "breach") return `BREACH: harm is significant; ${bound}`;
  if (arm.guardrailClass === "harm-ruled-out") return `harm ruled out: ${bound}${tolerance}`;
  return `harm not ruled out: ${bound}${tolerance}`;
}
function ruleLine(readout) {
  const arms = readout.verdictArms.length && readout.treatments.length > 1 ? ` (${readout.verdictArms.join(", ")})` : "";
  return { label: VERDICT_LABEL[readout.verdict], arms, ...readout.decision ? { quote: readout.decision.text } : {} };
}
function srmLine(readout) {
  const srm = readout.srm;
  if (!srm) return void 0;
  const split = srm.arms.map((a) => formatCount(a.units)).join(" / ");
  const weights = srm.arms.map((a) => formatValue(a.weight)).join(" / ");
  const days = srm.daysChecked ? `; ${srm.daysChecked} days checked, ${srm.days.length} alarmed` : "";
  return `Sample ratio: ${split} units against weights ${weights}: chi-square ${srm.statistic.toFixed(2)} on ${srm.degreesOfFreedom} df, ${statePValue(srm.pValue)}, ${srm.mismatch ? "MISMATCH" : "no mismatch"} (alarm below ${srm.threshold})${days}.`;
}
function timingLine(readout) {
  const t = readout.timing;
  const end = t.plannedEnd ? `planned end ${t.plannedEnd}` : "no planned end";
  const fraction = t.informationFraction !== void 0 ? `; ${formatCount(Object.values(readout.srm?.arms ?? []).reduce((s, a) => s + a.units, 0))} units, ${Math.round(t.informationFraction * 100)}% of the ${formatCount(t.plannedUnits)} planned` : "";
  return `Data through ${t.dataThrough} (${end}${t.readEarly ? ", READ EARLY" : ""})${fraction}.`;
}
function primaryClassText(arm) {
  return arm.primaryClass ?? "not computed";
}
function planSource(readout) {
  const commit = readout.rule?.commit ?? readout.planCommit;
  switch (readout.rule?.status) {
    case void 0:
      return { before: "Plan as launched: ", commit, after: "." };
    case "same":
      return { before: "Rule as registered at launch (", commit, after: ")." };
    case "amended":
      return { before: "Rule as amended after launch (", commit, after: "): see the note below." };
    case "changed":
      return { before: "Rule as registered at launch (", commit, after: "); the plan was changed since without an amendment." };
    case "unavailable":
      return { before: "Today's plan: the plan at ", commit, after: " cannot be read." };
  }
}

export {
  VERDICT_LABEL,
  formatP,
  statePValue,
  metricDifference,
  armCells,
  confidenceOf,
  guardrailClassText,
  ruleLine,
  srmLine,
  timingLine,
  primaryClassText,
  planSource
};
