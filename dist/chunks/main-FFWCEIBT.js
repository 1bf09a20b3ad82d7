#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  Command,
  CommanderError,
  EXIT,
  Option,
  REAL_DEPS,
  context,
  createCliOutput,
  formatOption,
  parseNumbers,
  reportSettingsProblems
} from "./chunk-PLTSYE6O.js";
import "./chunk-2ITRHRXB.js";
import {
  VERSION
} from "./chunk-Q5T6YC3M.js";
import {
  writeFileAtomic
} from "./chunk-5AUULDGE.js";
import {
  BOUNDARY_KINDS,
  SRM_ALARM_P
} from "./chunk-BXF2RWJM.js";
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  BUG_REPORT_HINT,
  ExternalError,
  UsageError
} from "./chunk-OICJSZPX.js";
import "./chunk-FUJ7I5KY.js";

// src/cli/adjust-command.ts
function addAdjustCommand(program, setExit, deps) {
  program.command("adjust").description("adjust p-values for multiple comparisons (Benjamini-Hochberg, Holm and Bonferroni)").argument("<p-values...>", "p-values, e.g. 0.001 0.02 0.04").option("--q <level>", "false discovery rate (and family-wise level) to compare with", "0.05").addOption(formatOption()).action(async (values, local) => {
    const [{ ADJUST_JSON_FORMAT, renderAdjustedText }, { adjustPValues }] = await Promise.all([import("./readout-TN27JINP.js"), import("./multiple-testing-3QRS5422.js")]);
    const p = parseNumbers("p-values", values);
    const q = parseNumbers("q", [local.q])[0];
    if (!(q > 0 && q < 1)) throw new UsageError(`--q ${local.q}: expected a level strictly between 0 and 1`, "e.g. --q 0.05");
    const adjusted = adjustPValues(p);
    if (!adjusted.ok) throw new UsageError(`${adjusted.error.input}: ${adjusted.error.message}`);
    const output = createCliOutput({ noColorFlag: true, ...deps.write ? { write: deps.write } : {} });
    output.out(local.format === "json" ? JSON.stringify({ format: ADJUST_JSON_FORMAT, q, pValues: p, ...adjusted.value }, null, 2) : renderAdjustedText(p, adjusted.value, q));
    setExit(EXIT.ok);
  });
}

