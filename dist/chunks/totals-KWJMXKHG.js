#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  pathInRepository
} from "./chunk-4JE24R3H.js";
import {
  findNamedPlan
} from "./chunk-FBZ7MJNX.js";
import {
  DECIMAL_TEXT
} from "./chunk-2ITRHRXB.js";
import {
  loadTotals
} from "./chunk-TH3NNBTK.js";
import {
  lineOfKey,
  requireWorkspace,
  require_picomatch
} from "./chunk-ZWIGW2MY.js";
import "./chunk-V65C5FSR.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-TLWZYCJO.js";
import {
  addDays,
  daysBetween
} from "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-J3CQQVSX.js";
import {
  closestName,
  formatFieldPath,
  require_dist
} from "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  DataFaultError,
  UsageError
} from "./chunk-OICJSZPX.js";
import {
  countOf
} from "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import {
  __toESM
} from "./chunk-FUJ7I5KY.js";

// src/run/totals.ts
var import_picomatch2 = __toESM(require_picomatch(), 1);
import { posix as posix2 } from "node:path";

// src/core/totals-query/dialects.ts
var doubled = (quote) => (text) => `${quote}${text.split(quote).join(quote + quote)}${quote}`;
function backslashed(text, quote, doubleQuote) {
  let out = "";
  for (const ch of text) {
    const code = ch.codePointAt(0);
    if (ch === "\\") out += "\\\\";
    else if (ch === quote) out += doubleQuote ? quote + quote : `\\${quote}`;
    else if (code < 32 || code === 127) out += `\\u${code.toString(16).padStart(4, "0")}`;
    else out += ch;
  }
  return `${quote}${out}${quote}`;
}
var ansiIdentifier = doubled('"');
var ansiString = doubled("'");
var duckdb = {
  name: "duckdb",
  identifier: ansiIdentifier,
  string: ansiString,
  midnightUtc: (day) => `CAST(${ansiString(`${day} 00:00:00+00`)} AS TIMESTAMPTZ)`,
  instant: (e) => `CAST(${e} AS TIMESTAMPTZ)`,
  utcDay: (e) => `STRFTIME(TIMEZONE('UTC', ${e}), '%Y-%m-%d')`,
  addHours: (e, h) => `(${e} ${h < 0 ? "-" : "+"} INTERVAL '${Math.abs(h)} hours')`,
  value: (e) => `CAST(${e} AS DECIMAL(38, 6))`,
  wide: (e) => `CAST(${e} AS DECIMAL(38, 12))`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  integer: (e) => `CAST(${e} AS BIGINT)`
};
var postgres = {
  name: "postgres",
  identifier: ansiIdentifier,
  // With standard_conforming_strings off a backslash would escape; E'' reads it the same either way.
  string: (text) => text.includes("\\") ? `E${backslashed(text, "'", true)}` : ansiString(text),
  midnightUtc: (day) => `CAST(${ansiString(`${day} 00:00:00+00`)} AS TIMESTAMPTZ)`,
  instant: (e) => `CAST(${e} AS TIMESTAMPTZ)`,
  utcDay: (e) => `TO_CHAR(${e} AT TIME ZONE 'UTC', 'YYYY-MM-DD')`,
  addHours: (e, h) => `(${e} ${h < 0 ? "-" : "+"} INTERVAL '${Math.abs(h)} hours')`,
  value: (e) => `CAST(${e} AS NUMERIC(38, 6))`,
  wide: (e) => `CAST(${e} AS NUMERIC(38, 12))`,
  text: (e) => `CAST(${e} AS TEXT)`,
  integer: (e) => `CAST(${e} AS BIGINT)`
};
var trino = {
  name: "trino",
  identifier: ansiIdentifier,
  string: ansiString,
  midnightUtc: (day) => `CAST(${ansiString(`${day} 00:00:00 UTC`)} AS TIMESTAMP(6) WITH TIME ZONE)`,
  instant: (e) => `CAST(${e} AS TIMESTAMP(6) WITH TIME ZONE)`,
  utcDay: (e) => `DATE_FORMAT(AT_TIMEZONE(${e}, 'UTC'), '%Y-%m-%d')`,
  addHours: (e, h) => `DATE_ADD('hour', ${h}, ${e})`,
  value: (e) => `CAST(${e} AS DECIMAL(38, 6))`,
  wide: (e) => `CAST(${e} AS DECIMAL(38, 12))`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  integer: (e) => `CAST(${e} AS BIGINT)`
};
var bigquery = {
  name: "bigquery",
  identifier: (name) => backslashed(name, "`", false),
  string: (text) => backslashed(text, "'", false),
  midnightUtc: (day) => `TIMESTAMP(${backslashed(`${day} 00:00:00+00`, "'", false)})`,
  instant: (e) => `CAST(${e} AS TIMESTAMP)`,
  utcDay: (e) => `FORMAT_TIMESTAMP('%Y-%m-%d', ${e}, 'UTC')`,
  addHours: (e, h) => `TIMESTAMP_ADD(${e}, INTERVAL ${h} HOUR)`,
  // NUMERIC holds 29 digits before the point and 9 after: values rounded to 6 decimals as elsewhere; a
  // square of a value with more than 4 decimals is rounded at the 9th (docs/totals-from-sql.md).
  value: (e) => `ROUND(CAST(${e} AS NUMERIC), 6)`,
  wide: (e) => `CAST(${e} AS NUMERIC)`,
  text: (e) => `CAST(${e} AS STRING)`,
  integer: (e) => `CAST(${e} AS INT64)`
};
var snowflake = {
  name: "snowflake",
  identifier: ansiIdentifier,
  string: (text) => backslashed(text, "'", true),
  midnightUtc: (day) => `TO_TIMESTAMP_TZ('${day} 00:00:00 +00:00')`,
  instant: (e) => `CAST(${e} AS TIMESTAMP_TZ)`,
  utcDay: (e) => `TO_CHAR(CONVERT_TIMEZONE('UTC', ${e}), 'YYYY-MM-DD')`,
  addHours: (e, h) => `DATEADD(hour, ${h}, ${e})`,
  value: (e) => `CAST(${e} AS NUMBER(38, 6))`,
  wide: (e) => `CAST(${e} AS NUMBER(38, 12))`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  integer: (e) => `CAST(${e} AS BIGINT)`
};
var spark = {
  name: "spark",
  identifier: doubled("`"),
  string: (text) => backslashed(text, "'", false),
  midnightUtc: (day) => `CAST('${day} 00:00:00Z' AS TIMESTAMP)`,
  instant: (e) => `CAST(${e} AS TIMESTAMP)`,
  utcDay: (e) => `DATE_FORMAT(TO_UTC_TIMESTAMP(${e}, CURRENT_TIMEZONE()), 'yyyy-MM-dd')`,
  addHours: (e, h) => `TIMESTAMP_MICROS(UNIX_MICROS(${e}) + ${h * 36e8})`,
  value: (e) => `CAST(${e} AS DECIMAL(38, 6))`,
  wide: (e) => `CAST(${e} AS DECIMAL(38, 12))`,
  text: (e) => `CAST(${e} AS STRING)`,
  integer: (e) => `CAST(${e} AS BIGINT)`
};
var DIALECT = { duckdb, postgres, trino, bigquery, snowflake, spark };
function tableName(dialect, name) {
  return name.split(".").map((part) => dialect.identifier(part.trim())).join(".");
}

