#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  sampleRatioMismatch
} from "./chunk-GIF3ITND.js";
import {
  loadTotals
} from "./chunk-TH3NNBTK.js";
import {
  finiteSizing
} from "./chunk-G6K6KKMR.js";
import {
  loadPlan
} from "./chunk-ZWIGW2MY.js";
import {
  sequentialBoundaries,
  sizePlan,
  spendingBoundaryAt
} from "./chunk-JLYO35IC.js";
import {
  normalCdf,
  normalQuantile,
  normalUpper,
  studentQuantile,
  studentUpper
} from "./chunk-B52SKDPA.js";
import {
  SRM_ALARM_P
} from "./chunk-BXF2RWJM.js";
import {
  countOf
} from "./chunk-ACAADDFF.js";
import {
  benjaminiHochberg
} from "./chunk-PTQPFAEX.js";

// src/core/plan/compare.ts
var NOT_SET = "(not set)";
function showValue(value) {
  if (value === void 0 || value === null) return NOT_SET;
  if (typeof value === "string") return value;
  if (typeof value === "number" || typeof value === "boolean") return String(value);
  if (Array.isArray(value)) return `[${value.map(showValue).join(", ")}]`;
  const entries = Object.entries(value).filter(([, v]) => v !== void 0);
  return `{ ${entries.map(([k, v]) => `${k}: ${showValue(v)}`).join(", ")} }`;
}
function metricFields(prefix, metric, withBaseline, into) {
  into.set(`${prefix}.name`, metric.name);
  into.set(`${prefix}.kind`, metric.kind);
  into.set(`${prefix}.events`, metric.events);
  into.set(`${prefix}.direction`, metric.direction);
  if (metric.tolerance) into.set(`${prefix}.tolerance`, metric.tolerance);
  if (metric.perUnit) into.set(`${prefix}.per-unit`, metric.perUnit);
  if (withBaseline) into.set(`${prefix}.baseline`, metric.baseline);
}
function decisiveFields(plan, started) {
  const fields = /* @__PURE__ */ new Map();
  metricFields("metrics.primary", plan.metrics.primary, started, fields);
  fields.set("metrics.guardrails", plan.metrics.guardrails.map((g) => g.name));
  for (const guardrail of plan.metrics.guardrails) metricFields(`metrics.guardrails[${guardrail.name}]`, guardrail, started, fields);
  fields.set("hypothesis.expected-direction", plan.hypothesis.direction);
  fields.set("design.min-detectable-effect", plan.design.minDetectableEffect);
  fields.set("design.alpha", plan.design.alpha);
  fields.set("design.power", plan.design.power);
  fields.set("design.sides", plan.design.sides);
  fields.set("design.arms", plan.design.arms);
  fields.set("design.control", plan.design.control);
  fields.set("design.interim-looks", plan.design.interimLooks);
  fields.set("design.interim-boundary", plan.design.interimBoundary);
  fields.set("unit.randomization", plan.unit.randomization);
  fields.set("unit.analysis", plan.unit.analysis);
  fields.set("exposure.event", plan.exposure.event);
  fields.set("decisions.win", plan.decisions.win);
  fields.set("decisions.flat", plan.decisions.flat);
  fields.set("decisions.loss", plan.decisions.loss);
  fields.set("decisions.guardrail-breach", plan.decisions.guardrailBreach);
  fields.set("decisions.launch-regardless", plan.decisions.launchRegardless?.reason);
  fields.set("window.start", plan.window.start);
  return fields;
}
function decisiveEntryFields(entry) {
  return /* @__PURE__ */ new Map([
    ["window.start", entry.window.start],
    ["flags", entry.flags],
    ["events", entry.events],
    ["traffic-share", entry.trafficShare]
  ]);
}
function writtenPathOf(field, guardrails) {
  const list = "metrics.guardrails[";
  if (!field.startsWith(list)) return field.split(".");
  const index = guardrails.findIndex((name) => field.startsWith(`${list}${name}].`));
  return index < 0 ? ["metrics", "guardrails"] : ["metrics", "guardrails", index, ...field.slice(list.length + guardrails[index].length + 2).split(".")];
}
function changedFields(before, after) {
  const changes = [];
  for (const field of /* @__PURE__ */ new Set([...before.keys(), ...after.keys()])) {
    const was = showValue(before.get(field));
    const now = showValue(after.get(field));
    if (was !== now) changes.push({ field, before: was, after: now });
  }
  return changes;
}

