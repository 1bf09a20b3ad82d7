import type { Check } from '../review/context.js';
import { bugFixUnmeasured } from './bug-fix.js';
import { collisionCheck } from './collisions.js';
import { effectImplausible } from './effect-plausible.js';
import { endedEarly } from './ended-early.js';
import { exposureOneArm } from './exposure-arms.js';
import { flagWithoutPlan } from './flags.js';
import { frozenPlans } from './frozen-plan.js';
import { eventMissing, eventRemoved } from './logging.js';
import {
  bundleUnexplained,
  decisionsMissing,
  fileWarnings,
  guardrailsMissing,
  planInvalid,
  populationChecks,
  reasonMissing,
  reviewMissing,
  windowChecks,
} from './plans.js';
import { sizingChecks } from './sizing.js';
import { outcomeRecorded } from './outcome.js';
import { endedWithoutReadout, ruleAtLaunch } from './readout-links.js';
import { treatmentChanged } from './treatment-change.js';
import { analysisUnitDiffers, spillover } from './unit.js';

/** Every check of the pull-request review, in the order their findings are listed. */
export const CHECKS: readonly Check[] = [
  planInvalid,
  fileWarnings,
  outcomeRecorded,
  ruleAtLaunch,
  frozenPlans,
  decisionsMissing,
  reviewMissing,
  eventRemoved,
  endedEarly,
  endedWithoutReadout,
  treatmentChanged,
  flagWithoutPlan,
  reasonMissing,
  guardrailsMissing,
  windowChecks,
  bundleUnexplained,
  populationChecks,
  sizingChecks,
  effectImplausible,
  spillover,
  analysisUnitDiffers,
  collisionCheck,
  eventMissing,
  exposureOneArm,
  bugFixUnmeasured,
];

/**
 * Checks about the change itself: every finding they raise has no plan (flags the change touches,
 * plan files it breaks, an unmeasured fix) or a change-bound code (what the change does to a plan),
 * so it always counts as introduced. The pass over the base commit, which only asks which findings
 * already held, skips them; test/review/findings.test.ts checks the promise on every finding code.
 */
export const CHANGE_CHECKS: ReadonlySet<Check> = new Set([planInvalid, frozenPlans, eventRemoved, endedEarly, treatmentChanged, flagWithoutPlan, exposureOneArm, bugFixUnmeasured]);

/** Checks about each plan as it stands: the base pass runs these, in the same order. */
export const PLAN_CHECKS: readonly Check[] = CHECKS.filter((check) => !CHANGE_CHECKS.has(check));