// src/core/totals-query/metric-spec.ts
function planMetrics(plan) {
  return [
    { metric: plan.metrics.primary, path: ["metrics", "primary"] },
    ...plan.metrics.guardrails.map((metric, i) => ({ metric, path: ["metrics", "guardrails", i] })),
    ...plan.metrics.secondary.map((metric, i) => ({ metric, path: ["metrics", "secondary", i] }))
  ];
}
function percentileFraction(percentile) {
  for (let decimals = 0; decimals <= 6; decimals++) {
    const denominator = 100 * 10 ** decimals;
    const numerator = Math.round(percentile * 10 ** decimals);
    if (Math.abs(numerator / 10 ** decimals - percentile) < 1e-12) return { numerator, denominator };
  }
  return void 0;
}
function metricSpecs(plan, options) {
  const problems = [];
  const specs = [];
  const cupedPlanned = plan.design.prePeriodCorrelation > 0;
  for (const { metric, path } of planMetrics(plan)) {
    const perUnit = metric.perUnit ?? {};
    const withinDays = perUnit.withinDays ?? options.metricWindowDays;
    const common = {
      name: metric.name,
      kind: metric.kind,
      ...withinDays !== void 0 ? { withinHours: withinDays * 24 } : {}
    };
    const pre = options.prePeriodDays !== void 0 && metric.kind !== "ratio" && (cupedPlanned || (metric.prePeriod?.correlation ?? 0) > 0);
    if (metric.kind === "proportion") {
      specs.push({
        ...common,
        y: { events: perUnit.events ?? metric.events, rule: perUnit.counts === "without-event" ? "none" : "any" },
        ...perUnit.among ? { among: perUnit.among } : {},
        pre
      });
    } else if (metric.kind === "mean") {
      let cap;
      if (metric.cappedAt !== void 0 && metric.cappedAt < 100) {
        cap = percentileFraction(metric.cappedAt);
        if (!cap) problems.push({ path: [...path, "capped-at"], message: `the percentile ${metric.cappedAt} has more than 6 decimals`, expected: "a percentile with at most 6 decimals, e.g. 99 or 99.5" });
      }
      specs.push({ ...common, y: { events: perUnit.events ?? metric.events, rule: perUnit.value ?? "sum" }, ...cap ? { cap } : {}, pre });
    } else {
      const numerator = perUnit.numerator?.events ?? (metric.events.length === 2 ? [metric.events[0]] : void 0);
      const denominator = perUnit.denominator?.events ?? (metric.events.length === 2 ? [metric.events[1]] : void 0);
      if (!numerator || !denominator) {
        problems.push({
          path: [...path, perUnit.numerator || perUnit.denominator ? "per-unit" : "events"],
          message: `the ratio ${metric.name} has ${metric.events.length} events and does not say which make the numerator and which the denominator`,
          expected: "per-unit: { numerator: { events: [...] }, denominator: { events: [...] } }, or exactly two events (numerator first)"
        });
        continue;
      }
      specs.push({
        ...common,
        y: { events: numerator, rule: perUnit.numerator?.value ?? "sum" },
        x: { events: denominator, rule: perUnit.denominator?.value ?? "sum" },
        pre: false
      });
    }
  }
  return problems.length ? { ok: false, problems } : { ok: true, specs };
}

