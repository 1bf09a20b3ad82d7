#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  AT_BASE,
  checklistSummary,
  countsSummary,
  overrideLines,
  planChangeTable,
  readoutSectionMarkdown
} from "./chunk-4JVBEDJS.js";
import {
  lengthSummary,
  renderSizingMarkdown
} from "./chunk-UDHHIPK7.js";
import {
  codeCell,
  codeSpan,
  inCell,
  linkTarget,
  safeCell,
  safeMessage,
  safeText,
  urlPath
} from "./chunk-7H6MHGDI.js";
import {
  countOf,
  formatCount
} from "./chunk-ACAADDFF.js";

// src/core/report/coverage-notice.ts
function coverageNotice(review) {
  const unseen = review.partial;
  if (!unseen) return [];
  const missed = unseen.changedFiles !== void 0 && unseen.changedFiles > unseen.reviewedFiles ? `; ${formatCount(unseen.changedFiles - unseen.reviewedFiles)} of its ${formatCount(unseen.changedFiles)} changed files were not reviewed` : "; the files past them were not reviewed";
  return [`> **Partial review.** ${unseen.reason}: this review read ${formatCount(unseen.reviewedFiles)} files${missed}, so it cannot say the change is clear.`, ""];
}

// src/core/report/review-markdown.ts
var REVIEW_MARKER = "<!-- plumbline:review -->";
var COMMENT_LIMIT = 65536;
var SUMMARY_LIMIT = 1024 * 1024;
var measureCharacters = (text) => text.length;
var encoder = new TextEncoder();
var measureBytes = (text) => encoder.encode(text).length;
var ICON = { block: "\u26D4", warn: "\u26A0\uFE0F", note: "\u2139\uFE0F" };
var HEADLINE = {
  blocked: "\u26D4 Plumbline: blocked",
  warnings: "\u26A0\uFE0F Plumbline: passes, with warnings",
  clear: "\u2705 Plumbline: all clear",
  "nothing-to-check": "\u2705 Plumbline: nothing to check",
  partial: "\u26A0\uFE0F Plumbline: partial review, nothing found in the files seen"
};
var atHead = (review) => ({ commit: review.head, base: false });
var atSide = (review, side) => side === "base" ? { commit: review.base, base: true } : atHead(review);
function where(path, line, at, options) {
  if (!path) return "";
  const label = codeSpan(`${path}${line ? `:${line}` : ""}`);
  const linked = options.repoUrl ? `[${label}](${linkTarget(`${options.repoUrl}/blob/${at.commit}/${urlPath(path)}#L${line ?? 1}`)})` : label;
  return at.base ? `${linked} (${AT_BASE})` : linked;
}
function findingLine(f, review, options) {
  const plan = f.plan ? ` \xB7 ${codeSpan(f.plan)}` : "";
  const at = f.file ? ` \xB7 ${where(f.file, f.line, atSide(review, f.side), options)}` : "";
  return `- ${ICON[f.severity]} **${f.code}**${plan}${at}: ${safeMessage(f.message)} _Fix:_ ${safeMessage(f.fix)}${planChangeTable(f)}`;
}
function headline(review) {
  const first = review.findings.find((f) => f.severity === "block") ?? review.findings.find((f) => f.severity === "warn");
  const todo = review.verdict === "blocked" || review.verdict === "warnings" ? first ? ` \u2014 first: ${safeMessage(first.fix)}` : "" : "";
  return `### ${HEADLINE[review.verdict]}${todo}`;
}
function countsLine(review) {
  const { introduced, known } = countsSummary(review);
  const parts = [introduced ? `This change: ${introduced}.` : known ? "Nothing new from this change." : ""];
  if (known) parts.push(`Already known before it: ${known}.`);
  parts.push(`<sub>Compared ${review.base.slice(0, 7)}\u2026${review.head.slice(0, 7)}</sub>`);
  return parts.filter(Boolean).join(" ");
}
function planSection(plan, review, options, detail, withTables) {
  const checklist = checklistSummary(plan.checklist);
  const length = lengthSummary(plan.sizing);
  const found = plan.events.filter((e) => e.location).length;
  const lines = [
    `#### Plan ${codeSpan(plan.id)}: ${safeText(plan.title)}`,
    `${safeText(plan.state)} \xB7 ${plan.owners.map(safeText).join(", ")} \xB7 ${where(plan.file, plan.line, atHead(review), options)} \xB7 linked because: ${plan.reasons.join(", ")}`,
    `**${checklist.count}.**${checklist.failing.length ? ` Not yet: ${checklist.failing.map((l) => safeText(l)).join("; ")}.` : ""}`
  ];
  const readout = readoutSectionMarkdown(plan);
  lines.push(...readout, ...readout.length && length ? [""] : []);
  if (length) lines.push(`**Length:** ${safeText(length.length)}.${length.power ? ` **Power:** ${safeText(length.power)}.` : ""} **Events:** ${formatCount(found)} of ${formatCount(plan.events.length)} logged in the code.`);
  if (!withTables) return lines;
  const sizing = renderSizingMarkdown(plan.sizing, { title: "Sizing", designLine: "", window: plan.window, power: plan.power }).split("\n").filter((l) => !l.startsWith("### "));
  lines.push(
    "",
    "<details><summary>Sizing and events</summary>",
    "",
    ...detail.charts ? sizing : cutChart(sizing),
    "| event | used for | first logged at |",
    "| --- | --- | --- |",
    ...plan.events.map(
      (e) => `| ${codeCell(e.event)} | ${safeCell(e.roles.join(", "))} | ${e.location ? `${inCell(where(e.location.file, e.location.line, atHead(review), options))}${e.via === "literal" ? " (as a string, not in a logging call)" : ""}` : "**missing**"} |`
    ),
    "",
    "</details>"
  );
  return lines;
}
function cutChart(lines) {
  const start = lines.findIndex((l) => l.startsWith("<details><summary>Power by day"));
  return start < 0 ? lines : [...lines.slice(0, start), ""];
}
function hasChart(review) {
  return review.plans.some((p) => renderSizingMarkdown(p.sizing, { title: "", designLine: "", window: p.window, power: p.power }).includes("<summary>Power by day"));
}
function findingsSection(review, options, shown) {
  const listed = review.findings.slice(0, shown);
  const introduced = listed.filter((f) => f.origin === "introduced");
  const knownBlocking = listed.filter((f) => f.origin === "known" && f.severity === "block");
  const knownRest = listed.filter((f) => f.origin === "known" && f.severity !== "block");
  const out = [];
  if (introduced.length) out.push("#### Introduced by this change", "", ...introduced.map((f) => findingLine(f, review, options)), "");
  if (knownBlocking.length) out.push("#### Still blocking from before this change", "", ...knownBlocking.map((f) => findingLine(f, review, options)), "");
  if (knownRest.length) {
    out.push(`<details><summary>Already known: ${countOf(knownRest.length, "finding")} that held before this change</summary>`, "", ...knownRest.map((f) => findingLine(f, review, options)), "", "</details>", "");
  }
  return out;
}
function render(review, options, detail, omitted) {
  const overrides = overrideLines(review.plans);
  const out = [REVIEW_MARKER, headline(review), ...overrides.length ? ["", ...overrides, ""] : [], countsLine(review), ""];
  out.push(...coverageNotice(review));
  if (review.verdict === "nothing-to-check") {
    out.push("This change touches no feature flag and no plan, and removes no event a running test depends on.");
    return out.join("\n");
  }
  out.push(...findingsSection(review, options, detail.findingsShown));
  review.plans.slice(0, detail.plansShown).forEach((plan, i) => out.push(...planSection(plan, review, options, detail, i < detail.tablesFor), ""));
  if (review.nudge) {
    out.push(
      "#### A small check test for this fix?",
      "",
      ...review.nudge.twoWeeksLine ? [safeText(review.nudge.twoWeeksLine), ""] : [],
      "A fix can fail to fix, or quietly cost latency or errors elsewhere. Behind a flag, half the traffic gets it first and a guardrail shows within days whether it made things worse; a kill switch is there if it did.",
      "",
      "<details><summary>Sizing, and a plan to paste into experiments/ (edit the placeholders)</summary>",
      "",
      ...review.nudge.sizingLine ? [safeMessage(review.nudge.sizingLine), ""] : [],
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
      `<details><summary>Running tests on the same surface: ${countOf(review.collisions.length, "overlap")}</summary>`,
      "",
      "| plan | overlaps | owners | their surface | days together | platforms | locales | traffic in both |",
      "| --- | --- | --- | --- | --- | --- | --- | --- |",
      ...review.collisions.map(
        (c) => `| ${codeCell(c.plan)} | ${codeCell(c.other)}${c.known ? " (declared)" : ""} | ${safeCell(c.owners.join(", "))} | ${codeCell(c.otherSurface)} | ${c.overlapDays !== void 0 ? formatCount(c.overlapDays) : "unknown"} | ${safeCell(c.platforms === "all" ? "all" : c.platforms.join(", "))} | ${safeCell(c.locales === "all" ? "all" : c.locales.join(", "))} | ${Math.round(c.trafficShare * 100)}% |`
      ),
      "",
      "</details>",
      ""
    );
  }
  if (review.flags.length && detail.flagsShown > 0) {
    const shown = review.flags.slice(0, detail.flagsShown);
    out.push(
      `<details><summary>Feature flags this change touches: ${formatCount(review.flags.length)}</summary>`,
      "",
      "| flag | where | how | plans |",
      "| --- | --- | --- | --- |",
      ...shown.map(
        (f) => `| ${codeCell(f.key)} | ${f.side === "removed" ? `${inCell(where(f.file, f.line, { commit: review.base, base: false }, options))} (removed, ${AT_BASE})` : `${inCell(where(f.file, f.line, atHead(review), options))} (added)`} | ${safeCell(f.via)} | ${f.exempt ? "exempt" : f.plans.length ? f.plans.map(codeCell).join(", ") : "**none**"} |`
      ),
      "",
      "</details>",
      ""
    );
  }
  if (omitted.length) {
    const list = omitted.length > 1 ? `${omitted.slice(0, -1).join(", ")} and ${omitted.at(-1)}` : omitted[0];
    out.push(`<sub>Left out to fit ${options.limitName ?? "GitHub's comment size limit"}: ${list}${options.fullReport ? `. They are in ${options.fullReport}` : ""}.</sub>`);
  }
  return out.join("\n").replace(/\n{3,}/g, "\n\n");
}
function omissions(review, detail, charts) {
  const out = [];
  if (!detail.charts && charts && detail.tablesFor > 0) out.push("the power charts");
  const withoutTables = Math.min(detail.plansShown, review.plans.length) - Math.min(detail.tablesFor, detail.plansShown);
  if (withoutTables > 0) out.push(`the sizing and events tables of ${countOf(withoutTables, "plan")}`);
  const hiddenPlans = review.plans.length - Math.min(detail.plansShown, review.plans.length);
  if (hiddenPlans > 0) out.push(`the sections of ${countOf(hiddenPlans, "more plan")}`);
  const hiddenFlags = review.flags.length - Math.min(detail.flagsShown, review.flags.length);
  if (hiddenFlags > 0) out.push(`${countOf(hiddenFlags, "row")} of the flags table`);
  const hiddenFindings = review.findings.length - Math.min(detail.findingsShown, review.findings.length);
  if (hiddenFindings > 0) out.push(countOf(hiddenFindings, "finding"));
  return out;
}
function halving(n) {
  const out = [];
  for (let k = n; k > 0; k = k > 8 ? Math.floor(k / 2) : k - 1) out.push(k);
  return [...out, 0];
}
function renderReviewMarkdown(review, options = {}, limit = COMMENT_LIMIT, measure = measureCharacters) {
  const plans = review.plans.length;
  const findings = review.findings.length;
  const charts = hasChart(review);
  const attempt = (detail) => {
    const body = render(review, options, detail, omissions(review, detail, charts));
    return measure(body) <= limit ? body : void 0;
  };
  const full = { charts: true, tablesFor: plans, findingsShown: findings, plansShown: plans, flagsShown: review.flags.length };
  const steps = [full, { ...full, charts: false }];
  for (const tablesFor of halving(plans).slice(1)) steps.push({ ...full, charts: false, tablesFor });
  const lean = { ...full, charts: false, tablesFor: 0 };
  for (const flagsShown of halving(review.flags.length).slice(1)) steps.push({ ...lean, flagsShown });
  for (const findingsShown of halving(findings).slice(1)) steps.push({ ...lean, flagsShown: 0, findingsShown });
  for (const plansShown of halving(plans).slice(1)) steps.push({ ...lean, flagsShown: 0, findingsShown: 0, plansShown });
  for (const detail of steps) {
    const body = attempt(detail);
    if (body !== void 0) return body;
  }
  return `${REVIEW_MARKER}
${headline(review)}

The review does not fit here${options.fullReport ? `; see ${options.fullReport}` : ""}.`;
}
function renderReviewSummary(review, options = {}) {
  return renderReviewMarkdown(review, { ...options, limitName: "GitHub's job summary size limit" }, SUMMARY_LIMIT, measureBytes);
}

export {
  REVIEW_MARKER,
  COMMENT_LIMIT,
  SUMMARY_LIMIT,
  measureCharacters,
  measureBytes,
  renderReviewMarkdown,
  renderReviewSummary
};
