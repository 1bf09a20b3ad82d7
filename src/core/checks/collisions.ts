import { daysBetween } from '../calendar.js';
import { entryFromPlan, type RegistryEntry } from '../registry/schema.js';
import { countOf, formatCount, formatMultiplier } from '../report/numbers.js';
import type { Check, LinkedPlan } from '../review/context.js';
import type { Settings } from '../config/schema.js';
import { sizingPolicy } from '../config/sizing-policy.js';
import { finiteSizing } from '../stats/finite-sizing.js';
import { sizePlan } from '../stats/plan-sizing.js';
import { atPlanKey } from './plan-key.js';
import { lengthSetter } from './test-length.js';
import { isSameOrBelow, surfacesMeet } from './surfaces.js';

/** How two tests overlap: where, when, whom and how much traffic they share. */
export interface Collision {
  other: RegistryEntry;
  /** Where the other test sits relative to this one. */
  surface: 'same' | 'above' | 'below';
  /** Days both windows cover (both ends included); undefined when a window is not set. */
  overlapDays?: number;
  overlapWindow?: { start: string; end: string };
  platforms: string[] | 'all';
  locales: string[] | 'all';
  regions: string[] | 'all';
  /** Share of eligible units expected in both tests. */
  trafficShare: number;
  /** One of the two plans lists the other under overlaps-with. */
  known: boolean;
}

/** Common values of two lists, where an empty list means "everyone". */
function intersect(a: readonly string[], b: readonly string[]): string[] | 'all' | undefined {
  if (a.length === 0 && b.length === 0) return 'all';
  if (a.length === 0) return [...b];
  if (b.length === 0) return [...a];
  const common = a.filter((x) => b.includes(x));
  return common.length ? common : undefined;
}

function windowOverlap(a: RegistryEntry['window'], b: RegistryEntry['window']): { days?: number; window?: { start: string; end: string } } | undefined {
  if (!a.start || !a.end || !b.start || !b.end) return {};
  const start = a.start > b.start ? a.start : b.start;
  const end = a.end < b.end ? a.end : b.end;
  if (end < start) return undefined;
  return { days: daysBetween(start, end) + 1, window: { start, end } };
}

function sharedTraffic(a: RegistryEntry, b: RegistryEntry): number {
  const ga = a.surface.trafficSplit;
  const gb = b.surface.trafficSplit;
  if (ga && gb && ga.name === gb.name) {
    // One pool's units are divided once, so half-open ranges either overlap or not at all.
    const overlap = Math.min(ga.range.end, gb.range.end) - Math.max(ga.range.start, gb.range.start);
    return Math.max(0, overlap) / 100;
  }
  // Independent assignments: a unit is in both with the product of the shares.
  return a.trafficShare * b.trafficShare;
}

/** The running tests that `subject` would collide with. */
export function findCollisions(subject: RegistryEntry, others: readonly RegistryEntry[]): Collision[] {
  const collisions: Collision[] = [];
  for (const other of others) {
    if (other.id === subject.id || !surfacesMeet(subject.surface.path, other.surface.path)) continue;
    const when = windowOverlap(subject.window, other.window);
    if (!when) continue;
    const platforms = intersect(subject.population.platforms, other.population.platforms);
    const locales = intersect(subject.population.locales, other.population.locales);
    const regions = intersect(subject.population.regions, other.population.regions);
    if (!platforms || !locales || !regions) continue;
    const trafficShare = sharedTraffic(subject, other);
    if (trafficShare <= 0) continue;
    collisions.push({
      other,
      surface: subject.surface.path === other.surface.path ? 'same' : isSameOrBelow(subject.surface.path, other.surface.path) ? 'above' : 'below',
      ...(when.days !== undefined ? { overlapDays: when.days } : {}),
      ...(when.window ? { overlapWindow: when.window } : {}),
      platforms,
      locales,
      regions,
      trafficShare,
      known: subject.surface.overlapsWith.includes(other.id) || other.surface.overlapsWith.includes(subject.id),
    });
  }
  return collisions;
}

/** Running tests are the live ones; a test on hold still holds its units but is not being read. */
export function runningEntries(entries: readonly RegistryEntry[]): RegistryEntry[] {
  return entries.filter((e) => e.state === 'live');
}

export function collisionsOfLinked(context: Parameters<Check>[0]): { plan: string; collision: Collision }[] {
  const running = runningEntries(context.registry.entries);
  // A concluded test no longer assigns anyone: its overlaps are history, not a risk to either result.
  return context.linked.filter(({ loaded }) => loaded.plan.state !== 'concluded').flatMap(({ loaded }) =>
    findCollisions(entryFromPlan(loaded.plan, loaded.file, loaded.line), running).map((collision) => ({ plan: loaded.plan.id, collision })),
  );
}

