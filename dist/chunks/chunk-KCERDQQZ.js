#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  QUOTED_STRING,
  collisionCheck,
  collisionsOfLinked,
  findFlagTouches,
  flagPatternsOf,
  isSameOrBelow,
  logPatternsOf,
  runningEntries,
  scanMatcher
} from "./chunk-AXMPQV5Z.js";
import {
  sizeMetric,
  sizePlan
} from "./chunk-KLXUGDTV.js";
import {
  inclusiveDays
} from "./chunk-BRB7BNQY.js";
import {
  formatCount,
  formatPower,
  formatRate,
  formatRelative
} from "./chunk-AAUUFJV7.js";
import {
  loadWorkspace,
  missingDecisions,
  ownFilesOf,
  require_picomatch
} from "./chunk-LNPMABAN.js";
import {
  eventsOfPlan
} from "./chunk-NUQJLPGC.js";
import {
  closestName,
  require_dist
} from "./chunk-7ABR6JAH.js";
import {
  formatProblem
} from "./chunk-EIDPB5F5.js";
import {
  GROUP_UNITS
} from "./chunk-6GTMEVTP.js";
import {
  __toESM
} from "./chunk-FUJ7I5KY.js";

// src/run/review-change.ts
var import_picomatch2 = __toESM(require_picomatch(), 1);

// src/core/checks/bug-fix.ts
var import_picomatch = __toESM(require_picomatch(), 1);
function bugFixReason(pr, settings) {
  const labels = (pr.labels ?? []).map((l) => l.toLowerCase());
  const label = settings.labels.find((l) => labels.includes(l.toLowerCase()));
  if (label) return `it has the label ${label}`;
  const title = pr.title ?? "";
  const prefix = settings.titlePrefixes.find((p) => new RegExp(`^${p.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}(\\([^)]*\\))?!?:`, "i").test(title));
  if (prefix) return `its title starts with ${prefix}:`;
  const branch = (pr.branch ?? "").toLowerCase();
  const branchPrefix = settings.branchPrefixes.find((p) => branch.startsWith(p.toLowerCase()));
  if (branchPrefix) return `its branch starts with ${branchPrefix}`;
  return void 0;
}
function bugFixNudge(context) {
  const settings = context.settings.bugFix;
  if (!settings.enabled) return void 0;
  const labels = (context.pr.labels ?? []).map((l) => l.toLowerCase());
  if (labels.includes(settings.silenceLabel.toLowerCase())) return void 0;
  const reason = bugFixReason(context.pr, settings);
  if (!reason || context.touches.length > 0 || context.linked.length > 0) return void 0;
  const notProduct = (0, import_picomatch.default)(settings.nonProductPaths, { dot: true });
  const productFiles = context.changedPaths.filter((p) => !notProduct(p));
  if (productFiles.length === 0) return void 0;
  const guardrail = settings.guardrail;
  let sizingLine;
  if (guardrail && settings.dailyUnits !== void 0) {
    const harm = guardrail.direction === "decrease" ? "increase" : "decrease";
    const sized = sizeMetric({
      baseline: { kind: "proportion", rate: guardrail.rate },
      direction: harm,
      effect: { relative: 0.01 },
      arms: [
        { name: "control", weight: 50 },
        { name: "fix", weight: 50 }
      ],
      control: "control",
      alpha: 0.05,
      power: 0.8,
      sides: 1,
      dailyUnits: settings.dailyUnits,
      trafficShare: 1,
      reach: 1,
      interimLooks: 0,
      boundary: "obrien-fleming-spending",
      prePeriodCorrelation: 0,
      plannedDays: 14
    });
    if (sized.ok && sized.value.headline && sized.value.effect) {
      const h = sized.value.headline;
      const twoWeeks = sized.value.atPlannedEnd?.detectable;
      const inTwoWeeks = twoWeeks ? ` Two weeks would catch a rise to ${formatRate(twoWeeks.to)} (${formatRelative(twoWeeks.relative)} relative).` : "";
      sizingLine = `To detect a 1% relative regression in ${guardrail.name} (${formatRate(guardrail.rate)} \u2192 ${formatRate(sized.value.effect.to)}) at ${formatCount(settings.dailyUnits)} eligible units a day: ${formatCount(h.perArm[0].units)} units per arm, ${h.duration ? `${h.duration.days} days (${h.duration.weeks} weeks)` : "no duration"}, one-sided \u03B1 0.05, power 80%.${inTwoWeeks}`;
    }
  }
  const slug = (context.pr.branch ?? "bug-fix").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40) || "bug-fix";
  const g = guardrail ?? { name: "error-rate", rate: 0.01, events: ["error_shown"], direction: "decrease" };
  const planStub = [
    `id: check-${slug}`,
    `title: "Check test: ${(context.pr.title ?? "the fix").replace(/"/g, "'").slice(0, 80)}"`,
    'owners: ["@your-handle"]',
    `flags: [${slug}]`,
    "state: draft",
    "hypothesis:",
    "  change: The fix, behind a flag, for half of the traffic.",
    "  because: It should stop the bug without harming anything else.",
    "  expected-direction: increase",
    "unit: { randomization: user }",
    "surface: { path: area/page }",
    "metrics:",
    "  primary:",
    "    name: task-completed",
    "    kind: proportion",
    "    baseline: { rate: 0.5 }",
    "    events: [task_completed]",
    "  guardrails:",
    `    - { name: ${g.name}, kind: proportion, baseline: { rate: ${g.rate} }, events: [${g.events.join(", ")}], direction: ${g.direction}, tolerance: { relative: 0.01 } }`,
    "    - { name: latency, kind: mean, baseline: { mean: 300, sd: 150 }, events: [page_rendered], direction: decrease, tolerance: { relative: 0.02 } }",
    "design:",
    "  min-detectable-effect: { relative: 0.02 }",
    `  daily-units: ${settings.dailyUnits ?? 1e4}`,
    "decisions:",
    "  win: Roll the fix out to everyone.",
    "  flat: Roll it out; the bug is gone and nothing got worse.",
    "  loss: Turn the flag off and look again at the fix.",
    "  guardrail-breach: Turn the flag off at once."
  ].join("\n");
  return { reason, productFiles, planStub, ...sizingLine ? { sizingLine } : {} };
}
var bugFixUnmeasured = (context) => {
  const nudge = bugFixNudge(context);
  if (!nudge) return [];
  return [
    {
      code: "bug-fix-unmeasured",
      message: `This looks like a bug fix (${nudge.reason}) that changes product code without a flag: if the fix does not fix, or slows things down or raises errors, nobody will see it.`,
      fix: `Ship it behind a flag with a small check test (a plan to paste is in the comment), or add the label ${context.settings.bugFix.silenceLabel} to say no test is needed.`
    }
  ];
};