// src/core/plan/launch-rule.ts
function ruleFields(plan) {
  const fields = decisiveFields(plan, false);
  fields.set("window.end", plan.window.end);
  fields.set("design.pre-period-correlation", plan.design.prePeriodCorrelation);
  return fields;
}
var WHY = {
  "no-repository": () => "this folder is not a git repository",
  "no-commit": (commit) => `the commit ${commit} is not in this repository (a shallow clone, or a mistyped plan-commit)`,
  "no-file": (commit, file) => `${file} did not exist at ${commit}`,
  "no-history": () => "no git history is available here"
};
function launchRule(today, file, commit, atLaunch) {
  if (!atLaunch.found) return { status: "unavailable", plan: today, commit, why: WHY[atLaunch.reason](commit, file) };
  const loaded = loadPlan(atLaunch.text, file);
  if (!loaded.ok) return { status: "unavailable", plan: today, commit, why: `${file} at ${commit} does not load as a plan (${loaded.errors[0]?.field ?? "the file"}: ${loaded.errors[0]?.message ?? "invalid"})` };
  const then = loaded.loaded.plan;
  if (then.id !== today.id) return { status: "unavailable", plan: today, commit, why: `${file} held the plan ${then.id} at ${commit}` };
  const changes = changedFields(ruleFields(then), ruleFields(today));
  if (changes.length === 0) return { status: "same", plan: today, commit };
  const intact = then.amendments.every((a, i) => JSON.stringify(a) === JSON.stringify(today.amendments[i]));
  const added = intact ? today.amendments.slice(then.amendments.length) : [];
  if (added.length) return { status: "amended", plan: today, commit, changes, amendments: added };
  return { status: "changed", plan: { ...then, ...today.outcome ? { outcome: today.outcome } : {} }, commit, changes };
}

// src/core/readout/combine.ts
function addTotals(parts) {
  const [first, ...rest] = parts;
  if (!first || rest.some((p) => p.kind !== first.kind)) return void 0;
  if (first.kind === "ratio") {
    const ratios = parts;
    const sum = (pick) => ratios.reduce((s, r) => s + pick(r), 0);
    return {
      kind: "ratio",
      n: sum((r) => r.n),
      numerator: { sum: sum((r) => r.numerator.sum), sumSquares: sum((r) => r.numerator.sumSquares) },
      denominator: { sum: sum((r) => r.denominator.sum), sumSquares: sum((r) => r.denominator.sumSquares) },
      sumProducts: sum((r) => r.sumProducts)
    };
  }
  const simple = parts;
  return {
    kind: first.kind,
    n: simple.reduce((s, p) => s + p.n, 0),
    sum: simple.reduce((s, p) => s + p.sum, 0),
    sumSquares: simple.reduce((s, p) => s + p.sumSquares, 0)
  };
}

// src/core/readout/compare.ts
var NORMAL_DF = 1e7;
function welchDf(control, treatment) {
  if (control.df === void 0 || treatment.df === void 0) return void 0;
  const vc = control.variance;
  const vt = treatment.variance;
  const denominator = vc * vc / control.df + vt * vt / treatment.df;
  if (!(denominator > 0)) return void 0;
  return Math.min(NORMAL_DF, (vc + vt) * (vc + vt) / denominator);
}
function compareArms(control, treatment, settings) {
  const difference = treatment.value - control.value;
  const standardError = Math.sqrt(control.variance + treatment.variance);
  if (!(standardError > 0) || !Number.isFinite(standardError)) return { ok: false, reason: "no variation in either arm, so there is no interval to compute" };
  const df = settings.boundaryZ === void 0 ? welchDf(control, treatment) : void 0;
  const level = 1 - settings.alpha / settings.sides;
  const critical = settings.boundaryZ ?? (df !== void 0 ? studentQuantile(level, df) : normalQuantile(level));
  const statistic = difference / standardError;
  const upper = (x) => df !== void 0 ? studentUpper(x, df) : normalUpper(x);
  const pValue = settings.sides === 2 ? Math.min(1, 2 * upper(Math.abs(statistic))) : upper(settings.direction === "increase" ? statistic : -statistic);
  const comparison = {
    control,
    treatment,
    difference,
    standardError,
    interval: { low: difference - critical * standardError, high: difference + critical * standardError },
    statistic,
    ...df !== void 0 ? { df } : {},
    pValue,
    critical,
    confidence: 1 - 2 * settings.alpha / settings.sides
  };
  if (control.value !== 0) {
    const mc = control.value;
    const relativeSe = Math.sqrt(treatment.variance / (mc * mc) + treatment.value * treatment.value * control.variance / mc ** 4);
    const z = settings.boundaryZ ?? normalQuantile(level);
    const value = difference / Math.abs(mc);
    if (Number.isFinite(relativeSe) && Number.isFinite(value)) {
      comparison.relative = { value, standardError: relativeSe, interval: { low: value - z * relativeSe, high: value + z * relativeSe } };
    }
  }
  return { ok: true, comparison };
}

