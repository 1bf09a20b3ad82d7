#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  COMMENT_LIMIT
} from "./chunk-J4PRLTV7.js";
import {
  codeSpan,
  safeText
} from "./chunk-7H6MHGDI.js";
import {
  terminalSafe
} from "./chunk-D7CL2H7J.js";
import {
  countOf,
  formatCount
} from "./chunk-ACAADDFF.js";

// src/core/report/digest-markdown.ts
var DIGEST_MARKER = "<!-- plumbline:digest -->";
var DIGEST_START = "<!-- plumbline:digest:start -->";
var DIGEST_END = "<!-- plumbline:digest:end -->";
var TIMELINE_LIMIT = 40;
var LABEL = {
  overdue: "\u23F0 past its end",
  "flag-gone": "\u{1F9F9} flag gone from the code",
  collision: "\u{1F4A5} collides",
  "draft-past-start": "\u{1F4DD} draft past its start",
  "long-on-hold": "\u23F8\uFE0F on hold too long",
  "ending-soon": "\u{1F4C5} ending soon",
  "outcome-missing": "\u{1F4CB} no outcome recorded",
  "concluded-flag-in-code": "\u{1F9F9} concluded, flag still in the code"
};
var READOUT_DUE = "\u{1F4CA} readout due";
function countLine(d) {
  const c = d.counts;
  const parts = [
    c.overdue ? `${formatCount(c.overdue)} past ${c.overdue === 1 ? "its" : "their"} planned end` : "",
    c["ending-soon"] ? `${formatCount(c["ending-soon"])} ending soon` : "",
    c["draft-past-start"] ? `${countOf(c["draft-past-start"], "draft")} past ${c["draft-past-start"] === 1 ? "its" : "their"} start` : "",
    c["long-on-hold"] ? `${formatCount(c["long-on-hold"])} on hold too long` : "",
    c.collision ? countOf(c.collision, "collision") : "",
    c["flag-gone"] ? `${countOf(c["flag-gone"], "live test")} with ${c["flag-gone"] === 1 ? "its flag" : "their flags"} gone` : "",
    c.orphanFlags ? `${countOf(c.orphanFlags, "flag")} in code without a plan` : ""
  ].filter(Boolean);
  const registry = [c.live ? `${formatCount(c.live)} live` : "", c.planned ? countOf(c.planned, "draft") : ""].filter(Boolean).join(", ") || "no live tests or drafts";
  return `${parts.length ? parts.join(" \xB7 ") : "nothing needs attention"} \u2014 ${registry}`;
}
function ownersOf(owners, mentioned) {
  return owners.map((owner) => {
    const handle = /^@[A-Za-z0-9][\w./-]*$/.test(owner);
    if (!handle || mentioned.has(owner.toLowerCase())) return safeText(owner);
    mentioned.add(owner.toLowerCase());
    return owner;
  }).join(", ");
}
function taskName(id) {
  return id.replace(/[:#;]/g, "-");
}
function gantt(d) {
  const shown = d.timeline.slice(0, TIMELINE_LIMIT);
  const lines = ["```mermaid", "gantt", "  title Live and planned tests by surface", "  dateFormat YYYY-MM-DD", `  todayMarker stroke-width:3px`];
  let section = "";
  shown.forEach((t, i) => {
    const area = t.surface.split("/")[0];
    if (area !== section) {
      section = area;
      lines.push(`  section ${taskName(area)}`);
    }
    const tag = t.overdue ? "crit, " : t.state === "live" ? "active, " : "";
    lines.push(`  ${taskName(t.id)} :${tag}t${i}, ${t.start}, ${t.end}`);
  });
  lines.push("```");
  if (d.timeline.length > shown.length) lines.push("", `${countOf(d.timeline.length - shown.length, "more test")} ${d.timeline.length - shown.length === 1 ? "is" : "are"} not drawn (the list above has them all).`);
  return lines;
}
function render(d, withTimeline, maxTests) {
  const out = [DIGEST_MARKER, DIGEST_START, `## Plumbline weekly digest, ${d.today}`, "", `**${countLine(d)}**`, ""];
  if (d.tests.length === 0 && d.orphanFlags.length === 0) out.push("Nothing needs attention this week.", "");
  const mentioned = /* @__PURE__ */ new Set();
  for (const test of d.tests.slice(0, maxTests)) {
    out.push(`- **${codeSpan(test.id)}** ${safeText(test.title)} \xB7 ${ownersOf(test.owners, mentioned)} \xB7 ${codeSpan(`${test.file}:${test.line}`)}`);
    for (const it of test.items) out.push(`  - ${it.readoutDue ? READOUT_DUE : LABEL[it.kind]}: ${safeText(it.detail)}`);
  }
  if (d.tests.length > maxTests) out.push(`- \u2026and ${countOf(d.tests.length - maxTests, "more test")} (see the JSON report).`);
  if (d.tests.length) out.push("");
  if (d.orphanFlags.length) {
    out.push("### Flags in code that no plan covers", "", ...d.orphanFlags.slice(0, 50).map((f) => `- ${codeSpan(f.key)} at ${codeSpan(`${f.location.file}:${f.location.line}`)}`));
    if (d.orphanFlags.length > 50) out.push(`- \u2026and ${formatCount(d.orphanFlags.length - 50)} more.`);
    out.push("", "Write a plan for each, or list kill switches and operational toggles under exempt-flags.", "");
  }
  if (withTimeline && d.timeline.length) out.push("### Timeline", "", ...gantt(d), "");
  out.push(DIGEST_END);
  return out.join("\n");
}
function renderDigestMarkdown(d, limit = COMMENT_LIMIT - 2e3) {
  for (const [timeline, tests] of [[true, Infinity], [false, Infinity], [false, 100], [false, 20], [false, 5]]) {
    const body = render(d, timeline, tests);
    if (body.length <= limit) return body;
  }
  return [DIGEST_MARKER, DIGEST_START, `## Plumbline weekly digest, ${d.today}`, "", `**${countLine(d)}**`, "", "The full list is too long for an issue; see the JSON report.", DIGEST_END].join("\n");
}
function mergeDigestBody(existing, block) {
  if (!existing) return block;
  const start = existing.indexOf(DIGEST_START);
  const end = existing.indexOf(DIGEST_END);
  if (start < 0 || end < start) return `${block}

${existing}`;
  const before = existing.slice(0, start).replace(DIGEST_MARKER, "").replace(/\s+$/, "");
  const after = existing.slice(end + DIGEST_END.length);
  const blockBody = block.slice(block.indexOf(DIGEST_START));
  return `${DIGEST_MARKER}
${before ? `${before}
` : ""}${blockBody}${after}`;
}
function renderDigestText(d) {
  const out = [`Plumbline digest for ${d.today}: ${countLine(d)}`];
  for (const test of d.tests) {
    out.push("", `${test.id} (${test.file}:${test.line}) ${terminalSafe(test.owners.join(", "))}`);
    for (const it of test.items) out.push(`  ${(it.readoutDue ? "readout-due" : it.kind).padEnd(16)} ${terminalSafe(it.detail)}`);
  }
  if (d.orphanFlags.length) {
    out.push("", "Flags in code that no plan covers:");
    for (const f of d.orphanFlags) out.push(`  ${terminalSafe(f.key)} at ${f.location.file}:${f.location.line}`);
  }
  return out.join("\n");
}
var DIGEST_JSON_FORMAT = "plumbline.digest/1";

export {
  DIGEST_MARKER,
  DIGEST_START,
  DIGEST_END,
  TIMELINE_LIMIT,
  countLine,
  renderDigestMarkdown,
  mergeDigestBody,
  renderDigestText,
  DIGEST_JSON_FORMAT
};