// src/core/checks/flags.ts
var flagWithoutPlan = ({ touches, registry, settings }) => {
  const planned = new Set(registry.entries.flatMap((e) => e.flags));
  const exempt = new Set(settings.exemptFlags);
  const reported = /* @__PURE__ */ new Set();
  return touches.filter((t) => !planned.has(t.key) && !exempt.has(t.key) && !reported.has(t.key) && reported.add(t.key)).map((t) => ({
    code: "flag-without-plan",
    message: `Flag \`${t.key}\` is ${t.side === "added" ? "used" : "removed"} here, but no plan names it.`,
    fix: `Write a plan for it (plumbline new ${t.key}), link one in the description, or list it under exempt-flags in the settings if it is a kill switch or an operational toggle.`,
    file: t.file,
    line: t.line
  }));
};

// src/core/checks/logging.ts
function eventStatuses(context, planId) {
  const linked = context.linked.find((l) => l.loaded.plan.id === planId);
  if (!linked) return [];
  const { plan } = linked.loaded;
  const roles = /* @__PURE__ */ new Map();
  const note = (event, role) => roles.set(event, [...roles.get(event) ?? [], role]);
  if (plan.exposure.event) note(plan.exposure.event, "exposure");
  for (const m of [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary]) for (const e of m.events) note(e, m.name);
  return eventsOfPlan(plan).map((event) => {
    const hits = context.events.get(event);
    const location = hits?.firstCall ?? hits?.firstQuoted;
    return { event, roles: roles.get(event) ?? [], ...location ? { location, via: hits?.firstCall ? "call" : "literal" } : {} };
  });
}
var eventMissing = (context) => context.linked.flatMap(
  ({ loaded }) => eventStatuses(context, loaded.plan.id).filter((s) => !s.location).map((s) => ({
    code: "event-missing",
    message: `Event \`${s.event}\` (${s.roles.join(", ")}) is not logged anywhere in the code at head, so the ${s.roles.includes("exposure") ? "exposure" : "metric"} cannot be computed.`,
    fix: `Log ${s.event} where it happens (or correct the name in the plan) before launch.`,
    plan: loaded.plan.id,
    file: loaded.file,
    line: loaded.line
  }))
);
function dependents(entries, event) {
  return runningEntries(entries).filter((e) => e.events.includes(event));
}
var eventRemoved = ({ removedEvents, events, registry }) => [...removedEvents].flatMap(([event, where]) => {
  const still = events.get(event);
  if (still?.firstCall || still?.firstQuoted) return [];
  const plans = dependents(registry.entries, event);
  if (plans.length === 0) return [];
  return [
    {
      code: "event-removed",
      message: `This change removes the last logging of \`${event}\`, which running test${plans.length === 1 ? "" : "s"} ${plans.map((p) => `${p.id} (${p.owners.join(", ")})`).join(", ")} depend${plans.length === 1 ? "s" : ""} on.`,
      fix: "Keep logging the event, or agree with the owners to end or change those tests first.",
      file: where.file,
      line: where.line
    }
  ];
});