// src/core/totals-query/build-query.ts
var ROW_COLUMNS = ["grain", "arm", "bucket", "metric", "units", "n", "sum_y", "sum_y2", "sum_x", "sum_x2", "sum_xy", "sum_pre", "sum_pre2", "sum_ypre"];
var GRAINS = ["arm", "day", "segment", "excluded"];
var EXCLUDED_REASONS = ["several-arms", "unknown-arm"];
var NO_EXPOSURE_TIME = "no-exposure-time";
var MISSING_SEGMENT = "(missing)";
var indent = (text, by = "  ") => text.split("\n").map((l) => l ? by + l : l).join("\n");
function from(d, source, what) {
  if ("table" in source) return tableName(d, source.table);
  if (d.name !== "duckdb") throw new Error(`${what}: files are read by DuckDB only`);
  const list2 = `[${source.files.map((f) => d.string(f)).join(", ")}]`;
  return source.format === "parquet" ? `read_parquet(${list2}, union_by_name = true)` : `read_csv(${list2}, header = true, union_by_name = true)`;
}
var list = (d, items) => items.map((i) => d.string(i)).join(", ");
function buildTotalsQuery(input) {
  const { plan } = input;
  const d = DIALECT[input.dialect];
  const start = plan.window.start;
  if (!start) return { ok: false, problems: [{ path: ["window", "start"], message: "the plan has no start date, so the query cannot tell which exposures belong to the test", expected: "window.start, e.g. 2026-11-09" }] };
  if (input.dataThrough < start) return { ok: false, problems: [{ path: ["window", "start"], message: `the data would run through ${input.dataThrough}, before the test starts on ${start}`, expected: `--through on or after ${start}` }] };
  const specs = metricSpecs(plan, {
    ...input.prePeriodDays !== void 0 ? { prePeriodDays: input.prePeriodDays } : {},
    ...input.metricWindowDays !== void 0 ? { metricWindowDays: input.metricWindowDays } : {}
  });
  if (!specs.ok) return specs;
  for (const [what, source] of [["exposures", input.exposures.source], ["events", input.events.source]]) {
    if (!("table" in source) && d.name !== "duckdb") {
      return { ok: false, problems: [{ path: [], message: `the ${what} are files, which only DuckDB reads`, expected: `data.${what}.table for --dialect ${d.name}, or --engine duckdb` }] };
    }
  }
  const metrics = specs.specs;
  const arms = plan.design.arms.map((a) => a.name);
  const begin = d.midnightUtc(start);
  const end = d.midnightUtc(addDays(input.dataThrough, 1));
  const preHours = metrics.some((m) => m.pre) ? input.prePeriodDays * 24 : 0;
  const x = input.exposures.columns;
  const e = input.events.columns;
  const segments = input.exposures.segments;
  const seg = (i) => `segment_${i + 1}`;
  const col = (name) => d.identifier(name);
  const exposedAt = d.instant(col(x.exposedAt));
  const occurredAt = d.instant(col(e.occurredAt));
  const ctes = [];
  ctes.push([
    "exposure_rows",
    [
      `SELECT ${d.text(col(x.unitId))} AS unit_id, ${d.text(col(x.arm))} AS arm, ${exposedAt} AS exposed_at${segments.map((s, i) => `, ${d.text(col(s))} AS ${seg(i)}`).join("")}`,
      `FROM ${from(d, input.exposures.source, "exposures")}`,
      `WHERE ${col(x.unitId)} IS NOT NULL`,
      // Rows without a time stay here only to be counted (the untimed row below); every other use skips them.
      `  AND (${exposedAt} IS NULL`,
      `    OR (${exposedAt} >= ${begin}`,
      `      AND ${exposedAt} < ${end}))`,
      ...x.experiment ? [`  AND ${d.text(col(x.experiment))} = ${d.string(plan.id)}`] : []
    ].join("\n")
  ]);
  ctes.push(["known_rows", `SELECT *
FROM exposure_rows
WHERE exposed_at IS NOT NULL
  AND arm IN (${list(d, arms)})`]);
  ctes.push(["first_exposures", "SELECT unit_id, MIN(exposed_at) AS first_exposed, MIN(arm) AS arm, MAX(arm) AS last_arm\nFROM known_rows\nGROUP BY unit_id"]);
  if (segments.length) {
    ctes.push([
      "first_segments",
      [
        `SELECT k.unit_id${segments.map((_, i) => `, MIN(k.${seg(i)}) AS ${seg(i)}`).join("")}`,
        "FROM known_rows k",
        "JOIN first_exposures f ON f.unit_id = k.unit_id AND f.first_exposed = k.exposed_at",
        "GROUP BY k.unit_id"
      ].join("\n")
    ]);
  }
  ctes.push([
    "units",
    [
      `SELECT f.unit_id, f.arm, f.first_exposed, ${d.utcDay("f.first_exposed")} AS exposure_day${segments.map((_, i) => `, COALESCE(s.${seg(i)}, ${d.string(MISSING_SEGMENT)}) AS ${seg(i)}`).join("")}`,
      "FROM first_exposures f",
      ...segments.length ? ["LEFT JOIN first_segments s ON s.unit_id = f.unit_id"] : [],
      "WHERE f.arm = f.last_arm"
    ].join("\n")
  ]);
  const allEvents = [...new Set(metrics.flatMap((m) => [...m.y.events, ...m.x?.events ?? [], ...m.among ?? []]))];
  ctes.push([
    "event_rows",
    [
      `SELECT ${d.text(col(e.unitId))} AS unit_id, ${d.text(col(e.event))} AS event, ${occurredAt} AS occurred_at, ${d.value(col(e.value))} AS value`,
      `FROM ${from(d, input.events.source, "events")}`,
      `WHERE ${col(e.unitId)} IS NOT NULL`,
      `  AND ${d.text(col(e.event))} IN (${list(d, allEvents)})`,
      `  AND ${occurredAt} >= ${preHours ? d.addHours(begin, -preHours) : begin}`,
      `  AND ${occurredAt} < ${end}`
    ].join("\n")
  ]);
  const after = (m) => `e.occurred_at >= u.first_exposed${m.withinHours ? ` AND e.occurred_at < ${d.addHours("u.first_exposed", m.withinHours)}` : ""}`;
  const before = `e.occurred_at >= ${d.addHours("u.first_exposed", -preHours)} AND e.occurred_at < u.first_exposed`;
  const aggregate = (v, when) => v.rule === "sum" ? `SUM(CASE WHEN e.event IN (${list(d, v.events)}) AND ${when} THEN COALESCE(e.value, 0) ELSE 0 END)` : `SUM(CASE WHEN e.event IN (${list(d, v.events)}) AND ${when} THEN 1 ELSE 0 END)`;
  const raw = [];
  metrics.forEach((m, i) => {
    raw.push(`${aggregate(m.y, after(m))} AS m${i}_y`);
    if (m.x) raw.push(`${aggregate(m.x, after(m))} AS m${i}_x`);
    if (m.among) raw.push(`${aggregate({ events: m.among, rule: "count" }, after(m))} AS m${i}_in`);
    if (m.pre) raw.push(`${aggregate(m.y, before)} AS m${i}_pre`);
  });
  ctes.push(["unit_events", ["SELECT u.unit_id,", indent(raw.join(",\n")), "FROM units u", "JOIN event_rows e ON e.unit_id = u.unit_id", "GROUP BY u.unit_id"].join("\n")]);
  const valueOf = (v, column) => {
    const zeroed = `COALESCE(ue.${column}, 0)`;
    if (v.rule === "any") return `CASE WHEN ${zeroed} > 0 THEN 1 ELSE 0 END`;
    if (v.rule === "none") return `CASE WHEN ${zeroed} = 0 THEN 1 ELSE 0 END`;
    return zeroed;
  };
  const perUnit = [];
  metrics.forEach((m, i) => {
    const inN = m.among ? `CASE WHEN COALESCE(ue.m${i}_in, 0) > 0 THEN 1 ELSE 0 END` : "1";
    const onlyIn = (expr) => m.among ? `CASE WHEN COALESCE(ue.m${i}_in, 0) > 0 THEN ${expr} ELSE 0 END` : expr;
    perUnit.push(`${inN} AS m${i}_n`);
    perUnit.push(`${onlyIn(valueOf(m.y, `m${i}_y`))} AS m${i}_y`);
    if (m.x) perUnit.push(`${valueOf(m.x, `m${i}_x`)} AS m${i}_x`);
    if (m.pre) perUnit.push(`${onlyIn(valueOf(m.y, `m${i}_pre`))} AS m${i}_pre`);
  });
  const capped = metrics.map((m, i) => m.cap ? i : -1).filter((i) => i >= 0);
  ctes.push([
    capped.length ? "uncapped_values" : "unit_values",
    [`SELECT u.unit_id, u.arm, u.exposure_day${segments.map((_, i) => `, u.${seg(i)}`).join("")},`, indent(perUnit.join(",\n")), "FROM units u", "LEFT JOIN unit_events ue ON ue.unit_id = u.unit_id"].join("\n")
  ]);
  if (capped.length) {
    for (const i of capped) {
      const { numerator, denominator } = metrics[i].cap;
      ctes.push([
        `cap_${i}`,
        [
          `SELECT MIN(value) AS cap`,
          "FROM (",
          indent(`SELECT m${i}_y AS value, ROW_NUMBER() OVER (ORDER BY m${i}_y) AS unit_rank, COUNT(*) OVER () AS unit_count
FROM uncapped_values`),
          ") ranked",
          `WHERE unit_rank * ${denominator} >= unit_count * ${numerator}`
        ].join("\n")
      ]);
    }
    const columns = metrics.flatMap((m, i) => {
      const own = [`v.m${i}_n`, m.cap ? `CASE WHEN v.m${i}_y > c${i}.cap THEN c${i}.cap ELSE v.m${i}_y END AS m${i}_y` : `v.m${i}_y`];
      if (m.x) own.push(`v.m${i}_x`);
      if (m.pre) own.push(`v.m${i}_pre`);
      return own;
    });
    ctes.push([
      "unit_values",
      [`SELECT v.unit_id, v.arm, v.exposure_day${segments.map((_, i) => `, v.${seg(i)}`).join("")},`, indent(columns.join(",\n")), "FROM uncapped_values v", ...capped.map((i) => `CROSS JOIN cap_${i} c${i}`)].join("\n")
    ]);
  }
  const sums = ["COUNT(*) AS units"];
  metrics.forEach((m, i) => {
    sums.push(`SUM(m${i}_n) AS m${i}_n`, `SUM(m${i}_y) AS m${i}_sy`, `SUM(m${i}_y * m${i}_y) AS m${i}_sy2`);
    if (m.x) sums.push(`SUM(m${i}_x) AS m${i}_sx`, `SUM(m${i}_x * m${i}_x) AS m${i}_sx2`, `SUM(m${i}_y * m${i}_x) AS m${i}_sxy`);
    if (m.pre) sums.push(`SUM(m${i}_pre) AS m${i}_sp`, `SUM(m${i}_pre * m${i}_pre) AS m${i}_sp2`, `SUM(m${i}_y * m${i}_pre) AS m${i}_syp`);
  });
  const groups = [
    { name: "by_arm", grain: "arm", bucket: "NULL", by: "arm" },
    { name: "by_day", grain: "day", bucket: "exposure_day", by: "arm, exposure_day" },
    ...segments.map((s, i) => ({ name: `by_${seg(i)}`, grain: "segment", bucket: `CONCAT(${d.string(`${s}: `)}, ${seg(i)})`, by: `arm, ${seg(i)}` }))
  ];
  for (const g of groups) {
    ctes.push([g.name, [`SELECT arm, ${g.bucket === "NULL" ? `${d.text("NULL")}` : g.bucket} AS bucket,`, indent(sums.join(",\n")), "FROM unit_values", `GROUP BY ${g.by}`].join("\n")]);
  }
  const nullText = d.text("NULL");
  const nullInt = d.integer("NULL");
  const nullSum = d.wide("NULL");
  const row = (grain, arm, bucket, metric, units, n, s) => `SELECT ${d.text(d.string(grain))} AS grain, ${arm} AS arm, ${bucket} AS bucket, ${metric} AS metric, ${units} AS units, ${n} AS n, ${["sum_y", "sum_y2", "sum_x", "sum_x2", "sum_xy", "sum_pre", "sum_pre2", "sum_ypre"].map((c) => `${s[c] ? d.wide(s[c]) : nullSum} AS ${c}`).join(", ")}`;
  const selects = [];
  for (const g of groups) {
    selects.push(`${row(g.grain, "arm", "bucket", nullText, d.integer("units"), nullInt, {})}
FROM ${g.name}`);
    metrics.forEach((m, i) => {
      selects.push(
        `${row(g.grain, "arm", "bucket", d.text(d.string(m.name)), d.integer("units"), d.integer(`m${i}_n`), {
          sum_y: `m${i}_sy`,
          sum_y2: `m${i}_sy2`,
          ...m.x ? { sum_x: `m${i}_sx`, sum_x2: `m${i}_sx2`, sum_xy: `m${i}_sxy` } : {},
          ...m.pre ? { sum_pre: `m${i}_sp`, sum_pre2: `m${i}_sp2`, sum_ypre: `m${i}_syp` } : {}
        })}
FROM ${g.name}`
      );
    });
  }
  selects.push(`${row("excluded", nullText, d.text(d.string("several-arms")), nullText, d.integer("COUNT(*)"), nullInt, {})}
FROM first_exposures
WHERE arm <> last_arm`);
  selects.push(`${row("excluded", nullText, d.text(d.string("unknown-arm")), nullText, d.integer("COUNT(DISTINCT unit_id)"), d.integer("COUNT(*)"), {})}
FROM exposure_rows
WHERE exposed_at IS NOT NULL
  AND (arm IS NULL OR arm NOT IN (${list(d, arms)}))`);
  selects.push(`${row("excluded", nullText, d.text(d.string(NO_EXPOSURE_TIME)), nullText, d.integer("COUNT(DISTINCT unit_id)"), d.integer("COUNT(*)"), {})}
FROM exposure_rows
WHERE exposed_at IS NULL`);
  const header = [
    `-- Plumbline arm totals for plan ${oneLine(plan.id)}, data through ${input.dataThrough} (UTC), dialect ${d.name}.`,
    `-- Columns: ${ROW_COLUMNS.join(", ")}. Save the result as CSV with a header and run: plumbline totals ${oneLine(plan.id)} --from-rows <file.csv> --through ${input.dataThrough}`
  ];
  const sql = `${header.join("\n")}
WITH
${ctes.map(([name, body]) => `${name} AS (
${indent(body)}
)`).join(",\n")}
${selects.join("\nUNION ALL\n")}
`;
  return { ok: true, sql, metrics };
}
function oneLine(text) {
  return text.replace(/[^a-z0-9-]/g, "?");
}

