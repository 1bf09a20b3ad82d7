import { designSummary, type SizingContext } from '../core/report/sizing.js';
import { sizingPolicy } from '../core/config/sizing-policy.js';
import { finiteSizing } from '../core/stats/finite-sizing.js';
import { sizePlan, type PlanSizing } from '../core/stats/plan-sizing.js';
import { sizeMetric, type SizingRequest } from '../core/stats/sizing.js';
import { findNamedPlan } from './find-plan.js';
import { requireWorkspace, type LoadWorkspaceOptions } from './load-workspace.js';

export interface SizeOutcome {
  sizing: PlanSizing;
  context: SizingContext;
  power: number;
}

/** Sizes a plan of the repository, named by id or by file path. */
export async function sizeNamedPlan(options: LoadWorkspaceOptions & { plan: string }): Promise<SizeOutcome> {
  const workspace = await requireWorkspace(options);
  const found = findNamedPlan(workspace, options.plan, 'size');
  const { plan } = found;
  return {
    sizing: finiteSizing(sizePlan(plan, sizingPolicy(workspace.settings))),
    power: plan.design.power,
    context: {
      title: `Sizing for ${plan.id} (${found.file})`,
      designLine: designSummary({ ...plan.design, reach: plan.exposure.reach }),
      window: plan.window,
    },
  };
}

/** Sizes one metric described entirely by command-line flags. */
export function sizeFromRequest(request: SizingRequest, window?: { start: string; end: string }): SizeOutcome {
  const sizing: PlanSizing = finiteSizing({
    planId: 'command-line',
    ...(request.plannedDays !== undefined ? { plannedDays: request.plannedDays } : {}),
    ...(request.dailyUnits !== undefined ? { dailyUnits: request.dailyUnits } : {}),
    metrics: [{ metric: 'metric', role: 'primary', kind: request.baseline.kind, direction: request.direction, sides: request.sides, alpha: request.alpha, power: request.power, result: sizeMetric(request) }],
  });
  return {
    sizing,
    power: request.power,
    context: { title: 'Sizing from the command line', designLine: designSummary(request), ...(window ? { window } : {}) },
  };
}