// src/core/checks/plans.ts
var planInvalid = ({ invalidPlanFiles }) => invalidPlanFiles.map(({ file, problems }) => {
  const errors = problems.filter((p) => p.severity === "error");
  return {
    code: "plan-invalid",
    message: `${file} cannot be used: ${errors.length} error${errors.length === 1 ? "" : "s"}, first: ${formatProblem(errors[0])}`,
    fix: "Run plumbline validate and fix each error.",
    file,
    line: errors[0]?.line ?? 1
  };
});
var decisionsMissing = ({ linked }) => linked.flatMap(({ loaded }) => {
  const missing = missingDecisions(loaded.plan);
  if (missing.length === 0) return [];
  return [
    {
      code: "decisions-missing",
      message: `No decision rule for ${missing.join(", ")}: without rules written before the data arrives, the result gets read to fit what people hoped.`,
      fix: `Add under decisions: ${missing.map((m) => `${m}: "what you will do"`).join("; ")}.`,
      plan: loaded.plan.id,
      file: loaded.file,
      line: loaded.line
    }
  ];
});
var reasonMissing = ({ linked }) => linked.filter(({ loaded }) => !loaded.plan.hypothesis.because).map(({ loaded }) => ({
  code: "reason-missing",
  message: "The hypothesis says what changes but not why it should work.",
  fix: "Add hypothesis.because: the mechanism you expect, so a flat or negative result teaches something.",
  plan: loaded.plan.id,
  file: loaded.file,
  line: loaded.line
}));
var guardrailsMissing = ({ linked }) => linked.filter(({ loaded }) => loaded.plan.metrics.guardrails.length === 0).map(({ loaded }) => ({
  code: "guardrails-missing",
  message: "No guardrail metric: harm elsewhere (errors, latency, cancellations) would go unseen.",
  fix: "Add metrics.guardrails with a direction and a tolerance each.",
  plan: loaded.plan.id,
  file: loaded.file,
  line: loaded.line
}));
var windowChecks = ({ linked }) => linked.flatMap(({ loaded }) => {
  const { start, end } = loaded.plan.window;
  const at = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
  if (!end) {
    return [{ code: "end-missing", message: "No planned end date: tests without one run on, and get peeked at until something looks significant.", fix: "Add window.end.", ...at }];
  }
  if (!start) return [];
  const days = inclusiveDays(start, end);
  if (days < 7) {
    return [{ code: "window-short", message: `The window is ${days} day${days === 1 ? "" : "s"}: less than a week misses weekly cycles.`, fix: "Plan at least 7 days, in whole weeks.", ...at }];
  }
  if (days % 7 !== 0) {
    return [{ code: "window-partial-week", message: `The window is ${days} days, not a whole number of weeks, so some weekdays count more than others.`, fix: `Make it ${Math.ceil(days / 7) * 7} days.`, ...at }];
  }
  return [];
});
var reviewMissing = ({ linked }) => linked.flatMap(
  ({ loaded }) => loaded.plan.sensitive.filter((s) => !s.review).map((s) => ({
    code: "review-missing",
    message: `The plan touches ${s.area}, but names no review for it. Tests in this area can hurt people; Plumbline cannot judge that, and defers to local law and to the people licensed to.`,
    fix: `Name the review under sensitive (review: ...) and get it before launch: ${REVIEW_HINT[s.area]}.`,
    plan: loaded.plan.id,
    file: loaded.file,
    line: loaded.line
  }))
);
var REVIEW_HINT = {
  pricing: "pricing, finance and legal (price discrimination and consumer law differ by country)",
  legal: "legal counsel",
  regulatory: "compliance, with the regulator\u2019s rules for each region in the population",
  minors: "legal and child-safety review; many places need parental consent or forbid such tests",
  health: "clinical or medical review, and legal where health data is involved",
  accessibility: "accessibility review, with assistive-technology testing",
  privacy: "privacy review (data protection officer where there is one)"
};
var bundleUnexplained = ({ linked }) => linked.filter(({ loaded }) => loaded.plan.flags.length > 1 && !loaded.plan.bundleRationale).map(({ loaded }) => ({
  code: "bundle-unexplained",
  message: `The plan bundles ${loaded.plan.flags.length} flags (${loaded.plan.flags.join(", ")}): a result will not say which change caused it.`,
  fix: "Add bundle-rationale, or split the plan.",
  plan: loaded.plan.id,
  file: loaded.file,
  line: loaded.line
}));
var populationChecks = ({ linked }) => linked.flatMap(({ loaded }) => {
  const { platforms, locales, ready } = loaded.plan.population;
  const at = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
  const missing = [platforms.length ? "" : "platforms", locales.length ? "" : "locales"].filter(Boolean);
  if (missing.length) {
    return [{ code: "population-undeclared", message: `The population does not declare ${missing.join(" or ")}.`, fix: `Add population.${missing.join(" and population.")}.`, ...at }];
  }
  const notReady = [...platforms.filter((p) => !ready.platforms.includes(p)), ...locales.filter((l) => !ready.locales.includes(l))];
  if (notReady.length === 0) return [];
  return [
    {
      code: "readiness-missing",
      message: `The change is not declared ready on ${notReady.join(", ")} (rendered, translated), though the population includes ${notReady.length === 1 ? "it" : "them"}.`,
      fix: "Check the change there and add it under population.ready, or take it out of the population.",
      ...at
    }
  ];
});

