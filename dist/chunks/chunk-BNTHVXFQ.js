#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  codeSpan,
  safeCell,
  safeText
} from "./chunk-7H6MHGDI.js";
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

// src/core/report/readout-markdown.ts
var HEADER = ["arm", "control", "treatment", "difference [CI]", "relative [CI]", "p", "adjusted p"];
function table(header, rows) {
  return [`| ${header.join(" | ")} |`, `| ${header.map(() => "---").join(" | ")} |`, ...rows.map((r) => `| ${r.map(safeCell).join(" | ")} |`)];
}
function metricTitle(read, what) {
  const segment = read.segment !== void 0 ? ` in \u201C${safeText(read.segment)}\u201D` : "";
  const cuped = read.cuped ? `; CUPED \u03B8 ${read.cuped.theta.toPrecision(3)}, variance \u2212${Math.round(read.cuped.varianceReduction * 100)}%` : "";
  return `**${what}: ${codeSpan(read.metric)}${segment}** (${read.kind}, ${read.direction} is better; ${confidenceOf(read)} intervals${cuped})`;
}
function sourceOf(readout) {
  const { before, commit, after } = planSource(readout);
  return `${before}${codeSpan(commit)}${after}`;
}
function renderReadoutMarkdown(readout) {
  const rule = ruleLine(readout);
  const quote = rule.quote ? `: \xAB${safeText(rule.quote)}\xBB` : readout.verdict === "not-read" ? "" : " (the plan registers no decision for this)";
  const lines = [
    `### Readout of ${codeSpan(readout.planId)}: ${safeText(readout.title)}`,
    "",
    `Rule applied: **${rule.label}**${safeText(rule.arms)}${quote}`,
    "",
    `${timingLine(readout)} ${sourceOf(readout)}`
  ];
  const blocking = readout.findings.filter((f) => f.severity === "block");
  if (blocking.length) lines.push("", ...blocking.map((f) => `- :no_entry: ${safeText(f.message)}`));
  const srm = srmLine(readout);
  if (srm) lines.push("", srm);
  if (readout.verdict === "not-read") {
    lines.push("", "Metrics are withheld: with a sample ratio mismatch no difference between the arms can be trusted.");
    return `${lines.join("\n")}
`;
  }
  lines.push("", metricTitle(readout.primary, "Primary"), "", ...table([...HEADER, "class"], readout.primary.arms.map((a) => [...armCells(readout.primary, a), primaryClassText(a)])));
  if (readout.primary.minDetectableEffect !== void 0) lines.push("", `Minimum detectable effect: \xB1${metricDifference(readout.primary, readout.primary.minDetectableEffect).replace(/^\+/, "")}.`);
  for (const g of readout.guardrails) {
    lines.push("", metricTitle(g, "Guardrail (non-inferiority, one-sided)"), "", ...table([...HEADER, "class"], g.arms.map((a) => [...armCells(g, a), guardrailClassText(a, g)])));
  }
  const exploratory = [...readout.secondary, ...readout.segments];
  if (exploratory.length) {
    lines.push("", "<details><summary>Exploratory: secondary metrics and segments (Benjamini\u2013Hochberg across them); leads to confirm, not results</summary>");
    for (const m of exploratory) {
      lines.push("", metricTitle(m, m.role === "segment" ? "Segment" : "Secondary"), "", ...table([...HEADER, "signal"], m.arms.map((a) => [...armCells(m, a), a.exploratorySignal ? "lead" : "\u2014"])));
    }
    lines.push("", "</details>");
  }
  const others = readout.findings.filter((f) => f.severity !== "block");
  if (others.length) lines.push("", ...others.map((f) => `- ${f.severity === "warn" ? ":warning:" : ":information_source:"} ${safeText(f.message)}`));
  return `${lines.join("\n")}
`;
}

export {
  table,
  metricTitle,
  renderReadoutMarkdown
};
