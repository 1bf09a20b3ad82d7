#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatTable
} from "./chunk-D7CL2H7J.js";
import {
  formatCount,
  formatMultiplier,
  formatPower,
  formatRate,
  formatRelative,
  formatValue
} from "./chunk-AAUUFJV7.js";

// src/core/report/sizing.ts
var SIZING_JSON_FORMAT = "plumbline.sizing/1";
function valueText(entry, value) {
  return entry.kind === "proportion" ? formatRate(value) : formatValue(value);
}
function describeChange(entry, change, from) {
  const absolute = entry.kind === "proportion" ? `${change.absolute >= 0 ? "+" : "-"}${Math.abs(change.absolute * 100).toPrecision(2)} pp` : `${change.absolute >= 0 ? "+" : "-"}${formatValue(Math.abs(change.absolute))}`;
  return `${valueText(entry, from)} \u2192 ${valueText(entry, change.to)} (${formatRelative(change.relative)} relative, ${absolute})`;
}
function sizeCells(size) {
  if (!size) return ["", "", "", ""];
  const perArm = new Set(size.perArm.map((a) => a.units)).size === 1 ? formatCount(size.perArm[0].units) : size.perArm.map((a) => formatCount(a.units)).join(" / ");
  return [perArm, formatCount(size.totalUnits), size.duration ? String(size.duration.days) : "", size.duration ? String(size.duration.weeks) : ""];
}
function rows(sizing) {
  return sizing.metrics.map((entry) => {
    const role = entry.role === "guardrail" ? `guardrail (harm, ${entry.sides}-sided)` : `primary (${entry.sides}-sided)`;
    if (!entry.result.ok) return { entry, cells: [entry.metric, role, `cannot size: ${entry.result.error.input}: ${entry.result.error.message}`, "", "", "", "", "", ""] };
    const s = entry.result.value;
    const effect = s.effect ? describeChange(entry, s.effect, s.baselineValue) : "no effect given";
    const end = s.atPlannedEnd;
    const detectable = end?.detectable ? describeChange(entry, end.detectable, s.baselineValue) : "";
    return { entry, cells: [entry.metric, role, effect, ...sizeCells(s.headline), end?.power !== void 0 ? formatPower(end.power) : "", detectable] };
  });
}
var HEADER = ["METRIC", "ROLE", "EFFECT TO DETECT", "UNITS/ARM", "TOTAL", "DAYS", "WEEKS", "POWER AT END", "DETECTABLE BY END"];
function multiplierNotes(entry, sizing) {
  const m = sizing.multipliers;
  const out = [];
  if (m.comparisons > 1) out.push(`${m.comparisons} treatment arms against one control: \u03B1 ${formatValue(m.alphaPerComparison)} per comparison (Bonferroni).`);
  if (m.designEffect > 1) out.push(`Groups are randomized: design effect ${formatMultiplier(m.designEffect)} on units${sizing.headline?.clusters !== void 0 ? `, ${formatCount(sizing.headline.clusters)} groups in all` : ""}.`);
  if (m.varianceReduction < 1) out.push(`Pre-period adjustment (CUPED): ${formatMultiplier(m.varianceReduction)} on units.`);
  if (sizing.boundaries) {
    const z = sizing.boundaries.z.map((v) => v.toFixed(3)).join(", ");
    const p = sizing.boundaries.nominalP.map((v) => v < 1e-3 ? v.toExponential(1) : v.toFixed(4)).join(", ");
    out.push(`Interim looks (${sizing.boundaries.kind}, ${sizing.boundaries.z.length} analyses): maximum sample ${formatMultiplier(m.sequential)} to keep the planned power; stop at |z| \u2265 ${z} (nominal p ${p}).`);
  }
  if (sizing.diluted && sizing.triggered) {
    const triggeredDays = sizing.triggered.duration ? ` (${sizing.triggered.duration.days} days)` : "";
    out.push(
      `Exposure is logged before the change is reached: the analysis of all exposed units needs ${formatMultiplier(m.dilutionUnits)} the units and ${formatMultiplier(m.dilutionDays)} the days of an analysis of reached units${triggeredDays}; log exposure where the change is seen to save the difference.`
    );
  }
  return out.map((text) => `${entry.metric}: ${text}`);
}
function notesOf(sizing) {
  return sizing.metrics.flatMap((entry) => entry.result.ok ? [...multiplierNotes(entry, entry.result.value), ...entry.result.value.notes.map((n) => `${entry.metric}: ${n}`)] : []);
}
function windowLine(sizing, context) {
  if (sizing.plannedDays !== void 0) {
    const dates = context.window?.start && context.window.end ? ` (${context.window.start} to ${context.window.end})` : "";
    return `Planned window: ${sizing.plannedDays} days${dates}.`;
  }
  return "Planned window: not set, so power and detectable effect at the end are not computed.";
}
function renderSizingText(sizing, context) {
  const table = formatTable(HEADER, rows(sizing).map((r) => r.cells));
  const traffic = sizing.dailyUnits === void 0 ? "No daily-units given, so no durations." : "";
  const notes = notesOf(sizing);
  return [
    context.title,
    context.designLine,
    windowLine(sizing, context),
    ...traffic ? [traffic] : [],
    "",
    table,
    ...notes.length ? ["", ...notes.map((n) => `- ${n}`)] : []
  ].join("\n");
}
function mermaidPowerChart(entry, sizing, target) {
  const points = sizing.powerByDay;
  if (!points || points.length < 3 || points[0].power > 0.99) return void 0;
  const days = points.map((p) => p.day).join(", ");
  const power = points.map((p) => (p.power * 100).toFixed(1)).join(", ");
  const goal = points.map(() => (target * 100).toFixed(0)).join(", ");
  return [
    "```mermaid",
    "xychart-beta",
    `  title "Power by day: ${entry.metric}"`,
    `  x-axis "day" [${days}]`,
    '  y-axis "power (%)" 0 --> 100',
    `  line [${power}]`,
    `  line [${goal}]`,
    "```"
  ].join("\n");
}
function markdownCell(text) {
  return text.replace(/\|/g, "\\|");
}
function renderSizingMarkdown(sizing, context) {
  const table = [
    `| ${HEADER.map((h) => h.toLowerCase()).join(" | ")} |`,
    `| ${HEADER.map(() => "---").join(" | ")} |`,
    ...rows(sizing).map((r) => `| ${r.cells.map(markdownCell).join(" | ")} |`)
  ];
  const primary = sizing.metrics.find((m) => m.role === "primary");
  const chart = primary?.result.ok ? mermaidPowerChart(primary, primary.result.value, context.power) : void 0;
  const notes = notesOf(sizing);
  return [
    `### ${context.title}`,
    "",
    [context.designLine, windowLine(sizing, context)].filter(Boolean).join(" "),
    "",
    ...table,
    ...notes.length ? ["", ...notes.map((n) => `- ${n}`)] : [],
    ...chart ? ["", `<details><summary>Power by day (the flat line is the planned ${(context.power * 100).toFixed(0)}%)</summary>`, "", chart, "", "</details>"] : [],
    ""
  ].join("\n");
}
function sizingJson(sizing, context) {
  return { format: SIZING_JSON_FORMAT, title: context.title, design: context.designLine, ...sizing };
}
function designSummary(design) {
  const arms = `${design.arms.length} arms (${design.arms.map((a) => `${a.name} ${formatValue(a.weight)}`).join(", ")})`;
  const test = `\u03B1 ${formatValue(design.alpha)} ${design.sides === 2 ? "two-sided" : "one-sided"}, power ${formatValue(design.power * 100)}%`;
  const traffic = design.dailyUnits === void 0 ? "" : `, ${formatCount(design.dailyUnits)} eligible units a day, ${formatValue(design.trafficShare * 100)}% of them enrolled${design.reach < 1 ? `, ${formatValue(design.reach * 100)}% of exposed units reach the change` : ""}`;
  return `${arms}, ${test}${traffic}.`;
}

export {
  SIZING_JSON_FORMAT,
  describeChange,
  multiplierNotes,
  renderSizingText,
  renderSizingMarkdown,
  sizingJson,
  designSummary
};