// src/core/checks/sizing.ts
var sizingChecks = ({ linked }) => linked.flatMap(({ loaded, sizing }) => {
  const { plan } = loaded;
  const at = { plan: plan.id, file: loaded.file, line: loaded.line };
  const out = [];
  if (!plan.design.minDetectableEffect || plan.design.dailyUnits === void 0) {
    const missing = [plan.design.minDetectableEffect ? "" : "design.min-detectable-effect", plan.design.dailyUnits === void 0 ? "design.daily-units" : ""].filter(Boolean);
    out.push({ code: "sizing-incomplete", message: `The test cannot be sized without ${missing.join(" and ")}.`, fix: `Add ${missing.join(" and ")}; then Plumbline says how many units and days the test needs.`, ...at });
  }
  for (const entry of sizing.metrics) {
    if (!entry.result.ok) {
      out.push({ code: "sizing-impossible", message: `${entry.metric} cannot be sized: ${entry.result.error.input}: ${entry.result.error.message}.`, fix: "Check the metric\u2019s baseline figures and the effect to detect.", ...at });
      continue;
    }
    const s = entry.result.value;
    const end = s.atPlannedEnd;
    if (end?.power !== void 0 && end.power < plan.design.power) {
      const needed = s.headline?.duration ? ` It needs ${s.headline.duration.days} days (${s.headline.duration.weeks} weeks).` : "";
      out.push({
        code: "underpowered",
        message: `${entry.role === "primary" ? "The primary metric" : `Guardrail ${entry.metric}`} reaches ${formatPower(end.power)} power by the planned end, below the planned ${formatPower(plan.design.power)}.${needed}`,
        fix: "Extend the window, enrol more traffic, or plan for a larger effect, and say which in the plan.",
        ...at
      });
    }
  }
  const primary = sizing.metrics[0];
  if (plan.exposure.reach < 1 && primary?.result.ok && primary.result.value.diluted && primary.result.value.triggered) {
    const s = primary.result.value;
    const days = (a) => a?.duration ? `${a.duration.days} days` : `${a?.totalUnits.toLocaleString("en-US")} units`;
    out.push({
      code: "exposure-diluted",
      message: `Only ${Math.round(plan.exposure.reach * 100)}% of exposed units reach the change, so the effect is diluted: the test needs ${days(s.diluted)} instead of ${days(s.triggered)}.`,
      fix: "Log the exposure event where the change is actually seen (or analyse only the units that reach it).",
      ...at
    });
  }
  return out;
});

// src/core/checks/unit.ts
var spillover = ({ linked, settings }) => linked.flatMap(({ loaded }) => {
  const { plan } = loaded;
  const shared = settings.groupSurfaces.find((s) => isSameOrBelow(plan.surface.path, s));
  if (!shared || GROUP_UNITS.includes(plan.unit.randomization)) return [];
  return [
    {
      code: "spillover",
      message: `${plan.surface.path} is shared between people (group-surfaces: ${shared}), but the plan randomizes by ${plan.unit.randomization}: treated and control people interact, so the difference between arms is biased.`,
      fix: `Randomize the group they share (unit.randomization: team, organization or household) and size with design.cluster.`,
      plan: plan.id,
      file: loaded.file,
      line: loaded.line
    }
  ];
});
var analysisUnitDiffers = ({ linked }) => linked.filter(({ loaded }) => loaded.plan.unit.analysis !== loaded.plan.unit.randomization).map(({ loaded }) => ({
  code: "analysis-unit-differs",
  message: `Units are randomized by ${loaded.plan.unit.randomization} but metrics are averaged per ${loaded.plan.unit.analysis}: observations within one ${loaded.plan.unit.randomization} are not independent.`,
  fix: "Compute the variance with the delta method or cluster-robust standard errors, not the naive per-unit formula.",
  plan: loaded.plan.id,
  file: loaded.file,
  line: loaded.line
}));

// src/core/checks/index.ts
var CHECKS = [
  planInvalid,
  decisionsMissing,
  reviewMissing,
  eventRemoved,
  flagWithoutPlan,
  reasonMissing,
  guardrailsMissing,
  windowChecks,
  bundleUnexplained,
  populationChecks,
  sizingChecks,
  spillover,
  analysisUnitDiffers,
  collisionCheck,
  eventMissing,
  bugFixUnmeasured
];

// src/core/review/finding.ts
var FINDING_CODES = {
  "flag-without-plan": { severity: "warn", about: "a changed feature flag has no plan (and is not exempt)" },
  "plan-invalid": { severity: "block", about: "a plan the change touches cannot be loaded" },
  "decisions-missing": { severity: "block", about: "a decision rule (win, flat, loss, guardrail breach) is not written" },
  "reason-missing": { severity: "warn", about: "the hypothesis does not say why the change should work" },
  "guardrails-missing": { severity: "warn", about: "no guardrail metric" },
  "end-missing": { severity: "warn", about: "no planned end date" },
  "window-short": { severity: "warn", about: "the planned window is shorter than 7 days" },
  "window-partial-week": { severity: "note", about: "the planned window is not a whole number of weeks" },
  "review-missing": { severity: "block", about: "a sensitive area has no named review" },
  "bundle-unexplained": { severity: "warn", about: "several flags in one plan without a rationale" },
  "population-undeclared": { severity: "warn", about: "platforms or locales are not declared" },
  "readiness-missing": { severity: "warn", about: "the change is not declared ready on a platform or locale of its population" },
  underpowered: { severity: "warn", about: "the planned window gives less than the planned power" },
  "sizing-incomplete": { severity: "note", about: "the plan lacks the figures sizing needs" },
  "sizing-impossible": { severity: "warn", about: "the plan\u2019s figures cannot be sized" },
  "exposure-diluted": { severity: "warn", about: "exposure is logged before the change is reached" },
  spillover: { severity: "warn", about: "people randomized one by one on a surface they share" },
  "analysis-unit-differs": { severity: "note", about: "metrics are averaged over another unit than the one randomized" },
  collision: { severity: "warn", about: "the test overlaps a running test on the same surface" },
  "known-overlap": { severity: "note", about: "the test overlaps a running test it declares" },
  "event-missing": { severity: "warn", about: "an event the plan names is not logged in the code" },
  "event-removed": { severity: "block", about: "the change removes an event a running test depends on" },
  "severity-unknown-code": { severity: "warn", about: "the settings name a finding code that does not exist" },
  "bug-fix-unmeasured": { severity: "note", about: "a bug fix changes product code without a flag or a check test" }
};
var ALWAYS_BLOCKS = /* @__PURE__ */ new Set(["decisions-missing"]);