// src/cli/check-command.ts
import { readFile } from "node:fs/promises";
import { resolve } from "node:path";
async function pullRequestInfo(flags, cwd) {
  let fromFile = {};
  if (flags.prJson) {
    let parsed;
    try {
      parsed = JSON.parse(await readFile(resolve(cwd, flags.prJson), "utf8"));
    } catch (error) {
      throw new UsageError(`--pr-json ${flags.prJson} is not a readable JSON file (${error instanceof Error ? error.message : String(error)})`, 'give { "title": ..., "body": ..., "labels": [...], "branch": ... } or a pull-request object');
    }
    fromFile = fromJson(parsed, flags.prJson);
  }
  let body = flags.body ?? fromFile.body;
  if (flags.bodyFile) {
    try {
      body = await readFile(resolve(cwd, flags.bodyFile), "utf8");
    } catch (error) {
      throw new ExternalError(`cannot read --body-file ${flags.bodyFile}`, void 0, { cause: error });
    }
  }
  const labels = flags.label.length ? flags.label : fromFile.labels;
  return {
    ...(flags.title ?? fromFile.title) !== void 0 ? { title: flags.title ?? fromFile.title } : {},
    ...body !== void 0 ? { body } : {},
    ...labels ? { labels } : {},
    ...(flags.branch ?? fromFile.branch) !== void 0 ? { branch: flags.branch ?? fromFile.branch } : {}
  };
}
function fromJson(value, file) {
  if (value === null || typeof value !== "object" || Array.isArray(value)) throw new UsageError(`--pr-json ${file}: expected a JSON object`);
  const record = value;
  const pr = record.pull_request && typeof record.pull_request === "object" ? record.pull_request : record;
  const text = (v, field) => {
    if (v === void 0 || v === null) return void 0;
    if (typeof v !== "string") throw new UsageError(`--pr-json ${file}: ${field} must be text`);
    return v;
  };
  const labels = Array.isArray(pr.labels) ? pr.labels.map((l, i) => {
    const name = typeof l === "string" ? l : l && typeof l === "object" ? l.name : void 0;
    if (typeof name !== "string") throw new UsageError(`--pr-json ${file}: labels[${i}] must be a name or an object with a name`);
    return name;
  }) : void 0;
  const headRef = pr.head && typeof pr.head === "object" ? pr.head.ref : void 0;
  const title = text(pr.title, "title");
  const body = text(pr.body, "body");
  const branch = text(pr.branch ?? headRef, "branch");
  return { ...title !== void 0 ? { title } : {}, ...body !== void 0 ? { body } : {}, ...labels ? { labels } : {}, ...branch !== void 0 ? { branch } : {} };
}
function addCheckCommand(program, setExit, deps) {
  program.command("check").description("review a change between two commits: plans, sizing, collisions, logging; exits 1 when something blocks").requiredOption("--base <ref>", "the commit the change is compared with (its merge base with head is used), e.g. origin/main").option("--head <ref>", "the commit with the change", "HEAD").option("--title <text>", "pull-request title").option("--body <text>", "pull-request description (may name plans by id or path)").option("--body-file <file>", "read the description from a file").option("--label <name>", "a pull-request label (repeatable)", (value, all) => [...all, value], []).option("--branch <name>", "the pull request\u2019s branch").option("--pr-json <file>", "pull-request details as JSON: a GitHub pull-request object or { title, body, labels, branch }").option("--repo-url <url>", "repository web address, for links to files in Markdown, e.g. https://github.com/acme/shop").addOption(new Option("--format <format>", "output format").choices(["text", "json", "markdown"]).default("text")).option("--output <file>", "also write the JSON report to this file").option("--today <date>", "the day to judge running tests by, YYYY-MM-DD (default: today in the settings\u2019 time zone)").action(async (flags) => {
    const options = program.opts();
    const { output } = context({ ...options, format: "text" }, deps);
    const cwd = resolve(options.cwd);
    const opening = deps.openChange(cwd, flags.base, flags.head);
    opening.catch(() => void 0);
    const [{ isCalendarDate }, { reviewChange }] = await Promise.all([import("./fields-DLQN7LI2.js"), import("./review-change-Q25OVJMC.js")]);
    if (flags.today !== void 0 && !isCalendarDate(flags.today)) throw new UsageError(`--today ${JSON.stringify(flags.today)} is not a date`, "write it as YYYY-MM-DD, e.g. --today 2026-12-01");
    const pr = await pullRequestInfo(flags, cwd);
    const change = await opening;
    const refNames = { base: `--base ${flags.base}`, head: `--head ${flags.head}` };
    const outcome = await reviewChange({ change, pr, refNames, onProgress: output.progress, ...deps.history ? { history: deps.history(cwd) } : {}, ...options.config ? { settingsPath: options.config } : {}, ...flags.today ? { today: flags.today } : {} });
    if (outcome.kind === "settings-invalid") return setExit(reportSettingsProblems(output, flags.format, outcome.settingsFile, outcome.problems));
    const { review } = outcome;
    const reportJson = async () => JSON.stringify((await import("./report-schema-MXIAN2XA.js")).reviewJson(review), null, 2);
    if (flags.output) await writeFileAtomic(resolve(cwd, flags.output), `${await reportJson()}
`, { overwrite: true });
    const repoUrl = flags.repoUrl?.replace(/\/+$/, "");
    if (flags.format === "json") output.out(await reportJson());
    else if (flags.format === "markdown") output.out((await import("./review-markdown-ZSRUVPAR.js")).renderReviewMarkdown(review, repoUrl ? { repoUrl } : {}));
    else output.out((await import("./review-text-BSBUOCRQ.js")).renderReviewText(review, { color: output.color }));
    setExit(review.verdict === "blocked" ? EXIT.findings : EXIT.ok);
  });
}

