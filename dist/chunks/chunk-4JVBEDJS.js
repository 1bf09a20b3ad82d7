#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  metricTitle,
  table
} from "./chunk-BNTHVXFQ.js";
import {
  codeSpan,
  safeCell,
  safeText
} from "./chunk-7H6MHGDI.js";
import {
  VERDICT_LABEL,
  armCells,
  metricDifference,
  primaryClassText
} from "./chunk-YHYDL5HF.js";
import {
  countOf,
  formatCount
} from "./chunk-ACAADDFF.js";

// src/core/report/review-summary.ts
function checklistSummary(items) {
  const held = items.filter((i) => i.done).length;
  return { count: `${formatCount(held)} of ${formatCount(items.length)} ${held === 1 ? "holds" : "hold"}`, failing: items.filter((i) => !i.done).map((i) => i.label) };
}
var NOUN = { block: ["blocking finding", "blocking findings"], warn: ["warning", "warnings"], note: ["note", "notes"] };
function countsSummary(review) {
  const { counts } = review;
  const introduced = ["block", "warn", "note"].filter((s) => counts[s] > 0).map((s) => countOf(counts[s], ...NOUN[s])).join(", ");
  const knownBlocking = review.findings.filter((f) => f.origin === "known" && f.severity === "block").length;
  const known = !counts.known ? "" : knownBlocking === counts.known ? countOf(knownBlocking, ...NOUN.block) : `${countOf(counts.known, "finding")}${knownBlocking ? `, ${formatCount(knownBlocking)} of them blocking` : ""}`;
  return { introduced, known };
}
var AT_BASE = "at the base";

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
function againstRule(r, style) {
  const flags = r.removes?.flags.map(style.code).join(", ");
  const said = [];
  let departs = false;
  if (r.recorded !== void 0 && r.recorded !== r.verdict) {
    said.push(`This change records ${style.strong(classLabel(r.recorded))} instead.`);
    departs = true;
  }
  if (r.removes) {
    const ships = r.ships.map((a) => style.strong(style.escape(a))).join(", ");
    if (r.removes.kept === void 0) {
      said.push(`This change removes ${flags}; could not tell which arm it keeps (${style.escape(r.removes.unknown ?? "no branch on the flag found")})${ships ? `: check that it ships ${ships}` : ""}.`);
      departs = true;
    } else if (!r.ships.includes(r.removes.kept)) {
      const rule = r.ships.length ? `the rule ships ${ships}` : "the readout gives no result to act on";
      said.push(`This change removes ${flags} and keeps ${style.strong(style.escape(r.removes.kept))}, but ${rule}.`);
      departs = true;
    }
  }
  if (departs) return said.join(" ");
  if (r.recorded === void 0 && !r.removes) return "This change records no class.";
  return "This change does that.";
}
function ruleAppliedLine(r, style) {
  const arms = r.arms.length && (r.primary?.arms.length ?? 0) > 1 ? ` (${r.arms.map(style.escape).join(", ")})` : "";
  const quote = r.decision !== void 0 ? `: \xAB${style.escape(r.decision)}\xBB` : r.verdict === "not-read" ? "" : " (the plan registers no decision for this)";
  return `Rule applied: ${style.strong(VERDICT_LABEL[r.verdict])}${arms}${quote}. ${againstRule(r, style)}`;
}
function ruleSourceLine(r, style) {
  const from = r.source === "latest" ? `Read from ${style.code(r.file)}, the latest totals of the test this change ends` : r.source === "changed" ? `Read from ${style.code(r.file)}, in this change` : `Read from ${style.code(r.file)}, named by the recorded outcome`;
  const rule = r.rule;
  if (!rule) return `${from}.`;
  const at = style.code(rule.commit);
  switch (rule.status) {
    case "same":
      return `${from}; the rule as registered at launch (${at}).`;
    case "amended":
      return `${from}; the rule as amended after launch (${at}): ${rule.amendments.map((a) => `${style.escape(a.date)}, \xAB${style.escape(a.changed)}\xBB`).join("; ")}.`;
    case "changed":
      return `${from}; the rule as registered at launch (${at}): the plan was changed since without an amendment (${rule.changes.map((c) => style.escape(c.field)).join(", ")}).`;
    case "unavailable":
      return `${from}; today's plan, because the plan at ${at} cannot be read (${style.escape(rule.why)}).`;
  }
}
function readoutSectionMarkdown(plan) {
  const r = plan.readout;
  if (!r) return [];
  const lines = ["", ruleAppliedLine(r, MARKDOWN_STYLE), "", `<sub>${ruleSourceLine(r, MARKDOWN_STYLE)}</sub>`];
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
  countsSummary,
  AT_BASE,
  planChangeTable,
  planChangeLines,
  ruleAppliedLine,
  ruleSourceLine,
  readoutSectionMarkdown,
  overrideLines
};
