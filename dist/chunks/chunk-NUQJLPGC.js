#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  checkWritten,
  readYaml
} from "./chunk-7ABR6JAH.js";
import {
  eventName,
  flagsSchema,
  ownersSchema,
  planId,
  populationSchema,
  stateSchema,
  surfaceSchema,
  windowSchema
} from "./chunk-6GTMEVTP.js";
import {
  text,
  uniqueList
} from "./chunk-WOJBVI3K.js";
import {
  external_exports
} from "./chunk-NZOXBD7U.js";

// src/core/registry/schema.ts
var writtenEntry = external_exports.strictObject(
  {
    id: planId,
    title: text("a short title"),
    owners: ownersSchema,
    state: stateSchema,
    flags: flagsSchema,
    window: windowSchema,
    surface: surfaceSchema,
    population: populationSchema,
    "traffic-share": external_exports.number({ error: "the share of eligible units enrolled, in (0, 1]" }).gt(0, { error: "a share in (0, 1]" }).lte(1, { error: "a share in (0, 1]" }).optional(),
    events: uniqueList(eventName, "a list of logging events the test depends on").default([])
  },
  { error: "a test entry with id, title, owners, state, flags, window and surface" }
);
var writtenRegistrySchema = external_exports.strictObject(
  { tests: external_exports.array(writtenEntry, { error: "a list of test entries under tests" }) },
  { error: "a registry file: a mapping with a tests list" }
).describe("A Plumbline registry file: tests defined outside this repository\u2019s plans.");
var registrySchema = writtenRegistrySchema.transform(
  (written) => written.tests.map((entry) => ({
    id: entry.id,
    title: entry.title,
    owners: entry.owners,
    state: entry.state,
    flags: entry.flags,
    window: entry.window,
    surface: {
      path: entry.surface.path,
      ...entry.surface["exclusion-group"] ? { exclusionGroup: entry.surface["exclusion-group"] } : {},
      overlapsWith: entry.surface["overlaps-with"]
    },
    population: { platforms: entry.population.platforms, locales: entry.population.locales, regions: entry.population.regions },
    trafficShare: entry["traffic-share"] ?? 1,
    events: entry.events
  }))
);
function eventsOfPlan(plan) {
  const metrics = [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary];
  const events = [...plan.exposure.event ? [plan.exposure.event] : [], ...metrics.flatMap((m) => m.events)];
  return [...new Set(events)];
}
function entryFromPlan(plan, file, line) {
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
    file,
    line,
    plan
  };
}

// src/core/registry/load.ts
var REGISTRY_LIMITS = { maxBytes: 4 * 1024 * 1024, maxAliases: 1e3 };
var cachedJsonSchema;
function registryJsonSchema() {
  cachedJsonSchema ??= {
    $id: "https://plumbline.dev/schema/registry.schema.json",
    title: "Plumbline registry file",
    ...external_exports.toJSONSchema(writtenRegistrySchema, { io: "input", target: "draft-2020-12" })
  };
  return cachedJsonSchema;
}
function loadRegistryFile(text2, file) {
  const read = readYaml(text2, file, REGISTRY_LIMITS, "registry");
  if (!read.ok) return { ok: false, errors: read.problems };
  const checked = checkWritten(read.source, registrySchema, registryJsonSchema, "registry");
  if (!checked.ok) return { ok: false, errors: checked.problems };
  const entries = checked.value.map((entry, index) => ({ ...entry, file, line: read.source.locate(["tests", index, "id"]).line }));
  return { ok: true, entries };
}
function buildRegistry(plans, extra) {
  const candidates = [...plans.map((p) => entryFromPlan(p.plan, p.file, p.line)), ...extra].sort(
    // Code-unit order, not localeCompare: the same in every locale, and no collator to load at start.
    (a, b) => a.file < b.file ? -1 : a.file > b.file ? 1 : a.line - b.line
  );
  const byId = /* @__PURE__ */ new Map();
  const problems = [];
  for (const entry of candidates) {
    const first = byId.get(entry.id);
    if (first) {
      problems.push({
        severity: "error",
        code: "registry/duplicate-id",
        file: entry.file,
        line: entry.line,
        column: 1,
        field: "id",
        message: `id "${entry.id}" is already used by ${first.file}:${first.line}`,
        expected: "an id unique across all plans and registry files"
      });
      continue;
    }
    byId.set(entry.id, entry);
  }
  return { registry: { entries: [...byId.values()] }, problems };
}

export {
  eventsOfPlan,
  entryFromPlan,
  REGISTRY_LIMITS,
  registryJsonSchema,
  loadRegistryFile,
  buildRegistry
};