// src/cli/digest-command.ts
function addDigestCommand(program, setExit, deps) {
  program.command("digest").description("the weekly digest: tests past their end, ending soon, stale drafts, long holds, collisions, flags without plans").option("--today <date>", "the day to judge by, YYYY-MM-DD (default: today in the settings\u2019 time zone, UTC unless set)").addOption(new Option("--format <format>", "output format").choices(["text", "json", "markdown"]).default("text")).action(async (local) => {
    const options = program.opts();
    const { output, ...ports } = context({ ...options, format: "text" }, deps);
    const [{ DIGEST_JSON_FORMAT, renderDigestMarkdown, renderDigestText }, { isCalendarDate }, { digestRepository }] = await Promise.all([
      import("./digest-markdown-WCQ72BUR.js"),
      import("./fields-DLQN7LI2.js"),
      import("./digest-FNG7XJQE.js")
    ]);
    if (local.today !== void 0 && !isCalendarDate(local.today)) throw new UsageError(`--today ${JSON.stringify(local.today)} is not a date`, "write it as YYYY-MM-DD, e.g. --today 2026-12-01");
    const { digest } = await digestRepository({ files: ports.files, now: /* @__PURE__ */ new Date(), ...ports.settingsPath ? { settingsPath: ports.settingsPath } : {}, ...local.today ? { today: local.today } : {} });
    if (local.format === "json") output.out(JSON.stringify({ format: DIGEST_JSON_FORMAT, ...digest }, null, 2));
    else if (local.format === "markdown") output.out(renderDigestMarkdown(digest));
    else output.out(renderDigestText(digest));
    setExit(EXIT.ok);
  });
}

// src/cli/list-command.ts
function addListCommand(program, setExit, deps) {
  program.command("list").description("show the registry of tests: state, surface, window, owners").addOption(formatOption()).addOption(new Option("--state <state>", "only tests in this state").choices(["draft", "live", "on-hold", "concluded"])).action(async (local) => {
    const options = { ...program.opts(), ...local };
    const { output, ...ports } = context(options, deps);
    const [{ registryJson, renderRegistryText }, { loadWorkspace }] = await Promise.all([import("./registry-list-TATUWLFO.js"), import("./load-workspace-LHI3BYS5.js")]);
    const loaded = await loadWorkspace(ports);
    if (!loaded.ok) return setExit(reportSettingsProblems(output, options.format, loaded.settingsFile, loaded.settingsProblems));
    const { workspace } = loaded;
    const registry = { entries: workspace.registry.entries.filter((e) => !local.state || e.state === local.state) };
    const skippedFiles = new Set(workspace.problems.filter((p) => p.severity === "error").map((p) => p.file)).size;
    output.out(options.format === "json" ? JSON.stringify(registryJson(registry), null, 2) : renderRegistryText(registry, { color: output.color, skippedFiles, ...workspace.planFiles.length === 0 ? { noPlanFiles: workspace.settingsFile ? { settingsFile: workspace.settingsFile } : {} } : {} }));
    setExit(EXIT.ok);
  });
}

// src/cli/new-command.ts
import { resolve as resolve2 } from "node:path";
function addNewCommand(program, setExit, deps) {
  program.command("new").description("write a new commented draft plan for a feature flag").argument("<flag-key>", "the feature-flag key the test reads").option("--id <id>", "plan id (default: from the flag key)").option("--owner <handle>", "owner, e.g. @ana-lima").option("--surface <path>", "surface path, e.g. checkout/payment").option("--out <file>", "where to write it (default: <plans folder>/<id>.yaml)").option("--today <date>", "today as YYYY-MM-DD (default: the system date, UTC)").option("--force", "replace an existing file", false).option("--stdout", "print the plan instead of writing it", false).action(async (flagKey, local) => {
    const options = program.opts();
    const { output, ...ports } = context({ ...options, format: "text" }, deps);
    const [{ isCalendarDate }, { scaffoldPlan }] = await Promise.all([import("./fields-DLQN7LI2.js"), import("./scaffold-DFQSEBXV.js")]);
    const today = local.today ?? (/* @__PURE__ */ new Date()).toISOString().slice(0, 10);
    if (!isCalendarDate(today)) throw new UsageError(`--today ${JSON.stringify(today)} is not a date`, "write it as YYYY-MM-DD, e.g. --today 2026-12-01");
    const result = await scaffoldPlan({ ...ports, ...local, flagKey, today });
    if (local.stdout) return output.out(result.text);
    await writeFileAtomic(resolve2(options.cwd, result.path), result.text, { overwrite: local.force });
    output.out(`Wrote ${result.path} (plan ${result.id}). Fill it in, then run: plumbline validate`);
  });
}

