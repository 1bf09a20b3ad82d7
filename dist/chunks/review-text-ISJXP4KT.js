#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  terminalSafe,
  terminalStyle
} from "./chunk-D7CL2H7J.js";
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
    "nothing-to-check": style.green("nothing to check")
  }[review.verdict];
  const n = (count, noun) => `${count} ${noun}${count === 1 ? "" : "s"}`;
  out.push(`${style.bold("Plumbline")}: ${verdict} (${review.counts.block} blocking, ${n(review.counts.warn, "warning")}, ${n(review.counts.note, "note")}) for ${review.base.slice(0, 7)}...${review.head.slice(0, 7)}`);
  if (review.verdict === "nothing-to-check") {
    out.push("This change touches no feature flag and no plan, and removes no event a running test depends on.");
    return out.join("\n");
  }
  for (const f of review.findings) {
    const at = f.file ? `${f.file}${f.line ? `:${f.line}` : ""}: ` : "";
    out.push(`${at}${paint(f.severity, LABEL[f.severity])} ${f.code}${f.plan ? ` [${f.plan}]` : ""}: ${terminalSafe(f.message)}`);
    out.push(`    fix: ${terminalSafe(f.fix)}`);
  }
  for (const plan of review.plans) {
    out.push("", `${style.bold(`Plan ${plan.id}`)} (${plan.state}, ${terminalSafe(plan.owners.join(", "))}) ${plan.file}:${plan.line}`);
    for (const item of plan.checklist) out.push(`  [${item.done ? style.green("x") : style.red(" ")}] ${item.label}`);
    const primary = plan.sizing.metrics[0];
    if (primary?.result.ok && primary.result.value.headline) {
      const h = primary.result.value.headline;
      const end = primary.result.value.atPlannedEnd;
      out.push(
        `  sizing: ${h.totalUnits.toLocaleString("en-US")} units${h.duration ? `, ${h.duration.days} days (${h.duration.weeks} weeks)` : ""}${end?.power !== void 0 ? `, ${(end.power * 100).toFixed(1)}% power by the planned end` : ""}; details: plumbline size ${plan.id}`
      );
    }
    const missing = plan.events.filter((e) => !e.location).map((e) => e.event);
    out.push(`  events: ${plan.events.length - missing.length} of ${plan.events.length} logged${missing.length ? ` (missing: ${terminalSafe(missing.join(", "))})` : ""}`);
  }
  return out.join("\n");
}
export {
  renderReviewText
};
