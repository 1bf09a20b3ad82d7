#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  DAILY_UNITS
} from "./chunk-JLYO35IC.js";
import {
  checkWritten,
  readYaml,
  valueAt
} from "./chunk-LSO7NHYS.js";
import {
  flagKey,
  surfacePath
} from "./chunk-XJ3K7LET.js";
import {
  calendarDate,
  external_exports,
  openShare,
  text,
  uniqueList,
  wholeNumber
} from "./chunk-5GP5B2QS.js";

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
var CALL_PATTERN_MAX_LENGTH = 500;
var callPattern = (group, example) => {
  const expected = `a regular expression with a (?<${group}>...) group, e.g. ${example}`;
  return external_exports.string({ error: expected }).max(CALL_PATTERN_MAX_LENGTH, { error: `${expected}; at most ${CALL_PATTERN_MAX_LENGTH} characters long` }).refine(compiles, { error: `${expected}; this one does not compile` }).refine((p) => p.includes(`(?<${group}>`), { error: `${expected}; this one has no (?<${group}>...) group` });
};
var GLOB_MAX_LENGTH = 500;
var pathGlob = text("a path or glob relative to the repository root, e.g. src/** or experiments").max(GLOB_MAX_LENGTH, {
  error: `a path or glob relative to the repository root, at most ${GLOB_MAX_LENGTH} characters long`
});
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
var SQL_NAME_MAX_LENGTH = 255;
var noControlCharacters = (value) => !/[\u0000-\u001f\u007f]/u.test(value);
var sqlName = (expected) => text(expected).max(SQL_NAME_MAX_LENGTH, { error: `${expected}, at most ${SQL_NAME_MAX_LENGTH} characters long` }).refine(noControlCharacters, { error: `${expected}, without control characters (tabs, line breaks)` });
var column = (what, example) => sqlName(`the column holding ${what}, e.g. ${example}`);
var DATA_FORMATS = ["parquet", "csv"];
var source = {
  table: sqlName("a table name, optionally qualified with dots, e.g. analytics.exposures").optional().describe("A table (or view) of the engine; dots separate schema and table."),
  files: pathGlob.optional().describe("Files read by DuckDB: a path or glob relative to the repository, e.g. data/exposures/*.parquet."),
  format: external_exports.enum(DATA_FORMATS, { error: `one of ${DATA_FORMATS.join(", ")}` }).optional().describe("The files\u2019 format. Default: from the extension (.parquet or .csv).")
};
var oneSource = (value) => value.table === void 0 !== (value.files === void 0) || value.table === void 0 && value.files === void 0;
var oneSourceError = { error: "either table or files, not both" };
var DEFAULT_EXPOSURE_COLUMNS = { "unit-id": "unit_id", arm: "arm", "exposed-at": "exposed_at" };
var DEFAULT_EXPERIMENT_COLUMN = "experiment";
var DEFAULT_EVENT_COLUMNS = { "unit-id": "unit_id", event: "event", "occurred-at": "occurred_at", value: "value" };
var DEFAULT_MEMORY_LIMIT = "1.5GiB";
var exposuresSource = external_exports.strictObject(
  {
    ...source,
    "unit-id": column("the unit id", "user_id").default(DEFAULT_EXPOSURE_COLUMNS["unit-id"]),
    arm: column("the arm name", "variant").default(DEFAULT_EXPOSURE_COLUMNS.arm),
    "exposed-at": column("the exposure time (a timestamp with time zone)", "exposed_at").default(DEFAULT_EXPOSURE_COLUMNS["exposed-at"]),
    experiment: external_exports.union([column("the plan id", "experiment"), external_exports.literal(false)], { error: "the column holding the plan id, e.g. experiment, or false when every row is this plan\u2019s" }).default(DEFAULT_EXPERIMENT_COLUMN).describe("Only rows whose value in this column is the plan\u2019s id count (one exposure table usually serves many tests). false: every row is this plan\u2019s."),
    segments: uniqueList(column("a segment", "platform"), "a list of segment columns, e.g. [platform, country]").default([]).describe("Columns to break the totals down by (value at the unit\u2019s first exposure).")
  },
  { error: "a mapping with table or files and the column names" }
).refine(oneSource, oneSourceError).default({ ...DEFAULT_EXPOSURE_COLUMNS, experiment: DEFAULT_EXPERIMENT_COLUMN, segments: [] }).describe("Where exposures live (one row per exposure; the first per unit counts) and their columns.");
var eventsSource = external_exports.strictObject(
  {
    ...source,
    "unit-id": column("the unit id", "user_id").default(DEFAULT_EVENT_COLUMNS["unit-id"]),
    event: column("the logging event name", "event_name").default(DEFAULT_EVENT_COLUMNS.event),
    "occurred-at": column("the event time (a timestamp with time zone)", "occurred_at").default(DEFAULT_EVENT_COLUMNS["occurred-at"]),
    value: column("the event\u2019s value (a number, may be NULL)", "amount").default(DEFAULT_EVENT_COLUMNS.value)
  },
  { error: "a mapping with table or files and the column names" }
).refine(oneSource, oneSourceError).default({ ...DEFAULT_EVENT_COLUMNS }).describe("Where logging events live and their columns.");
var MEMORY = /^\d+(?:\.\d+)?\s*(?:KB|MB|GB|TB|KiB|MiB|GiB|TiB)$/;
var dataSettings = external_exports.strictObject(
  {
    exposures: exposuresSource,
    events: eventsSource,
    "pre-period-days": wholeNumber("a whole number of days from 1 to 365, e.g. 28", 1, 365).optional().describe("Days before each unit\u2019s first exposure whose events make its pre-period value (CUPED), for plans sized with a pre-period correlation."),
    "metric-window-days": wholeNumber("a whole number of days from 1 to 3650, e.g. 14", 1, 3650).optional().describe("Default window from first exposure in which events count, for metrics whose per-unit.within-days is not written. Default: none (every event up to data-through)."),
    duckdb: external_exports.strictObject(
      {
        "memory-limit": external_exports.string({ error: "an amount of memory, e.g. 1.5GiB or 800MB" }).regex(MEMORY, { error: "an amount of memory, e.g. 1.5GiB or 800MB" }).default(DEFAULT_MEMORY_LIMIT),
        threads: wholeNumber("a whole number of threads from 1 to 256", 1, 256).optional().describe("Default: one per core.")
      },
      { error: "a mapping with memory-limit and threads" }
    ).default({ "memory-limit": DEFAULT_MEMORY_LIMIT }).describe("The embedded engine: its memory limit (it spills to disk beyond it) and threads.")
  },
  { error: "a mapping with exposures, events, pre-period-days and duckdb" }
).default({ exposures: { ...DEFAULT_EXPOSURE_COLUMNS, experiment: DEFAULT_EXPERIMENT_COLUMN, segments: [] }, events: { ...DEFAULT_EVENT_COLUMNS }, duckdb: { "memory-limit": DEFAULT_MEMORY_LIMIT } }).describe("Where the experiment data lives, for `plumbline totals` (see docs/totals-from-sql.md).");
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
        "daily-units": external_exports.number({ error: "eligible units per day, above 0" }).gte(DAILY_UNITS.min, { error: `eligible units per day, ${DAILY_UNITS.why}` }).lte(DAILY_UNITS.max, { error: `eligible units per day, ${DAILY_UNITS.why}` }).optional()
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
    // Sizing conventions (issue 13): guardrails' own error rates, the longest sensible window, atypical periods.
    sizing: external_exports.strictObject(
      {
        "guardrail-alpha": openShare("a one-sided significance level for guardrails strictly between 0 and 1, e.g. 0.05").default(0.05),
        "guardrail-power": openShare("a power for guardrails strictly between 0 and 1, e.g. 0.8").default(0.8),
        "guardrail-arm-correction": external_exports.boolean({ error: "true or false" }).default(false).describe("Divide a guardrail\u2019s \u03B1 among several treatment arms (Bonferroni); off by default, since it makes a safety check less sensitive."),
        "longest-window-days": external_exports.number({ error: "a whole number of days from 7 to 365" }).int({ error: "a whole number of days from 7 to 365" }).min(7, { error: "at least 7 days" }).max(365, { error: "at most 365 days" }).default(56).describe("Beyond this a test is not feasible at its traffic."),
        "atypical-periods": external_exports.array(
          external_exports.strictObject(
            {
              name: text("a name for the period, e.g. winter sale"),
              start: calendarDate("a start date written YYYY-MM-DD, e.g. 2026-11-27"),
              end: calendarDate("an end date written YYYY-MM-DD, e.g. 2026-11-30")
            },
            { error: "a period: { name, start, end }" }
          ),
          { error: "a list of periods, e.g. [{ name: winter sale, start: 2026-11-27, end: 2026-11-30 }]" }
        ).default([]).describe("Holidays, sales and other periods when behaviour is unusual; a window that overlaps one gets a note.")
      },
      { error: "a mapping of sizing settings" }
    ).default({ "guardrail-alpha": 0.05, "guardrail-power": 0.8, "guardrail-arm-correction": false, "longest-window-days": 56, "atypical-periods": [] }).describe("Sizing conventions: guardrails\u2019 error rates, the longest sensible window, atypical periods."),
    "treatment-lines": external_exports.number({ error: "a whole number of lines from 0 to 200, e.g. 10" }).int({ error: "a whole number of lines, e.g. 10" }).min(0, { error: "a whole number of lines from 0 to 200" }).max(200, { error: "a whole number of lines from 0 to 200" }).default(10).describe("Around a running test\u2019s flag read, code changed within the enclosing function (or block) counts as a treatment change; for a read outside any function or block, this many lines above and below."),
    data: dataSettings,
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
  treatmentLines: w["treatment-lines"],
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
  sizing: {
    guardrailAlpha: w.sizing["guardrail-alpha"],
    guardrailPower: w.sizing["guardrail-power"],
    guardrailArmCorrection: w.sizing["guardrail-arm-correction"],
    longestWindowDays: w.sizing["longest-window-days"],
    atypicalPeriods: w.sizing["atypical-periods"]
  },
  data: normalizeData(w.data),
  digest: {
    timeZone: w.digest["time-zone"],
    endingSoonDays: w.digest["ending-soon-days"],
    onHoldDays: w.digest["on-hold-days"],
    label: w.digest.label
  }
}));
function sourceOf(w) {
  if (w.table !== void 0) return { source: { table: w.table } };
  if (w.files !== void 0) return { source: { files: w.files, ...w.format ? { format: w.format } : {} } };
  return {};
}
function normalizeData(w) {
  const x = w.exposures;
  const e = w.events;
  return {
    exposures: {
      ...sourceOf(x),
      columns: { unitId: x["unit-id"], arm: x.arm, exposedAt: x["exposed-at"], ...x.experiment !== false ? { experiment: x.experiment } : {} },
      segments: x.segments
    },
    events: { ...sourceOf(e), columns: { unitId: e["unit-id"], event: e.event, occurredAt: e["occurred-at"], value: e.value } },
    ...w["pre-period-days"] !== void 0 ? { prePeriodDays: w["pre-period-days"] } : {},
    ...w["metric-window-days"] !== void 0 ? { metricWindowDays: w["metric-window-days"] } : {},
    duckdb: { memoryLimit: w.duckdb["memory-limit"], ...w.duckdb.threads !== void 0 ? { threads: w.duckdb.threads } : {} }
  };
}

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
  if (text2 === void 0) return { ok: true, settings: defaultSettings(), locate: () => ({ file, line: 1, column: 1 }), isWritten: () => false };
  const read = readYaml(text2, file, { maxBytes: 256 * 1024, maxAliases: 100 }, "settings");
  if (!read.ok) return { ok: false, errors: read.problems };
  const source2 = read.source.value === null || read.source.value === void 0 ? { ...read.source, value: {} } : read.source;
  const checked = checkWritten(source2, settingsSchema, settingsJsonSchema, "settings");
  return checked.ok ? { ok: true, settings: checked.value, locate: (path) => read.source.locate(path), isWritten: (path) => valueAt(source2.value, path) !== void 0 } : { ok: false, errors: checked.problems };
}

export {
  SETTINGS_FILE_NAMES,
  settingsJsonSchema,
  defaultSettings,
  loadSettings
};