// src/core/totals-query/diagnose.ts
function columnSettings(input) {
  const x = input.exposures.columns;
  const e = input.events.columns;
  return [
    { table: "exposures", path: ["data", "exposures", "unit-id"], column: x.unitId, as: "text" },
    { table: "exposures", path: ["data", "exposures", "arm"], column: x.arm, as: "text" },
    { table: "exposures", path: ["data", "exposures", "exposed-at"], column: x.exposedAt, as: "time" },
    ...x.experiment !== void 0 ? [{ table: "exposures", path: ["data", "exposures", "experiment"], column: x.experiment, as: "text" }] : [],
    ...input.exposures.segments.map((column, i) => ({ table: "exposures", path: ["data", "exposures", "segments", i], column, as: "text" })),
    { table: "events", path: ["data", "events", "unit-id"], column: e.unitId, as: "text" },
    { table: "events", path: ["data", "events", "event"], column: e.event, as: "text" },
    { table: "events", path: ["data", "events", "occurred-at"], column: e.occurredAt, as: "time" },
    { table: "events", path: ["data", "events", "value"], column: e.value, as: "number" }
  ];
}
function describeSourceSql(dialect, source) {
  return `SELECT * FROM ${from(DIALECT[dialect], source, "source")} LIMIT 0`;
}
var DUCKDB_TYPE = { time: "TIMESTAMPTZ", number: "DECIMAL(38, 6)" };
function firstBadValueSql(source, column, as) {
  const d = DIALECT.duckdb;
  const list2 = `[${source.files.map((f) => d.string(f)).join(", ")}]`;
  const reader = source.format === "parquet" ? `read_parquet(${list2}, union_by_name = true, filename = true)` : `read_csv(${list2}, header = true, union_by_name = true, all_varchar = true, filename = true)`;
  const c = d.identifier(column);
  return `SELECT filename, CAST(${c} AS VARCHAR) AS value FROM ${reader} WHERE ${c} IS NOT NULL AND TRY_CAST(${c} AS ${DUCKDB_TYPE[as]}) IS NULL LIMIT 1`;
}
function typedCsvReadSql(file, column, as) {
  const d = DIALECT.duckdb;
  return `SELECT COUNT(${d.identifier(column)}) FROM read_csv([${d.string(file)}], header = true, types = {${d.string(column)}: '${as === "time" ? "TIMESTAMP" : "DOUBLE"}'})`;
}

