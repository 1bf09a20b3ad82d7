import { z } from 'zod';
import type { Review } from './build-review.js';
import { OUTCOME_CLASSES } from '../plan/outcome.js';

/**
 * The JSON report of `plumbline check --format json`: the published contract for other tools.
 * schema/review-report.schema.json is generated from this; the tests validate real output
 * against the generated file.
 */
const location = z.object({ file: z.string(), line: z.number().int().positive(), column: z.number().int().positive() });
const severity = z.enum(['block', 'warn', 'note']);
const analysisSize = z.object({
  perArm: z.array(z.object({ arm: z.string(), units: z.number().int() })),
  totalUnits: z.number().int(),
  clusters: z.number().int().optional(),
  clustersPerArm: z.array(z.object({ arm: z.string(), groups: z.number().int() })).optional(),
  duration: z.object({ days: z.number().int(), weeks: z.number().int() }).optional(),
});
const change = z.object({ absolute: z.number(), relative: z.number(), to: z.number() });
const sizeResult = z.union([
  z.object({
    ok: z.literal(true),
    value: z.object({
      baselineValue: z.number(),
      sd: z.number().optional(),
      effect: change.extend({ from: z.number() }).optional(),
      multipliers: z.object({
        comparisons: z.number(),
        alphaPerComparison: z.number(),
        designEffect: z.number(),
        varianceReduction: z.number(),
        sequential: z.number(),
        dilutionUnits: z.number(),
        dilutionDays: z.number(),
      }),
      boundaries: z.object({ kind: z.enum(['obrien-fleming-spending', 'pocock-spending', 'obrien-fleming', 'pocock']), z: z.array(z.number()), nominalP: z.array(z.number()) }).optional(),
      triggered: analysisSize.optional(),
      diluted: analysisSize.optional(),
      headline: analysisSize.optional(),
      atPlannedEnd: z
        .object({
          days: z.number().int(),
          totalUnits: z.number(),
          power: z.number().optional(),
          /** Why there is no power at the planned end (too few units by then). */
          noPower: z.object({ reason: z.string(), tooFewUnits: z.literal(true).optional() }).optional(),
          detectable: change.optional(),
          /** Why no change within the metric's range is detectable by then. */
          noneDetectable: z.object({ reason: z.string() }).optional(),
        })
        .optional(),
      powerByDay: z.array(z.object({ day: z.number().int(), power: z.number() })).optional(),
      traffic: z
        .union([
          z.object({ kind: z.literal('daily'), perDay: z.number() }),
          z.object({ kind: z.literal('unique'), points: z.array(z.object({ days: z.number().int(), units: z.number() })), exponent: z.number() }),
        ])
        .optional(),
      feasibility: z
        .object({ feasible: z.boolean(), longestDays: z.number().int(), reason: z.string().optional(), detectableAtLongest: change.optional(), noneDetectableAtLongest: z.object({ reason: z.string() }).optional() })
        .optional(),
      squareRootAllocation: z.object({ controlWeight: z.number(), treatmentWeight: z.number(), totalUnits: z.number().int(), unitsSaved: z.number().int() }).optional(),
      notes: z.array(z.string()),
    }),
  }),
  z.object({ ok: z.literal(false), error: z.object({ input: z.string(), message: z.string() }) }),
]);

