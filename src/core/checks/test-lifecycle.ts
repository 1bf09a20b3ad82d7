import type { RegistryEntry } from '../registry/schema.js';

/**
 * When a test counts as started, shared by the checks that guard a running test. A live or on-hold test
 * has started whatever its dates say; a draft whose start date has passed has too (its units may already be
 * assigned); a concluded test is no longer guarded.
 */
export function hasStarted(entry: Pick<RegistryEntry, 'state' | 'window'>, today: string): boolean {
  if (entry.state === 'concluded') return false;
  if (entry.state === 'live' || entry.state === 'on-hold') return true;
  return entry.window.start !== undefined && entry.window.start <= today;
}

/** Whether data has been collected: by the start date when one is written, else by the state. */
export function collectingSince(entry: Pick<RegistryEntry, 'state' | 'window'>, today: string): boolean {
  return entry.window.start !== undefined ? entry.window.start <= today : entry.state === 'live' || entry.state === 'on-hold';
}

/**
 * A test has a recorded outcome when its plan has an `outcome` block (written by `readout --record`, or a
 * date and a one-line reason). A registry entry describes a test run elsewhere, so its concluded state is all it can say.
 */
export function hasOutcome(entry: RegistryEntry): boolean {
  return entry.plan ? entry.plan.outcome !== undefined : entry.state === 'concluded';
}

export const ownersOf = (entry: RegistryEntry) => entry.owners.join(', ');