// src/core/totals-query/rows-csv.ts
var ROWS_MAX_BYTES = 16 * 1024 * 1024;
function problem(file, line, column, field, message, expected) {
  return { severity: "error", code: "rows/invalid", file, line, column, field, message, expected };
}
function splitCsv(text, file) {
  const records = [];
  let record = [];
  let line = 1;
  let column = 1;
  let i = text.charCodeAt(0) === 65279 ? 1 : 0;
  const atRecordEnd = () => i >= text.length || text[i] === "\n" || text[i] === "\r";
  while (i < text.length) {
    const start = { line, column };
    let value = "";
    let quoted = false;
    if (text[i] === '"') {
      quoted = true;
      i++;
      column++;
      for (; ; ) {
        if (i >= text.length) return { ok: false, problem: problem(file, start.line, start.column, "", "a quoted field is never closed", "a closing double quote") };
        const ch = text[i];
        if (ch === '"') {
          if (text[i + 1] === '"') {
            value += '"';
            i += 2;
            column += 2;
            continue;
          }
          i++;
          column++;
          break;
        }
        value += ch;
        i++;
        if (ch === "\n") {
          line++;
          column = 1;
        } else column++;
      }
      if (!atRecordEnd() && text[i] !== ",") return { ok: false, problem: problem(file, line, column, "", "text after a closing quote", "a comma or the end of the line after a quoted field") };
    } else {
      while (!atRecordEnd() && text[i] !== ",") {
        value += text[i];
        i++;
        column++;
      }
    }
    record.push({ text: value, quoted, ...start });
    if (text[i] === ",") {
      i++;
      column++;
      if (atRecordEnd()) record.push({ text: "", quoted: false, line, column });
      else continue;
    }
    if (text[i] === "\r") i++;
    if (text[i] === "\n") i++;
    records.push(record);
    record = [];
    line++;
    column = 1;
  }
  return { ok: true, records: records.filter((r) => !(r.length === 1 && r[0].text === "" && !r[0].quoted)) };
}
function parseResultRows(text, file) {
  if (text.length > ROWS_MAX_BYTES) return { ok: false, problems: [problem(file, 1, 1, "", `the file is larger than ${ROWS_MAX_BYTES / 1024 / 1024} MiB`, "the result of the totals query: a few hundred rows")] };
  const split = splitCsv(text, file);
  if (!split.ok) return { ok: false, problems: [split.problem] };
  const [header, ...records] = split.records;
  if (!header) return { ok: false, problems: [problem(file, 1, 1, "", "the file is empty", `a header row: ${ROW_COLUMNS.join(",")}`)] };
  const problems = [];
  ROW_COLUMNS.forEach((name, i) => {
    const cell = header[i];
    if (cell?.text.trim().toLowerCase() !== name) {
      problems.push(problem(file, cell?.line ?? header[0].line, cell?.column ?? 1, "", `column ${i + 1} of the header is ${cell ? JSON.stringify(cell.text) : "missing"}, not ${name}`, `the header ${ROW_COLUMNS.join(",")} (in this order; more columns may follow)`));
    }
  });
  if (problems.length) return { ok: false, problems: problems.slice(0, 1) };
  const rows = [];
  for (const record of records) {
    if (record.length < ROW_COLUMNS.length) {
      const last = record[record.length - 1];
      problems.push(problem(file, record[0].line, last.column, "", `the row has ${record.length} fields, fewer than the header's ${ROW_COLUMNS.length}`, "a field for every column (empty for NULL)"));
      continue;
    }
    const row = { line: record[0].line };
    ROW_COLUMNS.forEach((name, i) => {
      const f = record[i];
      const isNull = !f.quoted && (f.text === "" || f.text === "NULL" || f.text === "\\N");
      row[name] = { value: isNull ? null : f.text, line: f.line, column: f.column };
    });
    rows.push(row);
  }
  return problems.length ? { ok: false, problems } : { ok: true, rows };
}
function rowsFromResult(result, source) {
  const wrong = ROW_COLUMNS.findIndex((name, i) => result.columns[i]?.toLowerCase() !== name);
  if (wrong >= 0) return { ok: false, problems: [problem(source, 1, wrong + 1, "", `column ${wrong + 1} is ${JSON.stringify(result.columns[wrong] ?? "")}, not ${ROW_COLUMNS[wrong]}`, `the columns ${ROW_COLUMNS.join(", ")}`)] };
  return {
    ok: true,
    rows: result.rows.map((values, r) => {
      const line = r + 2;
      const row = { line };
      ROW_COLUMNS.forEach((name, i) => row[name] = { value: values[i] ?? null, line, column: i + 1 });
      return row;
    })
  };
}

