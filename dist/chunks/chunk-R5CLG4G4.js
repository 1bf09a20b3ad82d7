#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  checkWritten,
  formatFieldPath,
  readYaml,
  valueAt
} from "./chunk-4F4MJKFM.js";
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
  windowSchema
} from "./chunk-J5RDXJJD.js";
import {
  external_exports,
  text,
  uniqueList
} from "./chunk-7GKTQ2BG.js";

// src/core/plan/renamed-keys.ts
var SURFACE_RENAMES = [
  {
    old: "exclusion-group",
    replacement: "traffic-split",
    how: "its slice: { from, to } is now range: { start, end }, with the same percent values",
    example: "traffic-split: { name: checkout-core, range: { start: 0, end: 50 } }"
  }
];
function renamedSurfaceKeys(source, surfaces, codePrefix) {
  const problems = [];
  for (const path of surfaces) {
    const surface = valueAt(source.value, path);
    if (!surface || typeof surface !== "object" || Array.isArray(surface)) continue;
    for (const rename of SURFACE_RENAMES) {
      if (!(rename.old in surface)) continue;
      problems.push({
        severity: "warning",
        code: `${codePrefix}/renamed-key`,
        ...source.locateKey(path, rename.old),
        field: formatFieldPath([...path, rename.old]),
        message: `"${rename.old}" is the old name of "${rename.replacement}" and is still read for now; rename it (${rename.how})`,
        expected: rename.example
      });
    }
  }
  return problems;
}

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
    events: uniqueList(eventName, "a list of logging events the test depends on").default([]),
    amendments: amendmentsSchema
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
    surface: normalizeSurface(entry.surface),
    population: { platforms: entry.population.platforms, locales: entry.population.locales, regions: entry.population.regions },
    trafficShare: entry["traffic-share"] ?? 1,
    events: entry.events,
    amendments: entry.amendments
  }))
);
function eventsOfPlan(plan) {
  const metrics = [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary];
  const events = [...plan.exposure.event ? [plan.exposure.event] : [], ...metrics.flatMap((m) => m.events)];
  return [...new Set(events)];
}
function entryFromPlan(plan, file, line, keyLines) {
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
    ...keyLines ? { keyLines } : {},
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
  const entries = checked.value.map((entry, index) => ({ ...entry, file, line: read.source.locate(["tests", index, "id"]).line, keyLines: read.source.keyLines(["tests", index]) }));
  const warnings = renamedSurfaceKeys(read.source, entries.map((_, index) => ["tests", index, "surface"]), "registry");
  return { ok: true, entries, warnings };
}
function buildRegistry(plans, extra) {
  const candidates = [...plans.map((p) => entryFromPlan(p.plan, p.file, p.line, p.keyLines)), ...extra].sort(
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
  renamedSurfaceKeys,
  REGISTRY_LIMITS,
  registryJsonSchema,
  loadRegistryFile,
  buildRegistry
};