export const reviewReportSchema = z
  .object({
    format: z.literal('plumbline.review/1'),
    verdict: z.enum(['blocked', 'warnings', 'clear', 'nothing-to-check', 'partial']),
    counts: z
      .object({
        block: z.number().int().describe('Blocking findings this change introduces.'),
        warn: z.number().int().describe('Warnings this change introduces.'),
        note: z.number().int().describe('Notes this change introduces.'),
        known: z.number().int().describe('Findings of any severity that already held at the base commit (origin: known).'),
      })
      .describe('The counts the text and Markdown reports show: findings this change introduces, by severity, and how many were already known before it. The verdict reads every finding: a known blocking finding still blocks.'),
    base: z.string().regex(/^[0-9a-f]{40,64}$/),
    head: z.string().regex(/^[0-9a-f]{40,64}$/),
    findings: z.array(
      z.object({
        code: z.string(),
        severity,
        message: z.string(),
        fix: z.string(),
        plan: z.string().optional(),
        file: z.string().optional(),
        line: z.number().int().positive().optional(),
        side: z
          .enum(['base', 'head'])
          .optional()
          .describe('Set with file: the commit file and line are read at. base: a place the change removes (a deleted line, a deleted plan), where the same line at head is something else; head otherwise.'),
        origin: z
          .enum(['introduced', 'known'])
          .describe('introduced: this change brought it; known: the same finding already held for the plan at the base commit'),
        changes: z
          .array(z.object({ field: z.string(), before: z.string(), after: z.string() }))
          .optional()
          .describe('Frozen-plan findings: each changed field of a started test’s plan, as written at the base commit and at head.'),
        amendment: z.object({ date: z.string(), changed: z.string(), reason: z.string() }).optional().describe('plan-amended: the amendment the change records.'),
        dependents: z.array(z.string()).optional().describe('event-removed and test-ended-early: ids of the running tests that depend on what the change removes.'),
      }),
    ),
    plans: z.array(
      z.object({
        id: z.string(),
        title: z.string(),
        file: z.string(),
        line: z.number().int(),
        state: z.string(),
        owners: z.array(z.string()),
        reasons: z.array(z.enum(['named in the description', 'plan file changed', 'flag touched', 'readout changed'])),
        checklist: z.array(z.object({ label: z.string(), done: z.boolean() })),
        sizing: z.object({
          planId: z.string(),
          plannedDays: z.number().int().optional(),
          dailyUnits: z.number().optional(),
          uniqueUnits: z.array(z.object({ days: z.number().int(), units: z.number() })).optional(),
          family: z.object({ primaryPower: z.number(), noFalseAlarm: z.number(), allGuardrailsClear: z.number() }).optional(),
          /** Why the family's power is left out (a metric has no power by the planned end). */
          familyOmitted: z.object({ reason: z.string() }).optional(),
          metrics: z.array(
            z.object({
              metric: z.string(),
              role: z.enum(['primary', 'guardrail']),
              kind: z.enum(['proportion', 'mean', 'ratio']),
              direction: z.enum(['increase', 'decrease']),
              sides: z.union([z.literal(1), z.literal(2)]),
              alpha: z.number(),
              power: z.number(),
              guardrailLooks: z.object({ looks: z.number().int(), falseAlarm: z.number() }).optional(),
              result: sizeResult,
            }),
          ),
        }),
        power: z.number(),
        window: z.object({ start: z.string().optional(), end: z.string().optional() }),
        events: z.array(z.object({ event: z.string(), roles: z.array(z.string()), location: location.optional(), via: z.enum(['call', 'literal']).optional(), mentionedAt: location.optional() })),
        readout: z
          .object({
            file: z.string(),
            verdict: z.enum(['win', 'loss', 'flat', 'inconclusive', 'guardrail-breach', 'not-read']),
            arms: z.array(z.string()),
            decision: z.string().optional(),
            recorded: z.enum(OUTCOME_CLASSES).optional(),
            primary: z.looseObject({ metric: z.string(), kind: z.string(), direction: z.string(), arms: z.array(z.looseObject({ arm: z.string(), ok: z.boolean() })) }).optional().describe('The primary metric as the readout computed it (plumbline readout --format json gives the same).'),
            source: z.enum(['outcome', 'changed', 'latest']).describe('Where the totals came from: the recorded outcome, a totals file the change adds or edits, or the latest totals file of a test the change ends.'),
            ships: z.array(z.string()).describe('The arms the rule says to ship: the winners of a win, else the control.'),
            removes: z
              .object({ flags: z.array(z.string()), kept: z.string().optional(), unknown: z.string().optional() })
              .optional()
              .describe('The change removes the last read of these flags: the arm its code keeps, or why that could not be told.'),
            rule: z
              .looseObject({ status: z.enum(['same', 'amended', 'changed', 'unavailable']), commit: z.string() })
              .optional()
              .describe('Which rule was applied: the plan at the totals’ plan-commit (same), an amended plan, the launch rule over a plan changed since (changed), or today’s plan when the launch plan cannot be read (unavailable).'),
          })
          .optional()
          .describe('The readout of a linked plan: the class the registered rule gives on its totals, beside what the change records and the arm it keeps.'),
        override: z.object({ class: z.enum(OUTCOME_CLASSES).optional(), ship: z.array(z.string()).optional(), reason: z.string() }).optional().describe('A recorded decision that departs from the registered rule, with its reason.'),
      }),
    ),
    flags: z.array(
      z.object({
        key: z.string(),
        file: z.string(),
        line: z.number().int(),
        side: z.enum(['added', 'removed']),
        via: z.string(),
        plans: z.array(z.string()),
        exempt: z.boolean(),
      }),
    ),
    collisions: z.array(
      z.object({
        plan: z.string(),
        other: z.string(),
        owners: z.array(z.string()),
        otherSurface: z.string(),
        overlapDays: z.number().int().optional(),
        overlapWindow: z.object({ start: z.string(), end: z.string() }).optional(),
        platforms: z.union([z.array(z.string()), z.literal('all')]),
        locales: z.union([z.array(z.string()), z.literal('all')]),
        trafficShare: z.number(),
        known: z.boolean(),
      }),
    ),
    nudge: z.object({ reason: z.string(), productFiles: z.array(z.string()), planStub: z.string(), twoWeeksLine: z.string().optional(), sizingLine: z.string().optional() }).optional(),
    partial: z
      .object({ reason: z.string(), reviewedFiles: z.number().int(), changedFiles: z.number().int().optional() })
      .optional()
      .describe('Present when some files of the change were not reviewed; the verdict is then never clear.'),
  })
  .describe('The Plumbline pull-request review report.');

export const REVIEW_JSON_FORMAT = 'plumbline.review/1';

export function reviewJson(review: Review): z.input<typeof reviewReportSchema> {
  // The readout's primary is published as the readout computes it; copies make its types open records.
  const plans = review.plans.map(({ readout, ...plan }) => {
    if (!readout) return plan;
    const { primary, ...rest } = readout;
    return { ...plan, readout: { ...rest, ...(primary ? { primary: { ...primary, arms: primary.arms.map((a) => ({ ...a })) } } : {}) } };
  });
  return { format: REVIEW_JSON_FORMAT, ...review, plans };
}
