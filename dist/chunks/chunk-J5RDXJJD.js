#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  outcomeSchema
} from "./chunk-KSA5GFQK.js";
import {
  BOUNDARY_KINDS
} from "./chunk-BXF2RWJM.js";
import {
  asDescription,
  calendarDate,
  external_exports,
  finiteNumber,
  kebabName,
  nonNegativeNumber,
  openShare,
  optionalText,
  positiveNumber,
  positiveShare,
  text,
  uniqueList,
  wholeNumber
} from "./chunk-7GKTQ2BG.js";

// src/core/plan/schema.ts
var PLAN_STATES = ["draft", "live", "on-hold", "concluded"];
var UNITS = ["user", "device", "session", "account", "team", "organization", "household", "region"];
var GROUP_UNITS = ["team", "organization", "household", "region"];
var SENSITIVE_AREAS = ["pricing", "legal", "regulatory", "minors", "health", "accessibility", "privacy"];
var DIRECTIONS = ["increase", "decrease"];
var planId = kebabName("a plan id in lower-case words joined by hyphens, e.g. checkout-wallet-first").describe(
  "Stable identifier of the plan, unique across the repository."
);
var flagKey = external_exports.string({ error: "a feature-flag key, e.g. wallet-first-checkout" }).regex(/^[A-Za-z0-9][A-Za-z0-9._:/-]{0,199}$/, { error: "a feature-flag key of letters, digits and . _ : / -, e.g. wallet-first-checkout" });
var eventName = external_exports.string({ error: "a logging event name, e.g. checkout_completed" }).regex(/^[^\s\n][^\n]{0,199}$/, { error: "a logging event name on one line, e.g. checkout_completed" });
var owner = text("an owner: a GitHub handle such as @ana-lima, a team such as @acme/growth, or an e-mail address");
var surfacePath = external_exports.string({ error: "a surface path of lower-case segments separated by /, e.g. checkout/payment" }).regex(/^[a-z0-9][a-z0-9_-]*(?:\/[a-z0-9][a-z0-9_-]*)*$/, {
  error: "a surface path of lower-case segments separated by /, e.g. checkout/payment"
});
var localeTag = external_exports.string({ error: "a BCP 47 locale tag, e.g. en-GB or pt-BR" }).regex(/^[A-Za-z]{2,3}(?:-[A-Za-z0-9]{2,8})*$/, { error: "a BCP 47 locale tag, e.g. en-GB or pt-BR" });
var platform = kebabName("a platform name in lower case, e.g. web, ios, android");
var direction = external_exports.enum(DIRECTIONS, { error: "increase or decrease" });
var percentage = (expected) => external_exports.number({ error: expected }).gte(0, { error: expected }).lte(100, { error: expected }).describe(asDescription(expected));
var effectSize = external_exports.strictObject(
  {
    relative: positiveNumber("a relative change as a fraction, e.g. 0.03 for 3%").optional(),
    absolute: positiveNumber("an absolute change in the metric\u2019s own units, e.g. 0.005 for half a percentage point").optional()
  },
  { error: "a mapping with relative (e.g. 0.03) or absolute (e.g. 0.005)" }
).refine((e) => e.relative === void 0 !== (e.absolute === void 0), {
  error: "exactly one of relative or absolute, e.g. relative: 0.03"
});
var moments = (what) => external_exports.strictObject(
  {
    mean: finiteNumber(`the ${what}\u2019s mean per unit, e.g. 2.4`),
    sd: nonNegativeNumber(`the ${what}\u2019s standard deviation per unit, e.g. 3.1`)
  },
  { error: `a mapping with mean and sd of the ${what}` }
).describe(`Per-unit mean and standard deviation of the ${what}.`);
var metricCommon = {
  name: kebabName("a metric name in lower-case words joined by hyphens, e.g. order-completed").describe("Name of the metric."),
  description: optionalText("a sentence describing the metric"),
  events: uniqueList(eventName, "a list of the logging events the metric is computed from, e.g. [order_completed]", 1, "at least one logging event, e.g. [order_completed]"),
  direction: direction.optional().describe("Desired direction. The primary metric defaults to the hypothesis direction."),
  tolerance: effectSize.optional().describe("Guardrails: the largest harm (movement against the desired direction) that is tolerated."),
  // Per-metric sizing settings (issue 13): each overrides the design's or the settings' default for this metric.
  alpha: openShare("a significance level for this metric strictly between 0 and 1, e.g. 0.05").optional(),
  power: openShare("a power for this metric strictly between 0 and 1, e.g. 0.8").optional(),
  "pre-period": external_exports.strictObject(
    {
      correlation: external_exports.number({ error: "a correlation from 0 to 0.99 between the metric and its pre-period value, e.g. 0.5" }).gte(0, { error: "a correlation from 0 to 0.99, e.g. 0.5" }).lte(0.99, { error: "a correlation from 0 to 0.99, e.g. 0.5 (closer to 1 the metric would hardly vary apart from its past: check the figure)" }).describe("Correlation of the metric with its own value before the test (CUPED)."),
      coverage: positiveShare("the share of units that have a pre-period value, in (0, 1], e.g. 0.7").default(1).describe("Share of units with a pre-period value; new units have none. The variance left is 1 - coverage \xD7 correlation\xB2.")
    },
    { error: "a mapping with correlation and coverage, e.g. { correlation: 0.5, coverage: 0.7 }" }
  ).optional().describe("Variance reduction from the metric\u2019s pre-period value (CUPED); overrides design.pre-period-correlation.")
};
var WITHIN_DAYS_MAX = 3650;
var withinDays = wholeNumber(`a whole number of days from 1 to ${WITHIN_DAYS_MAX}, e.g. 7`, 1, WITHIN_DAYS_MAX).optional().describe("Only events within this many days (24-hour periods) of the unit\u2019s first exposure count. Default: the settings\u2019 data.metric-window-days, else every event up to data-through.");
var perUnitEvents = (what) => uniqueList(eventName, `a list of events from the metric\u2019s events that ${what}, e.g. [order_placed]`, 1, `at least one event that ${what}, e.g. [order_placed]`).optional();
var PER_UNIT_VALUES = ["sum", "count"];
var perUnitValue = external_exports.enum(PER_UNIT_VALUES, { error: "sum (add up the events\u2019 value) or count (count the events)" }).optional().describe("sum: add up the value of the events (NULL adds nothing); count: count the events. Default: sum.");
var ratioSide = (side, example) => external_exports.strictObject({ events: perUnitEvents(`make the ${side}`), value: perUnitValue }, { error: `the ${side}: { events: [${example}], value: count }` }).optional().describe(`How each unit\u2019s ${side} is computed from its events.`);
var proportionPerUnit = external_exports.strictObject(
  {
    events: perUnitEvents("count for the unit (default: all of them)"),
    counts: external_exports.enum(["with-event", "without-event"], { error: "with-event or without-event" }).optional().describe("with-event: the share of units with one of the events (default); without-event: the share without any (e.g. abandonment)."),
    among: perUnitEvents("put a unit in the share\u2019s denominator (default: every exposed unit)").describe(
      "Take the share only among units with one of these events after exposure (e.g. units that viewed the basket)."
    ),
    "within-days": withinDays
  },
  { error: "a mapping with events, counts, among and within-days, e.g. { counts: without-event, events: [order_placed], among: [basket_viewed] }" }
).optional().describe("How each unit\u2019s 0/1 value is computed from its events (for the SQL query).");
var meanPerUnit = external_exports.strictObject({ events: perUnitEvents("count for the unit (default: all of them)"), value: perUnitValue, "within-days": withinDays }, { error: "a mapping with events, value and within-days, e.g. { value: count }" }).optional().describe("How each unit\u2019s value is computed from its events (for the SQL query).");
var ratioPerUnit = external_exports.strictObject(
  { numerator: ratioSide("numerator", "search_suggestion_clicked"), denominator: ratioSide("denominator", "search_performed"), "within-days": withinDays },
  { error: "a mapping with numerator, denominator and within-days, e.g. { numerator: { events: [click], value: count }, denominator: { events: [search], value: count } }" }
).optional().describe("How each unit\u2019s numerator and denominator are computed from its events (for the SQL query). Default with two events: the first over the second, each summing value.");
var proportionMetric = external_exports.strictObject({
  ...metricCommon,
  kind: external_exports.literal("proportion").describe("A share of units that do something (conversion, retention)."),
  "per-unit": proportionPerUnit,
  baseline: external_exports.strictObject(
    { rate: openShare("a baseline rate strictly between 0 and 1, e.g. 0.12") },
    { error: "a mapping with rate, e.g. { rate: 0.12 }" }
  ).describe("Baseline figures for sizing.")
});
var meanMetric = external_exports.strictObject({
  ...metricCommon,
  kind: external_exports.literal("mean").describe("An average per unit (revenue, items, latency)."),
  "per-unit": meanPerUnit,
  "capped-at": external_exports.number({ error: "a percentile above 50 and at most 100 at which values are capped, e.g. 99" }).gt(50, { error: "a percentile above 50 and at most 100, e.g. 99" }).lte(100, { error: "a percentile above 50 and at most 100, e.g. 99" }).optional().describe("Percentile at which each unit\u2019s value is capped (winsorized) in the analysis; give baseline.sd of the capped values."),
  baseline: external_exports.strictObject(
    {
      mean: finiteNumber("the metric\u2019s mean per unit, e.g. 42.5"),
      sd: positiveNumber("the standard deviation per unit, above 0, e.g. 30")
    },
    { error: "a mapping with mean and sd, e.g. { mean: 42.5, sd: 30 }" }
  ).describe("Baseline figures for sizing.")
});
var ratioMetric = external_exports.strictObject({
  ...metricCommon,
  kind: external_exports.literal("ratio").describe("A ratio of two sums whose denominator is not the randomization unit (clicks per session when users are randomized); variance by the delta method."),
  baseline: external_exports.strictObject(
    {
      numerator: moments("numerator"),
      denominator: moments("denominator").refine((d) => d.mean > 0, { error: "a denominator mean above 0", path: ["mean"] }),
      correlation: external_exports.number({ error: "the correlation of numerator and denominator per unit, between -1 and 1, e.g. 0.6" }).gte(-1, { error: "a correlation between -1 and 1" }).lte(1, { error: "a correlation between -1 and 1" }).default(0).describe("Correlation of numerator and denominator per unit.")
    },
    { error: "a mapping with numerator, denominator and correlation" }
  ).describe("Baseline figures for sizing: per-unit moments of the numerator and denominator."),
  "per-unit": ratioPerUnit,
  "denominator-may-move": external_exports.boolean({ error: "true or false" }).default(false).describe("True when the change may move the denominator itself (e.g. more sessions); the review then asks for numerator and denominator as secondary metrics.")
});
var metric = external_exports.discriminatedUnion("kind", [proportionMetric, meanMetric, ratioMetric], {
  error: "a metric whose kind is proportion, mean or ratio"
}).meta({ id: "metric", description: "A metric: its kind, baseline figures for sizing, and the events it is computed from." });
var arm = external_exports.strictObject(
  {
    name: kebabName("an arm name in lower-case words joined by hyphens, e.g. control"),
    weight: positiveNumber("a weight above 0, e.g. 50")
  },
  { error: "an arm: { name: control, weight: 50 }" }
).describe("One arm of the test.");
var ownersSchema = uniqueList(owner, "a list of owners, e.g. [@ana-lima]", 1, "at least one owner, e.g. [@ana-lima]").describe("People or teams accountable for the test; the digest mentions them.");
var flagsSchema = uniqueList(flagKey, "a list of the feature-flag keys the test reads, e.g. [wallet-first-checkout]", 1, "at least one feature-flag key, e.g. [wallet-first-checkout]").describe("Feature-flag keys that this plan randomizes.");
var stateSchema = external_exports.enum(PLAN_STATES, { error: `one of ${PLAN_STATES.join(", ")}` }).describe("Lifecycle: draft, live, on-hold or concluded.");
var windowSchema = external_exports.strictObject(
  {
    start: calendarDate("a start date written YYYY-MM-DD, e.g. 2026-11-02").optional(),
    end: calendarDate("an end date written YYYY-MM-DD, e.g. 2026-11-30").optional()
  },
  { error: "a mapping with start and end dates" }
).default({}).describe("Planned calendar window (UTC dates, both days included).");
var trafficSplitSchema = external_exports.strictObject(
  {
    name: kebabName("a traffic-split name, e.g. checkout-core").describe("Name of the pool of units the tests divide between them."),
    range: external_exports.strictObject(
      {
        start: percentage("where this test\u2019s range starts, in percent of the pool\u2019s units (0 to 100, included)"),
        end: percentage("where this test\u2019s range ends, in percent of the pool\u2019s units (0 to 100, excluded)")
      },
      { error: "a range of the pool\u2019s units in percent, e.g. { start: 0, end: 50 }" }
    ).describe("This test\u2019s range of the pool, in percent: start included, end excluded, so { start: 0, end: 50 } and { start: 50, end: 100 } take no unit twice.")
  },
  { error: "a mapping with name and range, e.g. { name: checkout-core, range: { start: 0, end: 50 } }" }
).describe("Tests with the same traffic-split name divide one pool of units: each takes its own range of it, and tests whose ranges do not overlap never collide.");
var oldTrafficSplitSchema = external_exports.strictObject(
  {
    name: kebabName("a traffic-split name, e.g. checkout-core"),
    slice: external_exports.strictObject(
      {
        from: percentage("where the range starts, in percent (0 to 100, included)"),
        to: percentage("where the range ends, in percent (0 to 100, excluded)")
      },
      { error: "a range in percent, e.g. { from: 0, to: 50 }" }
    ).describe("Now traffic-split.range (from is start, to is end).")
  },
  { error: "a mapping with name and slice" }
).meta({ deprecated: true, description: "Deprecated: the old name of traffic-split (slice.from and slice.to are now range.start and range.end). Still read, with a warning." });
var surfaceSchema = external_exports.strictObject(
  {
    path: surfacePath.describe("Where in the product the change lands, most general segment first."),
    "traffic-split": trafficSplitSchema.optional(),
    "exclusion-group": oldTrafficSplitSchema.optional(),
    "overlaps-with": uniqueList(planId, "a list of plan ids this plan may knowingly overlap with").default([])
  },
  { error: "a mapping with path, e.g. { path: checkout/payment }" }
).refine((s) => !(s["traffic-split"] && s["exclusion-group"]), {
  error: "traffic-split only; exclusion-group is its old name, so remove it",
  path: ["exclusion-group"]
}).describe("Where in the product the change lands, and how it may share that place with other tests.");
function trafficSplitOf(surface) {
  if (surface["traffic-split"]) return surface["traffic-split"];
  const old = surface["exclusion-group"];
  return old ? { name: old.name, range: { start: old.slice.from, end: old.slice.to } } : void 0;
}
function normalizeSurface(surface) {
  const split = trafficSplitOf(surface);
  return { path: surface.path, ...split ? { trafficSplit: split } : {}, overlapsWith: surface["overlaps-with"] };
}
var populationSchema = external_exports.strictObject(
  {
    platforms: uniqueList(platform, "a list of platforms, e.g. [web, ios]").default([]),
    locales: uniqueList(localeTag, "a list of locale tags, e.g. [en-GB, pt-BR]").default([]),
    regions: uniqueList(text("a region name or code, e.g. GB"), "a list of regions, e.g. [GB, PT]").default([]),
    segment: optionalText("a sentence naming the eligible segment, e.g. returning customers"),
    ready: external_exports.strictObject(
      {
        platforms: uniqueList(platform, "the platforms on which the change was checked, e.g. [web, ios]").default([]),
        locales: uniqueList(localeTag, "the locales into which the change is translated, e.g. [en-GB]").default([])
      },
      { error: "a mapping with platforms and locales the change is ready on" }
    ).default({ platforms: [], locales: [] }).describe("Where the change has been checked to work: rendered on each platform, translated for each locale.")
  },
  { error: "a mapping with platforms, locales, regions, segment and ready" }
).default({ platforms: [], locales: [], regions: [], ready: { platforms: [], locales: [] } }).describe("Who is eligible: platforms, locales, regions and segment.");
var amendmentsSchema = external_exports.array(
  external_exports.strictObject(
    {
      date: calendarDate("the date of the amendment written YYYY-MM-DD, e.g. 2026-11-20"),
      changed: text("what changed, in a sentence, e.g. guardrail order-errors tolerance 1% -> 2%"),
      reason: text("why the change was needed, in a sentence")
    },
    { error: "an amendment: { date: 2026-11-20, changed: ..., reason: ... }" }
  ),
  { error: "a list of amendments, each with date, changed and reason" }
).default([]).describe("Changes made after the test started, oldest first: date, what changed and why. Append only.");
var writtenPlanSchema = external_exports.strictObject({
  id: planId,
  title: text("a short title, e.g. Saved wallets shown before card entry"),
  owners: ownersSchema,
  flags: flagsSchema,
  state: stateSchema,
  window: windowSchema,
  hypothesis: external_exports.strictObject(
    {
      change: text("what the change does, in a sentence"),
      because: optionalText('why the change should work: the mechanism, not just "the metric goes up"'),
      "expected-direction": direction.describe("Expected direction of the primary metric.")
    },
    { error: "a mapping with change, because and expected-direction" }
  ).describe("The change, why it should work, and the expected direction of the primary metric."),
  unit: external_exports.strictObject(
    {
      randomization: external_exports.enum(UNITS, { error: `one of ${UNITS.join(", ")}` }).describe("The unit that is assigned to an arm."),
      analysis: external_exports.enum(UNITS, { error: `one of ${UNITS.join(", ")}` }).optional().describe("The unit metrics are averaged over; defaults to the randomization unit.")
    },
    { error: "a mapping with randomization (and analysis when it differs)" }
  ).describe("What is randomized, and what the metrics are averaged over when that differs."),
  surface: surfaceSchema,
  population: populationSchema,
  exposure: external_exports.strictObject(
    {
      event: eventName.optional().describe("The event logged when a unit is assigned and exposed."),
      reach: positiveShare("the share of exposed units that reach the changed experience, in (0, 1], e.g. 0.4").default(1).describe("Share of exposed units that actually reach the change; below 1 the effect is diluted.")
    },
    { error: "a mapping with event and reach" }
  ).default({ reach: 1 }).describe("When units count as exposed, and how many of them reach the change."),
  metrics: external_exports.strictObject(
    {
      primary: external_exports.union([metric, external_exports.array(metric)], { error: "one primary metric, written as a mapping" }).describe("Exactly one metric the decision rests on."),
      guardrails: external_exports.array(metric, { error: "a list of guardrail metrics" }).default([]).describe("Metrics that must not get worse beyond their tolerance."),
      secondary: external_exports.array(metric, { error: "a list of secondary metrics" }).default([]).describe("Metrics that explain the result; not decided on.")
    },
    { error: "a mapping with primary, guardrails and secondary" }
  ).describe("What the test is judged on."),
  design: external_exports.strictObject(
    {
      arms: external_exports.array(arm, { error: "a list of arms, e.g. [{ name: control, weight: 50 }, { name: treatment, weight: 50 }]" }).describe("Arms with relative weights; weights need not sum to 100.").min(2, { error: "at least two arms: a control and a treatment" }).default([
        { name: "control", weight: 50 },
        { name: "treatment", weight: 50 }
      ]),
      control: kebabName("the name of the control arm").optional().describe("Defaults to the first arm."),
      alpha: openShare("a significance level strictly between 0 and 1, e.g. 0.05").default(0.05),
      power: openShare("a power strictly between 0 and 1, e.g. 0.8").default(0.8),
      sides: external_exports.union([external_exports.literal(1), external_exports.literal(2)], { error: "1 or 2 (one- or two-sided test)" }).default(2).describe("A two-sided test (2) detects harm as well as gain."),
      "min-detectable-effect": effectSize.optional().describe("Smallest effect on the primary metric worth detecting."),
      "daily-units": positiveNumber("expected new eligible units per day (units not seen before), e.g. 12000").optional(),
      "traffic-share": positiveShare("the share of eligible units enrolled, in (0, 1], e.g. 0.5").optional().describe("Defaults to the width of the traffic-split range, or 1."),
      "interim-looks": wholeNumber("a whole number of interim analyses from 0 to 20", 0, 20).default(0),
      "interim-boundary": external_exports.enum(BOUNDARY_KINDS, { error: `one of ${BOUNDARY_KINDS.join(", ")}` }).default("obrien-fleming-spending").describe("Stopping boundary for interim looks: Lan-DeMets spending of O\u2019Brien-Fleming or Pocock type, or the classical constant boundaries."),
      "pre-period-correlation": external_exports.number({ error: "a correlation from 0 to 0.99 between the metric and its pre-period value, e.g. 0.5" }).describe("Correlation of the primary metric with its own pre-period value, for variance reduction (CUPED).").gte(0, { error: "a correlation from 0 to 0.99, e.g. 0.5" }).lte(0.99, { error: "a correlation from 0 to 0.99, e.g. 0.5 (closer to 1 the metric would hardly vary apart from its past: check the figure)" }).default(0),
      cluster: external_exports.strictObject(
        {
          "mean-size": external_exports.number({ error: "the mean number of units per group, at least 1, e.g. 8" }).gte(1, { error: "a mean group size of at least 1, e.g. 8" }).describe("Mean number of analysis units per randomized group."),
          icc: external_exports.number({ error: "an intra-cluster correlation from 0 to 1, e.g. 0.05" }).gte(0, { error: "an intra-cluster correlation from 0 to 1" }).lte(1, { error: "an intra-cluster correlation from 0 to 1" }).describe("Intra-cluster correlation of the primary metric."),
          "size-cv": nonNegativeNumber("the coefficient of variation of group sizes, e.g. 0.6").default(0)
        },
        { error: "a mapping with mean-size, icc and size-cv" }
      ).optional().describe("For group units: mean group size and intra-cluster correlation."),
      // Traffic as people arrive and groups that exist (issue 13).
      "unique-units": external_exports.array(
        external_exports.strictObject(
          {
            days: wholeNumber("a whole number of days from 1 to 3650, e.g. 7", 1, 3650),
            units: positiveNumber("the number of different eligible units seen over those days, e.g. 31000")
          },
          { error: "a point { days: 7, units: 31000 }" }
        ),
        { error: "a list of two points, e.g. [{ days: 7, units: 31000 }, { days: 28, units: 60000 }]" }
      ).length(2, { error: "exactly two points: the first 7 days and the planned window (or 28 days)" }).optional().describe("Different eligible units seen over the first days and over a longer span; sizing interpolates between them (a power law) because returning units do not add to the sample."),
      "groups-available": positiveNumber("the number of groups that exist to randomize, e.g. 400").optional().describe("For group units: how many groups exist; the review warns when the design needs more.")
    },
    { error: "a mapping of design settings" }
  ).default({
    arms: [
      { name: "control", weight: 50 },
      { name: "treatment", weight: 50 }
    ],
    alpha: 0.05,
    power: 0.8,
    sides: 2,
    "interim-looks": 0,
    "interim-boundary": "obrien-fleming-spending",
    "pre-period-correlation": 0
  }).describe("How the test is run and sized: arms, error rates, effect worth detecting, traffic."),
  decisions: external_exports.strictObject(
    {
      win: optionalText("what will be done on a significant win"),
      flat: optionalText("what will be done on a flat or inconclusive result"),
      loss: optionalText("what will be done on a significant loss"),
      "guardrail-breach": optionalText("what will be done when a guardrail is breached"),
      "launch-regardless": external_exports.strictObject({ reason: text("why the change ships whatever the result") }, { error: "a mapping with reason" }).optional().describe("Declare here when the change will launch whatever the result, and why.")
    },
    { error: "a mapping with win, flat, loss and guardrail-breach" }
  ).default({}).describe("Decision rules, written before launch."),
  sensitive: external_exports.array(
    external_exports.strictObject(
      {
        area: external_exports.enum(SENSITIVE_AREAS, { error: `one of ${SENSITIVE_AREAS.join(", ")}` }).describe("The kind of harm the test can do."),
        review: optionalText("the named review this area needs, e.g. pricing council"),
        reference: optionalText("a link or ticket for the review")
      },
      { error: "a mapping with area, review and reference" }
    ),
    { error: "a list of sensitive areas" }
  ).default([]).describe("Areas where the test can hurt someone, each with the named review it needs."),
  "bundle-rationale": optionalText("why several changes or flags are tested together").describe(
    "Required when the plan bundles several flags or changes."
  ),
  amendments: amendmentsSchema,
  notes: optionalText("free text"),
  outcome: outcomeSchema.optional()
}, { error: "a plan: a mapping with id, title, owners, flags, state, hypothesis, unit, surface and metrics" }).describe("A Plumbline experiment plan.");
function normalizePerUnit(written) {
  const { "within-days": withinDays2, ...rest } = written;
  return { ...rest, ...withinDays2 !== void 0 ? { withinDays: withinDays2 } : {} };
}
function normalizeMetric(written, fallbackDirection) {
  const { direction: direction2, "pre-period": prePeriod, "per-unit": perUnit, ...rest } = written;
  const chosen = direction2 ?? fallbackDirection;
  const renamed = { ...rest };
  if ("capped-at" in renamed) {
    renamed.cappedAt = renamed["capped-at"];
    delete renamed["capped-at"];
  }
  if ("denominator-may-move" in renamed) {
    renamed.denominatorMayMove = renamed["denominator-may-move"];
    delete renamed["denominator-may-move"];
  }
  return { ...renamed, ...prePeriod ? { prePeriod } : {}, ...perUnit ? { perUnit: normalizePerUnit(perUnit) } : {}, direction: chosen ?? "increase", directionAssumed: chosen === void 0 };
}
var PRIMARY_COUNT_CODE = "plan/primary-metric-count";
var planSchema = writtenPlanSchema.transform((written, ctx) => {
  const primaries = Array.isArray(written.metrics.primary) ? written.metrics.primary : [written.metrics.primary];
  if (primaries.length !== 1) {
    ctx.issues.push({
      code: "custom",
      input: written.metrics.primary,
      path: ["metrics", "primary"],
      message: primaries.length === 0 ? "one primary metric; the list is empty" : `one primary metric, not ${primaries.length}; move the others under secondary`,
      params: { code: PRIMARY_COUNT_CODE, summary: "a plan has exactly one primary metric" }
    });
    return external_exports.NEVER;
  }
  const d = written.design;
  const surface = normalizeSurface(written.surface);
  const range = surface.trafficSplit?.range;
  return {
    id: written.id,
    title: written.title,
    owners: written.owners,
    flags: written.flags,
    state: written.state,
    window: written.window,
    hypothesis: {
      change: written.hypothesis.change,
      ...written.hypothesis.because ? { because: written.hypothesis.because } : {},
      direction: written.hypothesis["expected-direction"]
    },
    unit: { randomization: written.unit.randomization, analysis: written.unit.analysis ?? written.unit.randomization },
    surface,
    population: written.population,
    exposure: written.exposure,
    metrics: {
      primary: normalizeMetric(primaries[0], written.hypothesis["expected-direction"]),
      guardrails: written.metrics.guardrails.map((m) => normalizeMetric(m, void 0)),
      secondary: written.metrics.secondary.map((m) => normalizeMetric(m, void 0))
    },
    design: {
      arms: d.arms,
      control: d.control ?? d.arms[0].name,
      alpha: d.alpha,
      power: d.power,
      sides: d.sides,
      ...d["min-detectable-effect"] ? { minDetectableEffect: d["min-detectable-effect"] } : {},
      ...d["daily-units"] !== void 0 ? { dailyUnits: d["daily-units"] } : {},
      trafficShare: d["traffic-share"] ?? (range ? Math.max(0, range.end - range.start) / 100 : 1),
      interimLooks: d["interim-looks"],
      interimBoundary: d["interim-boundary"],
      prePeriodCorrelation: d["pre-period-correlation"],
      ...d.cluster ? { cluster: { meanSize: d.cluster["mean-size"], icc: d.cluster.icc, sizeCv: d.cluster["size-cv"] } } : {},
      ...d["unique-units"] ? { uniqueUnits: [...d["unique-units"]].sort((a, b) => a.days - b.days) } : {},
      ...d["groups-available"] !== void 0 ? { groupsAvailable: d["groups-available"] } : {}
    },
    decisions: {
      ...written.decisions.win ? { win: written.decisions.win } : {},
      ...written.decisions.flat ? { flat: written.decisions.flat } : {},
      ...written.decisions.loss ? { loss: written.decisions.loss } : {},
      ...written.decisions["guardrail-breach"] ? { guardrailBreach: written.decisions["guardrail-breach"] } : {},
      ...written.decisions["launch-regardless"] ? { launchRegardless: written.decisions["launch-regardless"] } : {}
    },
    sensitive: written.sensitive,
    ...written["bundle-rationale"] ? { bundleRationale: written["bundle-rationale"] } : {},
    amendments: written.amendments,
    ...written.notes ? { notes: written.notes } : {},
    ...written.outcome ? { outcome: written.outcome } : {}
  };
});
var designShape = writtenPlanSchema.shape.design.unwrap().shape;
var clusterShape = designShape.cluster.unwrap().shape;
var SIZING_FLAG_FIELDS = {
  alpha: designShape.alpha.unwrap(),
  power: designShape.power.unwrap(),
  "daily-units": designShape["daily-units"].unwrap(),
  "traffic-share": designShape["traffic-share"].unwrap(),
  reach: writtenPlanSchema.shape.exposure.unwrap().shape.reach.unwrap(),
  "interim-looks": designShape["interim-looks"].unwrap(),
  "pre-period-correlation": designShape["pre-period-correlation"].unwrap(),
  "cluster-size": clusterShape["mean-size"],
  icc: clusterShape.icc,
  "size-cv": clusterShape["size-cv"].unwrap(),
  "groups-available": designShape["groups-available"].unwrap(),
  rate: proportionMetric.shape.baseline.shape.rate,
  mean: meanMetric.shape.baseline.shape.mean,
  sd: meanMetric.shape.baseline.shape.sd,
  "moment-mean": ratioMetric.shape.baseline.shape.numerator.shape.mean,
  "moment-sd": ratioMetric.shape.baseline.shape.numerator.shape.sd,
  "denominator-mean": ratioMetric.shape.baseline.shape.denominator.shape.mean,
  correlation: ratioMetric.shape.baseline.shape.correlation.unwrap(),
  "arm-weight": arm.shape.weight,
  effect: effectSize.shape.relative.unwrap(),
  "effect-absolute": effectSize.shape.absolute.unwrap()
};

export {
  GROUP_UNITS,
  planId,
  flagKey,
  eventName,
  surfacePath,
  ownersSchema,
  flagsSchema,
  stateSchema,
  windowSchema,
  surfaceSchema,
  normalizeSurface,
  populationSchema,
  amendmentsSchema,
  writtenPlanSchema,
  planSchema,
  SIZING_FLAG_FIELDS
};