// src/cli/readout-command.ts
import { resolve as resolve3 } from "node:path";
var READOUT_JSON_FORMAT = "plumbline.readout/1";
function addReadoutCommand(program, setExit, deps) {
  program.command("readout").description("read a test out against its plan: sample ratio, every metric, the registered rule applied; --record writes the outcome into the plan").argument("<plan>", "plan id or plan file").requiredOption("--totals <file>", "the arm-totals file (see docs/totals-reference.md)").addOption(new Option("--format <format>", "output format").choices(["text", "markdown", "json"]).default("text")).option("--record", "write the outcome block into the plan (comments and layout kept)", false).option("--decided-by <handle>", "who decided, e.g. @ana-lima (required with --record)").option("--today <date>", "the day recorded, YYYY-MM-DD (default: the system date, UTC)").action(async (planName, flags) => {
    const options = program.opts();
    const { output, files } = context({ ...options, format: "text" }, deps);
    const cwd = resolve3(options.cwd);
    const [{ renderReadoutMarkdown }, { renderReadoutText }, { isCalendarDate }, { readOutPlan }, { pathInRepository }] = await Promise.all([
      import("./readout-markdown-NKIZLN4P.js"),
      import("./readout-text-53J7IIYW.js"),
      import("./fields-DLQN7LI2.js"),
      import("./readout-LFMASOA5.js"),
      import("./repo-path-H4JSMIDD.js")
    ]);
    if (flags.record && !flags.decidedBy) throw new UsageError("--record needs --decided-by", "name who decided, e.g. --decided-by @ana-lima");
    const today = flags.today ?? (/* @__PURE__ */ new Date()).toISOString().slice(0, 10);
    if (!isCalendarDate(today)) throw new UsageError(`--today ${JSON.stringify(today)} is not a date`, "write it as YYYY-MM-DD, e.g. --today 2026-12-01");
    const outcome = await readOutPlan({
      files,
      ...options.config ? { settingsPath: options.config } : {},
      plan: planName,
      totals: pathInRepository(cwd, flags.totals),
      ...flags.record ? { record: { decidedBy: flags.decidedBy, recordedOn: today } } : {},
      ...deps.history ? { history: deps.history(cwd) } : {}
    });
    const { readout } = outcome;
    if (outcome.warnings.length) output.err(outcome.warnings.map(formatProblem).join("\n"));
    if (flags.format === "json") output.out(JSON.stringify({ format: READOUT_JSON_FORMAT, ...readout }, null, 2));
    else if (flags.format === "markdown") output.out(renderReadoutMarkdown(readout));
    else output.out(renderReadoutText(readout, { color: output.color }));
    if (outcome.recordedText !== void 0) {
      await writeFileAtomic(resolve3(cwd, outcome.planFile), outcome.recordedText, { overwrite: true });
      output.err(`Recorded the outcome (${readout.verdict}) in ${outcome.planFile}.`);
    }
    setExit(readout.findings.some((f) => f.severity === "block") ? EXIT.findings : EXIT.ok);
  });
}

// src/cli/schema-command.ts
function addSchemaCommand(program, setExit, deps) {
  program.command("schema").description("print the JSON Schema of a file format, for editors and other tools").addArgument(new Command().createArgument("[format]", "plan, registry, settings or totals (arm totals for a readout)").choices(["plan", "registry", "settings", "totals"]).default("plan")).action(async (which) => {
    const schema = which === "plan" ? (await import("./json-schema-6ZAVM5NX.js")).planJsonSchema() : which === "registry" ? (await import("./load-HXMMQQVP.js")).registryJsonSchema() : which === "settings" ? (await import("./load-7VHVUVDI.js")).settingsJsonSchema() : (await import("./load-5YKIGXCJ.js")).totalsJsonSchema();
    const text = `${JSON.stringify(schema, null, 2)}
`;
    if (deps.write) deps.write.out(text);
    else process.stdout.write(text);
  });
}

