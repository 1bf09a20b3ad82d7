#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  external_exports
} from "./chunk-NZOXBD7U.js";

// src/core/review/report-schema.ts
var location = external_exports.object({ file: external_exports.string(), line: external_exports.number().int().positive(), column: external_exports.number().int().positive() });
var severity = external_exports.enum(["block", "warn", "note"]);
var analysisSize = external_exports.object({
  perArm: external_exports.array(external_exports.object({ arm: external_exports.string(), units: external_exports.number().int() })),
  totalUnits: external_exports.number().int(),
  clusters: external_exports.number().int().optional(),
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
      atPlannedEnd: external_exports.object({ days: external_exports.number().int(), totalUnits: external_exports.number(), power: external_exports.number().optional(), detectable: change.optional() }).optional(),
      powerByDay: external_exports.array(external_exports.object({ day: external_exports.number().int(), power: external_exports.number() })).optional(),
      notes: external_exports.array(external_exports.string())
    })
  }),
  external_exports.object({ ok: external_exports.literal(false), error: external_exports.object({ input: external_exports.string(), message: external_exports.string() }) })
]);
var reviewReportSchema = external_exports.object({
  format: external_exports.literal("plumbline.review/1"),
  verdict: external_exports.enum(["blocked", "warnings", "clear", "nothing-to-check"]),
  counts: external_exports.object({ block: external_exports.number().int(), warn: external_exports.number().int(), note: external_exports.number().int() }),
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
      line: external_exports.number().int().positive().optional()
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
      reasons: external_exports.array(external_exports.enum(["named in the description", "plan file changed", "flag touched"])),
      checklist: external_exports.array(external_exports.object({ label: external_exports.string(), done: external_exports.boolean() })),
      sizing: external_exports.object({
        planId: external_exports.string(),
        plannedDays: external_exports.number().int().optional(),
        dailyUnits: external_exports.number().optional(),
        metrics: external_exports.array(
          external_exports.object({
            metric: external_exports.string(),
            role: external_exports.enum(["primary", "guardrail"]),
            kind: external_exports.enum(["proportion", "mean", "ratio"]),
            direction: external_exports.enum(["increase", "decrease"]),
            sides: external_exports.union([external_exports.literal(1), external_exports.literal(2)]),
            result: sizeResult
          })
        )
      }),
      power: external_exports.number(),
      window: external_exports.object({ start: external_exports.string().optional(), end: external_exports.string().optional() }),
      events: external_exports.array(external_exports.object({ event: external_exports.string(), roles: external_exports.array(external_exports.string()), location: location.optional(), via: external_exports.enum(["call", "literal"]).optional() }))
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
  nudge: external_exports.object({ reason: external_exports.string(), productFiles: external_exports.array(external_exports.string()), planStub: external_exports.string(), sizingLine: external_exports.string().optional() }).optional()
}).describe("The Plumbline pull-request review report.");
var REVIEW_JSON_FORMAT = "plumbline.review/1";
function reviewJson(review) {
  return { format: REVIEW_JSON_FORMAT, ...review };
}

export {
  reviewReportSchema,
  REVIEW_JSON_FORMAT,
  reviewJson
};
