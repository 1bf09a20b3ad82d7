#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  runRules
} from "./chunk-26OHVEWY.js";
import {
  checkWritten,
  closestName,
  readYaml
} from "./chunk-4F4MJKFM.js";
import {
  planId
} from "./chunk-J5RDXJJD.js";
import {
  asDescription,
  calendarDate,
  external_exports,
  finiteNumber,
  kebabName,
  nonNegativeNumber
} from "./chunk-7GKTQ2BG.js";

// src/core/totals/rules.ts
var RELATIVE_SLACK = 1e-9;
function* groups(totals) {
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    yield { arm, path: ["arms", arm], group: totalsOfArm };
    for (const [i, day] of totalsOfArm.days.entries()) yield { arm, path: ["arms", arm, "days", i], group: day };
    for (const [i, week] of totalsOfArm.weeks.entries()) yield { arm, path: ["arms", arm, "weeks", i], group: week };
    for (const [i, segment] of totalsOfArm.segments.entries()) yield { arm, path: ["arms", arm, "segments", i], group: segment };
  }
}
function centredSquares(n, sum, sumSquares) {
  return { value: sumSquares - (n > 0 ? sum * sum / n : 0), slack: RELATIVE_SLACK * Math.max(sumSquares, 1) };
}
function checkSquares(ctx, path, n, sum, sumSquares, what) {
  const { value, slack } = centredSquares(n, sum, sumSquares);
  if (value >= -slack) return true;
  ctx.report({
    severity: "error",
    code: "totals/impossible-sums",
    path,
    message: `the sum of squares of ${what} is below (\u03A3y)\xB2/n${Number.isFinite(sum * sum / n) ? ` = ${Number((sum * sum / n).toPrecision(8))}` : " (too large to write)"}, which no data can give`,
    expected: "a sum of squares of at least (sum)\xB2 / n; check that it sums squares of per-unit values, not squares of the sum",
    showFound: true
  });
  return false;
}
function checkProducts(ctx, path, n, a, b, sumProducts) {
  if (n < 2) return;
  const saa = Math.max(0, a.sumSquares - a.sum * a.sum / n);
  const sbb = Math.max(0, b.sumSquares - b.sum * b.sum / n);
  const sab = sumProducts - a.sum * b.sum / n;
  const bound = Math.sqrt(saa * sbb);
  if (Math.abs(sab) <= bound + RELATIVE_SLACK * Math.max(Math.abs(sumProducts), bound, 1)) return;
  ctx.report({
    severity: "error",
    code: "totals/impossible-sums",
    path,
    message: "the sum of products implies a correlation outside -1 to 1, which no data can give",
    expected: "\u03A3xy \u2212 \u03A3x\u03A3y/n no larger in size than \u221A((\u03A3x\xB2 \u2212 (\u03A3x)\xB2/n)(\u03A3y\xB2 \u2212 (\u03A3y)\xB2/n))",
    showFound: true
  });
}
function checkPre(ctx, path, metric, pre) {
  if (!checkSquares(ctx, [...path, "pre-period", "sum-of-squares"], metric.n, pre.sum, pre.sumSquares, "the pre-period value")) return;
  checkProducts(ctx, [...path, "pre-period", "sum-of-products"], metric.n, metric, pre, pre.sumProducts);
}
function checkMetric(ctx, path, units, metric) {
  if (metric.n > units) {
    ctx.report({
      severity: "error",
      code: "totals/more-than-units",
      path: [...path, "n"],
      message: `n is ${metric.n}, more than the ${units} units exposed`,
      expected: `at most ${units} (the units exposed)`
    });
  }
  if (metric.kind === "proportion") {
    if (metric.sum > metric.n) {
      ctx.report({
        severity: "error",
        code: "totals/more-than-units",
        path: [...path, "units-with-event"],
        message: `${metric.sum} units with the event out of ${metric.n}`,
        expected: `at most ${metric.n} (each unit counts once however many events it has)`,
        showFound: false
      });
    } else if (metric.pre) checkPre(ctx, path, metric, metric.pre);
    return;
  }
  if (metric.kind === "mean") {
    if (checkSquares(ctx, [...path, "sum-of-squares"], metric.n, metric.sum, metric.sumSquares, "the metric value") && metric.pre) checkPre(ctx, path, metric, metric.pre);
    return;
  }
  const numeratorOk = checkSquares(ctx, [...path, "numerator", "sum-of-squares"], metric.n, metric.numerator.sum, metric.numerator.sumSquares, "the numerator");
  const denominatorOk = checkSquares(ctx, [...path, "denominator", "sum-of-squares"], metric.n, metric.denominator.sum, metric.denominator.sumSquares, "the denominator");
  if (numeratorOk && denominatorOk) checkProducts(ctx, [...path, "sum-of-products"], metric.n, metric.numerator, metric.denominator, metric.sumProducts);
}
var possibleSums = (ctx) => {
  for (const { path, group: group2 } of groups(ctx.value.totals)) {
    for (const [name, metric] of Object.entries(group2.metrics)) checkMetric(ctx, [...path, "metrics", name], group2.units, metric);
  }
};
var atLeastTwoArms = (ctx) => {
  if (Object.keys(ctx.value.totals.arms).length < 2) {
    ctx.report({ severity: "error", code: "totals/arm-count", path: ["arms"], message: "a readout compares arms; fewer than two are given", expected: "the totals of every arm of the plan" });
  }
};
var datesInOrder = (ctx) => {
  const { totals } = ctx.value;
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    const seen = /* @__PURE__ */ new Set();
    totalsOfArm.days.forEach((day, i) => {
      const path = ["arms", arm, "days", i, "date"];
      if (day.date > totals.dataThrough) {
        ctx.report({ severity: "error", code: "totals/date-after-data", path, message: `${day.date} is after data-through (${totals.dataThrough})`, expected: `a day on or before ${totals.dataThrough}` });
      }
      if (seen.has(day.date)) ctx.report({ severity: "error", code: "totals/duplicate-date", path, message: `${day.date} is listed twice`, expected: "each day once" });
      seen.add(day.date);
    });
    totalsOfArm.weeks.forEach((week, i) => {
      if (week.starting > totals.dataThrough) {
        ctx.report({ severity: "error", code: "totals/date-after-data", path: ["arms", arm, "weeks", i, "starting"], message: `${week.starting} is after data-through (${totals.dataThrough})`, expected: `a week starting on or before ${totals.dataThrough}` });
      }
    });
  }
};
var daysAddUp = (ctx) => {
  for (const [arm, totalsOfArm] of Object.entries(ctx.value.totals.arms)) {
    if (!totalsOfArm.days.length) continue;
    const sum = totalsOfArm.days.reduce((s, d) => s + d.units, 0);
    if (sum === totalsOfArm.units) continue;
    ctx.report({
      severity: sum > totalsOfArm.units ? "error" : "warning",
      code: "totals/days-sum",
      path: ["arms", arm, "days"],
      atKey: true,
      message: `the days add up to ${sum} units, the arm to ${totalsOfArm.units}${sum > totalsOfArm.units ? ": a unit is counted on more than one day" : ": some days are missing"}`,
      expected: "the units first exposed on each day, adding up to the arm\u2019s units"
    });
  }
};
var TOTALS_RULES = [atLeastTwoArms, possibleSums, datesInOrder, daysAddUp];
function planMetrics(plan) {
  return [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary];
}
var samePlan = (ctx) => {
  const { totals, plan } = ctx.value;
  if (plan && totals.planId !== plan.id) {
    ctx.report({ severity: "error", code: "totals/other-plan", path: ["plan"], message: `these totals are for plan "${totals.planId}", not "${plan.id}"`, expected: `plan: ${plan.id}` });
  }
};
var armsOfThePlan = (ctx) => {
  const { totals, plan } = ctx.value;
  if (!plan) return;
  const planned = plan.design.arms.map((a) => a.name);
  for (const arm of Object.keys(totals.arms)) {
    if (planned.includes(arm)) continue;
    const suggestion = closestName(arm, planned);
    ctx.report({
      severity: "error",
      code: "totals/unknown-arm",
      path: ["arms", arm],
      atKey: true,
      message: `arm "${arm}" is not in the plan${suggestion ? `; did you mean "${suggestion}"?` : ""}`,
      expected: `one of the plan's arms: ${planned.join(", ")}`
    });
  }
  const missing = planned.filter((a) => !(a in totals.arms));
  if (missing.length) {
    ctx.report({ severity: "error", code: "totals/missing-arm", path: ["arms"], message: `no totals for ${missing.map((a) => `"${a}"`).join(", ")}`, expected: `totals for every arm of the plan: ${planned.join(", ")}` });
  }
};
var metricsOfThePlan = (ctx) => {
  const { totals, plan } = ctx.value;
  if (!plan) return;
  const known = new Map(planMetrics(plan).map((m) => [m.name, m]));
  for (const { path, group: group2 } of groups(totals)) {
    for (const [name, metric] of Object.entries(group2.metrics)) {
      const registered = known.get(name);
      if (!registered) {
        const suggestion = closestName(name, [...known.keys()]);
        ctx.report({
          severity: "error",
          code: "totals/unknown-metric",
          path: [...path, "metrics", name],
          atKey: true,
          message: `metric "${name}" is not in the plan${suggestion ? `; did you mean "${suggestion}"?` : ""}: a metric chosen after the data is in is not a pre-registered result`,
          expected: `one of the plan's metrics: ${[...known.keys()].join(", ")}`
        });
      } else if (registered.kind !== metric.kind) {
        ctx.report({
          severity: "error",
          code: "totals/metric-kind",
          path: [...path, "metrics", name],
          message: `the plan registers "${name}" as a ${registered.kind} metric, but these are ${metric.kind} totals`,
          expected: registered.kind === "proportion" ? "{ units-with-event }" : registered.kind === "mean" ? "{ n, sum, sum-of-squares }" : "{ n, numerator, denominator, sum-of-products }"
        });
      }
    }
  }
  const primary = plan.metrics.primary.name;
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    if (!(primary in totalsOfArm.metrics)) {
      ctx.report({ severity: "error", code: "totals/missing-primary", path: ["arms", arm, "metrics"], message: `no totals for the primary metric "${primary}" in arm "${arm}"`, expected: `metrics.${primary}` });
    }
  }
};
var insideTheWindow = (ctx) => {
  const { totals, plan } = ctx.value;
  const start = plan?.window.start;
  if (!start) return;
  if (totals.dataThrough < start) {
    ctx.report({ severity: "error", code: "totals/before-start", path: ["data-through"], message: `the data runs through ${totals.dataThrough}, before the test started on ${start}`, expected: `a day on or after ${start}`, showFound: true });
  }
  for (const [arm, totalsOfArm] of Object.entries(totals.arms)) {
    totalsOfArm.days.forEach((day, i) => {
      if (day.date < start) ctx.report({ severity: "error", code: "totals/before-start", path: ["arms", arm, "days", i, "date"], message: `${day.date} is before the test started on ${start}`, expected: `a day on or after ${start}`, showFound: true });
    });
  }
};
var TOTALS_PLAN_RULES = [samePlan, armsOfThePlan, metricsOfThePlan, insideTheWindow];

