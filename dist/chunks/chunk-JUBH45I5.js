#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  checkWritten,
  readYaml
} from "./chunk-7ABR6JAH.js";
import {
  flagKey,
  surfacePath
} from "./chunk-6GTMEVTP.js";
import {
  text,
  uniqueList
} from "./chunk-WOJBVI3K.js";
import {
  external_exports
} from "./chunk-NZOXBD7U.js";

// src/core/config/schema.ts
var SEVERITY_LEVELS = ["block", "warn", "note", "off"];
function compiles(pattern) {
  try {
    new RegExp(pattern, "u");
    return true;
  } catch {
    return false;
  }
}
var callPattern = (group, example) => {
  const expected = `a regular expression with a (?<${group}>...) group, e.g. ${example}`;
  return external_exports.string({ error: expected }).refine(compiles, { error: `${expected}; this one does not compile` }).refine((p) => p.includes(`(?<${group}>`), { error: `${expected}; this one has no (?<${group}>...) group` });
};
var pathGlob = text("a path or glob relative to the repository root, e.g. src/** or experiments");
var DEFAULT_PLAN_FOLDERS = ["experiments"];
var DEFAULT_BUG_LABELS = ["bug", "bugfix", "fix", "regression"];
var DEFAULT_NON_PRODUCT_PATHS = ["**/*.md", "**/*.mdx", "docs/**", "**/test/**", "**/tests/**", "**/__tests__/**", "**/*.test.*", "**/*.spec.*", ".github/**", "**/*.yml", "**/*.yaml", "**/*.json", "**/*.toml", ".*"];
function isTimeZone(zone) {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}
var DEFAULT_SCAN_EXCLUDE = ["**/node_modules/**", "**/dist/**", "**/build/**", "**/vendor/**", "**/*.min.js", "**/*.map"];
var writtenSettingsSchema = external_exports.strictObject(
  {
    plans: uniqueList(pathGlob, "a list of folders or globs that hold plan files, e.g. [experiments]").default(DEFAULT_PLAN_FOLDERS).describe("Where plan files live: folders (every .yaml/.yml file below) or globs. Default: [experiments]."),
    registries: uniqueList(pathGlob, "a list of registry files, e.g. [ops/other-tests.yaml]").default([]).describe("Extra registry files listing tests defined elsewhere."),
    "flag-calls": external_exports.array(callPattern("key", String.raw`isOn\(\s*["'](?<key>[\w.-]+)["']`), { error: "a list of flag-call patterns" }).default([]).describe("Extra patterns for code that evaluates a feature flag; added to the built-in ones."),
    "log-calls": external_exports.array(callPattern("event", String.raw`logEvent\(\s*["'](?<event>[\w.-]+)["']`), { error: "a list of logging-call patterns" }).default([]).describe("Extra patterns for code that logs an event; added to the built-in ones."),
    "builtin-patterns": external_exports.boolean({ error: "true or false" }).default(true).describe("Set false to use only the patterns written here."),
    "group-surfaces": uniqueList(surfacePath, "a list of surface paths shared between people, e.g. [teams/board]").default([]).describe("Surfaces (and everything below them) where people interact, so the unit must be a group."),
    scan: external_exports.strictObject(
      {
        include: uniqueList(pathGlob, "a list of globs to scan, e.g. [src/**]").default(["**"]),
        exclude: uniqueList(pathGlob, "a list of globs to skip, e.g. [**/fixtures/**]").default(DEFAULT_SCAN_EXCLUDE)
      },
      { error: "a mapping with include and exclude" }
    ).default({ include: ["**"], exclude: DEFAULT_SCAN_EXCLUDE }).describe("Which tracked files are searched for flags and events."),
    "exempt-flags": uniqueList(flagKey, "a list of flag keys that need no plan, e.g. [kill-payments]").default([]).describe("Flags that are not experiments (kill switches, operational toggles)."),
    "bug-fix": external_exports.strictObject(
      {
        enabled: external_exports.boolean({ error: "true or false" }).default(true),
        labels: uniqueList(text("a label name"), "a list of labels that mark a bug fix, e.g. [bug]").default(DEFAULT_BUG_LABELS),
        "title-prefixes": uniqueList(text("a conventional-commit type"), "a list of title prefixes, e.g. [fix]").default(["fix", "bugfix", "hotfix"]),
        "branch-prefixes": uniqueList(text("a branch prefix"), "a list of branch prefixes, e.g. [fix/]").default(["fix/", "bugfix/", "hotfix/"]),
        "silence-label": text("a label that turns the nudge off for one pull request").default("no-check-test"),
        "non-product-paths": uniqueList(pathGlob, "globs of files that are not product code").default(DEFAULT_NON_PRODUCT_PATHS),
        guardrail: external_exports.strictObject(
          {
            name: text("a metric name, e.g. error-rate"),
            rate: external_exports.number({ error: "a baseline rate strictly between 0 and 1" }).gt(0, { error: "a rate above 0" }).lt(1, { error: "a rate below 1" }),
            events: uniqueList(text("an event name"), "the events the guardrail is computed from", 1),
            direction: external_exports.enum(["increase", "decrease"], { error: "increase or decrease" }).default("decrease")
          },
          { error: "a guardrail: { name, rate, events, direction }" }
        ).optional().describe("The guardrail a check test of a fix watches (e.g. an error rate); with daily-units it gives the nudge a sizing line."),
        "daily-units": external_exports.number({ error: "eligible units per day, above 0" }).gt(0, { error: "eligible units per day, above 0" }).optional()
      },
      { error: "a mapping of bug-fix nudge settings" }
    ).default({
      enabled: true,
      labels: DEFAULT_BUG_LABELS,
      "title-prefixes": ["fix", "bugfix", "hotfix"],
      "branch-prefixes": ["fix/", "bugfix/", "hotfix/"],
      "silence-label": "no-check-test",
      "non-product-paths": DEFAULT_NON_PRODUCT_PATHS
    }).describe("The nudge on bug-fix pull requests to ship the fix behind a flag with a small check test."),
    digest: external_exports.strictObject(
      {
        "time-zone": external_exports.string({ error: "an IANA time zone, e.g. Europe/London" }).refine(isTimeZone, { error: "an IANA time zone, e.g. Europe/London or UTC" }).default("UTC"),
        "ending-soon-days": external_exports.number({ error: "a whole number of days" }).int().min(1, { error: "at least 1 day" }).default(7),
        "on-hold-days": external_exports.number({ error: "a whole number of days" }).int().min(1, { error: "at least 1 day" }).default(14),
        label: text("the label of the digest issue").default("plumbline-digest")
      },
      { error: "a mapping of digest settings" }
    ).default({ "time-zone": "UTC", "ending-soon-days": 7, "on-hold-days": 14, label: "plumbline-digest" }).describe("The weekly digest: the day boundary\u2019s time zone, what counts as ending soon and as on hold too long, the issue label."),
    severity: external_exports.record(
      external_exports.string().regex(/^[a-z0-9]+(?:[-/][a-z0-9]+)*$/, { error: "a finding code, e.g. plan-missing" }),
      external_exports.enum(SEVERITY_LEVELS, { error: `one of ${SEVERITY_LEVELS.join(", ")}` }),
      { error: "a mapping of finding code to block, warn, note or off" }
    ).default({}).describe("Raise or lower the severity of findings by code.")
  },
  { error: "a settings file: a mapping of settings" }
).describe("Plumbline repository settings.");
var settingsSchema = writtenSettingsSchema.transform((w) => ({
  planPaths: w.plans,
  registryFiles: w.registries,
  flagCalls: w["flag-calls"],
  logCalls: w["log-calls"],
  builtinPatterns: w["builtin-patterns"],
  groupSurfaces: w["group-surfaces"],
  scan: w.scan,
  exemptFlags: w["exempt-flags"],
  severity: w.severity,
  bugFix: {
    enabled: w["bug-fix"].enabled,
    labels: w["bug-fix"].labels,
    titlePrefixes: w["bug-fix"]["title-prefixes"],
    branchPrefixes: w["bug-fix"]["branch-prefixes"],
    silenceLabel: w["bug-fix"]["silence-label"],
    nonProductPaths: w["bug-fix"]["non-product-paths"],
    ...w["bug-fix"].guardrail ? { guardrail: w["bug-fix"].guardrail } : {},
    ...w["bug-fix"]["daily-units"] !== void 0 ? { dailyUnits: w["bug-fix"]["daily-units"] } : {}
  },
  digest: {
    timeZone: w.digest["time-zone"],
    endingSoonDays: w.digest["ending-soon-days"],
    onHoldDays: w.digest["on-hold-days"],
    label: w.digest.label
  }
}));

