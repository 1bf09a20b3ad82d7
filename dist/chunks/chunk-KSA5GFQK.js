#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  calendarDate,
  external_exports,
  finiteNumber,
  kebabName,
  text
} from "./chunk-7GKTQ2BG.js";

// src/core/plan/outcome.ts
var OUTCOME_CLASSES = ["win", "loss", "flat", "inconclusive", "guardrail-breach"];
var outcomeClass = external_exports.enum(OUTCOME_CLASSES, { error: `one of ${OUTCOME_CLASSES.join(", ")}` });
var figure = external_exports.strictObject(
  {
    arm: kebabName("the treatment arm, e.g. treatment"),
    metric: kebabName("the metric name, e.g. order-completed"),
    difference: finiteNumber("the absolute difference, treatment minus control, in the metric\u2019s units"),
    low: finiteNumber("the lower end of the interval of the difference"),
    high: finiteNumber("the upper end of the interval of the difference"),
    relative: finiteNumber("the relative difference as a fraction, e.g. 0.011").optional(),
    "p-value": external_exports.number({ error: "a p-value from 0 to 1" }).gte(0, { error: "a p-value from 0 to 1" }).lte(1, { error: "a p-value from 0 to 1" })
  },
  { error: "a figure: { arm, metric, difference, low, high, relative, p-value }" }
).describe("The primary metric\u2019s figures for one treatment arm.");
var outcomeSchema = external_exports.strictObject(
  {
    class: outcomeClass.optional().describe("The class the registered rule gave, as computed by the readout."),
    arms: external_exports.array(kebabName("an arm name, e.g. treatment"), { error: "a list of arm names" }).default([]).describe("The arms the class names (the winners of a win)."),
    "data-through": calendarDate("the last day of the data read, written YYYY-MM-DD").optional(),
    totals: text("the arm-totals file read, relative to the repository, e.g. readouts/checkout-wallet-first.totals.yaml").optional(),
    "read-early": external_exports.boolean({ error: "true or false" }).optional().describe("True when the data ended before the planned end."),
    figures: external_exports.array(figure, { error: "a list of figures" }).default([]).describe("The primary metric\u2019s figures per treatment arm."),
    "decided-by": text("who decided, e.g. @ana-lima").optional(),
    date: calendarDate("the date the test was decided, written YYYY-MM-DD, e.g. 2026-12-01").optional(),
    reason: text("the decision and why, in a sentence, e.g. stopped: checkout errors doubled").optional(),
    "recorded-on": calendarDate("the day the outcome was recorded, written YYYY-MM-DD").optional(),
    override: external_exports.strictObject(
      {
        class: outcomeClass.optional().describe("The class acted on instead of the computed one."),
        ship: external_exports.array(kebabName("an arm name"), { error: "a list of arm names" }).optional().describe("The arms shipped, when the rule does not name them."),
        reason: text("why the team departs from the registered rule")
      },
      { error: "a mapping with class, ship and reason" }
    ).optional().describe("A decision that departs from the registered rule, with its reason; reviewers judge it first.")
  },
  { error: "an outcome: a mapping with class, data-through, figures and decided-by (from plumbline readout --record), or date and reason" }
).refine((o) => o.class !== void 0 || o.reason !== void 0, { error: "an outcome needs the readout\u2019s class (plumbline readout --record) or a one-line reason, e.g. reason: stopped, checkout errors doubled" }).describe("The recorded outcome of the test: written by plumbline readout --record after the readout.");

export {
  OUTCOME_CLASSES,
  outcomeSchema
};