// src/core/review/build-review.ts
var CHECKLIST = [
  { label: "Decision rules written for a win, a flat result, a loss and a guardrail breach", codes: ["decisions-missing"] },
  { label: "Hypothesis says why the change should work", codes: ["reason-missing"] },
  { label: "One primary metric and at least one guardrail", codes: ["guardrails-missing"] },
  { label: "Planned end, at least a week, in whole weeks", codes: ["end-missing", "window-short", "window-partial-week"] },
  { label: "Enough power by the planned end", codes: ["underpowered", "sizing-incomplete", "sizing-impossible"] },
  { label: "Exposure logged where the change is seen", codes: ["exposure-diluted"] },
  { label: "Randomization unit fits the surface", codes: ["spillover"] },
  { label: "No collision with a running test", codes: ["collision"] },
  { label: "Every event the plan names is logged in the code", codes: ["event-missing"] },
  { label: "Population and readiness declared (platforms, locales)", codes: ["population-undeclared", "readiness-missing"] },
  { label: "Sensitive areas have their named review", codes: ["review-missing"], when: (p) => p.loaded.plan.sensitive.length > 0 },
  { label: "Bundled flags are explained", codes: ["bundle-unexplained"], when: (p) => p.loaded.plan.flags.length > 1 }
];
function severityFor(code, overrides) {
  const fallback = FINDING_CODES[code]?.severity ?? "warn";
  if (ALWAYS_BLOCKS.has(code)) return "block";
  const chosen = overrides[code];
  return chosen === "block" || chosen === "warn" || chosen === "note" || chosen === "off" ? chosen : fallback;
}
var ORDER = { block: 0, warn: 1, note: 2 };
function buildReview(context, change) {
  const raw = CHECKS.flatMap((check) => check(context));
  const known = Object.keys(FINDING_CODES);
  for (const code of Object.keys(context.settings.severity)) {
    if (known.includes(code)) continue;
    const suggestion = closestName(code, known);
    raw.push({
      code: "severity-unknown-code",
      message: `The settings set a severity for "${code}", which is not a finding code${suggestion ? `; did you mean "${suggestion}"?` : "."}`,
      fix: `Use one of: ${known.join(", ")}.`
    });
  }
  const findings = [];
  for (const finding of raw) {
    const severity = severityFor(finding.code, context.settings.severity);
    if (severity !== "off") findings.push({ ...finding, severity });
  }
  findings.sort((a, b) => ORDER[a.severity] - ORDER[b.severity]);
  const counts = { block: 0, warn: 0, note: 0 };
  for (const f of findings) counts[f.severity]++;
  const plans = context.linked.map((linked) => {
    const { plan } = linked.loaded;
    const mine = new Set(findings.filter((f) => f.plan === plan.id).map((f) => f.code));
    return {
      id: plan.id,
      title: plan.title,
      file: linked.loaded.file,
      line: linked.loaded.line,
      state: plan.state,
      owners: plan.owners,
      reasons: linked.reasons,
      checklist: CHECKLIST.filter((item) => !item.when || item.when(linked)).map((item) => ({ label: item.label, done: !item.codes.some((c) => mine.has(c)) })),
      sizing: linked.sizing,
      power: plan.design.power,
      window: plan.window,
      events: eventStatuses(context, plan.id)
    };
  });
  const planned = /* @__PURE__ */ new Map();
  for (const e of context.registry.entries) for (const f of e.flags) planned.set(f, [...planned.get(f) ?? [], e.id]);
  const exempt = new Set(context.settings.exemptFlags);
  const flags = context.touches.map((t) => ({ ...t, plans: planned.get(t.key) ?? [], exempt: exempt.has(t.key) }));
  const collisions = collisionsOfLinked(context).map(({ plan, collision: c }) => ({
    plan,
    other: c.other.id,
    owners: c.other.owners,
    otherSurface: c.other.surface.path,
    ...c.overlapDays !== void 0 ? { overlapDays: c.overlapDays } : {},
    ...c.overlapWindow ? { overlapWindow: c.overlapWindow } : {},
    platforms: c.platforms,
    locales: c.locales,
    trafficShare: c.trafficShare,
    known: c.known
  }));
  const nothing = context.touches.length === 0 && context.linked.length === 0 && context.invalidPlanFiles.length === 0 && findings.length === 0;
  const verdict = nothing ? "nothing-to-check" : counts.block ? "blocked" : counts.warn ? "warnings" : "clear";
  const nudge = findings.some((f) => f.code === "bug-fix-unmeasured") ? bugFixNudge(context) : void 0;
  return { verdict, counts, base: change.base, head: change.head, findings, plans, flags, collisions, ...nudge ? { nudge } : {} };
}