// src/core/totals-query/rows-to-totals.ts
var import_yaml = __toESM(require_dist(), 1);
function untimedSentence(untimed) {
  if (!untimed.rows) return "";
  return `Left out: ${countOf(untimed.rows, "exposure row")} (${countOf(untimed.units, "unit")}) with no exposure time, so in no day of the window; units seen only there are in no total.`;
}
function rowProblem(file, row, column, message, expected) {
  const cell = row[column];
  return { severity: "error", code: "rows/invalid", file, line: cell.line, column: cell.column, field: column, message, expected, ...cell.value !== null ? { found: JSON.stringify(cell.value) } : {} };
}
function rowsToTotals(input) {
  const { plan, file } = input;
  const problems = [];
  const kinds = new Map(planMetrics(plan).map(({ metric }) => [metric.name, metric.kind]));
  const armNames = plan.design.arms.map((a) => a.name);
  const groups = new Map(armNames.map((a) => [a, { arm: { units: 0, metrics: {} }, days: /* @__PURE__ */ new Map(), segments: /* @__PURE__ */ new Map() }]));
  const excluded = { "several-arms": 0, "unknown-arm": 0 };
  const untimed = { units: 0, rows: 0 };
  const whole = (row, column) => {
    const text = row[column].value;
    if (text === null) return void problems.push(rowProblem(file, row, column, "is empty", "a whole number of 0 or more"));
    const value = Number(text);
    if (!DECIMAL_TEXT.test(text) || !Number.isSafeInteger(value) || value < 0) return void problems.push(rowProblem(file, row, column, "is not a whole number of 0 or more", "a whole number of 0 or more, e.g. 1520"));
    return value;
  };
  const number = (row, column) => {
    const text = row[column].value;
    if (text === null) return void problems.push(rowProblem(file, row, column, "is empty", "a number"));
    const value = Number(text);
    if (!DECIMAL_TEXT.test(text) || !Number.isFinite(value)) return void problems.push(rowProblem(file, row, column, "is not a number", "a decimal number, e.g. 10250.5"));
    return value;
  };
  const prePeriod = (row) => {
    if (row.sum_pre.value === null) return {};
    const [sum, squares, products] = [number(row, "sum_pre"), number(row, "sum_pre2"), number(row, "sum_ypre")];
    return sum === void 0 || squares === void 0 || products === void 0 ? {} : { "pre-period": { sum, "sum-of-squares": squares, "sum-of-products": products } };
  };
  const metricTotals = (row, kind, units) => {
    const n = whole(row, "n");
    const sumY = kind === "proportion" ? whole(row, "sum_y") : number(row, "sum_y");
    const sumY2 = number(row, "sum_y2");
    if (n === void 0 || sumY === void 0 || sumY2 === void 0) return void 0;
    if (kind === "proportion") return { "units-with-event": sumY, ...n !== units ? { n } : {}, ...prePeriod(row) };
    if (kind === "mean") return { n, sum: sumY, "sum-of-squares": sumY2, ...prePeriod(row) };
    const [sumX, sumX2, sumXY] = [number(row, "sum_x"), number(row, "sum_x2"), number(row, "sum_xy")];
    if (sumX === void 0 || sumX2 === void 0 || sumXY === void 0) return void 0;
    return { n, numerator: { sum: sumY, "sum-of-squares": sumY2 }, denominator: { sum: sumX, "sum-of-squares": sumX2 }, "sum-of-products": sumXY };
  };
  for (const row of input.rows) {
    const grain = row.grain.value;
    if (grain === null || !GRAINS.includes(grain)) {
      problems.push(rowProblem(file, row, "grain", "is not a grain of the totals query", GRAINS.join(", ")));
      continue;
    }
    if (grain === "excluded") {
      const reason = row.bucket.value;
      if (reason === NO_EXPOSURE_TIME) {
        const [units3, rows] = [whole(row, "units"), whole(row, "n")];
        if (units3 !== void 0 && rows !== void 0) Object.assign(untimed, { units: untimed.units + units3, rows: untimed.rows + rows, line: row.line });
        continue;
      }
      if (reason === null || !EXCLUDED_REASONS.includes(reason)) {
        problems.push(rowProblem(file, row, "bucket", "is not a reason for leaving units out", [...EXCLUDED_REASONS, NO_EXPOSURE_TIME].join(", ")));
        continue;
      }
      const units2 = whole(row, "units");
      if (units2 !== void 0) excluded[reason] += units2;
      continue;
    }
    const arm = row.arm.value;
    const target = arm === null ? void 0 : groups.get(arm);
    if (!target) {
      problems.push(rowProblem(file, row, "arm", arm === null ? "is empty" : "is not an arm of the plan", `one of ${armNames.join(", ")}`));
      continue;
    }
    let group;
    if (grain === "arm") group = target.arm;
    else {
      const bucket = row.bucket.value;
      const map = grain === "day" ? target.days : target.segments;
      if (bucket === null || grain === "day" && !/^\d{4}-\d{2}-\d{2}$/.test(bucket)) {
        problems.push(rowProblem(file, row, "bucket", grain === "day" ? "is not a day" : "is empty", grain === "day" ? "the day of first exposure written YYYY-MM-DD" : 'the segment written "column: value"'));
        continue;
      }
      group = map.get(bucket) ?? { units: 0, metrics: {} };
      map.set(bucket, group);
    }
    const units = whole(row, "units");
    if (units === void 0) continue;
    const metric = row.metric.value;
    if (metric === null) {
      group.units = units;
      continue;
    }
    const kind = kinds.get(metric);
    if (!kind) {
      problems.push(rowProblem(file, row, "metric", "is not a metric of the plan", `one of ${[...kinds.keys()].join(", ")}`));
      continue;
    }
    const totals2 = metricTotals(row, kind, units);
    if (totals2) group.metrics[metric] = totals2;
  }
  if (problems.length) return { ok: false, problems };
  for (const { arm } of groups.values()) {
    for (const [name, kind] of kinds) {
      if (arm.metrics[name]) continue;
      arm.metrics[name] = kind === "proportion" ? { "units-with-event": 0 } : kind === "mean" ? { n: 0, sum: 0, "sum-of-squares": 0 } : { n: 0, numerator: { sum: 0, "sum-of-squares": 0 }, denominator: { sum: 0, "sum-of-squares": 0 }, "sum-of-products": 0 };
    }
  }
  const start = plan.window.start;
  const notes = [input.notes, untimedSentence(untimed)].filter(Boolean).join(" ");
  const totals = {
    plan: plan.id,
    "plan-commit": input.planCommit,
    "data-through": input.dataThrough,
    arms: Object.fromEntries(
      [...groups].map(([name, g]) => {
        const days = [...g.days].sort(([a], [b]) => a.localeCompare(b));
        return [
          name,
          {
            units: g.arm.units,
            metrics: g.arm.metrics,
            days: days.map(([date, day]) => ({ date, ...day })),
            ...start ? { weeks: weeksOf(days, start, kinds) } : {},
            segments: [...g.segments].sort(([a], [b]) => a.localeCompare(b)).map(([segment, s]) => ({ segment, ...s }))
          }
        ];
      })
    ),
    excluded,
    ...notes ? { notes } : {}
  };
  return { ok: true, totals, text: totalsYaml(totals), untimed };
}
function weeksOf(days, start, kinds) {
  const weeks = /* @__PURE__ */ new Map();
  for (const [date, day] of days) {
    const starting = addDays(start, Math.floor(daysBetween(start, date) / 7) * 7);
    weeks.set(starting, [...weeks.get(starting) ?? [], day]);
  }
  return [...weeks].map(([starting, parts]) => ({
    starting,
    units: parts.reduce((s, p) => s + p.units, 0),
    metrics: Object.fromEntries([...kinds.keys()].flatMap((name) => {
      const present = parts.flatMap((p) => {
        const m = p.metrics[name];
        return m === void 0 ? [] : ["units-with-event" in m ? { n: p.units, ...m } : m];
      });
      if (!present.length) return [];
      const sum = addWritten(present);
      const units = parts.reduce((s, p) => s + p.units, 0);
      if ("units-with-event" in sum && sum.n === units) delete sum.n;
      return [[name, sum]];
    }))
  }));
}
function addWritten(parts) {
  const add = (a, b) => {
    if (typeof a === "number" && typeof b === "number") return a + b;
    if (a && b && typeof a === "object" && typeof b === "object") {
      const keys = /* @__PURE__ */ new Set([...Object.keys(a), ...Object.keys(b)]);
      return Object.fromEntries([...keys].map((k) => [k, add(a[k] ?? 0, b[k] ?? 0)]));
    }
    return a;
  };
  return parts.reduce((s, p) => add(s, p));
}
var HEADER = "# Arm totals written by `plumbline totals` (docs/totals-from-sql.md): sums per arm, day, week and segment; no unit-level data.\n";
function totalsYaml(totals) {
  const doc = new import_yaml.Document(totals);
  (0, import_yaml.visit)(doc, {
    Pair(_, pair, path) {
      const key = pair.key?.value;
      if (key === "metrics" && (0, import_yaml.isMap)(pair.value)) {
        for (const item of pair.value.items) if ((0, import_yaml.isMap)(item.value)) item.value.flow = true;
      }
      if ((key === "days" || key === "weeks" || key === "segments") && (0, import_yaml.isSeq)(pair.value) && path.length) {
        for (const item of pair.value.items) if ((0, import_yaml.isMap)(item)) item.flow = true;
      }
      if (key === "excluded" && (0, import_yaml.isMap)(pair.value)) pair.value.flow = true;
    }
  });
  return HEADER + doc.toString({ lineWidth: 0 });
}

