#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  metricTitle,
  table
} from "./chunk-XKJLWKP7.js";
import {
  VERDICT_LABEL,
  armCells,
  metricDifference,
  primaryClassText
} from "./chunk-5QQVXPU4.js";
import {
  codeSpan,
  safeCell,
  safeText
} from "./chunk-7H6MHGDI.js";
import {
  formatCount
} from "./chunk-5CFAFUOS.js";

// src/core/report/review-summary.ts
function checklistSummary(items) {
  const held = items.filter((i) => i.done).length;
  return { count: `${formatCount(held)} of ${formatCount(items.length)} ${held === 1 ? "holds" : "hold"}`, failing: items.filter((i) => !i.done).map((i) => i.label) };
}

// src/core/report/plan-amendment.ts
function planChangeTable(finding) {
  if (!finding.changes?.length) return "";
  const rows = finding.changes.map((c) => `  | ${codeSpan(c.field)} | ${safeCell(c.before)} | ${safeCell(c.after)} |`);
  return ["", "", "  | field | at the base commit | in this change |", "  | --- | --- | --- |", ...rows].join("\n");
}
function planChangeLines(finding, clean) {
  return (finding.changes ?? []).map((c) => `    ${c.field}: ${clean(c.before)} -> ${clean(c.after)}`);
}

// src/core/report/review-readout.ts
var MARKDOWN_STYLE = { escape: safeText, strong: (t) => `**${t}**`, code: codeSpan };
function classLabel(c) {
  return VERDICT_LABEL[c] ?? c;
}
function ruleAppliedLine(r, style) {
  const arms = r.arms.length && (r.primary?.arms.length ?? 0) > 1 ? ` (${r.arms.map(style.escape).join(", ")})` : "";
  const quote = r.decision !== void 0 ? `: \xAB${style.escape(r.decision)}\xBB` : r.verdict === "not-read" ? "" : " (the plan registers no decision for this)";
  const verdict = r.recorded === void 0 ? "This change records no class." : r.recorded === r.verdict ? "This change does that." : `This change records ${style.strong(classLabel(r.recorded))} instead.`;
  return `Rule applied: ${style.strong(VERDICT_LABEL[r.verdict])}${arms}${quote}. ${verdict}`;
}
function readoutSectionMarkdown(plan) {
  const r = plan.readout;
  if (!r) return [];
  const lines = ["", ruleAppliedLine(r, MARKDOWN_STYLE), "", `<sub>Read from ${codeSpan(r.file)}.</sub>`];
  if (!r.primary) return [...lines, "", "Metrics are withheld: with a sample ratio mismatch no difference between the arms can be trusted."];
  const p = r.primary;
  lines.push("", metricTitle(p, "Primary"), "", ...table(["arm", "control", "treatment", "difference [CI]", "relative [CI]", "p", "adjusted p", "class"], p.arms.map((a) => [...armCells(p, a), primaryClassText(a)])));
  if (p.minDetectableEffect !== void 0) lines.push("", `Minimum detectable effect: \xB1${metricDifference(p, p.minDetectableEffect).replace(/^\+/, "")}.`);
  return lines;
}
function overrideLines(plans, style = MARKDOWN_STYLE) {
  return plans.flatMap((plan) => {
    const o = plan.override;
    if (!o) return [];
    const rule = plan.readout ? ` where the rule gives ${style.strong(classLabel(plan.readout.verdict))}` : "";
    const acted = o.class ? `acts on ${style.strong(classLabel(o.class))}${rule}` : `departs from the rule${rule}`;
    const ship = o.ship?.length ? `, shipping ${o.ship.map(style.escape).join(", ")}` : "";
    return [`${style.strong("Override to judge")}: ${style.code(plan.id)} ${acted}${ship}. Reason given: \xAB${style.escape(o.reason)}\xBB`];
  });
}

export {
  checklistSummary,
  planChangeTable,
  planChangeLines,
  ruleAppliedLine,
  readoutSectionMarkdown,
  overrideLines
};
