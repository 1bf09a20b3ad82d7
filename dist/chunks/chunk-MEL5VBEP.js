#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  renderSizingMarkdown
} from "./chunk-FZSY7OIF.js";

// src/core/report/markdown-safe.ts
function safeText(text) {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/@(?=[A-Za-z0-9_-])/g, "@\u200B").replace(/\r?\n/g, " ");
}
function safeCell(text) {
  return safeText(text).replace(/\|/g, "\\|");
}
function codeSpan(text) {
  const clean = text.replace(/\r?\n/g, " ");
  const longest = Math.max(0, ...[...clean.matchAll(/`+/g)].map((m) => m[0].length));
  const fence = "`".repeat(longest + 1);
  const pad = clean.startsWith("`") || clean.endsWith("`") ? " " : "";
  return `${fence}${pad}${clean}${pad}${fence}`;
}

// src/core/report/review-markdown.ts
var REVIEW_MARKER = "<!-- plumbline:review -->";
var COMMENT_LIMIT = 65536;
var ICON = { block: "\u26D4", warn: "\u26A0\uFE0F", note: "\u2139\uFE0F" };
var HEADLINE = {
  blocked: "\u26D4 Plumbline: blocked",
  warnings: "\u26A0\uFE0F Plumbline: passes, with warnings",
  clear: "\u2705 Plumbline: all clear",
  "nothing-to-check": "\u2705 Plumbline: nothing to check"
};
function plural(n, noun) {
  return `${n} ${noun}${n === 1 ? "" : "s"}`;
}
function where(path, line, options) {
  if (!path) return "";
  const label = codeSpan(`${path}${line ? `:${line}` : ""}`);
  return options.link ? `[${label}](${options.link(path, line ?? 1)})` : label;
}
function findingLine(f, options) {
  const plan = f.plan ? ` \xB7 ${codeSpan(f.plan)}` : "";
  const at = f.file ? ` \xB7 ${where(f.file, f.line, options)}` : "";
  return `- ${ICON[f.severity]} **${f.code}**${plan}${at}: ${safeText(f.message)} _Fix:_ ${safeText(f.fix)}`;
}
function verdictLine(review) {
  if (review.verdict === "nothing-to-check") return `### ${HEADLINE[review.verdict]}`;
  const parts = [
    review.counts.block ? plural(review.counts.block, "blocking finding") : "",
    review.counts.warn ? plural(review.counts.warn, "warning") : "",
    review.counts.note ? plural(review.counts.note, "note") : ""
  ].filter(Boolean);
  return `### ${HEADLINE[review.verdict]}${parts.length ? ` \u2014 ${parts.join(", ")}` : ""}`;
}
function planSection(plan, options, detail) {
  const lines = [
    `#### Plan ${codeSpan(plan.id)}: ${safeText(plan.title)}`,
    `${safeText(plan.state)} \xB7 ${plan.owners.map(safeText).join(", ")} \xB7 ${where(plan.file, plan.line, options)} \xB7 linked because: ${plan.reasons.join(", ")}`,
    "",
    ...plan.checklist.map((item) => `- [${item.done ? "x" : " "}] ${item.label}`)
  ];
  if (!detail.planDetails) return lines;
  const sizing = renderSizingMarkdown(plan.sizing, { title: "Sizing", designLine: "", window: plan.window, power: plan.power }).split("\n").filter((l) => !l.startsWith("### "));
  const body = detail.charts ? sizing : cutChart(sizing);
  const found = plan.events.filter((e) => e.location).length;
  lines.push(
    "",
    "<details><summary>Sizing: units, days and power</summary>",
    "",
    ...body,
    "</details>",
    "",
    `<details><summary>Events: ${found} of ${plan.events.length} logged in the code</summary>`,
    "",
    "| event | used for | first logged at |",
    "| --- | --- | --- |",
    ...plan.events.map((e) => `| ${codeSpan(e.event)} | ${safeCell(e.roles.join(", "))} | ${e.location ? `${where(e.location.file, e.location.line, options)}${e.via === "literal" ? " (as a string, not in a logging call)" : ""}` : "**missing**"} |`),
    "",
    "</details>"
  );
  return lines;
}
function cutChart(lines) {
  const start = lines.findIndex((l) => l.startsWith("<details><summary>Power by day"));
  return start < 0 ? lines : lines.slice(0, start);
}
function render(review, options, detail, omitted) {
  const out = [REVIEW_MARKER, verdictLine(review), `<sub>Compared ${review.base.slice(0, 7)}\u2026${review.head.slice(0, 7)}</sub>`, ""];
  if (review.verdict === "nothing-to-check") {
    out.push("This change touches no feature flag and no plan, and removes no event a running test depends on.");
    return out.join("\n");
  }
  if (review.findings.length) {
    out.push("#### Findings", "", ...review.findings.slice(0, detail.findingsShown).map((f) => findingLine(f, options)));
    const hidden = review.findings.length - detail.findingsShown;
    if (hidden > 0) out.push(`- \u2026 and ${plural(hidden, "more finding")}${options.fullReport ? ` in ${options.fullReport}` : ""}.`);
    out.push("");
  }
  for (const plan of review.plans) out.push(...planSection(plan, options, detail), "");
  if (review.nudge) {
    out.push(
      "#### A small check test for this fix?",
      "",
      "A fix can fail to fix, or quietly cost latency or errors elsewhere. Behind a flag, half the traffic gets it first and a guardrail shows within days whether it made things worse; a kill switch is there if it did.",
      ...review.nudge.sizingLine ? ["", safeText(review.nudge.sizingLine)] : [],
      "",
      "<details><summary>A plan to paste into experiments/ (edit the placeholders)</summary>",
      "",
      "```yaml",
      review.nudge.planStub.replace(/```/g, "'''"),
      "```",
      "",
      "</details>",
      ""
    );
  }
  if (review.collisions.length) {
    out.push(
      "#### Running tests on the same surface",
      "",
      "| plan | overlaps | owners | their surface | days together | platforms | locales | traffic in both |",
      "| --- | --- | --- | --- | --- | --- | --- | --- |",
      ...review.collisions.map(
        (c) => `| ${codeSpan(c.plan)} | ${codeSpan(c.other)}${c.known ? " (declared)" : ""} | ${safeCell(c.owners.join(", "))} | ${codeSpan(c.otherSurface)} | ${c.overlapDays ?? "unknown"} | ${safeCell(c.platforms === "all" ? "all" : c.platforms.join(", "))} | ${safeCell(c.locales === "all" ? "all" : c.locales.join(", "))} | ${Math.round(c.trafficShare * 100)}% |`
      ),
      ""
    );
  }
  if (review.flags.length) {
    const shown = review.flags.slice(0, detail.planDetails ? 50 : 10);
    out.push(
      "<details><summary>Feature flags this change touches</summary>",
      "",
      "| flag | where | how | plans |",
      "| --- | --- | --- | --- |",
      ...shown.map((f) => `| ${codeSpan(f.key)} | ${where(f.file, f.line, options)} (${f.side}) | ${f.via} | ${f.exempt ? "exempt" : f.plans.length ? f.plans.map(codeSpan).join(", ") : "**none**"} |`),
      ...review.flags.length > shown.length ? [``, `\u2026and ${review.flags.length - shown.length} more.`] : [],
      "",
      "</details>",
      ""
    );
  }
  if (omitted.length) out.push(`<sub>To fit GitHub's comment size limit, this comment leaves out ${omitted.join(", ")}${options.fullReport ? `; the full report is in ${options.fullReport}` : ""}.</sub>`);
  return out.join("\n").replace(/\n{3,}/g, "\n\n");
}
function renderReviewMarkdown(review, options = {}, limit = COMMENT_LIMIT) {
  const steps = [
    [{ charts: true, planDetails: true, findingsShown: review.findings.length }, []],
    [{ charts: false, planDetails: true, findingsShown: review.findings.length }, ["the power charts"]],
    [{ charts: false, planDetails: false, findingsShown: review.findings.length }, ["the power charts", "the sizing and events tables"]]
  ];
  for (const [detail, omitted] of steps) {
    const body = render(review, options, detail, omitted);
    if (body.length <= limit) return body;
  }
  for (let shown = Math.min(review.findings.length, 200); shown >= 0; shown = shown > 20 ? Math.floor(shown / 2) : shown - 1) {
    const body = render(review, options, { charts: false, planDetails: false, findingsShown: shown }, ["the power charts", "the sizing and events tables", "some findings"]);
    if (body.length <= limit) return body;
  }
  return `${REVIEW_MARKER}
${verdictLine(review)}

The full review does not fit in a comment${options.fullReport ? `; see ${options.fullReport}` : ""}.`;
}

export {
  safeText,
  codeSpan,
  REVIEW_MARKER,
  COMMENT_LIMIT,
  renderReviewMarkdown
};