// src/core/readout/estimate.ts
function sampleVariance(n, sum, sumSquares) {
  return Math.max(0, (sumSquares - sum * sum / n) / (n - 1));
}
function sampleCovariance(n, sumA, sumB, sumProducts) {
  return (sumProducts - sumA * sumB / n) / (n - 1);
}
function estimateArm(totals, cuped) {
  if (totals.n < 2) return { ok: false, reason: `only ${totals.n} units: at least 2 per arm are needed` };
  const n = totals.n;
  if (totals.kind === "ratio") {
    const x = totals.denominator;
    const y = totals.numerator;
    if (!(x.sum > 0)) return { ok: false, reason: "the denominator sums to 0: the ratio is undefined" };
    const ratio = y.sum / x.sum;
    const meanX = x.sum / n;
    const variance2 = (sampleVariance(n, y.sum, y.sumSquares) - 2 * ratio * sampleCovariance(n, x.sum, y.sum, totals.sumProducts) + ratio * ratio * sampleVariance(n, x.sum, x.sumSquares)) / (n * meanX * meanX);
    return { ok: true, estimate: { n, value: ratio, variance: Math.max(0, variance2) } };
  }
  const mean = totals.sum / n;
  const df = totals.kind === "mean" ? { df: n - 1 } : {};
  if (cuped && totals.pre) {
    const pre = totals.pre;
    const theta = cuped.theta;
    const adjusted = mean - theta * (pre.sum / n - cuped.pooledPreMean);
    const variance2 = sampleVariance(n, totals.sum, totals.sumSquares) - 2 * theta * sampleCovariance(n, totals.sum, pre.sum, pre.sumProducts) + theta * theta * sampleVariance(n, pre.sum, pre.sumSquares);
    return { ok: true, estimate: { n, value: adjusted, variance: Math.max(0, variance2) / n, ...df } };
  }
  const variance = totals.kind === "proportion" ? mean * (1 - mean) / n : sampleVariance(n, totals.sum, totals.sumSquares) / n;
  return { ok: true, estimate: { n, value: mean, variance, ...df } };
}
function cupedAdjustment(arms) {
  if (arms.some((a) => !a.pre)) return void 0;
  const n = arms.reduce((s, a) => s + a.n, 0);
  const sumY = arms.reduce((s, a) => s + a.sum, 0);
  const sumYY = arms.reduce((s, a) => s + a.sumSquares, 0);
  const sumP = arms.reduce((s, a) => s + a.pre.sum, 0);
  const sumPP = arms.reduce((s, a) => s + a.pre.sumSquares, 0);
  const sumYP = arms.reduce((s, a) => s + a.pre.sumProducts, 0);
  if (n < 3) return void 0;
  const varP = sampleVariance(n, sumP, sumPP);
  const varY = sampleVariance(n, sumY, sumYY);
  if (!(varP > 0) || !(varY > 0)) return void 0;
  const cov = sampleCovariance(n, sumY, sumP, sumYP);
  const theta = cov / varP;
  return { theta, pooledPreMean: sumP / n, varianceReduction: Math.min(1, cov * cov / (varP * varY)) };
}

// src/core/readout/timing.ts
function plannedMaximumUnits(plan) {
  const primary = finiteSizing(sizePlan(plan)).metrics.find((m) => m.role === "primary");
  if (primary?.result.ok && primary.result.value.headline) return primary.result.value.headline.totalUnits;
  return void 0;
}
function readoutTiming(plan, dataThrough, unitsSeen, alphaPerComparison) {
  const plannedEnd = plan.window.end;
  const readEarly = plannedEnd !== void 0 && dataThrough < plannedEnd;
  const plannedUnits = plannedMaximumUnits(plan);
  const fraction = plannedUnits ? unitsSeen / plannedUnits : void 0;
  const timing = {
    ...plannedEnd ? { plannedEnd } : {},
    dataThrough,
    readEarly,
    ...fraction !== void 0 && Number.isFinite(fraction) ? { informationFraction: fraction, plannedUnits } : {}
  };
  const looks = plan.design.interimLooks + 1;
  if (!readEarly || looks === 1) return timing;
  const { interimBoundary: kind, sides } = plan.design;
  const t = Math.min(1, fraction ?? 1);
  const planned = Array.from({ length: looks }, (_, i) => (i + 1) / looks);
  let z;
  let look = looks;
  if ((kind === "obrien-fleming-spending" || kind === "pocock-spending") && t > 0) {
    const earlier = planned.filter((p) => p < t - 1e-9);
    look = earlier.length + 1;
    const boundary = spendingBoundaryAt(kind, alphaPerComparison, sides, [...earlier, t]);
    if (boundary.ok) z = boundary.value;
  } else {
    const bounds = sequentialBoundaries({ kind, looks, alpha: alphaPerComparison, sides });
    look = Math.max(1, Math.min(looks, Math.floor(t * looks + 1e-9)));
    if (bounds.ok) z = bounds.value.z[look - 1];
  }
  if (z === void 0 || !Number.isFinite(z)) return timing;
  return { ...timing, boundary: { z, nominalP: sides * normalUpper(z), look, looks } };
}