// src/cli/size-command.ts
function addSizeOptions(command) {
  return command.addOption(new Option("--format <format>", "output format").choices(["text", "json", "markdown"]).default("text")).addOption(new Option("--kind <kind>", "metric kind, to size without a plan").choices(["proportion", "mean", "ratio"])).option("--baseline <number>", "baseline rate (proportion, e.g. 0.12) or mean (mean)").option("--sd <number>", "standard deviation per unit (mean)").option("--numerator <mean,sd>", "per-unit mean and sd of the numerator (ratio), e.g. 0.9,1.4").option("--denominator <mean,sd>", "per-unit mean and sd of the denominator (ratio), e.g. 3.2,2.5").option("--correlation <number>", "correlation of numerator and denominator (ratio)", "0").option("--effect <number>", "minimum detectable effect, relative (0.03 = 3%) unless --absolute").option("--absolute", "read --effect in the metric\u2019s own units", false).addOption(new Option("--direction <direction>", "direction of the effect").choices(["increase", "decrease"]).default("increase")).option("--alpha <number>", "significance level", "0.05").option("--power <number>", "power", "0.8").addOption(new Option("--sides <n>", "one- or two-sided test").choices(["1", "2"]).default("2")).option("--arms <weights>", "arm weights, control first, e.g. 50,50 or 34,33,33", "50,50").option("--daily-units <number>", "new eligible units per day (units not seen before that day)").option("--traffic-share <number>", "share of eligible units enrolled", "1").option("--reach <number>", "share of exposed units that reach the change", "1").option("--interim-looks <n>", "interim analyses before the final one", "0").addOption(new Option("--boundary <kind>", "stopping boundary for interim looks").choices([...BOUNDARY_KINDS]).default("obrien-fleming-spending")).option("--pre-period-correlation <number>", "correlation with the pre-period value (CUPED)", "0").option("--cluster-size <number>", "mean group size, when groups are randomized").option("--icc <number>", "intra-cluster correlation, when groups are randomized").option("--size-cv <number>", "coefficient of variation of group sizes", "0").option("--groups <number>", "how many groups exist to randomize, when groups are randomized").option("--days <n>", "planned days, for power and detectable effect at the end").addOption(new Option("--method <method>", "mean and ratio metrics: exact t, normal approximation, or auto").choices(["auto", "exact", "normal"]).default("auto"));
}
function addSizeCommand(program, setExit, deps) {
  addSizeOptions(
    program.command("size").description("size a test: units per arm, days, power and detectable effect by the planned end").argument("[plan]", "plan id or plan file; omit to describe a metric with --kind and the flags below")
  ).action(async (planName, flags) => {
    const options = program.opts();
    const { output, ...ports } = context({ ...options, format: "text" }, deps);
    if (planName && flags.kind) throw new UsageError("name a plan or give --kind, not both");
    const [{ renderSizingMarkdown, renderSizingText, sizingJson }, { sizeFromRequest, sizeNamedPlan }, { requestFromFlags }] = await Promise.all([
      import("./sizing-VILOE3KO.js"),
      import("./size-26EGJH4A.js"),
      import("./size-request-RY7ABCQQ.js")
    ]);
    const outcome = planName ? await sizeNamedPlan({ ...ports, plan: planName }) : sizeFromRequest(requestFromFlags(flags));
    if (!planName && !outcome.sizing.metrics[0].result.ok) {
      const { error } = outcome.sizing.metrics[0].result;
      throw new UsageError(`cannot size this metric: ${error.input}: ${error.message}`);
    }
    if (flags.format === "json") output.out(JSON.stringify(sizingJson(outcome.sizing, outcome.context), null, 2));
    else if (flags.format === "markdown") output.out(renderSizingMarkdown(outcome.sizing, { ...outcome.context, power: outcome.power }));
    else output.out(renderSizingText(outcome.sizing, outcome.context));
    setExit(EXIT.ok);
  });
}

// src/cli/srm-command.ts
var ARGUMENT_OF = { observed: "counts", weights: "--weights", threshold: "--threshold" };
function addSrmCommand(program, setExit, deps) {
  program.command("srm").description("sample ratio mismatch: do the units seen per arm fit the planned weights?").argument("<counts...>", "units observed in each arm, control first, e.g. 50412 49288").option("--weights <weights>", "planned weights, e.g. 50,50 (default: equal)").option("--threshold <p>", "alarm below this p-value", String(SRM_ALARM_P)).addOption(formatOption()).action(async (counts, local) => {
    const [{ SRM_JSON_FORMAT, renderSrmText }, { sampleRatioMismatch, isUnitCount, MAX_UNIT_COUNT }] = await Promise.all([import("./readout-TN27JINP.js"), import("./srm-YAMDXEXY.js")]);
    const observed = parseNumbers("counts", counts).map((n, i) => {
      if (!isUnitCount(n)) throw new UsageError(`counts: ${JSON.stringify(counts[i])} is not a count of units`, `write a whole number from 0 to ${MAX_UNIT_COUNT} (Number.MAX_SAFE_INTEGER), e.g. 50412`);
      return n + 0;
    });
    const weights = local.weights ? parseNumbers("weights", local.weights.split(",")) : observed.map(() => 1);
    weights.forEach((w, i) => {
      if (!(w > 0)) throw new UsageError(`--weights: ${JSON.stringify(local.weights.split(",")[i])} is not a planned weight`, "write a number above 0 for each arm, e.g. 50,50");
    });
    const threshold = parseNumbers("threshold", [local.threshold])[0];
    if (!(threshold > 0 && threshold < 1)) throw new UsageError(`--threshold ${local.threshold}: expected a p-value strictly between 0 and 1`, `e.g. --threshold ${SRM_ALARM_P}`);
    const check = sampleRatioMismatch(observed, weights, threshold);
    if (!check.ok) throw new UsageError(`${ARGUMENT_OF[check.error.input] ?? check.error.input}: ${check.error.message}`);
    const output = createCliOutput({ noColorFlag: true, ...deps.write ? { write: deps.write } : {} });
    output.out(local.format === "json" ? JSON.stringify({ format: SRM_JSON_FORMAT, observed, weights, threshold, ...check.value }, null, 2) : renderSrmText(check.value, observed, threshold));
    setExit(check.value.mismatch ? EXIT.findings : EXIT.ok);
  });
}