// src/run/totals-data-fault.ts
var import_picomatch = __toESM(require_picomatch(), 1);
import { posix } from "node:path";
var EXPECTED = {
  time: "a timestamp, ISO-8601 with an offset, e.g. 2026-11-09T23:30:00-05:00, or an empty field for none",
  number: "a number, e.g. 42.5, or an empty field for none"
};
async function explainDataFault(fault, ctx) {
  return fault.kind === "missing-column" ? missingColumn(fault.column, ctx) : badValue(fault, ctx);
}
var sameName = (ctx, a, b) => ctx.engine === "duckdb" ? a.toLowerCase() === b.toLowerCase() : a === b;
function sourceName(ctx, table) {
  const source = ctx.sources[table];
  if ("table" in source) return `the table ${source.table}`;
  return `the ${table} files (${ctx.dataFlag !== void 0 ? `--data ${ctx.dataFlag}` : `data.${table}.files`})`;
}
async function columnsOf(ctx, table) {
  try {
    return (await ctx.run(describeSourceSql(ctx.engine, ctx.sources[table]))).columns;
  } catch {
    return void 0;
  }
}
async function missingColumn(column, ctx) {
  const named = ctx.columns.filter((c) => sameName(ctx, c.column, column));
  if (!named.length) return void 0;
  const described = {};
  for (const table of ["exposures", "events"]) {
    const columns = await columnsOf(ctx, table);
    if (columns) described[table] = columns;
  }
  const absent = (c) => {
    const have = described[c.table];
    return have ? !have.some((h) => sameName(ctx, h, c.column)) : named.includes(c);
  };
  const lacking = ctx.columns.filter(absent);
  const problems = (lacking.length ? lacking : named).map((c) => {
    const field = formatFieldPath(c.path);
    const have = described[c.table];
    return {
      severity: "error",
      code: "totals/missing-column",
      ...ctx.locateSetting(c.path),
      field,
      message: `${sourceName(ctx, c.table)} ${"table" in ctx.sources[c.table] ? "has" : "have"} no column "${c.column}"${ctx.isSettingWritten(c.path) ? "" : ` (${field} is not set: "${c.column}" is its default)`}`,
      expected: have ? `one of the columns there: ${have.join(", ")}` : `the name of a column of the ${c.table}`
    };
  });
  const hints = (lacking.length ? lacking : named).map((c) => {
    const have = described[c.table];
    const suggestion = have ? closestName(c.column, have) : void 0;
    const field = formatFieldPath(c.path);
    if (c.path.at(-1) === "experiment") return `${field}: the column that holds the plan id, or false when every row is this plan\u2019s`;
    return suggestion ? `${field}: ${suggestion}` : `${field}: the column that holds it`;
  });
  return new UsageError(`the data lacks ${problems.length === 1 ? "a column the settings name" : `${problems.length} columns the settings name`}:
${problems.map(formatProblem).join("\n")}`, `set in the settings file ${hints.join("; ")}`);
}
async function badValue(fault, ctx) {
  const converted = ctx.columns.filter((c) => c.as !== "text");
  let { file, line, value } = fault;
  let setting = fault.column !== void 0 ? converted.find((c) => sameName(ctx, c.column, fault.column) && (!file || isOf(ctx, c.table, file))) : void 0;
  if (!file && ctx.engine === "duckdb") {
    for (const c of setting ? [setting] : converted) {
      const source = ctx.sources[c.table];
      if ("table" in source) continue;
      const found = await ctx.run(firstBadValueSql(source, c.column, c.as)).catch(() => void 0);
      const [badFile, badValue2] = found?.rows[0] ?? [];
      if (!badFile) continue;
      [file, value, setting] = [badFile, badValue2 ?? void 0, c];
      if (source.format === "csv") line = await csvLine(ctx, badFile, c, value);
      break;
    }
  }
  if (!setting && !file) return void 0;
  const where = file ? `${shown(ctx, file)}${line ? `:${line}` : ""}` : setting ? sourceName(ctx, setting.table) : "the data";
  const column = setting?.column ?? fault.column;
  const at = setting ? ctx.locateSetting(setting.path) : void 0;
  const what = setting ? EXPECTED[setting.as] : "a value the column\u2019s type takes";
  const named = setting ? `; the column of ${formatFieldPath(setting.path)}${ctx.isSettingWritten(setting.path) ? `, ${at.file}:${at.line}` : " (its default)"}` : "";
  const message = `${where}: error: ${column ? `column "${column}"` : "a value"}: ${value !== void 0 ? JSON.stringify(value) : "a value"} does not convert (expected ${what}${named})`;
  return new UsageError(`a value in the data is not what the totals query reads:
${message}`, "correct the value at its source and export the data again, or leave the field empty for none");
}
function isOf(ctx, table, file) {
  const source = ctx.sources[table];
  return !("table" in source) && source.files.some((pattern) => pattern === file || (0, import_picomatch.default)(pattern)(file));
}
async function csvLine(ctx, file, c, value) {
  try {
    await ctx.run(typedCsvReadSql(file, c.column, c.as));
  } catch (error) {
    if (error instanceof DataFaultError && error.fault.kind === "bad-value" && error.fault.line !== void 0 && error.fault.value === value) return error.fault.line;
  }
  return void 0;
}
function shown(ctx, file) {
  const relative = posix.relative(ctx.root, file);
  return relative.startsWith("..") || posix.isAbsolute(relative) ? file : relative;
}

