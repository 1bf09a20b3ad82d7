import type { Plan } from '../plan/schema.js';
import { finiteSizing } from '../stats/finite-sizing.js';
import { sizePlan } from '../stats/plan-sizing.js';
import { sequentialBoundaries, spendingBoundaryAt } from '../stats/sequential.js';
import { normalUpper } from '../stats/distributions.js';

/**
 * When the data runs through a day before the planned end, the readout is early. Without interim
 * looks in the plan that is a peek, and a peek inflates the false-positive rate. With looks, the
 * boundary is recomputed at the information fraction actually reached (units seen over the
 * planned maximum), the earlier looks taken to have happened at their planned fractions.
 */
export interface Timing {
  plannedEnd?: string;
  dataThrough: string;
  readEarly: boolean;
  /** Units seen over the planned maximum (sequential inflation included); absent when the plan gives no size. */
  informationFraction?: number;
  plannedUnits?: number;
  /** With interim looks and an early read: the boundary this analysis must cross. */
  boundary?: { z: number; nominalP: number; look: number; looks: number };
}

export function plannedMaximumUnits(plan: Plan): number | undefined {
  const primary = finiteSizing(sizePlan(plan)).metrics.find((m) => m.role === 'primary');
  if (primary?.result.ok && primary.result.value.headline) return primary.result.value.headline.totalUnits;
  return undefined;
}

export function readoutTiming(plan: Plan, dataThrough: string, unitsSeen: number, alphaPerComparison: number): Timing {
  const plannedEnd = plan.window.end;
  const readEarly = plannedEnd !== undefined && dataThrough < plannedEnd;
  const plannedUnits = plannedMaximumUnits(plan);
  const fraction = plannedUnits ? unitsSeen / plannedUnits : undefined;
  const timing: Timing = {
    ...(plannedEnd ? { plannedEnd } : {}),
    dataThrough,
    readEarly,
    ...(fraction !== undefined && Number.isFinite(fraction) ? { informationFraction: fraction, plannedUnits: plannedUnits! } : {}),
  };
  const looks = plan.design.interimLooks + 1;
  if (!readEarly || looks === 1) return timing;
  const { interimBoundary: kind, sides } = plan.design;
  // Without a planned size the fraction is unknown; the final boundary is the safe reading.
  const t = Math.min(1, fraction ?? 1);
  const planned = Array.from({ length: looks }, (_, i) => (i + 1) / looks);
  let z: number | undefined;
  let look = looks;
  if ((kind === 'obrien-fleming-spending' || kind === 'pocock-spending') && t > 0) {
    const earlier = planned.filter((p) => p < t - 1e-9);
    look = earlier.length + 1;
    const boundary = spendingBoundaryAt(kind, alphaPerComparison, sides, [...earlier, t]);
    if (boundary.ok) z = boundary.value;
  } else {
    // Classical boundaries exist only at planned looks: use the last planned look reached (the stricter one).
    const bounds = sequentialBoundaries({ kind, looks, alpha: alphaPerComparison, sides });
    look = Math.max(1, Math.min(looks, Math.floor(t * looks + 1e-9)));
    if (bounds.ok) z = bounds.value.z[look - 1];
  }
  if (z === undefined || !Number.isFinite(z)) return timing;
  return { ...timing, boundary: { z, nominalP: sides * normalUpper(z), look, looks } };
}