// src/cli/totals-command.ts
import { resolve as resolve4 } from "node:path";
var TOTALS_JSON_FORMAT = "plumbline.totals-run/1";
var DIALECT_NAMES = ["duckdb", "postgres", "trino", "bigquery", "snowflake", "spark"];
function addTotalsCommand(program, setExit, deps) {
  program.command("totals").description("compute a plan\u2019s arm totals where the data lives (DuckDB over files, PostgreSQL), print the query for another engine, or read its result back").argument("<plan>", "plan id or plan file").option("--data <folder-or-glob>", "files read by DuckDB: a folder of exposures*.parquet|csv and events*.parquet|csv, or a glob (default: data.* in the settings)").addOption(new Option("--engine <engine>", "where the query runs").choices(["duckdb", "postgres"]).default("duckdb")).option("--url <url>", "PostgreSQL connection URL (default: PLUMBLINE_DATABASE_URL, else the PG* variables)").option("--sql", "print the query instead of running it", false).option("--dialect <name>", `the SQL dialect printed with --sql: ${DIALECT_NAMES.join(", ")} (default: the engine)`).option("--from-rows <csv>", "read the query\u2019s result from a CSV file (with its header row) instead of running it").option("--through <date>", "last day of data, YYYY-MM-DD, UTC (default: the plan\u2019s end or yesterday, whichever is earlier)").option("--out <file>", "the totals file to write (default: readouts/<plan-id>.totals.yaml)").option("--plan-commit <sha>", "the plan\u2019s commit at launch (default: from git: the commit where it went live)").option("--today <date>", "today, YYYY-MM-DD (default: the system date, UTC)").option("--progress", "show a progress line on stderr even when it is not a terminal", false).addOption(new Option("--format <format>", "output format").choices(["text", "json"]).default("text")).action(async (planName, flags) => {
    const options = program.opts();
    const { output, files } = context({ ...options, format: "text" }, deps);
    const root = resolve4(options.cwd);
    const [{ isCalendarDate }, { computeTotals }, { countOf, formatCount }, { pathInRepository }] = await Promise.all([import("./fields-DLQN7LI2.js"), import("./totals-KWJMXKHG.js"), import("./numbers-F62QSHW7.js"), import("./repo-path-H4JSMIDD.js")]);
    for (const [flag, value] of [["--through", flags.through], ["--today", flags.today]]) {
      if (value !== void 0 && !isCalendarDate(value)) throw new UsageError(`${flag} ${JSON.stringify(value)} is not a date`, `write it as YYYY-MM-DD, e.g. ${flag} 2026-12-06`);
    }
    if (flags.planCommit !== void 0 && !/^[0-9a-f]{7,40}$/.test(flags.planCommit)) throw new UsageError(`--plan-commit ${JSON.stringify(flags.planCommit)} is not a commit id`, "write 7 to 40 lower-case hexadecimal digits, e.g. --plan-commit 4b1d2e7");
    if (flags.dialect !== void 0 && !DIALECT_NAMES.includes(flags.dialect)) throw new UsageError(`--dialect ${JSON.stringify(flags.dialect)} is not a dialect Plumbline writes`, `one of ${DIALECT_NAMES.join(", ")}; for another engine, start from the dialect closest to it`);
    if (flags.dialect && !flags.sql) throw new UsageError("--dialect goes with --sql", `plumbline totals ${planName} --sql --dialect ${flags.dialect}`);
    if (flags.sql && flags.fromRows) throw new UsageError("--sql prints the query; --from-rows reads its result: use one at a time");
    if (flags.fromRows && !flags.through) throw new UsageError("--from-rows needs --through: the last day the query\u2019s data covers", `the date in the query's first line ("data through YYYY-MM-DD"), e.g. plumbline totals ${planName} --from-rows ${flags.fromRows} --through 2026-12-06`);
    const url = flags.url ?? process.env.PLUMBLINE_DATABASE_URL;
    const showProgress = flags.progress || !deps.write && process.stderr.isTTY === true;
    let drawn = false;
    const progress = showProgress ? (fraction) => {
      process.stderr.write(`\rRunning the totals query: ${Math.round(fraction * 100)}%${flags.progress && !process.stderr.isTTY ? "\n" : ""}`);
      drawn = true;
    } : void 0;
    const outcome = await computeTotals({
      files,
      ...options.config ? { settingsPath: options.config } : {},
      plan: planName,
      root,
      engine: flags.engine,
      ...flags.sql ? { sqlDialect: flags.dialect ?? flags.engine } : {},
      ...flags.data !== void 0 ? { data: flags.data } : {},
      ...flags.fromRows !== void 0 ? { fromRows: pathInRepository(root, flags.fromRows) } : {},
      ...flags.through ? { through: flags.through } : {},
      today: flags.today ?? (/* @__PURE__ */ new Date()).toISOString().slice(0, 10),
      ...flags.out ? { out: pathInRepository(root, flags.out) } : {},
      ...flags.planCommit ? { planCommit: flags.planCommit } : {},
      findPlanCommit: async (file) => (await import("./git-OHS6UJEC.js")).planCommitAtLaunch(root, file),
      runQuery: async (engine, sql, settings) => {
        try {
          if (engine === "postgres") return await (await import("./postgres-47DOOTCM.js")).runPostgresQuery(sql, url ? { url } : {});
          return await (await import("./duckdb-ICBURZJE.js")).runDuckDbQuery(sql, settings);
        } finally {
          if (drawn) process.stderr.write(process.stderr.isTTY ? "\r\x1B[2K" : "");
        }
      },
      ...progress ? { progress } : {}
    });
    if (outcome.kind === "sql") {
      output.out(outcome.sql);
      setExit(EXIT.ok);
      return;
    }
    await writeFileAtomic(resolve4(root, outcome.out), outcome.text, { overwrite: true });
    if (outcome.warnings.length) {
      const { formatProblem: formatProblem2 } = await import("./problem-G6HX7WF6.js");
      output.err(outcome.warnings.map(formatProblem2).join("\n"));
    }
    const excluded = outcome.totals.excluded ?? { "several-arms": 0, "unknown-arm": 0 };
    if (flags.format === "json") {
      output.out(
        JSON.stringify(
          {
            format: TOTALS_JSON_FORMAT,
            plan: outcome.planId,
            out: outcome.out,
            dataThrough: outcome.dataThrough,
            planCommit: outcome.planCommit,
            planCommitFrom: outcome.planCommitHow,
            units: Object.fromEntries(Object.entries(outcome.totals.arms).map(([arm, t]) => [arm, t.units])),
            excluded: { severalArms: excluded["several-arms"] ?? 0, unknownArm: excluded["unknown-arm"] ?? 0 },
            noExposureTime: outcome.untimed
          },
          null,
          2
        )
      );
    } else {
      const units = Object.entries(outcome.totals.arms).map(([arm, t]) => `${arm} ${formatCount(t.units)}`).join(", ");
      output.out(
        [
          `Wrote ${outcome.out}: ${outcome.planId}, data through ${outcome.dataThrough}; units ${units}.`,
          `Left out: ${countOf(excluded["several-arms"] ?? 0, "unit")} in several arms, ${formatCount(excluded["unknown-arm"] ?? 0)} with an arm the plan does not have${outcome.untimed.rows ? `, ${countOf(outcome.untimed.rows, "exposure row")} (${countOf(outcome.untimed.units, "unit")}) with no exposure time` : ""}.`,
          `Plan commit ${outcome.planCommit.slice(0, 12)} (${outcome.planCommitHow === "went-live" ? "where the plan went live" : outcome.planCommitHow === "latest" ? "the latest commit of the plan file: no commit set it live" : "given"}).`,
          `Next: plumbline readout ${outcome.planId} --totals ${outcome.out}`
        ].join("\n")
      );
    }
    setExit(EXIT.ok);
  });
}