// src/core/review/link-plans.ts
function linkPlans(options) {
  const links = /* @__PURE__ */ new Map();
  const add = (id, reason) => {
    const reasons = links.get(id) ?? [];
    if (!reasons.includes(reason)) reasons.push(reason);
    links.set(id, reasons);
  };
  const body = options.pr.body ?? "";
  const touched = new Set(options.touches.map((t) => t.key));
  for (const { plan, file } of options.plans) {
    const idPattern = new RegExp(`(?<![\\w/-])${plan.id.replace(/[-]/g, "\\-")}(?![\\w-])`);
    if (body.includes(file) || idPattern.test(body)) add(plan.id, "named in the description");
    if (options.changedPaths.has(file)) add(plan.id, "plan file changed");
    if (plan.flags.some((f) => touched.has(f))) add(plan.id, "flag touched");
  }
  return links;
}

// src/core/scan/diff.ts
var HUNK = /^@@ -(\d+)(?:,\d+)? \+(\d+)(?:,\d+)? @@/;
function unquote(path) {
  if (!path.startsWith('"')) return path;
  const bytes = [];
  const body = path.slice(1, -1);
  for (let i = 0; i < body.length; i++) {
    const c = body[i];
    if (c !== "\\") {
      bytes.push(...Buffer.from(c, "utf8"));
      continue;
    }
    const next = body[++i];
    if (/[0-7]/.test(next)) {
      bytes.push(parseInt(body.slice(i, i + 3), 8));
      i += 2;
    } else bytes.push({ n: 10, t: 9, '"': 34, "\\": 92 }[next] ?? next.charCodeAt(0));
  }
  return Buffer.from(bytes).toString("utf8");
}
function stripPrefix(path, prefix) {
  const plain = unquote(path);
  return plain.startsWith(prefix) ? plain.slice(prefix.length) : plain;
}
function parseUnifiedDiff(text) {
  const files = [];
  let current;
  let oldLine = 0;
  let newLine = 0;
  for (const raw of text.split("\n")) {
    if (raw.startsWith("diff --git ")) {
      current = { path: "", added: [], removed: [], binary: false };
      files.push(current);
      continue;
    }
    if (!current) continue;
    if (raw.startsWith("--- ")) {
      const from = raw.slice(4);
      if (from !== "/dev/null") current.previousPath = stripPrefix(from, "a/");
      continue;
    }
    if (raw.startsWith("+++ ")) {
      const to = raw.slice(4);
      current.path = to === "/dev/null" ? current.previousPath ?? "" : stripPrefix(to, "b/");
      if (current.previousPath === current.path) delete current.previousPath;
      continue;
    }
    if (raw.startsWith("rename from ")) {
      current.previousPath = unquote(raw.slice("rename from ".length));
      continue;
    }
    if (raw.startsWith("rename to ")) {
      current.path = unquote(raw.slice("rename to ".length));
      continue;
    }
    if (raw.startsWith("Binary files ")) {
      current.binary = true;
      const match = / and (?:b\/)?(.+) differ$/.exec(raw);
      if (match && !current.path) current.path = match[1] === "/dev/null" ? "" : match[1];
      continue;
    }
    const hunk = HUNK.exec(raw);
    if (hunk) {
      oldLine = Number(hunk[1]);
      newLine = Number(hunk[2]);
      continue;
    }
    if (raw.startsWith("+")) current.added.push({ line: newLine++, text: raw.slice(1) });
    else if (raw.startsWith("-")) current.removed.push({ line: oldLine++, text: raw.slice(1) });
    else if (raw.startsWith(" ")) {
      oldLine++;
      newLine++;
    }
  }
  return files.filter((f) => f.path !== "");
}

// src/core/scan/flag-files.ts
var import_yaml = __toESM(require_dist(), 1);
var DEFAULT_FLAG_FILES = ["**/flags.json", "**/*.flags.json", "**/*.flagd.json", "**/flags.yaml", "**/flags.yml", "**/*.flags.yaml", "**/*.flags.yml"];
function flagDefinitions(text) {
  if (text === void 0) return /* @__PURE__ */ new Map();
  let value;
  try {
    value = (0, import_yaml.parse)(text, { maxAliasCount: 100 });
  } catch {
    return void 0;
  }
  if (value === null || typeof value !== "object" || Array.isArray(value)) return void 0;
  const record = value;
  const flags = record.flags !== null && typeof record.flags === "object" && !Array.isArray(record.flags) ? record.flags : record;
  return new Map(Object.entries(flags).map(([key, definition]) => [key, JSON.stringify(definition)]));
}
function flagDefinitionTouches(path, before, after) {
  const old = flagDefinitions(before) ?? /* @__PURE__ */ new Map();
  const now = flagDefinitions(after) ?? /* @__PURE__ */ new Map();
  const lineOf = (text, key) => {
    if (!text) return 1;
    const index = text.split("\n").findIndex((l) => l.includes(`"${key}"`) || l.includes(`'${key}'`) || new RegExp(`^\\s*${key.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}\\s*:`).test(l));
    return index < 0 ? 1 : index + 1;
  };
  const touches = [];
  for (const [key, definition] of now) {
    if (old.get(key) !== definition) touches.push({ key, file: path, line: lineOf(after, key), side: "added", via: "definition" });
  }
  for (const key of old.keys()) {
    if (!now.has(key)) touches.push({ key, file: path, line: lineOf(before, key), side: "removed", via: "definition" });
  }
  return touches;
}