// src/run/totals.ts
var DATA_NAME = /^(exposures|events)[^/]*$/i;
var DATA_FORMAT = /\.(parquet|csv)$/i;
function tableOf(pathBelow) {
  const format = DATA_FORMAT.exec(pathBelow)?.[1]?.toLowerCase();
  if (!format) return void 0;
  const parts = pathBelow.split("/");
  const named = parts.length === 1 ? parts[0].replace(DATA_FORMAT, "") : parts[0];
  const m = DATA_NAME.exec(named);
  return m ? { kind: m[1].toLowerCase(), format } : void 0;
}
async function dataFiles(options, spec) {
  const entry = pathInRepository(options.root, spec).replace(/\/+$/, "");
  const scan = import_picomatch2.default.scan(entry);
  const folder = scan.isGlob ? scan.base : entry;
  const listed = await options.files.listFiles(folder === "." ? "" : folder);
  if (!listed.length) throw new UsageError(`--data ${spec}: no such folder, or no files in it`, "give the folder the exports are in (an absolute path, or one relative to the repository), or a glob of the files");
  const prefix = folder === "." || folder === "" ? "" : `${folder}/`;
  const glob = scan.isGlob ? (0, import_picomatch2.default)(entry, { dot: false }) : void 0;
  const found = { exposures: [], events: [] };
  const formats = { exposures: /* @__PURE__ */ new Set(), events: /* @__PURE__ */ new Set() };
  for (const path of listed) {
    if (!path.startsWith(prefix) || glob && !glob(path)) continue;
    const table = tableOf(glob ? posix2.basename(path) : path.slice(prefix.length));
    if (!table) continue;
    found[table.kind].push(posix2.join(options.root, path));
    formats[table.kind].add(table.format);
  }
  const source = (kind) => {
    if (!found[kind].length) throw new UsageError(`--data ${spec}: no ${kind} files (${kind}*.parquet or ${kind}*.csv, or a folder ${kind}/ of them)`, `put the exports in ${spec} named ${kind}.parquet (or ${kind}-*.csv, or ${kind}/part-*.parquet), or set data.${kind}.files in the settings`);
    if (formats[kind].size > 1) throw new UsageError(`--data ${spec}: the ${kind} files mix Parquet and CSV`, "keep one format per table");
    return { files: found[kind].sort(), format: [...formats[kind]][0] };
  };
  return { exposures: source("exposures"), events: source("events") };
}
function settingsSource(source, kind, root) {
  if (!source) throw new UsageError(`the settings do not say where the ${kind} are`, `set data.${kind}.table (or .files) in the settings file, or pass --data <folder>; see docs/totals-from-sql.md`);
  if ("table" in source) return source;
  const format = source.format ?? (/\.parquet$/i.test(source.files) ? "parquet" : /\.csv$/i.test(source.files) ? "csv" : void 0);
  if (!format) throw new UsageError(`data.${kind}.files: cannot tell the format of ${source.files}`, `set data.${kind}.format: parquet (or csv)`);
  return { files: [posix2.join(root, source.files)], format };
}
function located(loaded, problems) {
  return problems.map((p) => formatProblem({ severity: "error", code: "totals-query/plan", file: loaded.file, line: lineOfKey(loaded, p.path), column: 1, field: p.path.join("."), message: p.message, expected: p.expected })).join("\n");
}
async function computeTotals(options) {
  const workspace = await requireWorkspace(options);
  const loaded = findNamedPlan(workspace, options.plan, "compute its totals");
  const { plan } = loaded;
  const data = workspace.settings.data;
  const yesterday = addDays(options.today, -1);
  const dataThrough = options.through ?? (plan.window.end && plan.window.end < yesterday ? plan.window.end : yesterday);
  const start = plan.window.start;
  if (start && dataThrough < start) {
    const where = `${loaded.file}:${lineOfKey(loaded, ["window", "start"])}`;
    throw new UsageError(
      options.through ? `--through ${dataThrough} is before ${plan.id} starts (window.start ${start}, ${where}); nothing written` : `${plan.id} starts on ${start} (window.start, ${where}): yesterday (${dataThrough}) is before it, so there is no data yet; nothing written`,
      `--through takes the last day of data, on or after ${start} (the day the query's first line names: "data through YYYY-MM-DD")`
    );
  }
  let rows;
  let source;
  if (options.fromRows) {
    const text = await options.files.readText(options.fromRows);
    if (text === void 0) throw new UsageError(`the rows file ${options.fromRows} does not exist`, "the path is relative to --cwd (the repository root)");
    const parsed = parseResultRows(text, options.fromRows);
    if (!parsed.ok) throw new UsageError(`${options.fromRows} cannot be read:
${parsed.problems.map(formatProblem).join("\n")}`, `save the query's result as CSV with its header row (plumbline totals ${plan.id} --sql --dialect <name> prints the query)`);
    rows = parsed.rows;
    source = `the query's result in ${options.fromRows}`;
  } else {
    const dialect = options.sqlDialect ?? options.engine;
    let sources;
    if (options.data) {
      if (dialect !== "duckdb") throw new UsageError(`--data reads files with DuckDB, not ${dialect}`, "drop --engine/--dialect, or set data.exposures.table and data.events.table for a database");
      sources = await dataFiles(options, options.data);
    } else {
      sources = { exposures: settingsSource(data.exposures.source, "exposures", options.root), events: settingsSource(data.events.source, "events", options.root) };
    }
    const query = {
      plan,
      dialect,
      dataThrough,
      exposures: { source: sources.exposures, columns: data.exposures.columns, segments: data.exposures.segments },
      events: { source: sources.events, columns: data.events.columns },
      ...data.prePeriodDays !== void 0 ? { prePeriodDays: data.prePeriodDays } : {},
      ...data.metricWindowDays !== void 0 ? { metricWindowDays: data.metricWindowDays } : {}
    };
    const built2 = buildTotalsQuery(query);
    if (!built2.ok) throw new UsageError(`no totals query can be written for ${plan.id}:
${located(loaded, built2.problems)}`, "see docs/totals-from-sql.md");
    if (options.sqlDialect) return { kind: "sql", sql: built2.sql, dialect, dataThrough };
    const settings = { ...data.duckdb, ...options.progress ? { progress: options.progress } : {} };
    let result;
    try {
      result = await options.runQuery(options.engine, built2.sql, settings);
    } catch (error) {
      if (!(error instanceof DataFaultError)) throw error;
      const explained = await explainDataFault(error.fault, {
        engine: options.engine,
        sources,
        columns: columnSettings(query),
        locateSetting: workspace.locateSetting,
        isSettingWritten: workspace.isSettingWritten,
        root: options.root,
        ...options.data !== void 0 ? { dataFlag: options.data } : {},
        run: (sql) => options.runQuery(options.engine, sql, { ...data.duckdb })
      });
      throw explained ?? error;
    }
    const fromEngine = rowsFromResult(result, `${options.engine} result`);
    if (!fromEngine.ok) throw new UsageError(`the ${options.engine} result is not the totals query's:
${fromEngine.problems.map(formatProblem).join("\n")}`);
    rows = fromEngine.rows;
    source = options.engine === "duckdb" ? `DuckDB over ${options.data ? `--data ${options.data}` : "the files in the settings"}` : "PostgreSQL";
  }
  let planCommit = options.planCommit;
  let planCommitHow = "given";
  if (!planCommit) {
    const found = await options.findPlanCommit(loaded.file);
    if (!found) throw new UsageError(`git has no commit of ${loaded.file}, so the totals cannot name the plan they were computed for`, "commit the plan first, or pass --plan-commit <sha>");
    planCommit = found.commit;
    planCommitHow = found.how;
  }
  const built = rowsToTotals({ plan, planCommit, dataThrough, rows, file: options.fromRows ?? source, notes: `Computed by plumbline totals from ${source}, data through ${dataThrough} (UTC).` });
  if (!built.ok) throw new UsageError(`the rows do not make totals for ${plan.id}:
${built.problems.map(formatProblem).join("\n")}`);
  const out = (options.out ?? `readouts/${plan.id}.totals.yaml`).replace(/^\.\//, "");
  const existing = await options.files.readText(out);
  if (existing !== void 0) {
    const other = /^plan:[ \t]*["']?([^"'\s#]+)/m.exec(existing)?.[1];
    if (other !== plan.id) throw new UsageError(`${out} holds the totals of ${other ? `plan "${other}"` : "something else"}, not ${plan.id}; nothing written`, "choose another --out");
  }
  const checked = loadTotals(built.text, out, plan);
  if (!checked.ok) throw new UsageError(`the totals computed for ${plan.id} do not pass their own checks:
${[...checked.errors].map(formatProblem).join("\n")}`);
  const warnings = [...checked.warnings];
  if (built.untimed.rows) {
    const at = options.fromRows ? { file: options.fromRows, line: built.untimed.line ?? 1, column: 1 } : workspace.locateSetting(["data", "exposures", "exposed-at"]);
    warnings.push({
      severity: "warning",
      code: "totals/no-exposure-time",
      ...at,
      field: options.fromRows ? "bucket" : "data.exposures.exposed-at",
      message: `${countOf(built.untimed.rows, "exposure row")} of ${plan.id} (${countOf(built.untimed.units, "unit")}) ${built.untimed.rows === 1 ? "has" : "have"} no exposure time: left out of every total, so a sample ratio check sees only the units with a time`,
      expected: `every exposure of ${plan.id} with its time in ${data.exposures.columns.exposedAt}`
    });
  }
  return { kind: "totals", planId: plan.id, out, text: built.text, totals: built.totals, dataThrough, planCommit, planCommitHow, untimed: { units: built.untimed.units, rows: built.untimed.rows }, warnings };
}
export {
  computeTotals
};
