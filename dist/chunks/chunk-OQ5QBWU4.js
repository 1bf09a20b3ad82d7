#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  COMMENT_LIMIT,
  codeSpan,
  safeText
} from "./chunk-MEL5VBEP.js";
import {
  terminalSafe
} from "./chunk-D7CL2H7J.js";

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
  "ending-soon": "\u{1F4C5} ending soon"
};
function countLine(d) {
  const c = d.counts;
  return `${c.overdue} past their planned end \xB7 ${c["ending-soon"]} ending soon \xB7 ${c["draft-past-start"]} drafts past their start \xB7 ${c["long-on-hold"]} on hold too long \xB7 ${c.collision} collisions \xB7 ${c["flag-gone"]} live with their flag gone \xB7 ${c.orphanFlags} flags in code without a plan \u2014 ${c.live} live, ${c.planned} drafts`;
}
function ownerHeading(owner) {
  return /^@[A-Za-z0-9][\w./-]*$/.test(owner) ? `### ${owner}` : `### ${safeText(owner)}`;
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
  if (d.timeline.length > shown.length) lines.push("", `${d.timeline.length - shown.length} more tests are not drawn (the list above has them all).`);
  return lines;
}
function render(d, withTimeline, itemsPerOwner) {
  const out = [DIGEST_MARKER, DIGEST_START, `## Plumbline weekly digest, ${d.today}`, "", `**${countLine(d)}**`, ""];
  if (d.owners.length === 0 && d.orphanFlags.length === 0) out.push("Nothing needs attention this week.", "");
  for (const { owner, items } of d.owners) {
    out.push(ownerHeading(owner), "");
    for (const it of items.slice(0, itemsPerOwner)) out.push(`- ${LABEL[it.kind]}: ${codeSpan(it.test)} ${safeText(it.title)} (${codeSpan(`${it.file}:${it.line}`)}). ${safeText(it.detail)}`);
    if (items.length > itemsPerOwner) out.push(`- \u2026and ${items.length - itemsPerOwner} more (see the JSON report).`);
    out.push("");
  }
  if (d.orphanFlags.length) {
    out.push("### Flags in code that no plan covers", "", ...d.orphanFlags.slice(0, 50).map((f) => `- ${codeSpan(f.key)} at ${codeSpan(`${f.location.file}:${f.location.line}`)}`));
    if (d.orphanFlags.length > 50) out.push(`- \u2026and ${d.orphanFlags.length - 50} more.`);
    out.push("", "Write a plan for each, or list kill switches and operational toggles under exempt-flags.", "");
  }
  if (withTimeline && d.timeline.length) out.push("### Timeline", "", ...gantt(d), "");
  out.push(DIGEST_END);
  return out.join("\n");
}
function renderDigestMarkdown(d, limit = COMMENT_LIMIT - 2e3) {
  for (const [timeline, per] of [[true, Infinity], [false, Infinity], [false, 20], [false, 5], [false, 1]]) {
    const body = render(d, timeline, per);
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
  for (const { owner, items } of d.owners) {
    out.push("", terminalSafe(owner));
    for (const it of items) out.push(`  ${it.kind.padEnd(16)} ${it.test} (${it.file}:${it.line}): ${terminalSafe(it.detail)}`);
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