// src/core/scan/aho-corasick.ts
function buildAutomaton(names) {
  const encoded = names.map((n) => new TextEncoder().encode(n));
  const classOf = new Uint8Array(256);
  let classes = 1;
  for (const bytes of encoded) for (const b of bytes) if (classOf[b] === 0) classOf[b] = classes++;
  if (classes > 255) throw new Error("too many distinct bytes in names");
  let capacity = 1 + encoded.reduce((s, b) => s + b.length, 0);
  let next = new Int32Array(capacity * classes).fill(-1);
  const output = new Int32Array(capacity).fill(-1);
  let states = 1;
  const duplicates = [];
  encoded.forEach((bytes, index) => {
    let s = 0;
    for (const b of bytes) {
      const slot = s * classes + classOf[b];
      if (next[slot] === -1) next[slot] = states++;
      s = next[slot];
    }
    if (output[s] === -1) output[s] = index;
    else duplicates.push([output[s], index]);
  });
  capacity = states;
  next = next.slice(0, capacity * classes);
  const fail = new Int32Array(capacity);
  const dictionary = new Int32Array(capacity).fill(-1);
  const queue = new Int32Array(capacity);
  let head = 0;
  let tail = 0;
  for (let c = 0; c < classes; c++) {
    const child = next[c];
    if (child === -1) next[c] = 0;
    else {
      fail[child] = 0;
      queue[tail++] = child;
    }
  }
  while (head < tail) {
    const s = queue[head++];
    const f = fail[s];
    dictionary[s] = output[f] !== -1 ? f : dictionary[f];
    for (let c = 0; c < classes; c++) {
      const slot = s * classes + c;
      const child = next[slot];
      if (child === -1) next[slot] = next[f * classes + c];
      else {
        fail[child] = next[f * classes + c];
        queue[tail++] = child;
      }
    }
  }
  const delta = new Int32Array(next.length);
  for (let i = 0; i < next.length; i++) delta[i] = next[i] * classes;
  const reports = new Uint8Array(capacity * classes);
  for (let s = 0; s < capacity; s++) reports[s * classes] = output[s] !== -1 || dictionary[s] !== -1 ? 1 : 0;
  const lengths = Int32Array.from(encoded, (b) => b.length);
  const twins = /* @__PURE__ */ new Map();
  for (const [first, other] of duplicates) twins.set(first, [...twins.get(first) ?? [], other]);
  return {
    names,
    lengths,
    search(bytes, onMatch) {
      let row = 0;
      for (let i = 0; i < bytes.length; i++) {
        row = delta[row + classOf[bytes[i]]];
        if (reports[row] === 0) continue;
        const s = row / classes;
        for (let t = output[s] !== -1 ? s : dictionary[s]; t !== -1; t = dictionary[t]) {
          const name = output[t];
          onMatch(name, i);
          const same = twins.get(name);
          if (same) for (const other of same) onMatch(other, i);
        }
      }
    }
  };
}

// src/core/scan/name-scan.ts
var QUOTES = /* @__PURE__ */ new Set([34, 39, 96]);
function looksBinary(bytes) {
  return bytes.subarray(0, 8e3).indexOf(0) !== -1;
}
function createNameScanner(names, callPatterns = []) {
  const unique = [...new Set(names)].filter((n) => n.length > 0 && !n.includes("\n"));
  const automaton = buildAutomaton(unique);
  const hits = unique.map(() => ({}));
  let files = 0;
  let bytesSeen = 0;
  let skippedBinary = 0;
  return {
    scanFile(path, bytes) {
      if (looksBinary(bytes)) {
        skippedBinary++;
        return;
      }
      files++;
      bytesSeen += bytes.length;
      let countedTo = 0;
      let line = 1;
      let lineStart = 0;
      const locate = (start, end) => {
        for (let nl = bytes.indexOf(10, countedTo); nl !== -1 && nl < end; nl = bytes.indexOf(10, nl + 1)) {
          line++;
          lineStart = nl + 1;
        }
        countedTo = end;
        return { file: path, line, column: start - lineStart + 1 };
      };
      automaton.search(bytes, (name, end) => {
        const h = hits[name];
        if (h.first && h.firstQuoted && (h.firstCall || callPatterns.length === 0)) return;
        const start = end - automaton.lengths[name] + 1;
        const here = locate(start, end);
        h.first ??= here;
        const quote = bytes[start - 1];
        if (quote === void 0 || !QUOTES.has(quote) || bytes[end + 1] !== quote) return;
        h.firstQuoted ??= here;
        if (!h.firstCall && callPatterns.length && isLoggedOnLine(bytes, lineStart, unique[name], callPatterns)) h.firstCall = here;
      });
    },
    results() {
      return new Map(unique.map((n, i) => [n, hits[i]]));
    },
    stats() {
      return { files, bytes: bytesSeen, skippedBinary };
    }
  };
}
function isLoggedOnLine(bytes, lineStart, name, patterns) {
  let lineEnd = bytes.indexOf(10, lineStart);
  if (lineEnd === -1) lineEnd = bytes.length;
  const line = Buffer.from(bytes.buffer, bytes.byteOffset + lineStart, lineEnd - lineStart).toString("utf8");
  for (const pattern of patterns) {
    pattern.lastIndex = 0;
    for (const match of line.matchAll(pattern)) if (match.groups?.event === name) return true;
  }
  return false;
}