// src/cli/validate-command.ts
function addValidateCommand(program, setExit, deps) {
  program.command("validate").description("check every plan file, registry file and the settings file").addOption(formatOption()).action(async (local) => {
    const options = { ...program.opts(), ...local };
    const { output, ...ports } = context(options, deps);
    const [{ renderValidationText, validationJson }, { validateRepository }] = await Promise.all([import("./validation-YQMKRM5P.js"), import("./validate-45XNTIGL.js")]);
    const outcome = await validateRepository(ports);
    if (outcome.kind === "settings-invalid") return setExit(reportSettingsProblems(output, options.format, outcome.settingsFile, outcome.problems));
    const { report } = outcome;
    output.out(options.format === "json" ? JSON.stringify(validationJson(report), null, 2) : renderValidationText(report, { color: output.color }));
    setExit(report.errors > 0 ? EXIT.findings : EXIT.ok);
  });
}

// src/cli/main.ts
function buildProgram(setExit, deps = REAL_DEPS) {
  const program = new Command("plumbline").description("Experiment hygiene for code review: validate plans, list the registry, size and check changes.").version(VERSION).option("-C, --cwd <dir>", "repository root", ".").option("-c, --config <file>", "settings file, relative to the repository (default: .plumbline.yml if present)").option("--no-color", "never colour the output (NO_COLOR is respected too)").configureHelp({ helpWidth: 80 }).showHelpAfterError().exitOverride().addHelpText(
    "after",
    [
      "",
      "Exit codes: 0 fine, 1 blocking findings or invalid plans, 2 usage, settings or",
      "environment error, 3 internal error (a bug)."
    ].join("\n")
  );
  addValidateCommand(program, setExit, deps);
  addListCommand(program, setExit, deps);
  addNewCommand(program, setExit, deps);
  addSizeCommand(program, setExit, deps);
  addCheckCommand(program, setExit, deps);
  addDigestCommand(program, setExit, deps);
  addSrmCommand(program, setExit, deps);
  addAdjustCommand(program, setExit, deps);
  addSchemaCommand(program, setExit, deps);
  addReadoutCommand(program, setExit, deps);
  addTotalsCommand(program, setExit, deps);
  return program;
}
function withoutHelpForUnknownCommand(argv, program) {
  const [node = "", script = "", ...words] = argv;
  const known = new Set(program.commands.flatMap((c) => [c.name(), ...c.aliases()]));
  const valued = new Set(program.options.filter((o) => o.required || o.optional).flatMap((o) => [o.short, o.long].filter((f) => f !== void 0)));
  let at = 0;
  while (at < words.length && words[at].startsWith("-") && words[at] !== "--") at += valued.has(words[at]) ? 2 : 1;
  const first = words[at];
  if (first === void 0 || known.has(first)) return [...argv];
  if (first === "help") {
    const asked = words[at + 1];
    return asked !== void 0 && !asked.startsWith("-") && !known.has(asked) ? [node, script, ...words.slice(0, at), asked] : [...argv];
  }
  if (first.startsWith("-")) return [...argv];
  return [node, script, ...words.filter((w, i) => i <= at || w !== "--help" && w !== "-h")];
}
async function runCli(argv, deps = REAL_DEPS) {
  let exitCode = EXIT.ok;
  const program = buildProgram((code) => exitCode = code, deps);
  const stderr = (text) => deps.write ? deps.write.err(text) : process.stderr.write(text);
  try {
    await program.parseAsync(withoutHelpForUnknownCommand(argv, program));
    return exitCode;
  } catch (error) {
    if (error instanceof CommanderError) {
      return error.exitCode === 0 ? EXIT.ok : EXIT.usage;
    }
    if (error instanceof UsageError) {
      stderr(`plumbline: ${error.message}${error.hint ? `
  hint: ${error.hint}` : ""}
`);
      return EXIT.usage;
    }
    if (error instanceof ExternalError) {
      const cause = error.cause instanceof Error ? `
  cause: ${error.cause.message}` : "";
      stderr(`plumbline: ${error.message}${cause}${error.hint ? `
  hint: ${error.hint}` : ""}
`);
      return EXIT.usage;
    }
    const detail = error instanceof Error ? error.stack ?? error.message : String(error);
    stderr(`plumbline: internal error: ${detail}
${BUG_REPORT_HINT}
`);
    return EXIT.internal;
  }
}
export {
  EXIT,
  buildProgram,
  runCli
};
