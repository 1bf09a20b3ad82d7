import { addDays } from '../calendar.js';

export interface ScaffoldOptions {
  /** The feature-flag key the new test reads. */
  flagKey: string;
  /** Plan id; default: the flag key in kebab-case. */
  id?: string;
  /** Default: a placeholder handle the author replaces. */
  owner?: string;
  /** Default: a placeholder surface. */
  surface?: string;
  /** Today's date (YYYY-MM-DD); the planned window starts a week later and runs four whole weeks. */
  today: string;
  /** Relative path from the plan file to the plan JSON Schema, for the editor comment. */
  schemaPath: string;
}

/** A plan id from a flag key: lower case, runs of other characters become one hyphen. */
export function planIdFromFlag(flagKey: string): string {
  return flagKey
    .replace(/([a-z0-9])([A-Z])/g, '$1-$2')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '') || 'new-plan';
}

/**
 * A commented draft plan that already loads, so an author can fill it in step by step and see
 * each hygiene finding disappear. The decision rules are left for the author on purpose: they
 * must be written by a person, before launch.
 *
 * Every commented example is a whole YAML block at its final indentation: removing "# " from its
 * lines, as written, gives a plan that still loads (test/core/scaffold.test.ts uncomments each).
 * Prose comments start with a capital letter; examples start with a key or a list item.
 */
export function renderPlanScaffold(options: ScaffoldOptions): string {
  const id = options.id ?? planIdFromFlag(options.flagKey);
  const start = addDays(options.today, 7);
  // Four whole weeks, both days included, so every weekday is seen the same number of times.
  const end = addDays(start, 27);
  const quote = (s: string) => JSON.stringify(s);
  return `# yaml-language-server: $schema=${options.schemaPath}
# Experiment plan, written before launch. Every key is described by \`plumbline schema plan\` (the JSON
# Schema above) and by the plan reference in Plumbline's own documentation (docs/plan-reference.md there).
id: ${id}
title: ${quote(`Describe the change behind ${options.flagKey}`)}
owners: [${quote(options.owner ?? '@your-handle')}]
flags: [${quote(options.flagKey)}]
state: draft                # draft, live, on-hold or concluded
window:
  start: ${start}
  end: ${end}           # four whole weeks; weekly cycles matter

hypothesis:
  change: "What users will see or get that they do not today."
  # because: "Why it should work: the mechanism, not just 'the metric goes up'."
  expected-direction: increase

unit:
  randomization: user       # user, device, session, account, team, organization, household, region
  # analysis: session       # only when metrics are averaged over another unit

surface:
  path: ${options.surface ?? 'area/page'}            # where the change lands, most general first, e.g. checkout/payment
  # traffic-split: { name: checkout-core, range: { start: 0, end: 50 } }   # percent of the pool, start included, end excluded
  # overlaps-with: [another-plan-id]

population:
  platforms: [web]
  locales: [en-GB]
  ready:                    # where the change was checked: rendered, translated
    platforms: []
    locales: []

exposure:
  event: ${id.replace(/-/g, '_')}_exposed   # logged when a unit is assigned AND sees the change
  reach: 1                  # share of exposed units that reach the changed experience

metrics:
  primary:
    name: conversion
    kind: proportion        # proportion, mean or ratio
    baseline: { rate: 0.1 } # replace with the measured baseline
    events: [conversion_completed]
  # Guardrails: metrics that must not get worse beyond their tolerance (none until you add them).
  # guardrails:
  #   - name: page-latency
  #     kind: mean
  #     baseline: { mean: 420, sd: 180 }
  #     events: [page_rendered]
  #     direction: decrease
  #     tolerance: { relative: 0.02 }

design:
  arms:
    - { name: control, weight: 50 }
    - { name: treatment, weight: 50 }
  alpha: 0.05
  power: 0.8
  min-detectable-effect: { relative: 0.05 }
  # daily-units: 10000      # new eligible units per day (or unique-units: [{ days: 7, units: .. }, { days: 28, units: .. }])

# Decision rules: write them now, before any data arrives, in your own words (these are examples).
# decisions:
#   win: "Ship to everyone and remove the flag."
#   flat: "Keep the simpler experience and remove the flag."
#   loss: "Roll back and write down what we learned."
#   guardrail-breach: "Roll back, whatever the primary metric says."
`;
}
