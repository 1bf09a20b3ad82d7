#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  AT_BASE,
  checklistSummary,
  countsSummary,
  overrideLines,
  planChangeLines,
  ruleAppliedLine,
  ruleSourceLine
} from "./chunk-4JVBEDJS.js";
import {
  lengthSummary
} from "./chunk-UDHHIPK7.js";
import "./chunk-BNTHVXFQ.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-YHYDL5HF.js";
import {
  terminalSafe,
  terminalStyle
} from "./chunk-D7CL2H7J.js";
import {
  formatCount
} from "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";

// src/core/report/review-text.ts
var LABEL = { block: "BLOCK", warn: "warn ", note: "note " };
function renderReviewText(review, options) {
  const style = terminalStyle(options.color);
  const paint = (s, text) => s === "block" ? style.red(text) : s === "warn" ? style.yellow(text) : style.dim(text);
  const out = [];
  const verdict = {
    blocked: style.red("blocked"),
    warnings: style.yellow("passes, with warnings"),
    clear: style.green("all clear"),
    "nothing-to-check": style.green("nothing to check"),
    partial: style.yellow("partial review, nothing found in the files seen")
  }[review.verdict];
  const { introduced, known } = countsSummary(review);
  const counts = introduced || known ? ` (this change: ${introduced || "nothing new"}${known ? `; already known before it: ${known}` : ""})` : "";
  out.push(`${style.bold("Plumbline")}: ${verdict}${counts} for ${review.base.slice(0, 7)}...${review.head.slice(0, 7)}`);
  const readoutStyle = { escape: terminalSafe, strong: style.bold, code: terminalSafe };
  out.push(...overrideLines(review.plans, readoutStyle));
  if (review.verdict === "nothing-to-check") {
    out.push("This change touches no feature flag and no plan, and removes no event a running test depends on.");
    return out.join("\n");
  }
  for (const f of review.findings) {
    const at = f.file ? `${terminalSafe(f.file)}${f.line ? `:${f.line}` : ""}${f.side === "base" ? ` (${AT_BASE} ${review.base.slice(0, 7)})` : ""}: ` : "";
    out.push(`${at}${paint(f.severity, LABEL[f.severity])} ${f.code}${f.plan ? ` [${terminalSafe(f.plan)}]` : ""}${f.origin === "known" ? style.dim(" (already known)") : ""}: ${terminalSafe(f.message)}`);
    out.push(`    fix: ${terminalSafe(f.fix)}`, ...planChangeLines(f, terminalSafe));
  }
  for (const plan of review.plans) {
    out.push("", `${style.bold(`Plan ${terminalSafe(plan.id)}`)} (${terminalSafe(plan.state)}, ${terminalSafe(plan.owners.join(", "))}) ${terminalSafe(plan.file)}:${plan.line}`);
    const checklist = checklistSummary(plan.checklist);
    if (plan.readout) out.push(`  ${ruleAppliedLine(plan.readout, readoutStyle)}`, `  ${ruleSourceLine(plan.readout, readoutStyle)}`);
    out.push(`  checklist: ${checklist.count}`);
    for (const label of checklist.failing) out.push(`  [${style.red(" ")}] ${label}`);
    const length = lengthSummary(plan.sizing);
    if (length) out.push(`  length: ${terminalSafe(length.length)}${length.power ? `; power: ${terminalSafe(length.power)}` : ""}; details: plumbline size ${terminalSafe(plan.id)}`);
    const missing = plan.events.filter((e) => !e.location).map((e) => e.event);
    out.push(`  events: ${formatCount(plan.events.length - missing.length)} of ${formatCount(plan.events.length)} logged${missing.length ? ` (missing: ${terminalSafe(missing.join(", "))})` : ""}`);
  }
  return out.join("\n");
}
export {
  renderReviewText
};
