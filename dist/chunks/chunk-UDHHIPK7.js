#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  safeCell,
  safeText
} from "./chunk-7H6MHGDI.js";
import {
  unitsAmount
} from "./chunk-6TRXKJK6.js";
import {
  formatTable
} from "./chunk-D7CL2H7J.js";
import {
  countOf,
  formatCount,
  formatMultiplier,
  formatPower,
  formatRate,
  formatRelative,
  formatValue
} from "./chunk-ACAADDFF.js";

// src/core/report/sizing.ts
var SIZING_JSON_FORMAT = "plumbline.sizing/1";
function valueText(entry, value) {
  return entry.kind === "proportion" ? formatRate(value) : formatValue(value);
}
function changeSize(kind, absolute) {
  const size = Math.abs(absolute);
  if (kind !== "proportion") return formatValue(size);
  const points = size * 100;
  return `${points !== 0 && points < 1e-3 ? points.toExponential(2) : Number(points.toPrecision(3)).toLocaleString("en-US", { maximumFractionDigits: 8 })} pp`;
}
function describeChange(entry, change, from) {
  const absolute = `${change.absolute >= 0 ? "+" : "-"}${changeSize(entry.kind, change.absolute)}`;
  return `${valueText(entry, from)} \u2192 ${valueText(entry, change.to)} (${formatRelative(change.relative)} relative, ${absolute})`;
}
function withArticle(text) {
  const lead = /^(\d{1,3})(?:,\d{3})*(?:\.\d+)?/.exec(text)?.[1];
  const an = lead !== void 0 && (lead.startsWith("8") || lead === "11" || lead === "18");
  return `${an ? "an" : "a"} ${text}`;
}
function noneDetectableCell(entry) {
  return entry.kind === "proportion" ? "none within 0\u2013100%" : "none";
}
function sizeCells(size) {
  if (!size) return ["", "", "", ""];
  const perArm = new Set(size.perArm.map((a) => a.units)).size === 1 ? formatCount(size.perArm[0].units) : size.perArm.map((a) => formatCount(a.units)).join(" / ");
  return [perArm, formatCount(size.totalUnits), size.duration ? formatCount(size.duration.days) : "", size.duration ? formatCount(size.duration.weeks) : ""];
}
function rows(sizing) {
  return sizing.metrics.map((entry) => {
    const role = entry.role === "guardrail" ? `guardrail (non-inferiority, \u03B1 ${formatValue(entry.alpha)} 1-sided)` : `primary (${entry.sides}-sided)`;
    if (!entry.result.ok) return { entry, cells: [entry.metric, role, `cannot size: ${entry.result.error.input}: ${entry.result.error.message}`, "", "", "", "", "", ""] };
    const s = entry.result.value;
    const effect = s.effect ? describeChange(entry, s.effect, s.baselineValue) : "no effect given";
    const end = s.atPlannedEnd;
    const detectable = end?.detectable ? describeChange(entry, end.detectable, s.baselineValue) : end?.noneDetectable ? noneDetectableCell(entry) : "";
    const power = end?.power !== void 0 ? formatPower(end.power) : end?.noPower ? "unknown" : "";
    return { entry, cells: [entry.metric, role, effect, ...sizeCells(s.headline), power, detectable] };
  });
}
var HEADER = ["METRIC", "ROLE", "EFFECT TO DETECT", "UNITS/ARM", "TOTAL", "DAYS", "WEEKS", "POWER AT END", "DETECTABLE BY END"];
function multiplierNotes(entry, sizing) {
  const m = sizing.multipliers;
  const out = [];
  if (sizing.traffic?.kind === "unique" && entry.role === "primary") {
    const [a, b] = sizing.traffic.points;
    out.push(`Traffic as people arrive: ${formatCount(a.units)} different units in ${a.days} days and ${formatCount(b.units)} in ${b.days}, interpolated as a power law (exponent ${sizing.traffic.exponent.toFixed(2)}; 1 would mean every unit is new).`);
  }
  if (entry.role === "guardrail" && sizing.effect) {
    out.push(
      `Non-inferiority: the test can rule out harm of ${describeChange(entry, sizing.effect, sizing.baselineValue)} with ${formatPower(entry.power)} power when there is none. At the readout the one-sided ${formatValue((1 - entry.alpha) * 100)}% bound on the harm reads three ways: breach (harm is significant), harm ruled out (the bound is inside the tolerance), or not ruled out (neither; more data or a judgement).`
    );
  }
  if (entry.guardrailLooks) {
    out.push(`The interim boundaries are the primary\u2019s; at each of the ${entry.guardrailLooks.looks} analyses this guardrail\u2019s harm check is its own one-sided test at \u03B1 ${formatValue(entry.alpha)}, so it can stop the test at the first look; checking ${entry.guardrailLooks.looks} times gives ${withArticle(formatPower(entry.guardrailLooks.falseAlarm))} chance of a false alarm at some look.`);
  }
  if (sizing.feasibility && !sizing.feasibility.feasible) {
    const f = sizing.feasibility;
    const detect = f.detectableAtLongest ? ` The longest window (${f.longestDays} days) can detect ${describeChange(entry, f.detectableAtLongest, sizing.baselineValue)}.` : f.noneDetectableAtLongest ? ` In the longest window (${f.longestDays} days), ${f.noneDetectableAtLongest.reason}.` : "";
    out.push(`Not feasible at this traffic: ${f.reason}.${detect} Alternatives: plan for a larger effect, pick a more sensitive metric (closer to the change, or with a pre-period adjustment), or ship as a guarded rollout without a test.`);
  }
  if (sizing.squareRootAllocation) {
    const a = sizing.squareRootAllocation;
    out.push(`Several arms share one control: giving the control \u221Ak times a treatment arm\u2019s share (weights ${formatValue(a.controlWeight)} : ${formatValue(a.treatmentWeight)} each) needs ${formatCount(a.totalUnits)} units, ${formatCount(a.unitsSaved)} fewer.`);
  }
  if (m.comparisons > 1) out.push(`${m.comparisons} treatment arms against one control: \u03B1 ${formatValue(m.alphaPerComparison)} per comparison (Bonferroni).`);
  if (m.designEffect > 1) {
    const perArm = sizing.headline?.clustersPerArm;
    const groups = perArm ? `, whole groups per arm ${perArm.map((g) => formatCount(g.groups)).join(" / ")} (${formatCount(sizing.headline.clusters)} groups in all; t reference with groups \u2212 2 degrees of freedom)` : "";
    out.push(`Groups are randomized: design effect ${formatMultiplier(m.designEffect)} on units${groups}.`);
  }
  if (m.varianceReduction < 1) out.push(`Pre-period adjustment (CUPED): ${formatMultiplier(m.varianceReduction)} on units.`);
  if (sizing.boundaries) {
    const z = sizing.boundaries.z.map((v) => v.toFixed(3)).join(", ");
    const p = sizing.boundaries.nominalP.map((v) => v < 1e-3 ? v.toExponential(1) : v.toFixed(4)).join(", ");
    out.push(`Interim looks (${sizing.boundaries.kind}, ${sizing.boundaries.z.length} analyses): maximum sample ${formatMultiplier(m.sequential)} to keep the planned power; stop at |z| \u2265 ${z} (nominal p ${p}).`);
  }
  if (sizing.diluted && sizing.triggered) {
    const triggeredDays = sizing.triggered.duration ? ` (${countOf(sizing.triggered.duration.days, "day")})` : "";
    out.push(
      `Exposure is logged before the change is reached: the analysis of all exposed units needs ${formatMultiplier(m.dilutionUnits)} the units and ${formatMultiplier(m.dilutionDays)} the days of an analysis of reached units${triggeredDays}; log exposure where the change is seen to save the difference.`
    );
  }
  return out.map((text) => `${entry.metric}: ${text}`);
}
function plannedEndNotes(entry, sizing) {
  const end = sizing.atPlannedEnd;
  if (!end) return [];
  const by = `By the planned end (${countOf(end.days, "day")})`;
  const out = [];
  if (end.noPower?.tooFewUnits && end.noneDetectable) out.push(`${by}: no power, and ${end.noneDetectable.reason}.`);
  else {
    if (end.noPower) out.push(`${by} no power can be computed: ${end.noPower.reason}.`);
    if (end.noneDetectable) out.push(`${by}: ${end.noneDetectable.reason}.`);
  }
  if (end.power !== void 0 && end.power < entry.power) out.push(`The planned ${countOf(end.days, "day")} give ${formatPower(end.power)} power, below the planned ${formatPower(entry.power)}.`);
  return out.map((text) => `${entry.metric}: ${text}`);
}
function familyNote(sizing) {
  if (sizing.familyOmitted) return [`Power for the family is not computed: ${sizing.familyOmitted.reason}.`];
  if (!sizing.family) return [];
  const f = sizing.family;
  return [
    `Power for the family: ${formatPower(f.noFalseAlarm)} that the primary wins (${formatPower(f.primaryPower)} alone) and no harmless guardrail shows significant harm (a false alarm); ${formatPower(f.allGuardrailsClear)} that it wins and every guardrail rules out harm beyond its tolerance. Both figures multiply the metrics\u2019 chances as if the metrics were independent. Neither figure bounds the other: a guardrail can show significant harm that is still within its tolerance, and it can fail to rule out harm without showing any.`
  ];
}
function notesOf(sizing) {
  return [
    ...familyNote(sizing),
    ...sizing.metrics.flatMap(
      (entry) => entry.result.ok ? [...multiplierNotes(entry, entry.result.value), ...plannedEndNotes(entry, entry.result.value), ...entry.result.value.notes.map((n) => `${entry.metric}: ${n}`)] : []
    )
  ];
}
function windowLine(sizing, context) {
  if (sizing.plannedDays !== void 0) {
    const dates = context.window?.start && context.window.end ? ` (${context.window.start} to ${context.window.end})` : "";
    return `Planned window: ${countOf(sizing.plannedDays, "day")}${dates}.`;
  }
  return "Planned window: not set, so power and detectable effect at the end are not computed.";
}
function renderSizingText(sizing, context) {
  const table = formatTable(HEADER, rows(sizing).map((r) => r.cells));
  const traffic = sizing.dailyUnits === void 0 && sizing.uniqueUnits === void 0 ? "No daily-units or unique-units given, so no durations." : "";
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
function chartPower(power) {
  return Math.min(99.9, Math.max(0.1, power * 100)).toFixed(1);
}
function mermaidPowerChart(entry, sizing, target) {
  const points = sizing.powerByDay;
  if (!points || points.length < 3 || points[0].power > 0.99) return void 0;
  const days = points.map((p) => p.day).join(", ");
  const power = points.map((p) => chartPower(p.power)).join(", ");
  const goal = points.map(() => chartPower(target)).join(", ");
  return [
    "```mermaid",
    "xychart-beta",
    `  title "Power by day: ${entry.metric.replace(/["\r\n]/g, " ")}"`,
    `  x-axis "day" [${days}]`,
    '  y-axis "power (%)" 0 --> 100',
    `  line [${power}]`,
    `  line [${goal}]`,
    "```"
  ].join("\n");
}
function renderSizingMarkdown(sizing, context) {
  const table = [
    `| ${HEADER.map((h) => h.toLowerCase()).join(" | ")} |`,
    `| ${HEADER.map(() => "---").join(" | ")} |`,
    ...rows(sizing).map((r) => `| ${r.cells.map(safeCell).join(" | ")} |`)
  ];
  const primary = sizing.metrics.find((m) => m.role === "primary");
  const chart = primary?.result.ok ? mermaidPowerChart(primary, primary.result.value, context.power) : void 0;
  const notes = notesOf(sizing);
  return [
    `### ${safeText(context.title)}`,
    "",
    [safeText(context.designLine), windowLine(sizing, context)].filter(Boolean).join(" "),
    "",
    ...table,
    ...notes.length ? ["", ...notes.map((n) => `- ${safeText(n)}`)] : [],
    ...chart ? ["", `<details><summary>Power by day (the flat line is the planned ${formatPower(context.power)})</summary>`, "", chart, "", "</details>"] : [],
    ""
  ].join("\n");
}
function sizingJson(sizing, context) {
  return { format: SIZING_JSON_FORMAT, title: context.title, design: context.designLine, ...sizing };
}
function designSummary(design) {
  const arms = `${design.arms.length} arms (${design.arms.map((a) => `${a.name} ${formatValue(a.weight)}`).join(", ")})`;
  const test = `\u03B1 ${formatValue(design.alpha)} ${design.sides === 2 ? "two-sided" : "one-sided"}, power ${formatPower(design.power)}`;
  const reached = `${formatValue(design.trafficShare * 100)}% of them enrolled${design.reach < 1 ? `, ${formatValue(design.reach * 100)}% of exposed units reach the change` : ""}`;
  const traffic = design.uniqueUnits ? `, ${design.uniqueUnits.map((p) => `${formatCount(p.units)} different eligible units in ${p.days} days`).join(" and ")}, ${reached}` : design.dailyUnits === void 0 ? "" : `, ${unitsAmount(design.dailyUnits)} new eligible units a day, ${reached}`;
  return `${arms}, ${test}${traffic}.`;
}
function lengthSetter(sizing) {
  let best;
  for (const entry of sizing.metrics) {
    const duration = entry.result.ok ? entry.result.value.headline?.duration : void 0;
    if (entry.result.ok && duration && (!best || duration.days > best.duration.days)) best = { entry, sizing: entry.result.value, duration };
  }
  return best;
}
function lengthSummary(sizing) {
  const setter = lengthSetter(sizing);
  if (!setter) return void 0;
  const { entry, duration } = setter;
  const who = entry.role === "guardrail" ? `guardrail ${entry.metric}` : `primary metric ${entry.metric}`;
  const length = `${countOf(duration.weeks, "week")} (${who} sets the length: ${countOf(duration.days, "day")})`;
  const end = setter.sizing.atPlannedEnd;
  return end?.power !== void 0 ? { length, power: `${formatPower(end.power)} for ${entry.metric} by the planned end (${countOf(end.days, "day")})` } : { length };
}

export {
  SIZING_JSON_FORMAT,
  changeSize,
  describeChange,
  withArticle,
  multiplierNotes,
  renderSizingText,
  renderSizingMarkdown,
  sizingJson,
  designSummary,
  lengthSetter,
  lengthSummary
};