/** Which side wrote the overlap under surface.overlaps-with: an overlap agreed by one side only is worth a look. */
function declaredBy(id: string, mine: readonly string[], other: RegistryEntry): string {
  const here = mine.includes(other.id);
  const there = other.surface.overlapsWith.includes(id);
  if (here && there) return 'Both tests declare this overlap.';
  return here ? `This plan declares the overlap; ${other.id} does not.` : `${other.id} declares the overlap; this plan does not.`;
}

const list = (values: string[] | 'all') => (values === 'all' ? 'everyone' : values.join(', '));
const percent = (share: number) => `${Math.round(share * 100)}%`;

/**
 * What isolating the subject from a running test would cost it. The running test keeps its units
 * (re-dividing a live test would restart it), so the subject can take only what the other leaves
 * free; when the other takes everyone, the two would have to divide the pool afresh.
 */
export function isolationCost(subject: LinkedPlan, other: RegistryEntry, settings: Settings): string {
  const { plan } = subject.loaded;
  const wanted = plan.design.trafficShare;
  const free = 1 - other.trafficShare;
  if (free >= wanted - 1e-9) {
    return `Isolating costs this test nothing: ${other.id} leaves ${percent(free)} of eligible units free, enough for this test’s ${percent(wanted)} in a traffic split.`;
  }
  const share = free > 1e-9 ? free : wanted / (wanted + other.trafficShare);
  const how = free > 1e-9 ? `taking only the ${percent(free)} that ${other.id} leaves free` : `splitting traffic with ${other.id} (which would restart it)`;
  const now = lengthSetter(subject.sizing);
  // Sized the way the review sized it (the settings' guardrail policy), so only the traffic differs.
  const isolated = lengthSetter(finiteSizing(sizePlan({ ...plan, design: { ...plan.design, trafficShare: share } }, sizingPolicy(settings))));
  if (now && isolated) {
    // Tests run in whole weeks, so a longer test can still fit the same number of weeks: say so rather than "1 week → 1 week".
    const weeks = now.duration.weeks === isolated.duration.weeks ? `still ${countOf(now.duration.weeks, 'week')}` : `${countOf(now.duration.weeks, 'week')} → ${countOf(isolated.duration.weeks, 'week')}`;
    return `Isolating would cost this test time: ${how}, ${formatCount(now.duration.days)} → ${countOf(isolated.duration.days, 'day')} (${weeks}).`;
  }
  return `Isolating would cost this test traffic: ${how}, ${percent(wanted)} → ${percent(share)} of eligible units, so it would run about ${formatMultiplier(wanted / share)} as long.`;
}

export const collisionCheck: Check = (context) =>
  collisionsOfLinked(context).map(({ plan, collision: c }) => {
    const linked = context.linked.find((l) => l.loaded.plan.id === plan)!;
    const where = c.surface === 'same' ? `the same surface (${c.other.surface.path})` : `${c.other.surface.path}, ${c.surface === 'above' ? 'which contains this surface' : 'inside this surface'}`;
    const when = c.overlapDays !== undefined ? `${countOf(c.overlapDays, 'day')} (${c.overlapWindow!.start} to ${c.overlapWindow!.end})` : 'an unknown stretch (a window is not set)';
    const message = `Overlaps ${c.other.id} (${c.other.owners.join(', ')}) on ${where} for ${when}; platforms ${list(c.platforms)}, locales ${list(c.locales)}; about ${percent(c.trafficShare)} of eligible units would be in both.`;
    const at = atPlanKey(linked.loaded, ['surface']);
    return c.known
      ? { code: 'known-overlap', message: `${message} ${declaredBy(linked.loaded.plan.id, linked.loaded.plan.surface.overlapsWith, c.other)}`, fix: 'Check for an interaction between the two when reading out.', ...at }
      : {
          code: 'collision',
          message: `${message} Independently assigned tests that overlap usually just share units and each still reads its own effect; it matters when both change the same elements, or one changes what the other measures. ${isolationCost(linked, c.other, context.settings)}`,
          fix: `Agree with ${c.other.owners.join(', ')} whether the two interact. If they do, isolate them (the same surface.traffic-split with ranges that do not overlap) or move the window; if not, declare the overlap under surface.overlaps-with and check for an interaction when reading out.`,
          ...at,
        };
  });
