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
