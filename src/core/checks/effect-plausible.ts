import type { Plan } from '../plan/schema.js';
import type { Check } from '../review/context.js';
import { countOf } from '../report/numbers.js';
import { atPlanKey } from './plan-key.js';

/**
 * A test planned to detect an effect larger than nearly every effect measured on its metric before
 * is underpowered for the effects that really happen: it will mostly come back inconclusive, and a
 * win it does find is likely an inflated one (the winner's curse). The history is the registry's
 * recorded outcomes: the primary figures other tests wrote with `plumbline readout --record`.
 */

/** Outcomes on a metric needed before its history says anything (the threshold). */
export const MIN_OUTCOMES = 5;
/** The planned effect is implausible when it is above this share of the effects measured before. */
export const IMPLAUSIBLE_SHARE = 0.9;

/** The planned minimum detectable effect as a fraction of the baseline, when the plan gives one. */
function relativeEffect(plan: Plan): number | undefined {
  const effect = plan.design.minDetectableEffect;
  if (!effect) return undefined;
  if (effect.relative !== undefined) return Math.abs(effect.relative);
  const primary = plan.metrics.primary;
  const baseline = primary.kind === 'proportion' ? primary.baseline.rate : primary.kind === 'mean' ? primary.baseline.mean : undefined;
  return effect.absolute !== undefined && baseline ? Math.abs(effect.absolute / baseline) : undefined;
}

/** Relative effects measured on a metric, by the test that measured them; `except` leaves a plan out. */
function measuredEffects(plans: readonly Plan[], metric: string, except: string): { tests: number; effects: number[] } {
  let tests = 0;
  const effects: number[] = [];
  for (const p of plans) {
    if (p.id === except) continue;
    const relatives = (p.outcome?.figures ?? []).filter((f) => f.metric === metric && f.relative !== undefined).map((f) => Math.abs(f.relative!));
    if (relatives.length === 0) continue;
    tests++;
    effects.push(...relatives);
  }
  return { tests, effects };
}

const percent = (x: number) => `${Number((x * 100).toPrecision(3))}%`;

export const effectImplausible: Check = ({ linked, registry }) => {
  const plans = registry.entries.flatMap((e) => (e.plan ? [e.plan] : []));
  return linked.flatMap(({ loaded }) => {
    const { plan } = loaded;
    // A test already read out is judged by its readout, not by its planned effect.
    if (plan.outcome) return [];
    const mde = relativeEffect(plan);
    const metric = plan.metrics.primary.name;
    if (mde === undefined) return [];
    const { tests, effects } = measuredEffects(plans, metric, plan.id);
    if (tests < MIN_OUTCOMES) return [];
    const below = effects.filter((e) => e < mde).length;
    if (below / effects.length < IMPLAUSIBLE_SHARE) return [];
    const largest = Math.max(...effects);
    return [
      {
        code: 'effect-implausible',
        message: `The plan is sized to detect ${percent(mde)} on ${metric}, larger than ${below} of the ${countOf(effects.length, 'effect')} measured on it by ${countOf(tests, 'recorded test')} (the largest: ${percent(largest)}). A test sized for an effect that rarely happens is underpowered for the ones that do, and a win it finds is likely inflated.`,
        fix: `Size for an effect in the range measured before (most were below ${percent(largest)}): run longer or enrol more traffic, or say in the plan why this change should move ${metric} more than past ones did.`,
        ...atPlanKey(loaded, ['design', 'min-detectable-effect']),
      },
    ];
  });
};