// src/core/readout/build-readout.ts
var NOVELTY_P = 0.01;
var SEVERAL_ARMS_BLOCK_SHARE = 0.01;
var LOW_POWER = 0.5;
function resolveThreshold(effect, controlValue) {
  if (!effect) return void 0;
  if (effect.absolute !== void 0) return effect.absolute;
  if (effect.relative !== void 0 && controlValue !== void 0 && controlValue !== 0) return effect.relative * Math.abs(controlValue);
  return void 0;
}
function metricTotalsOf(groups, metric) {
  return Object.fromEntries(Object.entries(groups).map(([arm, g]) => [arm, g?.metrics[metric]]));
}
function readMetric(ctx, metric, role, byArm, settings, segment) {
  const controlTotals = byArm[ctx.control];
  if (!controlTotals) return void 0;
  let cuped;
  if (settings.useCuped && controlTotals.kind !== "ratio") {
    const all = [ctx.control, ...ctx.treatments].map((a) => byArm[a]);
    if (all.every((t) => t !== void 0 && t.kind !== "ratio")) cuped = cupedAdjustment(all);
  }
  const controlEstimate = estimateArm(controlTotals, cuped);
  const controlValue = controlEstimate.ok ? controlEstimate.estimate.value : void 0;
  const arms = ctx.treatments.flatMap((arm) => {
    const totals = byArm[arm];
    if (!totals) return role === "segment" ? [] : [{ arm, ok: false, reason: `no totals for arm "${arm}"` }];
    const treatment = estimateArm(totals, cuped);
    if (!controlEstimate.ok) return [{ arm, ok: false, reason: `control: ${controlEstimate.reason}` }];
    if (!treatment.ok) return [{ arm, ok: false, reason: treatment.reason }];
    const compared = compareArms(controlEstimate.estimate, treatment.estimate, {
      alpha: settings.alpha,
      sides: settings.sides,
      direction: settings.direction,
      ...settings.boundaryZ !== void 0 ? { boundaryZ: settings.boundaryZ } : {}
    });
    return [compared.ok ? { arm, ok: true, comparison: compared.comparison } : { arm, ok: false, reason: compared.reason }];
  });
  if (arms.length === 0) return void 0;
  return {
    metric: metric.name,
    kind: metric.kind,
    role,
    ...segment !== void 0 ? { segment } : {},
    direction: metric.direction,
    ...cuped ? { cuped: { theta: cuped.theta, varianceReduction: cuped.varianceReduction } } : {},
    arms
  };
}
function good(direction) {
  return direction === "increase" ? 1 : -1;
}
function classifyPrimary(read, mde, early) {
  const s = good(read.direction);
  for (const arm of read.arms) {
    const c = arm.comparison;
    if (!c) continue;
    const lowGood = s === 1 ? c.interval.low : -c.interval.high;
    const highGood = s === 1 ? c.interval.high : -c.interval.low;
    if (lowGood > 0) arm.primaryClass = "win";
    else if (highGood < 0) arm.primaryClass = "loss";
    else if (!early && mde !== void 0 && c.interval.low > -mde && c.interval.high < mde) arm.primaryClass = "flat";
    else arm.primaryClass = "inconclusive";
  }
}
function classifyGuardrail(read, tolerance) {
  const harmSign = -good(read.direction);
  for (const arm of read.arms) {
    const c = arm.comparison;
    if (!c) continue;
    const estimate = harmSign * c.difference;
    const lower = harmSign === 1 ? c.interval.low : -c.interval.high;
    const upper = harmSign === 1 ? c.interval.high : -c.interval.low;
    arm.harm = { estimate, upperBound: upper };
    arm.guardrailClass = lower > 0 ? "breach" : tolerance !== void 0 && upper < tolerance ? "harm-ruled-out" : "harm-not-ruled-out";
  }
}
function bonferroni(read, k) {
  for (const arm of read.arms) if (arm.comparison) arm.adjustedP = Math.min(1, arm.comparison.pValue * k);
}
function checkSampleRatio(ctx) {
  const arms = [ctx.control, ...ctx.treatments];
  const weights = arms.map((a) => ctx.plan.design.arms.find((p) => p.name === a).weight);
  const units = arms.map((a) => ctx.totals.arms[a]?.units ?? 0);
  const overall = sampleRatioMismatch(units, weights, SRM_ALARM_P);
  if (!overall.ok) return void 0;
  const dates = [...new Set(arms.flatMap((a) => (ctx.totals.arms[a]?.days ?? []).map((d) => d.date)))].sort();
  const days = [];
  let daysChecked = 0;
  for (const date of dates) {
    const counts = arms.map((a) => ctx.totals.arms[a]?.days.find((d) => d.date === date)?.units);
    if (counts.some((c) => c === void 0)) continue;
    const check = sampleRatioMismatch(counts, weights, SRM_ALARM_P);
    if (!check.ok) continue;
    daysChecked++;
    if (check.value.mismatch) days.push({ date, units: counts, pValue: check.value.pValue });
  }
  return {
    threshold: SRM_ALARM_P,
    arms: arms.map((arm, i) => ({ arm, weight: weights[i], units: units[i], expected: overall.value.expected[i] })),
    statistic: overall.value.statistic,
    degreesOfFreedom: overall.value.degreesOfFreedom,
    pValue: overall.value.pValue,
    mismatch: overall.value.mismatch,
    days,
    daysChecked
  };
}
function noveltyCheck(ctx, metric) {
  const findings = [];
  const weeksOf = (arm) => [...ctx.totals.arms[arm]?.weeks ?? []].sort((a, b) => a.starting.localeCompare(b.starting));
  const control = weeksOf(ctx.control);
  if (control.length < 2) return findings;
  for (const arm of ctx.treatments) {
    const treatment = weeksOf(arm);
    const split = (weeks) => {
      const first2 = weeks[0]?.metrics[metric.name];
      const later2 = addTotals(weeks.slice(1).map((w) => w.metrics[metric.name]).filter((m) => m !== void 0));
      return first2 && later2 ? { first: first2, later: later2 } : void 0;
    };
    const c = split(control);
    const t = split(treatment);
    if (!c || !t || treatment[0]?.starting !== control[0]?.starting) continue;
    const effect = (a, b) => {
      const ea = estimateArm(a);
      const eb = estimateArm(b);
      if (!ea.ok || !eb.ok) return void 0;
      return { value: eb.estimate.value - ea.estimate.value, variance: ea.estimate.variance + eb.estimate.variance };
    };
    const first = effect(c.first, t.first);
    const later = effect(c.later, t.later);
    if (!first || !later) continue;
    const se = Math.sqrt(first.variance + later.variance);
    if (!(se > 0)) continue;
    const p = 2 * normalUpper(Math.abs(first.value - later.value) / se);
    if (p < NOVELTY_P) {
      findings.push({
        severity: "note",
        code: "readout/novelty",
        message: `${arm}: the first week's effect on ${metric.name} (${signed(first.value)}) differs from the later weeks' (${signed(later.value)}), p = ${formatP(p)}: a novelty or learning effect; the later weeks say more about the lasting effect.`
      });
    }
  }
  return findings;
}
function signed(x) {
  const text = Number(x.toPrecision(3)).toString();
  return x > 0 ? `+${text}` : text;
}
function formatP(p) {
  return p < 1e-3 ? p.toExponential(1) : p.toFixed(3);
}
function buildReadout(plan, totals) {
  const control = plan.design.control;
  const treatments = plan.design.arms.map((a) => a.name).filter((a) => a !== control);
  const k = Math.max(1, treatments.length);
  const alphaPerComparison = plan.design.alpha / k;
  const unitsSeen = Object.values(totals.arms).reduce((s, a) => s + a.units, 0);
  const timing = readoutTiming(plan, totals.dataThrough, unitsSeen, alphaPerComparison);
  const cupedRegistered = plan.design.prePeriodCorrelation > 0;
  const ctx = {
    plan,
    totals,
    control,
    treatments,
    alphaPerComparison,
    cupedRegistered,
    ...timing.boundary ? { boundaryZ: timing.boundary.z } : {}
  };
  const findings = [];
  const overall = Object.fromEntries([control, ...treatments].map((a) => [a, totals.arms[a]]));
  const srm = checkSampleRatio(ctx);
  if (srm?.mismatch) {
    findings.push({
      severity: "block",
      code: "readout/sample-ratio-mismatch",
      message: `Sample ratio mismatch: the units per arm do not fit the planned weights (p = ${formatP(srm.pValue)} < ${srm.threshold}). Nothing here is a result: find why assignment or logging lost units, fix it, and read again.`
    });
  }
  findings.push(...excludedUnitsFindings(totals, unitsSeen));
  if (srm && srm.days.length) {
    findings.push({
      severity: "warn",
      code: "readout/sample-ratio-mismatch-day",
      message: `The split alone raises the alarm on ${srm.days.length} of ${srm.daysChecked} days (${srm.days.map((d) => d.date).join(", ")}): check what changed in assignment or logging on those days.`
    });
  }
  if (timing.readEarly && !timing.boundary) {
    findings.push({
      severity: "block",
      code: "readout/read-early",
      message: `Read early: the data runs through ${totals.dataThrough}, before the planned end (${timing.plannedEnd}), and the plan registered no interim looks. Looking before the end and stopping on a good day inflates false wins; wait for the planned end.`
    });
  }
  const primaryMetric = plan.metrics.primary;
  const primaryRead = readMetric(ctx, primaryMetric, "primary", metricTotalsOf(overall, primaryMetric.name), {
    alpha: alphaPerComparison,
    sides: plan.design.sides,
    direction: primaryMetric.direction,
    ...ctx.boundaryZ !== void 0 ? { boundaryZ: ctx.boundaryZ } : {},
    useCuped: cupedRegistered
  }) ?? { metric: primaryMetric.name, kind: primaryMetric.kind, role: "primary", direction: primaryMetric.direction, arms: treatments.map((arm) => ({ arm, ok: false, reason: "no totals for the control arm" })) };
  const controlPrimary = primaryRead.arms.find((a) => a.comparison)?.comparison?.control.value;
  const mde = resolveThreshold(plan.design.minDetectableEffect, controlPrimary);
  if (mde !== void 0) primaryRead.minDetectableEffect = mde;
  bonferroni(primaryRead, k);
  classifyPrimary(primaryRead, mde, timing.readEarly);
  if (timing.boundary) {
    const crossed = primaryRead.arms.some((a) => a.primaryClass === "win" || a.primaryClass === "loss");
    findings.push({
      severity: "note",
      code: "readout/interim-look",
      message: `Interim analysis at ${formatShare(timing.informationFraction)} of the planned information (look ${timing.boundary.look} of ${timing.boundary.looks}): the ${plan.design.interimBoundary} boundary is |z| \u2265 ${timing.boundary.z.toFixed(3)} (nominal p ${formatP(timing.boundary.nominalP)}); ${crossed ? "crossed, so the test may stop here" : "not crossed: keep the test running to the next look or the planned end"}.`
    });
  }
  for (const arm of primaryRead.arms) {
    if (!arm.ok) findings.push({ severity: "block", code: "readout/primary-not-computed", message: `${primaryMetric.name}, ${arm.arm}: ${arm.reason}` });
  }
  if (mde === void 0) {
    findings.push({ severity: "note", code: "readout/no-minimum-effect", message: "The plan registers no minimum detectable effect, so no result can be called flat; a non-significant result is inconclusive." });
  }
  if (cupedRegistered) {
    if (!primaryRead.cuped) {
      findings.push({ severity: "warn", code: "readout/cuped-missing", message: `The plan was sized with variance reduction (pre-period correlation ${plan.design.prePeriodCorrelation}), but the totals give no usable pre-period sums for ${primaryMetric.name}: the interval is wider than planned.` });
    }
  } else if (Object.values(totals.arms).some((a) => Object.values(a.metrics).some((m) => m.kind !== "ratio" && m.pre))) {
    findings.push({ severity: "note", code: "readout/cuped-not-registered", message: "The totals carry pre-period sums, but the plan did not register variance reduction (design.pre-period-correlation), so they are not used: a method chosen after the data is in is not the registered test." });
  }
  const guardrails = [];
  for (const metric of plan.metrics.guardrails) {
    const harm = metric.direction === "increase" ? "decrease" : "increase";
    const read = readMetric(ctx, metric, "guardrail", metricTotalsOf(overall, metric.name), { alpha: alphaPerComparison, sides: 1, direction: harm, useCuped: cupedRegistered });
    if (!read) {
      findings.push({ severity: "block", code: "readout/guardrail-missing", message: `No totals for the guardrail ${metric.name}: a launch cannot show it did no harm.` });
      continue;
    }
    const controlValue = read.arms.find((a) => a.comparison)?.comparison?.control.value;
    const tolerance = resolveThreshold(metric.tolerance, controlValue);
    if (tolerance !== void 0) read.tolerance = tolerance;
    else findings.push({ severity: "warn", code: "readout/no-tolerance", message: `The guardrail ${metric.name} has no tolerance, so harm can never be ruled out; only a breach can be seen.` });
    bonferroni(read, k);
    classifyGuardrail(read, tolerance);
    guardrails.push(read);
  }
  const secondary = [];
  for (const metric of plan.metrics.secondary) {
    const read = readMetric(ctx, metric, "secondary", metricTotalsOf(overall, metric.name), { alpha: plan.design.alpha, sides: plan.design.sides, direction: metric.direction, useCuped: cupedRegistered });
    if (read) secondary.push(read);
    else findings.push({ severity: "note", code: "readout/secondary-missing", message: `No totals for the secondary metric ${metric.name}.` });
  }
  const segments = [];
  const allMetrics = [primaryMetric, ...plan.metrics.guardrails, ...plan.metrics.secondary];
  const segmentNames = [...new Set((totals.arms[control]?.segments ?? []).map((s) => s.segment))];
  for (const name of segmentNames) {
    const groups = Object.fromEntries([control, ...treatments].map((a) => [a, totals.arms[a]?.segments.find((s) => s.segment === name)]));
    for (const metric of allMetrics) {
      const read = readMetric(ctx, metric, "segment", metricTotalsOf(groups, metric.name), { alpha: plan.design.alpha, sides: plan.design.sides, direction: metric.direction, useCuped: false }, name);
      if (read) segments.push(read);
    }
  }
  const exploratory = [...secondary, ...segments].flatMap((m) => m.arms.filter((a) => a.comparison));
  const adjusted = benjaminiHochberg(exploratory.map((a) => a.comparison.pValue));
  if (adjusted.ok) {
    exploratory.forEach((arm, i) => {
      arm.adjustedP = adjusted.value[i];
      arm.exploratorySignal = adjusted.value[i] <= plan.design.alpha;
    });
  }
  const perArm = treatments.map((arm) => {
    const breached = guardrails.some((g) => g.arms.some((a) => a.arm === arm && a.guardrailClass === "breach"));
    const primaryClass = primaryRead.arms.find((a) => a.arm === arm)?.primaryClass ?? "inconclusive";
    return { arm, verdict: breached ? "guardrail-breach" : primaryClass };
  });
  let verdict;
  const armsWith = (v) => perArm.filter((a) => a.verdict === v).map((a) => a.arm);
  if (srm?.mismatch) verdict = "not-read";
  else if (armsWith("win").length) verdict = "win";
  else if (armsWith("guardrail-breach").length) verdict = "guardrail-breach";
  else if (armsWith("loss").length) verdict = "loss";
  else if (perArm.length && perArm.every((a) => a.verdict === "flat")) verdict = "flat";
  else verdict = "inconclusive";
  const verdictArms = verdict === "not-read" ? [] : armsWith(verdict);
  for (const g of guardrails) {
    for (const a of g.arms) {
      if (a.guardrailClass === "breach") findings.push({ severity: "block", code: "readout/guardrail-breach", message: `${a.arm} harms the guardrail ${g.metric} significantly${armsWith("guardrail-breach").includes(a.arm) && primaryRead.arms.find((p) => p.arm === a.arm)?.primaryClass === "win" ? ", which overrides its win on the primary metric" : ""}.` });
    }
  }
  const primaryFlatOverall = verdict === "flat" || verdict === "inconclusive";
  if (primaryFlatOverall) {
    for (const s of segments) {
      if (s.metric !== primaryMetric.name) continue;
      for (const a of s.arms) {
        const c = a.comparison;
        if (a.exploratorySignal && c && good(s.direction) * c.difference > 0) {
          findings.push({
            severity: "note",
            code: "readout/segment-pattern",
            message: `Flat overall, but ${a.arm} wins in the segment "${s.segment}" (Benjamini\u2013Hochberg adjusted p = ${formatP(a.adjustedP)}): a pattern to confirm with a new test on that segment, not a result.`
          });
        }
      }
    }
  }
  findings.push(...noveltyCheck(ctx, primaryMetric));
  if (verdict === "win" || verdict === "loss") {
    for (const arm of primaryRead.arms) {
      const c = arm.comparison;
      if (!c || arm.primaryClass !== "win" && arm.primaryClass !== "loss") continue;
      const effect = mde ?? Math.abs(c.difference);
      const power = normalCdf(effect / c.standardError - c.critical);
      if (power < LOW_POWER) {
        findings.push({
          severity: "note",
          code: "readout/winners-curse",
          message: `${arm.arm}: this readout had ${formatShare(power)} power at ${mde !== void 0 ? "the minimum detectable effect" : "the observed effect"}; a significant estimate from an underpowered test usually overstates the true effect (the winner's curse). Expect a smaller effect after launch.`
        });
      }
    }
  }
  if (plan.sensitive.length && (verdict === "win" || verdict === "loss")) {
    findings.push({
      severity: "note",
      code: "readout/sensitive",
      message: `This test touches ${plan.sensitive.map((s) => s.area).join(", ")}: before acting on the result, take it to ${plan.sensitive.map((s) => s.review ?? `the ${s.area} review`).join(", ")}; local law and licensed practice come before this rule.`
    });
  }
  const rule = verdict === "win" ? "win" : verdict === "loss" ? "loss" : verdict === "guardrail-breach" ? "guardrail-breach" : verdict === "not-read" ? void 0 : "flat";
  const text = rule === "win" ? plan.decisions.win : rule === "loss" ? plan.decisions.loss : rule === "guardrail-breach" ? plan.decisions.guardrailBreach : rule === "flat" ? plan.decisions.flat : void 0;
  return {
    planId: plan.id,
    title: plan.title,
    planCommit: totals.planCommit,
    dataThrough: totals.dataThrough,
    control,
    treatments,
    alpha: plan.design.alpha,
    sides: plan.design.sides,
    alphaPerComparison,
    ...srm ? { srm } : {},
    timing,
    primary: primaryRead,
    guardrails,
    secondary,
    segments,
    verdict,
    verdictArms,
    ...rule && text ? { decision: { rule, text } } : {},
    findings
  };
}
function excludedUnitsFindings(totals, unitsKept) {
  const findings = [];
  const several = totals.excluded?.severalArms ?? 0;
  if (several > 0) {
    const share = several / (several + unitsKept);
    const block = share > SEVERAL_ARMS_BLOCK_SHARE;
    findings.push({
      severity: block ? "block" : "warn",
      code: "readout/units-in-several-arms",
      message: `${countOf(several, "unit")} (${formatShare(share)} of those exposed) ${several === 1 ? "was" : "were"} seen in more than one arm and are left out of every total: assignment was not sticky for them, which breaks randomization${block ? `. Above ${formatShare(SEVERAL_ARMS_BLOCK_SHARE)} the arms left may not be comparable: find why units switch arms (ids reused across devices, a flag re-evaluated with other attributes, a changed split), fix it, and read again.` : "; a small share costs little, but find out why."}`
    });
  }
  const unknown = totals.excluded?.unknownArm ?? 0;
  if (unknown > 0) {
    findings.push({
      severity: "warn",
      code: "readout/unknown-arm",
      message: `${countOf(unknown, "unit")} ${unknown === 1 ? "has" : "have"} exposures under an arm name the plan does not have; those exposures are left out. Check the flag's variations against the plan's arms.`
    });
  }
  return findings;
}
function formatShare(x) {
  if (x === void 0 || !Number.isFinite(x)) return "an unknown share";
  return `${(x * 100).toFixed(x < 0.1 ? 1 : 0)}%`;
}
function armsToShip(read) {
  if (read.verdict === "not-read") return [];
  return read.verdict === "win" ? read.verdictArms : [read.control];
}

