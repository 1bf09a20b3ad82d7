import { GROUP_UNITS } from '../plan/schema.js';
import type { Check } from '../review/context.js';
import { atPlanKey } from './plan-key.js';
import { isSameOrBelow } from './surfaces.js';

/** People who share a surface affect each other; randomizing them one by one lets the change spill over. */
export const spillover: Check = ({ linked, settings }) =>
  linked.flatMap(({ loaded }) => {
    const { plan } = loaded;
    const shared = settings.groupSurfaces.find((s) => isSameOrBelow(plan.surface.path, s));
    if (!shared || GROUP_UNITS.includes(plan.unit.randomization)) return [];
    return [
      {
        code: 'spillover',
        message: `${plan.surface.path} is shared between people (group-surfaces: ${shared}), but the plan randomizes by ${plan.unit.randomization}: treated and control people interact, so the difference between arms is biased.`,
        fix: `Randomize the group they share (unit.randomization: team, organization or household) and size with design.cluster.`,
        ...atPlanKey(loaded, ['unit', 'randomization']),
      },
    ];
  });

export const analysisUnitDiffers: Check = ({ linked }) =>
  linked
    .filter(({ loaded }) => loaded.plan.unit.analysis !== loaded.plan.unit.randomization)
    .map(({ loaded }) => ({
      code: 'analysis-unit-differs',
      message: `Units are randomized by ${loaded.plan.unit.randomization} but metrics are averaged per ${loaded.plan.unit.analysis}: observations within one ${loaded.plan.unit.randomization} are not independent.`,
      fix: 'Compute the variance with the delta method or cluster-robust standard errors, not the naive per-unit formula.',
      ...atPlanKey(loaded, ['unit', 'analysis']),
    }));