// src/core/totals/schema.ts
var count = (expected) => external_exports.number({ error: expected }).int({ error: expected }).gte(0, { error: expected }).describe(asDescription(expected));
var sumOf = (what) => finiteNumber(`the sum of ${what} over the units, e.g. 10250.5`);
var squaresOf = (what) => nonNegativeNumber(`the sum of squares of ${what} over the units (0 or more), e.g. 84210.25`);
var prePeriod = external_exports.strictObject(
  {
    sum: sumOf("each unit\u2019s pre-period value"),
    "sum-of-squares": squaresOf("each unit\u2019s pre-period value"),
    "sum-of-products": finiteNumber("the sum over the units of the metric value times the pre-period value, e.g. 5120.75")
  },
  { error: "a mapping with sum, sum-of-squares and sum-of-products of the pre-period value" }
).describe("The same metric measured on the same units before the test (for variance reduction, CUPED).");
var proportionTotals = external_exports.strictObject(
  {
    "units-with-event": count("the number of units with the event, a whole number of 0 or more, e.g. 1520"),
    n: count("the number of units the share is taken over, a whole number of 0 or more (default: the units)").optional(),
    "pre-period": prePeriod.optional()
  },
  { error: "a mapping with units-with-event" }
).describe("A proportion metric: how many units had the event.");
var meanTotals = external_exports.strictObject(
  {
    n: count("the number of units the mean is taken over, a whole number of 0 or more, e.g. 12000"),
    sum: sumOf("the metric value"),
    "sum-of-squares": squaresOf("the metric value"),
    "pre-period": prePeriod.optional()
  },
  { error: "a mapping with n, sum and sum-of-squares" }
).describe("A mean metric: n, the sum and the sum of squares of the per-unit values.");
var sideOfRatio = (what) => external_exports.strictObject({ sum: sumOf(`each unit\u2019s ${what}`), "sum-of-squares": squaresOf(`each unit\u2019s ${what}`) }, { error: `a mapping with sum and sum-of-squares of the ${what}` }).describe(`Sums of each unit\u2019s ${what}.`);
var ratioTotals = external_exports.strictObject(
  {
    n: count("the number of units (the randomization unit), a whole number of 0 or more, e.g. 12000"),
    numerator: sideOfRatio("numerator"),
    denominator: sideOfRatio("denominator"),
    "sum-of-products": finiteNumber("the sum over the units of numerator times denominator, e.g. 40210")
  },
  { error: "a mapping with n, numerator, denominator and sum-of-products" }
).describe("A ratio metric: per-unit sums of numerator and denominator, their squares and their products.");
var metricTotals = external_exports.union([proportionTotals, meanTotals, ratioTotals], {
  error: "metric totals: { units-with-event } for a proportion, { n, sum, sum-of-squares } for a mean, or { n, numerator, denominator, sum-of-products } for a ratio"
}).meta({ id: "metricTotals", description: "The totals of one metric in one arm (or one day, week or segment of it)." });
var metricsMap = external_exports.record(kebabName("a metric name of the plan, e.g. order-completed"), metricTotals, { error: "a mapping of metric names to their totals" }).default({}).describe("Totals per metric, keyed by the metric\u2019s name in the plan.");
var unitsField = count("the number of units exposed, a whole number of 0 or more, e.g. 12000");
var group = { units: unitsField, metrics: metricsMap };
var armTotals = external_exports.strictObject(
  {
    ...group,
    days: external_exports.array(external_exports.strictObject({ date: calendarDate("a date written YYYY-MM-DD, e.g. 2026-11-09"), ...group }, { error: "a mapping with date, units and metrics" }), {
      error: "a list of days, e.g. [{ date: 2026-11-09, units: 7000 }]"
    }).default([]).describe("Per day: the units first exposed that day (and, optionally, metric totals of those units)."),
    weeks: external_exports.array(external_exports.strictObject({ starting: calendarDate("the week\u2019s first day written YYYY-MM-DD, e.g. 2026-11-09"), ...group }, { error: "a mapping with starting, units and metrics" }), {
      error: "a list of weeks, e.g. [{ starting: 2026-11-09, units: 49000, metrics: { ... } }]"
    }).default([]).describe("Per week of first exposure: units and metric totals (for the novelty check)."),
    segments: external_exports.array(
      external_exports.strictObject(
        { segment: external_exports.string({ error: 'a segment name, e.g. "platform: ios"' }).trim().min(1, { error: 'a segment name, e.g. "platform: ios"' }), ...group },
        { error: "a mapping with segment, units and metrics" }
      ),
      { error: 'a list of segments, e.g. [{ segment: "platform: ios", units: 5000, metrics: { ... } }]' }
    ).default([]).describe("Per segment: units and metric totals (exploratory).")
  },
  { error: "an arm\u2019s totals: a mapping with units and metrics" }
).describe("Totals of one arm.");
var writtenTotalsSchema = external_exports.strictObject(
  {
    plan: planId.describe("The id of the plan this readout is for."),
    "plan-commit": external_exports.string({ error: "the commit of the plan at launch, 7 to 40 hexadecimal digits, e.g. 4b1d2e7" }).regex(/^[0-9a-f]{7,40}$/, { error: "the commit of the plan at launch, 7 to 40 lower-case hexadecimal digits, e.g. 4b1d2e7" }).describe("The commit of the plan when the test launched: the rule read out is the one registered then."),
    "data-through": calendarDate("the last day the data covers, written YYYY-MM-DD, e.g. 2026-12-06").describe("The last day (UTC, included) the data covers."),
    arms: external_exports.record(kebabName("an arm name of the plan, e.g. control"), armTotals, { error: "a mapping of arm names to their totals" }).describe("Totals per arm, keyed by the arm\u2019s name in the plan."),
    excluded: external_exports.strictObject(
      {
        "several-arms": count("the number of units seen in two or more arms, a whole number of 0 or more, e.g. 12").default(0).describe("Units exposed in two or more arms, left out of every total: they break randomization."),
        "unknown-arm": count("the number of units whose exposures name an arm the plan does not have, a whole number of 0 or more, e.g. 3").default(0).describe("Units with exposures under an arm name the plan does not have; those exposures are left out.")
      },
      { error: "a mapping with several-arms and unknown-arm, e.g. { several-arms: 12, unknown-arm: 0 }" }
    ).optional().describe("Units left out of the totals, by reason (written by plumbline totals)."),
    notes: external_exports.string({ error: "free text" }).optional().describe("Free text: where the totals came from.")
  },
  { error: "arm totals: a mapping with plan, plan-commit, data-through and arms" }
).describe("Plumbline arm totals: the sufficient statistics of one readout.");
function normalizePre(pre) {
  return pre ? { pre: { sum: pre.sum, sumSquares: pre["sum-of-squares"], sumProducts: pre["sum-of-products"] } } : {};
}
function normalizeMetricTotals(written, units) {
  if ("units-with-event" in written) {
    const x = written["units-with-event"];
    return { kind: "proportion", n: written.n ?? units, sum: x, sumSquares: x, ...normalizePre(written["pre-period"]) };
  }
  if ("numerator" in written) {
    return {
      kind: "ratio",
      n: written.n,
      numerator: { sum: written.numerator.sum, sumSquares: written.numerator["sum-of-squares"] },
      denominator: { sum: written.denominator.sum, sumSquares: written.denominator["sum-of-squares"] },
      sumProducts: written["sum-of-products"]
    };
  }
  return { kind: "mean", n: written.n, sum: written.sum, sumSquares: written["sum-of-squares"], ...normalizePre(written["pre-period"]) };
}
function normalizeGroup(written) {
  return {
    units: written.units,
    metrics: Object.fromEntries(Object.entries(written.metrics).map(([name, m]) => [name, normalizeMetricTotals(m, written.units)]))
  };
}
var totalsSchema = writtenTotalsSchema.transform(
  (written) => ({
    planId: written.plan,
    planCommit: written["plan-commit"],
    dataThrough: written["data-through"],
    arms: Object.fromEntries(
      Object.entries(written.arms).map(([name, arm]) => [
        name,
        {
          ...normalizeGroup(arm),
          days: arm.days.map((d) => ({ date: d.date, ...normalizeGroup(d) })),
          weeks: arm.weeks.map((w) => ({ starting: w.starting, ...normalizeGroup(w) })),
          segments: arm.segments.map((s) => ({ segment: s.segment, ...normalizeGroup(s) }))
        }
      ])
    ),
    ...written.excluded ? { excluded: { severalArms: written.excluded["several-arms"], unknownArm: written.excluded["unknown-arm"] } } : {},
    ...written.notes !== void 0 ? { notes: written.notes } : {}
  })
);

