#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  armCells,
  confidenceOf,
  guardrailClassText,
  metricDifference,
  planSource,
  primaryClassText,
  ruleLine,
  srmLine,
  timingLine
} from "./chunk-YHYDL5HF.js";
import {
  formatTable,
  terminalSafe,
  terminalStyle
} from "./chunk-D7CL2H7J.js";
import "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";

// src/core/report/readout-text.ts
var HEADER = ["ARM", "CONTROL", "TREATMENT", "DIFFERENCE [CI]", "RELATIVE [CI]", "P", "ADJUSTED P"];
function metricTitle(read, what) {
  return `${what}: ${terminalSafe(read.metric)}${read.segment !== void 0 ? ` in "${terminalSafe(read.segment)}"` : ""} (${read.kind}, ${read.direction} is better; ${confidenceOf(read)} intervals${read.cuped ? `; CUPED \u03B8 ${read.cuped.theta.toPrecision(3)}, variance \u2212${Math.round(read.cuped.varianceReduction * 100)}%` : ""})`;
}
function renderReadoutText(readout, options) {
  const style = terminalStyle(options.color);
  const rule = ruleLine(readout);
  const colour = readout.verdict === "win" ? style.green : readout.verdict === "inconclusive" || readout.verdict === "flat" ? style.yellow : style.red;
  const lines = [
    style.bold(`Readout of ${terminalSafe(readout.planId)}: ${terminalSafe(readout.title)}`),
    `${timingLine(readout)} ${((s) => `${s.before}${terminalSafe(s.commit)}${s.after}`)(planSource(readout))}`,
    "",
    `Rule applied: ${colour(style.bold(rule.label))}${terminalSafe(rule.arms)}${rule.quote ? `: \xAB${terminalSafe(rule.quote)}\xBB` : readout.verdict === "not-read" ? "" : " (the plan registers no decision for this)"}`
  ];
  const blocking = readout.findings.filter((f) => f.severity === "block");
  const others = readout.findings.filter((f) => f.severity !== "block");
  if (blocking.length) lines.push("", ...blocking.map((f) => `${style.red("BLOCK")} ${terminalSafe(f.message)}`));
  const srm = srmLine(readout);
  if (srm) lines.push("", srm);
  if (readout.verdict === "not-read") {
    lines.push("", "Metrics are withheld: with a sample ratio mismatch no difference between the arms can be trusted.");
    return lines.join("\n");
  }
  lines.push("", style.bold(metricTitle(readout.primary, "Primary")));
  lines.push(formatTable([...HEADER, "CLASS"], readout.primary.arms.map((a) => [...armCells(readout.primary, a), primaryClassText(a)])));
  if (readout.primary.minDetectableEffect !== void 0) lines.push(`Minimum detectable effect: \xB1${metricDifference(readout.primary, readout.primary.minDetectableEffect).replace(/^\+/, "")}.`);
  for (const g of readout.guardrails) {
    lines.push("", style.bold(metricTitle(g, "Guardrail (non-inferiority, one-sided)")));
    lines.push(formatTable([...HEADER, "CLASS"], g.arms.map((a) => [...armCells(g, a), guardrailClassText(a, g)])));
  }
  const exploratory = [...readout.secondary, ...readout.segments];
  if (exploratory.length) {
    lines.push("", style.bold("Exploratory (secondary metrics and segments; Benjamini\u2013Hochberg across them): leads to confirm, not results"));
    for (const m of exploratory) {
      lines.push("", metricTitle(m, m.role === "segment" ? "Segment" : "Secondary"));
      lines.push(formatTable([...HEADER, "SIGNAL"], m.arms.map((a) => [...armCells(m, a), a.exploratorySignal ? "lead" : "\u2014"])));
    }
  }
  if (others.length) lines.push("", ...others.map((f) => `${f.severity === "warn" ? style.yellow("WARN") : style.dim("NOTE")}  ${terminalSafe(f.message)}`));
  return lines.join("\n");
}
export {
  renderReadoutText
};