// src/core/readout/launch-note.ts
var listChanges = (changes) => changes.map((c) => `${c.field} (${c.before} \u2192 ${c.after})`).join("; ");
function findingOf(rule) {
  switch (rule.status) {
    case "same":
      return void 0;
    case "changed":
      return {
        severity: "block",
        code: "readout/rule-changed",
        message: `The rule was changed after launch (plan-commit ${rule.commit}) without an amendment: ${listChanges(rule.changes)}. This readout applies the rule as registered at launch; a rule changed after the data came in lets the result be chosen.`
      };
    case "amended":
      return {
        severity: "note",
        code: "readout/rule-amended",
        message: `The plan was amended after launch (plan-commit ${rule.commit}): ${rule.amendments.map((a) => `on ${a.date}, \u201C${a.changed}\u201D because \u201C${a.reason}\u201D`).join("; ")}. This readout applies the amended rule (${listChanges(rule.changes)}).`
      };
    case "unavailable":
      return {
        severity: "warn",
        code: "readout/launch-plan-unavailable",
        message: `The plan as registered at launch cannot be read: ${rule.why}. This readout uses today's plan, which may not be the rule registered at launch.`
      };
  }
}
function withLaunchRule(readout, rule) {
  const source = rule.status === "same" ? { status: "same", commit: rule.commit } : rule.status === "unavailable" ? { status: "unavailable", commit: rule.commit, why: rule.why } : rule.status === "amended" ? { status: "amended", commit: rule.commit, changes: rule.changes, amendments: rule.amendments } : { status: "changed", commit: rule.commit, changes: rule.changes };
  const finding = findingOf(rule);
  return { ...readout, rule: source, findings: finding ? [finding, ...readout.findings] : readout.findings };
}

