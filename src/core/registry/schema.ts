import { z } from 'zod';
import { text, uniqueList } from '../source/fields.js';
import {
  amendmentsSchema,
  eventName,
  flagsSchema,
  normalizeSurface,
  ownersSchema,
  planId,
  populationSchema,
  stateSchema,
  surfaceSchema,
  windowSchema,
  type Amendment,
  type Plan,
  type PlanState,
} from '../plan/schema.js';

/**
 * A registry file lists tests defined outside this repository's plans (another repo, another
 * team's tool) so that collisions and logging dependencies can still be checked against them.
 */
const writtenEntry = z.strictObject(
  {
    id: planId,
    title: text('a short title'),
    owners: ownersSchema,
    state: stateSchema,
    flags: flagsSchema,
    window: windowSchema,
    surface: surfaceSchema,
    population: populationSchema,
    'traffic-share': z
      .number({ error: 'the share of eligible units enrolled, in (0, 1]' })
      .gt(0, { error: 'a share in (0, 1]' })
      .lte(1, { error: 'a share in (0, 1]' })
      .optional(),
    events: uniqueList(eventName, 'a list of logging events the test depends on').default([]),
    amendments: amendmentsSchema,
  },
  { error: 'a test entry with id, title, owners, state, flags, window and surface' },
);

export const writtenRegistrySchema = z
  .strictObject(
    { tests: z.array(writtenEntry, { error: 'a list of test entries under tests' }) },
    { error: 'a registry file: a mapping with a tests list' },
  )
  .describe('A Plumbline registry file: tests defined outside this repository’s plans.');

/** One test the registry knows, from a plan file or a registry file. */
export interface RegistryEntry {
  id: string;
  title: string;
  owners: string[];
  state: PlanState;
  flags: string[];
  window: { start?: string; end?: string };
  surface: Plan['surface'];
  population: Pick<Plan['population'], 'platforms' | 'locales' | 'regions'>;
  trafficShare: number;
  /** Logging events the test's readout depends on (exposure and metric events). */
  events: string[];
  /** Changes recorded after the start (see the plan field of the same name). */
  amendments: Amendment[];
  /** Where the entry is written. */
  file: string;
  line: number;
  /** 1-based line of every key the entry writes, by field path within the entry (`window.end`); not for entries made up in code. */
  keyLines?: ReadonlyMap<string, number>;
  /** The full plan, when the entry comes from a plan file. */
  plan?: Plan;
}

export const registrySchema = writtenRegistrySchema.transform((written) =>
  written.tests.map((entry) => ({
    id: entry.id,
    title: entry.title,
    owners: entry.owners,
    state: entry.state,
    flags: entry.flags,
    window: entry.window,
    surface: normalizeSurface(entry.surface),
    population: { platforms: entry.population.platforms, locales: entry.population.locales, regions: entry.population.regions },
    trafficShare: entry['traffic-share'] ?? 1,
    events: entry.events,
    amendments: entry.amendments,
  })),
);

/** The events a plan's readout depends on: its exposure event and every metric's events. */
export function eventsOfPlan(plan: Plan): string[] {
  const metrics = [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary];
  const events = [...(plan.exposure.event ? [plan.exposure.event] : []), ...metrics.flatMap((m) => m.events)];
  return [...new Set(events)];
}

export function entryFromPlan(plan: Plan, file: string, line: number, keyLines?: ReadonlyMap<string, number>): RegistryEntry {
  return {
    id: plan.id,
    title: plan.title,
    owners: plan.owners,
    state: plan.state,
    flags: plan.flags,
    window: plan.window,
    surface: plan.surface,
    population: { platforms: plan.population.platforms, locales: plan.population.locales, regions: plan.population.regions },
    trafficShare: plan.design.trafficShare,
    events: eventsOfPlan(plan),
    amendments: plan.amendments,
    file,
    line,
    ...(keyLines ? { keyLines } : {}),
    plan,
  };
}
