import { eventsOfPlan, type RegistryEntry } from '../registry/schema.js';
import type { Check, ReviewContext } from '../review/context.js';
import type { Location } from '../scan/name-scan.js';
import { runningEntries } from './collisions.js';
import { atPlanKey, metricPath } from './plan-key.js';

/** Where each event of a plan is logged at head: a logging call first, else a quoted string, else nowhere. */
export interface EventStatus {
  event: string;
  /** What the plan uses it for. */
  roles: string[];
  location?: Location;
  /** How it was found: in a logging call, or only as a quoted string in product code. */
  via?: 'call' | 'literal';
  /** Not logged, but quoted in a test, fixture, document, generated file or comment: a mention is not evidence. */
  mentionedAt?: Location;
}

export function eventStatuses(context: ReviewContext, planId: string): EventStatus[] {
  const linked = context.linked.find((l) => l.loaded.plan.id === planId);
  if (!linked) return [];
  const { plan } = linked.loaded;
  const roles = new Map<string, string[]>();
  const note = (event: string, role: string) => roles.set(event, [...(roles.get(event) ?? []), role]);
  if (plan.exposure.event) note(plan.exposure.event, 'exposure');
  for (const m of [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary]) for (const e of m.events) note(e, m.name);
  return eventsOfPlan(plan).map((event) => {
    const hits = context.events.get(event);
    const location = hits?.firstCall ?? hits?.firstQuoted;
    const mentioned = !location && hits?.firstMention ? { mentionedAt: hits.firstMention } : {};
    return { event, roles: roles.get(event) ?? [], ...(location ? { location, via: hits?.firstCall ? ('call' as const) : ('literal' as const) } : {}), ...mentioned };
  });
}

export const eventMissing: Check = (context) =>
  context.linked.flatMap(({ loaded }) =>
    eventStatuses(context, loaded.plan.id)
      .filter((s) => !s.location)
      .map((s) => ({
        code: 'event-missing',
        message: `Event \`${s.event}\` (${s.roles.join(', ')}) is not logged anywhere in the code at head${s.mentionedAt ? ` (only mentioned, in ${s.mentionedAt.file}:${s.mentionedAt.line}, which logs nothing)` : ''}, so the ${s.roles.includes('exposure') ? 'exposure' : 'metric'} cannot be computed.`,
        fix: `Log ${s.event} where it happens (or correct the name in the plan) before launch.`,
        ...atPlanKey(loaded, s.roles[0] === 'exposure' ? ['exposure', 'event'] : [...metricPath(loaded.plan, s.roles[0] ?? ''), 'events']),
      })),
  );

/**
 * Running tests whose readout depends on `event`, at the base commit or at head: a change that also drops
 * the event from the plan still cuts the data the test has been collecting.
 */
function dependents(entries: readonly RegistryEntry[], baseEntries: readonly RegistryEntry[], event: string): RegistryEntry[] {
  const byId = new Map<string, RegistryEntry>();
  for (const e of [...runningEntries(entries), ...runningEntries(baseEntries)]) if (e.events.includes(event) && !byId.has(e.id)) byId.set(e.id, e);
  return [...byId.values()];
}

export const eventRemoved: Check = ({ removedEvents, events, registry, baseEntries }) =>
  [...removedEvents].flatMap(([event, where]) => {
    // Only a logging call or a quoted name in product code keeps the event; a mention in a test, a document or a comment does not.
    const still = events.get(event);
    if (still?.firstCall || still?.firstQuoted) return [];
    const plans = dependents(registry.entries, baseEntries, event);
    if (plans.length === 0) return [];
    return [
      {
        code: 'event-removed',
        message: `This change removes the last logging of \`${event}\`, which running test${plans.length === 1 ? '' : 's'} ${plans.map((p) => `${p.id} (${p.owners.join(', ')})`).join(', ')} depend${plans.length === 1 ? 's' : ''} on.`,
        fix: 'Keep logging the event, or agree with the owners to end or change those tests first.',
        file: where.file,
        line: where.line,
        side: 'base',
        dependents: plans.map((p) => p.id),
      },
    ];
  });
