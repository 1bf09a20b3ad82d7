#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  OUTCOME_CLASSES
} from "./chunk-MGCIOLH6.js";
import {
  external_exports
} from "./chunk-5GP5B2QS.js";

// src/core/review/report-schema.ts
var location = external_exports.object({ file: external_exports.string(), line: external_exports.number().int().positive(), column: external_exports.number().int().positive() });
var severity = external_exports.enum(["block", "warn", "note"]);
var analysisSize = external_exports.object({
  perArm: external_exports.array(external_exports.object({ arm: external_exports.string(), units: external_exports.number().int() })),
  totalUnits: external_exports.number().int(),
  clusters: external_exports.number().int().optional(),
  clustersPerArm: external_exports.array(external_exports.object({ arm: external_exports.string(), groups: external_exports.number().int() })).optional(),
  duration: external_exports.object({ days: external_exports.number().int(), weeks: external_exports.number().int() }).optional()
});
var change = external_exports.object({ absolute: external_exports.number(), relative: external_exports.number(), to: external_exports.number() });
var sizeResult = external_exports.union([
  external_exports.object({
    ok: external_exports.literal(true),
    value: external_exports.object({
      baselineValue: external_exports.number(),
      sd: external_exports.number().optional(),
      effect: change.extend({ from: external_exports.number() }).optional(),
      multipliers: external_exports.object({
        comparisons: external_exports.number(),
        alphaPerComparison: external_exports.number(),
        designEffect: external_exports.number(),
        varianceReduction: external_exports.number(),
        sequential: external_exports.number(),
        dilutionUnits: external_exports.number(),
        dilutionDays: external_exports.number()
      }),
      boundaries: external_exports.object({ kind: external_exports.enum(["obrien-fleming-spending", "pocock-spending", "obrien-fleming", "pocock"]), z: external_exports.array(external_exports.number()), nominalP: external_exports.array(external_exports.number()) }).optional(),
      triggered: analysisSize.optional(),
      diluted: analysisSize.optional(),
      headline: analysisSize.optional(),
      atPlannedEnd: external_exports.object({
        days: external_exports.number().int(),
        totalUnits: external_exports.number(),
        power: external_exports.number().optional(),
        /** Why there is no power at the planned end (too few units by then). */
        noPower: external_exports.object({ reason: external_exports.string(), tooFewUnits: external_exports.literal(true).optional() }).optional(),
        detectable: change.optional(),
        /** Why no change within the metric's range is detectable by then. */
        noneDetectable: external_exports.object({ reason: external_exports.string() }).optional()
      }).optional(),
      powerByDay: external_exports.array(external_exports.object({ day: external_exports.number().int(), power: external_exports.number() })).optional(),
      traffic: external_exports.union([
        external_exports.object({ kind: external_exports.literal("daily"), perDay: external_exports.number() }),
        external_exports.object({ kind: external_exports.literal("unique"), points: external_exports.array(external_exports.object({ days: external_exports.number().int(), units: external_exports.number() })), exponent: external_exports.number() })
      ]).optional(),
      feasibility: external_exports.object({ feasible: external_exports.boolean(), longestDays: external_exports.number().int(), reason: external_exports.string().optional(), detectableAtLongest: change.optional(), noneDetectableAtLongest: external_exports.object({ reason: external_exports.string() }).optional() }).optional(),
      squareRootAllocation: external_exports.object({ controlWeight: external_exports.number(), treatmentWeight: external_exports.number(), totalUnits: external_exports.number().int(), unitsSaved: external_exports.number().int() }).optional(),
      notes: external_exports.array(external_exports.string())
    })
  }),
  external_exports.object({ ok: external_exports.literal(false), error: external_exports.object({ input: external_exports.string(), message: external_exports.string() }) })
]);
var reviewReportSchema = external_exports.object({
  format: external_exports.literal("plumbline.review/1"),
  verdict: external_exports.enum(["blocked", "warnings", "clear", "nothing-to-check", "partial"]),
  counts: external_exports.object({
    block: external_exports.number().int().describe("Blocking findings this change introduces."),
    warn: external_exports.number().int().describe("Warnings this change introduces."),
    note: external_exports.number().int().describe("Notes this change introduces."),
    known: external_exports.number().int().describe("Findings of any severity that already held at the base commit (origin: known).")
  }).describe("The counts the text and Markdown reports show: findings this change introduces, by severity, and how many were already known before it. The verdict reads every finding: a known blocking finding still blocks."),
  base: external_exports.string().regex(/^[0-9a-f]{40,64}$/),
  head: external_exports.string().regex(/^[0-9a-f]{40,64}$/),
  findings: external_exports.array(
    external_exports.object({
      code: external_exports.string(),
      severity,
      message: external_exports.string(),
      fix: external_exports.string(),
      plan: external_exports.string().optional(),
      file: external_exports.string().optional(),
      line: external_exports.number().int().positive().optional(),
      side: external_exports.enum(["base", "head"]).optional().describe("Set with file: the commit file and line are read at. base: a place the change removes (a deleted line, a deleted plan), where the same line at head is something else; head otherwise."),
      origin: external_exports.enum(["introduced", "known"]).describe("introduced: this change brought it; known: the same finding already held for the plan at the base commit"),
      changes: external_exports.array(external_exports.object({ field: external_exports.string(), before: external_exports.string(), after: external_exports.string() })).optional().describe("Frozen-plan findings: each changed field of a started test\u2019s plan, as written at the base commit and at head."),
      amendment: external_exports.object({ date: external_exports.string(), changed: external_exports.string(), reason: external_exports.string() }).optional().describe("plan-amended: the amendment the change records."),
      dependents: external_exports.array(external_exports.string()).optional().describe("event-removed and test-ended-early: ids of the running tests that depend on what the change removes.")
    })
  ),
  plans: external_exports.array(
    external_exports.object({
      id: external_exports.string(),
      title: external_exports.string(),
      file: external_exports.string(),
      line: external_exports.number().int(),
      state: external_exports.string(),
      owners: external_exports.array(external_exports.string()),
      reasons: external_exports.array(external_exports.enum(["named in the description", "plan file changed", "flag touched", "readout changed"])),
      checklist: external_exports.array(external_exports.object({ label: external_exports.string(), done: external_exports.boolean() })),
      sizing: external_exports.object({
        planId: external_exports.string(),
        plannedDays: external_exports.number().int().optional(),
        dailyUnits: external_exports.number().optional(),
        uniqueUnits: external_exports.array(external_exports.object({ days: external_exports.number().int(), units: external_exports.number() })).optional(),
        family: external_exports.object({ primaryPower: external_exports.number(), noFalseAlarm: external_exports.number(), allGuardrailsClear: external_exports.number() }).optional(),
        /** Why the family's power is left out (a metric has no power by the planned end). */
        familyOmitted: external_exports.object({ reason: external_exports.string() }).optional(),
        metrics: external_exports.array(
          external_exports.object({
            metric: external_exports.string(),
            role: external_exports.enum(["primary", "guardrail"]),
            kind: external_exports.enum(["proportion", "mean", "ratio"]),
            direction: external_exports.enum(["increase", "decrease"]),
            sides: external_exports.union([external_exports.literal(1), external_exports.literal(2)]),
            alpha: external_exports.number(),
            power: external_exports.number(),
            guardrailLooks: external_exports.object({ looks: external_exports.number().int(), falseAlarm: external_exports.number() }).optional(),
            result: sizeResult
          })
        )
      }),
      power: external_exports.number(),
      window: external_exports.object({ start: external_exports.string().optional(), end: external_exports.string().optional() }),
      events: external_exports.array(external_exports.object({ event: external_exports.string(), roles: external_exports.array(external_exports.string()), location: location.optional(), via: external_exports.enum(["call", "literal"]).optional(), mentionedAt: location.optional() })),
      readout: external_exports.object({
        file: external_exports.string(),
        verdict: external_exports.enum(["win", "loss", "flat", "inconclusive", "guardrail-breach", "not-read"]),
        arms: external_exports.array(external_exports.string()),
        decision: external_exports.string().optional(),
        recorded: external_exports.enum(OUTCOME_CLASSES).optional(),
        primary: external_exports.looseObject({ metric: external_exports.string(), kind: external_exports.string(), direction: external_exports.string(), arms: external_exports.array(external_exports.looseObject({ arm: external_exports.string(), ok: external_exports.boolean() })) }).optional().describe("The primary metric as the readout computed it (plumbline readout --format json gives the same)."),
        source: external_exports.enum(["outcome", "changed", "latest"]).describe("Where the totals came from: the recorded outcome, a totals file the change adds or edits, or the latest totals file of a test the change ends."),
        ships: external_exports.array(external_exports.string()).describe("The arms the rule says to ship: the winners of a win, else the control."),
        removes: external_exports.object({ flags: external_exports.array(external_exports.string()), kept: external_exports.string().optional(), unknown: external_exports.string().optional() }).optional().describe("The change removes the last read of these flags: the arm its code keeps, or why that could not be told."),
        rule: external_exports.looseObject({ status: external_exports.enum(["same", "amended", "changed", "unavailable"]), commit: external_exports.string() }).optional().describe("Which rule was applied: the plan at the totals\u2019 plan-commit (same), an amended plan, the launch rule over a plan changed since (changed), or today\u2019s plan when the launch plan cannot be read (unavailable).")
      }).optional().describe("The readout of a linked plan: the class the registered rule gives on its totals, beside what the change records and the arm it keeps."),
      override: external_exports.object({ class: external_exports.enum(OUTCOME_CLASSES).optional(), ship: external_exports.array(external_exports.string()).optional(), reason: external_exports.string() }).optional().describe("A recorded decision that departs from the registered rule, with its reason.")
    })
  ),
  flags: external_exports.array(
    external_exports.object({
      key: external_exports.string(),
      file: external_exports.string(),
      line: external_exports.number().int(),
      side: external_exports.enum(["added", "removed"]),
      via: external_exports.string(),
      plans: external_exports.array(external_exports.string()),
      exempt: external_exports.boolean()
    })
  ),
  collisions: external_exports.array(
    external_exports.object({
      plan: external_exports.string(),
      other: external_exports.string(),
      owners: external_exports.array(external_exports.string()),
      otherSurface: external_exports.string(),
      overlapDays: external_exports.number().int().optional(),
      overlapWindow: external_exports.object({ start: external_exports.string(), end: external_exports.string() }).optional(),
      platforms: external_exports.union([external_exports.array(external_exports.string()), external_exports.literal("all")]),
      locales: external_exports.union([external_exports.array(external_exports.string()), external_exports.literal("all")]),
      trafficShare: external_exports.number(),
      known: external_exports.boolean()
    })
  ),
  nudge: external_exports.object({ reason: external_exports.string(), productFiles: external_exports.array(external_exports.string()), planStub: external_exports.string(), twoWeeksLine: external_exports.string().optional(), sizingLine: external_exports.string().optional() }).optional(),
  partial: external_exports.object({ reason: external_exports.string(), reviewedFiles: external_exports.number().int(), changedFiles: external_exports.number().int().optional() }).optional().describe("Present when some files of the change were not reviewed; the verdict is then never clear.")
}).describe("The Plumbline pull-request review report.");
var REVIEW_JSON_FORMAT = "plumbline.review/1";
function reviewJson(review) {
  const plans = review.plans.map(({ readout, ...plan }) => {
    if (!readout) return plan;
    const { primary, ...rest } = readout;
    return { ...plan, readout: { ...rest, ...primary ? { primary: { ...primary, arms: primary.arms.map((a) => ({ ...a })) } } : {} } };
  });
  return { format: REVIEW_JSON_FORMAT, ...review, plans };
}

export {
  reviewReportSchema,
  REVIEW_JSON_FORMAT,
  reviewJson
};