// src/run/read-totals.ts
async function readTotalsAgainstPlan(options) {
  const { plan, planFile, totalsFile, totalsText } = options;
  const bare = loadTotals(totalsText, totalsFile);
  if (!bare.ok) return bare;
  const commit = bare.totals.planCommit;
  const atLaunch = options.history ? await options.history.fileAt(commit, planFile) : { found: false, reason: "no-history" };
  const rule = launchRule(plan, planFile, commit, atLaunch);
  const loaded = loadTotals(totalsText, totalsFile, rule.plan);
  if (!loaded.ok) return loaded;
  return { ok: true, readout: withLaunchRule(buildReadout(rule.plan, loaded.totals), rule), warnings: loaded.warnings };
}
var isTotalsPath = (path) => /\.ya?ml$/i.test(path) && (/(?:^|\/)readouts\//.test(path) || /\.totals\.ya?ml$/i.test(path));
function latestByPlan(texts, wanted) {
  const latest = /* @__PURE__ */ new Map();
  for (const { file, text } of [...texts].sort((a, b) => a.file < b.file ? -1 : a.file > b.file ? 1 : 0)) {
    if (text === void 0 || !isTotalsPath(file)) continue;
    if (wanted && ![...wanted].some((id) => text.includes(id))) continue;
    const loaded = loadTotals(text, file);
    if (!loaded.ok || wanted && !wanted.has(loaded.totals.planId)) continue;
    const was = latest.get(loaded.totals.planId);
    if (!was || loaded.totals.dataThrough >= was.through) latest.set(loaded.totals.planId, { file, text, through: loaded.totals.dataThrough });
  }
  return new Map([...latest].map(([id, { file, text }]) => [id, { file, text }]));
}
async function latestTotals(planIds, paths, files) {
  if (planIds.length === 0) return /* @__PURE__ */ new Map();
  const candidates = paths.filter(isTotalsPath);
  const texts = await files.readTexts(candidates);
  return latestByPlan(candidates.map((file, i) => ({ file, text: texts[i] })), new Set(planIds));
}

export {
  showValue,
  decisiveFields,
  decisiveEntryFields,
  writtenPathOf,
  changedFields,
  armsToShip,
  readTotalsAgainstPlan,
  latestByPlan,
  latestTotals
};
