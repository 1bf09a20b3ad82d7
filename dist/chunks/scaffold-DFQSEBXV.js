#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  loadPlan,
  requireWorkspace
} from "./chunk-ZWIGW2MY.js";
import "./chunk-V65C5FSR.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-TLWZYCJO.js";
import {
  addDays
} from "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-J3CQQVSX.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  UsageError
} from "./chunk-OICJSZPX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";

// src/run/scaffold.ts
import { posix } from "node:path";

// src/core/plan/scaffold.ts
function planIdFromFlag(flagKey) {
  return flagKey.replace(/([a-z0-9])([A-Z])/g, "$1-$2").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "") || "new-plan";
}
function renderPlanScaffold(options) {
  const id = options.id ?? planIdFromFlag(options.flagKey);
  const start = addDays(options.today, 7);
  const end = addDays(start, 27);
  const quote = (s) => JSON.stringify(s);
  return `# yaml-language-server: $schema=${options.schemaPath}
# Experiment plan, written before launch. Every key is described by \`plumbline schema plan\` (the JSON
# Schema above) and by the plan reference in Plumbline's own documentation (docs/plan-reference.md there).
id: ${id}
title: ${quote(`Describe the change behind ${options.flagKey}`)}
owners: [${quote(options.owner ?? "@your-handle")}]
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
  path: ${options.surface ?? "area/page"}            # where the change lands, most general first, e.g. checkout/payment
  # traffic-split: { name: checkout-core, range: { start: 0, end: 50 } }   # percent of the pool, start included, end excluded
  # overlaps-with: [another-plan-id]

population:
  platforms: [web]
  locales: [en-GB]
  ready:                    # where the change was checked: rendered, translated
    platforms: []
    locales: []

exposure:
  event: ${id.replace(/-/g, "_")}_exposed   # logged when a unit is assigned AND sees the change
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

// src/run/scaffold.ts
var INSTALLED_SCHEMA = "node_modules/plumbline/schema/plan.schema.json";
async function scaffoldPlan(request) {
  const workspace = await requireWorkspace(request);
  const id = request.id ?? planIdFromFlag(request.flagKey);
  const taken = workspace.registry.entries.find((entry) => entry.id === id);
  if (taken) throw new UsageError(`a plan with id "${id}" already exists in ${taken.file}:${taken.line}`, "choose another id with --id");
  const firstPlans = workspace.settings.planPaths[0] ?? "experiments";
  const folder = /[*?[{]/.test(firstPlans) || /\.ya?ml$/.test(firstPlans) ? "experiments" : firstPlans.replace(/\/+$/, "");
  const path = request.out ?? posix.join(folder, `${id}.yaml`);
  const schemaPath = posix.relative(posix.dirname(path), INSTALLED_SCHEMA);
  const text = renderPlanScaffold({
    flagKey: request.flagKey,
    id,
    today: request.today,
    schemaPath,
    ...request.owner ? { owner: request.owner } : {},
    ...request.surface ? { surface: request.surface } : {}
  });
  const check = loadPlan(text, path);
  if (!check.ok) {
    throw new UsageError(`the new plan would not be valid:
${check.errors.map(formatProblem).join("\n")}`, "check --id, --owner, --surface and the flag key");
  }
  return { path, text, id };
}
export {
  scaffoldPlan
};