// src/core/config/load.ts
var SETTINGS_FILE_NAMES = [".plumbline.yml", ".plumbline.yaml"];
var cachedJsonSchema;
function settingsJsonSchema() {
  cachedJsonSchema ??= {
    $id: "https://plumbline.dev/schema/settings.schema.json",
    title: "Plumbline settings file",
    ...external_exports.toJSONSchema(writtenSettingsSchema, { io: "input", target: "draft-2020-12" })
  };
  return cachedJsonSchema;
}
function defaultSettings() {
  return settingsSchema.parse({});
}
function loadSettings(text2, file) {
  if (text2 === void 0) return { ok: true, settings: defaultSettings(), locate: () => ({ file, line: 1, column: 1 }) };
  const read = readYaml(text2, file, { maxBytes: 256 * 1024, maxAliases: 100 }, "settings");
  if (!read.ok) return { ok: false, errors: read.problems };
  const source = read.source.value === null || read.source.value === void 0 ? { ...read.source, value: {} } : read.source;
  const checked = checkWritten(source, settingsSchema, settingsJsonSchema, "settings");
  return checked.ok ? { ok: true, settings: checked.value, locate: (path) => read.source.locate(path) } : { ok: false, errors: checked.problems };
}

export {
  SETTINGS_FILE_NAMES,
  settingsJsonSchema,
  defaultSettings,
  loadSettings
};