// src/run/review-change.ts
async function reviewChange(options) {
  const { change } = options;
  const trackedAtHead = change.trackedFiles("head");
  const head = change.filesAt("head");
  const loaded = await loadWorkspace({ files: head, ...options.settingsPath ? { settingsPath: options.settingsPath } : {}, ...options.onProgress ? { onProgress: options.onProgress } : {} });
  if (!loaded.ok) return { kind: "settings-invalid", settingsFile: loaded.settingsFile, problems: loaded.settingsProblems };
  const { workspace } = loaded;
  const { settings } = workspace;
  const [changed, diffText] = await Promise.all([change.changedFiles(), change.diff()]);
  const diffs = parseUnifiedDiff(diffText);
  const changedPaths = new Set(changed.filter((f) => f.status !== "deleted").map((f) => f.path));
  const textual = diffs.filter((d) => !d.binary);
  const headPaths = textual.filter((d) => changedPaths.has(d.path)).map((d) => d.path);
  const basePaths = textual.map((d) => d.previousPath ?? d.path);
  const [headTexts, baseTexts] = await Promise.all([head.readTexts(headPaths), change.filesAt("base").readTexts(basePaths)]);
  const textAt = { added: new Map(headPaths.map((p, i) => [p, headTexts[i]])), removed: new Map(basePaths.map((p, i) => [p, baseTexts[i]])) };
  const isFlagFile = (0, import_picomatch2.default)(DEFAULT_FLAG_FILES, { dot: true });
  const definitionTouches = changed.filter((f) => isFlagFile(f.path) || f.previousPath !== void 0 && isFlagFile(f.previousPath)).flatMap((f) => flagDefinitionTouches(f.path, textAt.removed.get(f.previousPath ?? f.path), f.status === "deleted" ? void 0 : textAt.added.get(f.path)));
  const definedKeys = [...textAt.added.entries()].filter(([p]) => isFlagFile(p)).flatMap(([, text]) => [...flagDefinitions(text)?.keys() ?? []]);
  const knownKeys = /* @__PURE__ */ new Set([...workspace.registry.entries.flatMap((e) => e.flags), ...settings.exemptFlags, ...definedKeys]);
  const flagPatterns = flagPatternsOf(settings);
  const codeTouches = findFlagTouches({
    diffs: textual.filter((d) => !isFlagFile(d.path)),
    patterns: flagPatterns,
    knownKeys,
    textOf: (side, path) => textAt[side].get(path)
  });
  const touches = [...definitionTouches, ...codeTouches];
  const pr = options.pr ?? {};
  const links = linkPlans({ plans: workspace.plans, changedPaths, touches, pr });
  const linked = workspace.plans.filter((p) => links.has(p.plan.id)).map((p) => ({ loaded: p, reasons: links.get(p.plan.id), sizing: sizePlan(p.plan) }));
  const invalidPlanFiles = [...new Set(workspace.problems.filter((p) => p.severity === "error" && changedPaths.has(p.file)).map((p) => p.file))].map((file) => ({
    file,
    problems: workspace.problems.filter((p) => p.file === file)
  }));
  const running = runningEntries(workspace.registry.entries);
  const names = [.../* @__PURE__ */ new Set([...linked.flatMap((l) => eventsOfPlan(l.loaded.plan)), ...running.flatMap((e) => e.events)])];
  const logPatterns = logPatternsOf(settings);
  const scanner = createNameScanner(names, logPatterns);
  if (names.length) {
    const ownFiles = ownFilesOf(workspace);
    const inScope = scanMatcher(settings.scan);
    const paths = (await trackedAtHead).filter((p) => !ownFiles.has(p) && inScope(p));
    let done = 0;
    await change.streamFiles("head", paths, (path, bytes) => {
      scanner.scanFile(path, bytes);
      options.onProgress?.(++done, paths.length, "files");
    });
  }
  const runningEvents = new Set(running.flatMap((e) => e.events));
  const removedEvents = /* @__PURE__ */ new Map();
  for (const diff of textual) {
    for (const { line, text } of diff.removed) {
      for (const match of text.matchAll(QUOTED_STRING)) {
        const event = match[2];
        if (runningEvents.has(event) && !removedEvents.has(event)) {
          removedEvents.set(event, { file: diff.previousPath ?? diff.path, line, column: match.index + 2 });
        }
      }
    }
  }
  const review = buildReview(
    { settings, pr, linked, invalidPlanFiles, changedPaths: [...changedPaths], touches, registry: workspace.registry, events: scanner.results(), removedEvents },
    { base: change.base, head: change.head }
  );
  const stats = scanner.stats();
  return { kind: "review", review, scanned: { files: stats.files, bytes: stats.bytes } };
}

export {
  reviewChange
};