// src/core/totals/load.ts
var TOTALS_LIMITS = { maxBytes: 1024 * 1024, maxAliases: 100 };
var TOTALS_SCHEMA_ID = "https://plumbline.dev/schema/totals.schema.json";
var cached;
function totalsJsonSchema() {
  cached ??= {
    $id: TOTALS_SCHEMA_ID,
    title: "Plumbline arm totals",
    ...external_exports.toJSONSchema(writtenTotalsSchema, { io: "input", target: "draft-2020-12" })
  };
  return cached;
}
function commitAsWritten(text, source) {
  const value = source.value;
  if (!value || typeof value !== "object" || typeof value["plan-commit"] !== "number") return;
  const at = source.locate(["plan-commit"]);
  const line = text.split(/\r?\n/)[at.line - 1] ?? "";
  const written = /^[0-9a-fA-F.eE+-]+/.exec(line.slice(at.column - 1))?.[0];
  if (written) value["plan-commit"] = written;
}
function loadTotals(text, file, plan) {
  const read = readYaml(text, file, TOTALS_LIMITS, "totals");
  if (!read.ok) return { ok: false, errors: read.problems, warnings: [] };
  commitAsWritten(text, read.source);
  const checked = checkWritten(read.source, totalsSchema, totalsJsonSchema, "totals");
  if (!checked.ok) return { ok: false, errors: checked.problems, warnings: [] };
  const problems = runRules({ totals: checked.value, ...plan ? { plan } : {} }, read.source, [...TOTALS_RULES, ...plan ? TOTALS_PLAN_RULES : []]);
  const errors = problems.filter((p) => p.severity === "error");
  const warnings = problems.filter((p) => p.severity === "warning");
  if (errors.length) return { ok: false, errors, warnings };
  return { ok: true, totals: checked.value, warnings };
}

export {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  totalsJsonSchema,
  loadTotals
};
