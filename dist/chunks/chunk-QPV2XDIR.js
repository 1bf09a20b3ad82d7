#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  armsToShip,
  changedFields,
  decisiveEntryFields,
  decisiveFields,
  latestByPlan,
  latestTotals,
  readTotalsAgainstPlan,
  showValue,
  writtenPathOf
} from "./chunk-HGOBTQHY.js";
import {
  QUOTED_STRING,
  atPlanKey,
  collisionCheck,
  collisionsOfLinked,
  commentsOfBytes,
  commentsOfText,
  describeSetter,
  findCalls,
  findFlagTouches,
  flagPatternsOf,
  flagReadsOf,
  globMatcher,
  insideRanges,
  isSameOrBelow,
  lengthSetter,
  lineIndex,
  lineStarts,
  logPatternsOf,
  metricPath,
  resolveConstant,
  runningEntries,
  scanMatcher,
  todayIn
} from "./chunk-KWOGD6NP.js";
import {
  sizingPolicy
} from "./chunk-XZ7PS274.js";
import {
  finiteSizing,
  firstNonFinite
} from "./chunk-G6K6KKMR.js";
import {
  lineOfKey,
  loadWorkspace,
  missingDecisions,
  ownFilesOf,
  require_picomatch
} from "./chunk-ZWIGW2MY.js";
import {
  addDays,
  daysBetween,
  inclusiveDays,
  sizeMetric,
  sizePlan
} from "./chunk-JLYO35IC.js";
import {
  eventsOfPlan
} from "./chunk-J3CQQVSX.js";
import {
  closestName,
  require_dist
} from "./chunk-LSO7NHYS.js";
import {
  GROUP_UNITS
} from "./chunk-XJ3K7LET.js";
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  UsageError
} from "./chunk-OICJSZPX.js";
import {
  countOf,
  formatCount,
  formatPower,
  formatRate,
  formatRelative,
  formatWeeks
} from "./chunk-ACAADDFF.js";
import {
  __toESM
} from "./chunk-FUJ7I5KY.js";

// src/core/plan/declared-flags.ts
var import_yaml = __toESM(require_dist(), 1);
function declaredFlags(text) {
  if (text === void 0) return [];
  let value;
  try {
    value = (0, import_yaml.parse)(text, { maxAliasCount: 100, uniqueKeys: false, logLevel: "silent" });
  } catch {
    return [];
  }
  if (value === null || typeof value !== "object" || Array.isArray(value)) return [];
  const flags = value.flags;
  return Array.isArray(flags) ? flags.filter((f) => typeof f === "string") : [];
}

// src/core/checks/bug-fix.ts
var import_picomatch = __toESM(require_picomatch(), 1);
var CONVENTIONAL_TAIL = /^(\([^)]*\))?!?:/;
function bugFixReason(pr, settings) {
  const labels = (pr.labels ?? []).map((l) => l.toLowerCase());
  const label = settings.labels.find((l) => labels.includes(l.toLowerCase()));
  if (label) return `it has the label ${label}`;
  const title = pr.title ?? "";
  const prefix = settings.titlePrefixes.find((p) => title.toLowerCase().startsWith(p.toLowerCase()) && CONVENTIONAL_TAIL.test(title.slice(p.length)));
  if (prefix) return `its title starts with ${prefix}:`;
  const branch = (pr.branch ?? "").toLowerCase();
  const branchPrefix = settings.branchPrefixes.find((p) => branch.startsWith(p.toLowerCase()));
  if (branchPrefix) return `its branch starts with ${branchPrefix}`;
  return void 0;
}
var CHECK_TEST_DAYS = 14;
function bugFixNudge(context) {
  const settings = context.settings.bugFix;
  if (!settings.enabled) return void 0;
  const labels = (context.pr.labels ?? []).map((l) => l.toLowerCase());
  if (labels.includes(settings.silenceLabel.toLowerCase())) return void 0;
  const reason = bugFixReason(context.pr, settings);
  if (!reason || context.touches.length > 0 || context.linked.length > 0) return void 0;
  const notProduct = (0, import_picomatch.default)(settings.nonProductPaths, { dot: true });
  const productFiles = context.changedPaths.filter((p) => !notProduct(p));
  if (productFiles.length === 0) return void 0;
  const guardrail = settings.guardrail;
  let sizingLine;
  let twoWeeksLine;
  if (guardrail && settings.dailyUnits !== void 0) {
    const harm = guardrail.direction === "decrease" ? "increase" : "decrease";
    const sized = sizeMetric({
      baseline: { kind: "proportion", rate: guardrail.rate },
      direction: harm,
      effect: { relative: 0.01 },
      arms: [
        { name: "control", weight: 50 },
        { name: "fix", weight: 50 }
      ],
      control: "control",
      alpha: 0.05,
      power: 0.8,
      sides: 1,
      dailyUnits: settings.dailyUnits,
      trafficShare: 1,
      reach: 1,
      interimLooks: 0,
      boundary: "obrien-fleming-spending",
      prePeriodCorrelation: 0,
      plannedDays: CHECK_TEST_DAYS
    });
    if (sized.ok && sized.value.headline && sized.value.effect && firstNonFinite(sized.value) === void 0) {
      const h = sized.value.headline;
      const twoWeeks = sized.value.atPlannedEnd?.detectable;
      const traffic = `${formatCount(settings.dailyUnits)} eligible units a day, half of them getting the fix`;
      const test = "one-sided \u03B1 0.05, power 80%";
      if (twoWeeks) {
        twoWeeksLine = `In two weeks at ${traffic}, a check test would catch ${guardrail.name} ${harm === "increase" ? "rising" : "falling"} from ${formatRate(guardrail.rate)} to ${formatRate(twoWeeks.to)} (${formatRelative(twoWeeks.relative)} relative; ${test}).`;
      }
      sizingLine = `To catch a 1% relative regression in ${guardrail.name} (${formatRate(guardrail.rate)} \u2192 ${formatRate(sized.value.effect.to)}) at ${traffic}: ${countOf(h.perArm[0].units, "unit")} per arm, ${h.duration ? formatWeeks(h.duration) : "no duration"}; ${test}.`;
    }
  }
  const slug = (context.pr.branch ?? "bug-fix").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40) || "bug-fix";
  const g = guardrail ?? { name: "error-rate", rate: 0.01, events: ["error_shown"], direction: "decrease" };
  const planStub = [
    `id: check-${slug}`,
    `title: "Check test: ${(context.pr.title ?? "the fix").replace(/"/g, "'").slice(0, 80)}"`,
    'owners: ["@your-handle"]',
    `flags: [${slug}]`,
    "state: draft",
    ...context.today ? [`window: { start: ${context.today}, end: ${addDays(context.today, CHECK_TEST_DAYS - 1)} }   # two whole weeks`] : [],
    "hypothesis:",
    "  change: The fix, behind a flag, for half of the traffic.",
    "  because: It should stop the bug without harming anything else.",
    "  expected-direction: increase",
    "unit: { randomization: user }",
    "surface: { path: area/page }",
    "metrics:",
    "  primary:",
    "    name: task-completed",
    "    kind: proportion",
    "    baseline: { rate: 0.5 }",
    "    events: [task_completed]",
    "  guardrails:",
    `    - { name: ${g.name}, kind: proportion, baseline: { rate: ${g.rate} }, events: [${g.events.join(", ")}], direction: ${g.direction}, tolerance: { relative: 0.01 } }`,
    "    - { name: latency, kind: mean, baseline: { mean: 300, sd: 150 }, events: [page_rendered], direction: decrease, tolerance: { relative: 0.02 } }",
    "design:",
    "  min-detectable-effect: { relative: 0.02 }",
    `  daily-units: ${settings.dailyUnits ?? 1e4}`,
    "decisions:",
    "  win: Roll the fix out to everyone.",
    "  flat: Roll it out; the bug is gone and nothing got worse.",
    "  loss: Turn the flag off and look again at the fix.",
    "  guardrail-breach: Turn the flag off at once."
  ].join("\n");
  return { reason, productFiles, planStub, ...twoWeeksLine ? { twoWeeksLine } : {}, ...sizingLine ? { sizingLine } : {} };
}
var bugFixUnmeasured = (context) => {
  const nudge = bugFixNudge(context);
  if (!nudge) return [];
  return [
    {
      code: "bug-fix-unmeasured",
      message: `This looks like a bug fix (${nudge.reason}) that changes product code without a flag: if the fix does not fix, or slows things down or raises errors, nobody will see it.`,
      fix: `Ship it behind a flag with a small check test (a plan to paste is in the comment), or add the label ${context.settings.bugFix.silenceLabel} to say no test is needed.`
    }
  ];
};

// src/core/checks/effect-plausible.ts
var MIN_OUTCOMES = 5;
var IMPLAUSIBLE_SHARE = 0.9;
function relativeEffect(plan) {
  const effect = plan.design.minDetectableEffect;
  if (!effect) return void 0;
  if (effect.relative !== void 0) return Math.abs(effect.relative);
  const primary = plan.metrics.primary;
  const baseline = primary.kind === "proportion" ? primary.baseline.rate : primary.kind === "mean" ? primary.baseline.mean : void 0;
  return effect.absolute !== void 0 && baseline ? Math.abs(effect.absolute / baseline) : void 0;
}
function measuredEffects(plans, metric, except) {
  let tests = 0;
  const effects = [];
  for (const p of plans) {
    if (p.id === except) continue;
    const relatives = (p.outcome?.figures ?? []).filter((f) => f.metric === metric && f.relative !== void 0).map((f) => Math.abs(f.relative));
    if (relatives.length === 0) continue;
    tests++;
    effects.push(...relatives);
  }
  return { tests, effects };
}
var percent = (x) => `${Number((x * 100).toPrecision(3))}%`;
var effectImplausible = ({ linked, registry }) => {
  const plans = registry.entries.flatMap((e) => e.plan ? [e.plan] : []);
  return linked.flatMap(({ loaded }) => {
    const { plan } = loaded;
    if (plan.outcome) return [];
    const mde = relativeEffect(plan);
    const metric = plan.metrics.primary.name;
    if (mde === void 0) return [];
    const { tests, effects } = measuredEffects(plans, metric, plan.id);
    if (tests < MIN_OUTCOMES) return [];
    const below = effects.filter((e) => e < mde).length;
    if (below / effects.length < IMPLAUSIBLE_SHARE) return [];
    const largest = Math.max(...effects);
    return [
      {
        code: "effect-implausible",
        message: `The plan is sized to detect ${percent(mde)} on ${metric}, larger than ${below} of the ${countOf(effects.length, "effect")} measured on it by ${countOf(tests, "recorded test")} (the largest: ${percent(largest)}). A test sized for an effect that rarely happens is underpowered for the ones that do, and a win it finds is likely inflated.`,
        fix: `Size for an effect in the range measured before (most were below ${percent(largest)}): run longer or enrol more traffic, or say in the plan why this change should move ${metric} more than past ones did.`,
        ...atPlanKey(loaded, ["design", "min-detectable-effect"])
      }
    ];
  });
};

// src/core/checks/test-lifecycle.ts
function hasStarted(entry, today) {
  if (entry.state === "concluded") return false;
  if (entry.state === "live" || entry.state === "on-hold") return true;
  return entry.window.start !== void 0 && entry.window.start <= today;
}
function collectingSince(entry, today) {
  return entry.window.start !== void 0 ? entry.window.start <= today : entry.state === "live" || entry.state === "on-hold";
}
function hasOutcome(entry) {
  return entry.plan ? entry.plan.outcome !== void 0 : entry.state === "concluded";
}
var ownersOf = (entry) => entry.owners.join(", ");

// src/core/checks/ended-early.ts
function removedReads(touches) {
  const removed = /* @__PURE__ */ new Map();
  for (const t of touches) if (t.side === "removed" && (t.via === "call" || t.via === "constant") && !removed.has(t.key)) removed.set(t.key, t);
  return removed;
}
var stillRead = (context, key) => {
  const hits = context.flagsAtHead.get(key);
  return hits?.firstCall !== void 0 || hits?.firstQuoted !== void 0;
};
function finding(before, after, keys, where, today) {
  const flags = keys.map((k) => `\`${k}\``).join(", ");
  const end = after.window.end;
  const base = { plan: after.id, file: where.file, line: where.line, side: "base", dependents: [after.id] };
  if (end !== void 0 && end < today) {
    return {
      code: "outcome-missing",
      message: `This change removes the last read of ${flags}; ${after.id} (${ownersOf(after)}) passed its planned end on ${end}, but its plan records no outcome.`,
      fix: `Record the outcome in ${after.file}: state: concluded and outcome: { date, reason } with the decision in one line.`,
      ...base
    };
  }
  const left = end !== void 0 ? `its planned end is ${end}, ${daysBetween(today, end)} day${daysBetween(today, end) === 1 ? "" : "s"} away` : "it has no planned end";
  return {
    code: "test-ended-early",
    message: `This change removes the last read of ${flags}, which ${before.state === "live" ? "the running" : "the started"} test ${after.id} (${ownersOf(after)}) randomizes; ${left}. Hard-coding one arm ends the test early, and a result read before its planned end overstates the effect.`,
    fix: `Keep the flag read until the planned end, or end the test on purpose: set state: concluded with an outcome (date and a one-line reason) in ${after.file}.`,
    ...base
  };
}
var endedEarly = (context) => {
  const removed = removedReads(context.touches);
  if (removed.size === 0) return [];
  const head = new Map(context.registry.entries.map((e) => [e.id, e]));
  return context.baseEntries.filter((before) => hasStarted(before, context.today)).flatMap((before) => {
    const gone = before.flags.filter((k) => removed.has(k) && !stillRead(context, k));
    const after = head.get(before.id) ?? before;
    if (gone.length === 0 || hasOutcome(after)) return [];
    const raised = finding(before, after, gone, removed.get(gone[0]), context.today);
    const linked = context.linked.find((l) => l.loaded.plan.id === after.id);
    if (raised.code === "outcome-missing" && linked?.ending && !linked.readout) return [];
    return [raised];
  });
};

// src/core/scan/evidence.ts
var TEST_FOLDER = /(?:^|\/)(?:test|tests|__tests__|spec|specs|e2e|fixtures?|__fixtures__|testdata|test-data|__mocks__|mocks?|stories|__snapshots__)\//i;
var TEST_FILE = /(?:\.(?:test|spec|stories|e2e|cy)\.[^/]+$|_test\.(?:go|py|rb|exs?)$|(?:^|\/)test_[^/]+\.py$|(?:Tests?|Spec|IT)\.(?:java|kt|cs|swift|scala)$|\.snap$)/;
var DOCS = /(?:(?:^|\/)(?:docs?|documentation)\/|\.(?:md|mdx|markdown|rst|adoc|txt|html?)$)/i;
var GENERATED = /(?:(?:^|\/)(?:generated|__generated__|gen|dist|build|out|vendor)\/|\.(?:generated|gen|g|pb|min)\.[^/]+$|\.lock$|-lock\.json$)/i;
function evidenceKindOf(path) {
  if (TEST_FOLDER.test(path) || TEST_FILE.test(path)) return "test";
  if (GENERATED.test(path)) return "generated";
  if (DOCS.test(path)) return "docs";
  return "code";
}

// src/core/scan/code-blocks.ts
var CONTROL = /^(?:else\b|if\b|for\b|while\b|switch\b|catch\b|try\b|do\b|finally\b|case\b|elif\b|except\b|with\b|match\b)/;
var FUNCTION_HEADER = /(?:\bfunction\b|=>\s*$|\bfunc\b|\bfn\b|\bdef\b|\)\s*(?::\s*[^=;{]+)?(?:\s*throws\s+[\w.,\s]+)?\s*$)/;
var isPython = (path) => /\.pyi?$/i.test(path);
function blocksOf(text, path) {
  return isPython(path) ? indentBlocks(text) : braceBlocks(text, path);
}
function braceBlocks(text, path) {
  const comments = commentsOfText(text, path);
  const blocks = [];
  const stack = [];
  let quote;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quote) {
      if (c === "\\") i++;
      else if (c === quote || c === "\n" && quote !== "`") quote = void 0;
      continue;
    }
    if (insideRanges(comments, i)) continue;
    if (c === '"' || c === "'" || c === "`") quote = c;
    else if (c === "{") stack.push(i);
    else if (c === "}" && stack.length) {
      const open = stack.pop();
      blocks.push({ open, close: i, ...headerBefore(text, open) });
    }
  }
  return blocks.sort((a, b) => a.open - b.open);
}
function headerBefore(text, open) {
  let start = open - 1;
  while (start >= 0 && !";{}".includes(text[start])) start--;
  const headerStart = controlLineStart(text, start + 1, open);
  return { header: text.slice(headerStart, open).replace(/\s+/g, " ").trim(), headerStart };
}
function controlLineStart(text, from, open) {
  for (let newline = text.lastIndexOf("\n", open - 1); newline >= from; newline = newline > 0 ? text.lastIndexOf("\n", newline - 1) : -1) {
    if (!CONTROL.test(text.slice(newline + 1, open).trimStart())) continue;
    const before = text.slice(from, newline).trimEnd();
    if (before === "") return from;
    if (!/[([,=&|+\-*/.?:!<>]$/.test(before)) return newline + 1;
  }
  return from;
}
function indentBlocks(text) {
  const lines = text.split("\n");
  const offsets = [];
  let at = 0;
  for (const line of lines) {
    offsets.push(at);
    at += line.length + 1;
  }
  const indent = (line) => line.length - line.trimStart().length;
  const blocks = [];
  lines.forEach((line, n) => {
    const trimmed = line.trim();
    if (!trimmed.endsWith(":") || trimmed.startsWith("#")) return;
    const own = indent(line);
    let end = n + 1;
    for (let k = n + 1; k < lines.length; k++) {
      if (lines[k].trim() === "" || lines[k].trim().startsWith("#")) continue;
      if (indent(lines[k]) <= own) break;
      end = k + 1;
    }
    blocks.push({ open: offsets[n] + line.length, close: (offsets[end - 1] ?? 0) + (lines[end - 1]?.length ?? 0), header: trimmed.slice(0, -1), headerStart: offsets[n] });
  });
  return blocks;
}
function enclosing(blocks, offset) {
  return blocks.filter((b) => b.open < offset && offset <= b.close);
}
var isFunctionHeader = (header) => !CONTROL.test(header) && FUNCTION_HEADER.test(header);
var isControlHeader = (header) => CONTROL.test(header);
function enclosingFunction(blocks, offset) {
  return enclosing(blocks, offset).filter((b) => isFunctionHeader(b.header)).at(-1);
}

// src/core/scan/exposure-branch.ts
function receiverStart(text, read) {
  const space = (at) => {
    while (at > 0 && /\s/.test(text.charAt(at - 1))) at--;
    return at;
  };
  let start = read.start;
  for (; ; ) {
    let at = space(start);
    if (text.charAt(at - 1) !== ".") return start;
    at = space(at - (text.charAt(at - 2) === "?" ? 2 : 1));
    let name = at;
    while (name > 0 && /[\w$]/.test(text.charAt(name - 1))) name--;
    if (name === at) return start;
    start = name;
  }
}
function assignedName(text, read) {
  const start = receiverStart(text, read);
  const before = text.slice(text.lastIndexOf("\n", start - 1) + 1, start);
  return /(?:^|[^\w$.])([A-Za-z_$][\w$]*)(?:\s*,\s*[A-Za-z_$][\w$]*)*\s*(?::\s*[^=]+)?\s*:?=\s*(?:await\s+)?$/.exec(before)?.[1];
}
function conditionsOf(text, blocks, block) {
  const chain = [block];
  let current = block;
  while (/^else\b/.test(current.header)) {
    const previous = blocks.filter((b) => b.close < current.open && /^[\s}]*$/.test(text.slice(b.close + 1, current.open).replace(/\belse\b/, ""))).at(-1);
    if (!previous) break;
    chain.push(previous);
    current = previous;
  }
  return chain;
}
function exposureInOneArm(text, path, reads, exposures) {
  if (reads.length === 0 || exposures.length === 0) return [];
  const blocks = blocksOf(text, path);
  const lineOf = lineIndex(text);
  const lineText = (offset) => {
    const start = text.lastIndexOf("\n", offset - 1) + 1;
    const end = text.indexOf("\n", offset);
    return text.slice(start, end === -1 ? text.length : end).trim();
  };
  const at = (offset) => ({ line: lineOf(offset), text: lineText(offset) });
  const headerAt = (b) => b.headerStart + Math.max(0, text.slice(b.headerStart, b.open).search(/\S/));
  const found = [];
  for (const log of exposures) {
    const fn = enclosingFunction(blocks, log.start);
    const read = reads.filter((r) => r.start < log.start && enclosingFunction(blocks, r.start) === fn).at(-1);
    if (!read) continue;
    const name = assignedName(text, read);
    const named = name !== void 0 ? new RegExp(`(?<![\\w$.])${name.replace(/\$/g, "\\$")}(?![\\w$])`) : void 0;
    const mentions = (b) => read.start >= b.headerStart && read.start < b.open || (named?.test(b.header) ?? false);
    const inner = enclosing(blocks, log.start).filter((b) => (!fn || b.open > fn.open) && isControlHeader(b.header));
    const branch = inner.map((b) => conditionsOf(text, blocks, b).find(mentions)).find((b) => b !== void 0);
    if (branch) {
      found.push({ kind: "branch", exposure: at(log.start), flag: at(read.start), condition: at(headerAt(branch)) });
      continue;
    }
    const between = text.slice(read.end, log.start);
    const condition = name ?? "";
    const oneLine = new RegExp(`\\bif\\b[^\\n]*(?<![\\w$.])${condition.replace(/\$/g, "\\$")}(?![\\w$])[^\\n]*?(?:\\)|:|(?=\\s*\\{))\\s*(?:\\{\\s*)?(?:\\n\\s*)?(?:return|throw|raise)\\b`);
    const early = name ? oneLine.exec(between) : null;
    if (early) found.push({ kind: "early-return", exposure: at(log.start), flag: at(read.start), condition: at(read.end + early.index) });
  }
  return found;
}

// src/core/checks/exposure-arms.ts
var exposureOneArm = (context) => {
  const flagPatterns = flagPatternsOf(context.settings);
  const logPatterns = logPatternsOf(context.settings);
  return context.linked.flatMap(({ loaded }) => {
    const { plan } = loaded;
    const event = plan.exposure.event;
    if (!event) return [];
    const keys = new Set(plan.flags);
    return [...context.codeAtHead].flatMap(([path, text]) => {
      if (evidenceKindOf(path) !== "code" || !text.includes(event)) return [];
      const reads = flagReadsOf(text, path, flagPatterns, keys);
      const exposures = findCalls(text, path, logPatterns).filter((s) => s.groups.event === event);
      return exposureInOneArm(text, path, reads, exposures).map((found) => ({
        code: "exposure-one-arm",
        message: `Exposure event \`${event}\` is logged ${found.kind === "branch" ? "inside a branch on" : "after an early return on"} the value of ${plan.flags.map((f) => `\`${f}\``).join(", ")}, so some arms never log it: line ${found.flag.line} \`${found.flag.text}\`, line ${found.condition.line} \`${found.condition.text}\`, line ${found.exposure.line} \`${found.exposure.text}\`. The arms are then compared over different people (a classic cause of sample ratio mismatch).`,
        fix: "Log exposure where the arms first differ, in every arm, control included: right after the flag is read, before any branch or return on its value.",
        plan: plan.id,
        file: path,
        line: found.exposure.line
      }));
    });
  });
};

// src/core/checks/flags.ts
var flagWithoutPlan = ({ touches, registry, settings, invalidPlanFiles }) => {
  const planned = /* @__PURE__ */ new Set([...registry.entries.flatMap((e) => e.flags), ...invalidPlanFiles.flatMap((f) => f.flags ?? [])]);
  const exempt = new Set(settings.exemptFlags);
  const reported = /* @__PURE__ */ new Set();
  return touches.filter((t) => !planned.has(t.key) && !exempt.has(t.key) && !reported.has(t.key) && reported.add(t.key)).map((t) => ({
    code: "flag-without-plan",
    message: `Flag \`${t.key}\` is ${t.side === "added" ? "used" : "removed"} here, but no plan names it.`,
    fix: `Write a plan for it (plumbline new ${t.key}), link one in the description, or list it under exempt-flags in the settings if it is a kill switch or an operational toggle.`,
    file: t.file,
    line: t.line,
    // A removed use is a line of the base commit.
    ...t.side === "removed" ? { side: "base" } : {}
  }));
};

// src/core/checks/frozen-plan.ts
function appendedAmendments(before, after) {
  const rewritten = after.length < before.length || before.some((a, i) => JSON.stringify(a) !== JSON.stringify(after[i]));
  return { added: rewritten ? [] : after.slice(before.length), rewritten };
}
function decisiveChanges(before, after, today) {
  const baselineFrozen = collectingSince(before, today);
  if (before.plan && after.plan) return changedFields(decisiveFields(before.plan, baselineFrozen), decisiveFields(after.plan, baselineFrozen));
  return changedFields(decisiveEntryFields(before), decisiveEntryFields(after));
}
var startedOn = (entry) => entry.window.start ? `started on ${entry.window.start}` : `is ${entry.state}`;
var listChanges = (changes) => changes.map((c) => `${c.field} (${c.before} \u2192 ${c.after})`).join("; ");
function endMove(before, after) {
  const was = before.window.end;
  const now = after.window.end;
  if (was === now || was === void 0) return void 0;
  const later = now === void 0 || now > was;
  if (!later && (after.plan?.design.interimLooks ?? 0) > 0) return void 0;
  return { field: "window.end", before: showValue(was), after: showValue(now) };
}
function atChangedKey(entry, fields) {
  const { keyLines } = entry;
  const line = keyLines && fields.length ? Math.min(...fields.map((path) => lineOfKey({ line: entry.line, keyLines }, path))) : entry.line;
  return { plan: entry.id, file: entry.file, line };
}
function reviewOne(before, after, today) {
  const guardrails = after.plan?.metrics.guardrails.map((g) => g.name) ?? [];
  const at = (changes2) => atChangedKey(after, changes2.map((c) => writtenPathOf(c.field, guardrails)));
  const { added, rewritten } = appendedAmendments(before.amendments, after.amendments);
  const changes = decisiveChanges(before, after, today);
  if (rewritten) changes.push({ field: "amendments", before: `${before.amendments.length} recorded`, after: "earlier entries edited or removed" });
  const end = endMove(before, after);
  const amendment = added.at(-1);
  if (amendment && !rewritten && (changes.length || end)) {
    const all = end ? [...changes, end] : changes;
    return [
      {
        code: "plan-amended",
        message: `${after.id} (${ownersOf(after)}) ${startedOn(before)}; this change amends what decides its result (${all.map((c) => c.field).join(", ")}), recorded on ${amendment.date}: \u201C${amendment.changed}\u201D because \u201C${amendment.reason}\u201D.`,
        fix: "Judge the amendment against the table: a result must not be chosen after seeing data. The readout must say the plan changed on this date.",
        changes: all,
        amendment,
        ...atChangedKey(after, [["amendments", after.amendments.length - 1]])
      }
    ];
  }
  const findings = [];
  if (changes.length) {
    findings.push({
      code: "plan-frozen",
      message: `${after.id} (${ownersOf(after)}) ${startedOn(before)}, and this change alters what decides its result: ${listChanges(changes)}. Changing these after the start lets the result be chosen after the fact.`,
      fix: `Put these fields back as they were. If a change is truly needed, append an entry under amendments: with date, changed and reason (reviewers then see a before/after table), or end ${after.id} and plan a new test.`,
      changes,
      ...at(changes)
    });
  }
  if (end) {
    const later = end.after === showValue(void 0) || end.after > end.before;
    findings.push({
      code: "plan-end-moved",
      message: later ? `${after.id} ${startedOn(before)}; this change moves its planned end from ${end.before} to ${end.after}. A later end changes the power the test was sized for and invites stopping when the numbers look good.` : `${after.id} ${startedOn(before)}; this change brings its planned end forward from ${end.before} to ${end.after}, and the plan has no interim looks, so the test ends with less power than planned.`,
      fix: later ? "Keep the planned end, or record the reason under amendments: and read the result only at the new end." : "Keep the planned end, plan interim looks with a stopping boundary, or record the reason under amendments:.",
      changes: [end],
      ...at([end])
    });
  }
  return findings;
}
function deleted(before) {
  return {
    code: "plan-deleted",
    message: `This change deletes ${before.id} (${ownersOf(before)}) from ${before.file}, a test that ${startedOn(before)} and has no recorded outcome; its pre-registered plan is what its result will be judged against.`,
    fix: `Keep the plan: set state: concluded with an outcome (date and a one-line reason) when the test is over.`,
    plan: before.id,
    file: before.file,
    line: before.line,
    side: "base"
  };
}
function baseUnread(context, why) {
  const edited = new Set(context.changedPaths);
  const deleted2 = context.changedCode.filter((c) => c.head === void 0 && !edited.has(c.path) && /\.ya?ml$/i.test(c.basePath)).map((c) => c.basePath);
  const started = context.registry.entries.filter((e) => hasStarted(e, context.today) && edited.has(e.file));
  if (started.length === 0 && deleted2.length === 0) return [];
  const named = started.slice(0, 5).map((e) => e.id).join(", ");
  const ids = started.length > 5 ? `${named} and ${formatCount(started.length - 5)} more` : named;
  return [
    {
      code: "base-unread",
      message: [
        started.length ? `The plans of ${countOf(started.length, "started test")} this change edits (${ids}) were not compared with the base commit, so changes to what decides their results (plan-frozen, plan-amended, plan-end-moved) could not be checked.` : "",
        deleted2.length ? `This change deletes ${countOf(deleted2.length, "YAML file")} (${deleted2.slice(0, 5).join(", ")}${deleted2.length > 5 ? ", \u2026" : ""}); whether one held a started test's plan (plan-deleted) could not be checked.` : "",
        `The base commit was not read because ${why}.`
      ].filter(Boolean).join(" "),
      fix: "Check out the repository with its history (actions/checkout with fetch-depth: 0) so the review reads the base commit with git."
    }
  ];
}
var frozenPlans = (context) => {
  if (context.baseUnreadable) return baseUnread(context, context.baseUnreadable);
  const head = new Map(context.registry.entries.map((e) => [e.id, e]));
  const unloadable = new Set(context.invalidPlanFiles.map((f) => f.file));
  return context.baseEntries.filter((before) => hasStarted(before, context.today)).flatMap((before) => {
    const after = head.get(before.id);
    if (after) return reviewOne(before, after, context.today);
    if (unloadable.has(before.file) || hasOutcome(before)) return [];
    return [deleted(before)];
  });
};

// src/core/checks/logging.ts
function eventStatuses(context, planId) {
  const linked = context.linked.find((l) => l.loaded.plan.id === planId);
  if (!linked) return [];
  const { plan } = linked.loaded;
  const roles = /* @__PURE__ */ new Map();
  const note = (event, role) => roles.set(event, [...roles.get(event) ?? [], role]);
  if (plan.exposure.event) note(plan.exposure.event, "exposure");
  for (const m of [plan.metrics.primary, ...plan.metrics.guardrails, ...plan.metrics.secondary]) for (const e of m.events) note(e, m.name);
  return eventsOfPlan(plan).map((event) => {
    const hits = context.events.get(event);
    const location = hits?.firstCall ?? hits?.firstQuoted;
    const mentioned = !location && hits?.firstMention ? { mentionedAt: hits.firstMention } : {};
    return { event, roles: roles.get(event) ?? [], ...location ? { location, via: hits?.firstCall ? "call" : "literal" } : {}, ...mentioned };
  });
}
var eventMissing = (context) => context.linked.flatMap(
  ({ loaded }) => eventStatuses(context, loaded.plan.id).filter((s) => !s.location).map((s) => ({
    code: "event-missing",
    message: `Event \`${s.event}\` (${s.roles.join(", ")}) is not logged anywhere in the code at head${s.mentionedAt ? ` (only mentioned, in ${s.mentionedAt.file}:${s.mentionedAt.line}, which logs nothing)` : ""}, so the ${s.roles.includes("exposure") ? "exposure" : "metric"} cannot be computed.`,
    fix: `Log ${s.event} where it happens (or correct the name in the plan) before launch.`,
    ...atPlanKey(loaded, s.roles[0] === "exposure" ? ["exposure", "event"] : [...metricPath(loaded.plan, s.roles[0] ?? ""), "events"])
  }))
);
function dependents(entries, baseEntries, event) {
  const byId = /* @__PURE__ */ new Map();
  for (const e of [...runningEntries(entries), ...runningEntries(baseEntries)]) if (e.events.includes(event) && !byId.has(e.id)) byId.set(e.id, e);
  return [...byId.values()];
}
var eventRemoved = ({ removedEvents, events, registry, baseEntries }) => [...removedEvents].flatMap(([event, where]) => {
  const still = events.get(event);
  if (still?.firstCall || still?.firstQuoted) return [];
  const plans = dependents(registry.entries, baseEntries, event);
  if (plans.length === 0) return [];
  return [
    {
      code: "event-removed",
      message: `This change removes the last logging of \`${event}\`, which running test${plans.length === 1 ? "" : "s"} ${plans.map((p) => `${p.id} (${p.owners.join(", ")})`).join(", ")} depend${plans.length === 1 ? "s" : ""} on.`,
      fix: "Keep logging the event, or agree with the owners to end or change those tests first.",
      file: where.file,
      line: where.line,
      side: "base",
      dependents: plans.map((p) => p.id)
    }
  ];
});

// src/core/checks/plans.ts
var planInvalid = ({ invalidPlanFiles }) => invalidPlanFiles.map(({ file, problems }) => {
  const errors = problems.filter((p) => p.severity === "error");
  return {
    code: "plan-invalid",
    message: `${file} cannot be used: ${countOf(errors.length, "error")}, first: ${formatProblem(errors[0])}`,
    fix: "Run plumbline validate and fix each error.",
    file,
    line: errors[0]?.line ?? 1
  };
});
var REPORTED_BY_A_CHECK = /* @__PURE__ */ new Set(["plan/decisions-missing"]);
var fileWarnings = ({ fileWarnings: fileWarnings2, linked, changedPaths }) => {
  const planOf = new Map(linked.map(({ loaded }) => [loaded.file, loaded.plan.id]));
  const inScope = /* @__PURE__ */ new Set([...planOf.keys(), ...changedPaths]);
  return fileWarnings2.filter((p) => inScope.has(p.file) && !REPORTED_BY_A_CHECK.has(p.code)).map((p) => {
    const plan = planOf.get(p.file);
    return {
      code: "file-warning",
      message: `${p.field ? `${p.field}: ` : ""}${p.message} (${p.code})`,
      fix: p.expected ? `Write ${p.expected}; plumbline validate lists every warning.` : "See plumbline validate, which lists every warning with what it expects.",
      ...plan ? { plan } : {},
      file: p.file,
      line: p.line
    };
  });
};
var decisionsMissing = ({ linked }) => linked.flatMap(({ loaded }) => {
  const missing = missingDecisions(loaded.plan);
  if (missing.length === 0) return [];
  return [
    {
      code: "decisions-missing",
      message: `No decision rule for ${missing.join(", ")}: without rules written before the data arrives, the result gets read to fit what people hoped.`,
      fix: `Add under decisions: ${missing.map((m) => `${m}: "what you will do"`).join("; ")}.`,
      ...atPlanKey(loaded, ["decisions"])
    }
  ];
});
var reasonMissing = ({ linked }) => linked.filter(({ loaded }) => !loaded.plan.hypothesis.because).map(({ loaded }) => ({
  code: "reason-missing",
  message: "The hypothesis says what changes but not why it should work.",
  fix: "Add hypothesis.because: the mechanism you expect, so a flat or negative result teaches something.",
  ...atPlanKey(loaded, ["hypothesis"])
}));
var guardrailsMissing = ({ linked }) => linked.filter(({ loaded }) => loaded.plan.metrics.guardrails.length === 0).map(({ loaded }) => ({
  code: "guardrails-missing",
  message: "No guardrail metric: harm elsewhere (errors, latency, cancellations) would go unseen.",
  fix: "Add metrics.guardrails with a direction and a tolerance each.",
  ...atPlanKey(loaded, ["metrics", "guardrails"])
}));
var windowChecks = ({ linked }) => linked.flatMap(({ loaded }) => {
  const { start, end } = loaded.plan.window;
  const at = atPlanKey(loaded, ["window", "end"]);
  if (!end) {
    return [{ code: "end-missing", message: "No planned end date: tests without one run on, and get peeked at until something looks significant.", fix: "Add window.end.", ...at }];
  }
  if (!start) return [];
  const days = inclusiveDays(start, end);
  if (days < 7) {
    return [{ code: "window-short", message: `The window is ${countOf(days, "day")}: less than a week misses weekly cycles.`, fix: "Plan at least 7 days, in whole weeks.", ...at }];
  }
  if (days % 7 !== 0) {
    return [{ code: "window-partial-week", message: `The window is ${countOf(days, "day")}, not a whole number of weeks, so some weekdays count more than others.`, fix: `Make it ${countOf(Math.ceil(days / 7) * 7, "day")} (${countOf(Math.ceil(days / 7), "week")}).`, ...at }];
  }
  return [];
});
var reviewMissing = ({ linked }) => linked.flatMap(
  ({ loaded }) => loaded.plan.sensitive.map((s, index) => ({ ...s, index })).filter((s) => !s.review).map((s) => ({
    code: "review-missing",
    message: `The plan touches ${s.area}, but names no review for it. Tests in this area can hurt people; Plumbline cannot judge that, and defers to local law and to the people licensed to.`,
    fix: `Name the review under sensitive (review: ...) and get it before launch: ${REVIEW_HINT[s.area]}.`,
    ...atPlanKey(loaded, ["sensitive", s.index])
  }))
);
var REVIEW_HINT = {
  pricing: "pricing, finance and legal (price discrimination and consumer law differ by country)",
  legal: "legal counsel",
  regulatory: "compliance, with the regulator\u2019s rules for each region in the population",
  minors: "legal and child-safety review; many places need parental consent or forbid such tests",
  health: "clinical or medical review, and legal where health data is involved",
  accessibility: "accessibility review, with assistive-technology testing",
  privacy: "privacy review (data protection officer where there is one)"
};
var bundleUnexplained = ({ linked }) => linked.filter(({ loaded }) => loaded.plan.flags.length > 1 && !loaded.plan.bundleRationale).map(({ loaded }) => ({
  code: "bundle-unexplained",
  message: `The plan bundles ${loaded.plan.flags.length} flags (${loaded.plan.flags.join(", ")}): a result will not say which change caused it.`,
  fix: "Add bundle-rationale, or split the plan.",
  ...atPlanKey(loaded, ["flags"])
}));
var populationChecks = ({ linked }) => linked.flatMap(({ loaded }) => {
  const { platforms, locales, ready } = loaded.plan.population;
  const missing = [platforms.length ? "" : "platforms", locales.length ? "" : "locales"].filter(Boolean);
  if (missing.length) {
    return [{ code: "population-undeclared", message: `The population does not declare ${missing.join(" or ")}.`, fix: `Add population.${missing.join(" and population.")}.`, ...atPlanKey(loaded, ["population"]) }];
  }
  const notReady = [...platforms.filter((p) => !ready.platforms.includes(p)), ...locales.filter((l) => !ready.locales.includes(l))];
  if (notReady.length === 0) return [];
  return [
    {
      code: "readiness-missing",
      message: `The change is not declared ready on ${notReady.join(", ")} (rendered, translated), though the population includes ${notReady.length === 1 ? "it" : "them"}.`,
      fix: "Check the change there and add it under population.ready, or take it out of the population.",
      ...atPlanKey(loaded, ["population", "ready"])
    }
  ];
});

// src/core/checks/sizing.ts
var sizingChecks = ({ linked, settings }) => linked.flatMap(({ loaded, sizing }) => {
  const { plan } = loaded;
  const out = [];
  const noTraffic = plan.design.dailyUnits === void 0 && plan.design.uniqueUnits === void 0;
  if (!plan.design.minDetectableEffect || noTraffic) {
    const missing = [plan.design.minDetectableEffect ? "" : "design.min-detectable-effect", noTraffic ? "design.daily-units (or design.unique-units)" : ""].filter(Boolean);
    const key = plan.design.minDetectableEffect ? "daily-units" : "min-detectable-effect";
    out.push({ code: "sizing-incomplete", message: `The test cannot be sized without ${missing.join(" and ")}.`, fix: `Add ${missing.join(" and ")}; then Plumbline says how many units and days the test needs.`, ...atPlanKey(loaded, ["design", key]) });
  }
  for (const entry of sizing.metrics) {
    const at = atPlanKey(loaded, metricPath(plan, entry.metric));
    if (!entry.result.ok) {
      out.push({ code: "sizing-impossible", message: `${entry.metric} cannot be sized: ${entry.result.error.input}: ${entry.result.error.message}.`, fix: "Check the metric\u2019s baseline figures and the effect to detect.", ...at });
      continue;
    }
    const s = entry.result.value;
    const end = s.atPlannedEnd;
    if (end?.power !== void 0 && end.power < entry.power) {
      const needed = s.headline?.duration ? ` It needs ${formatWeeks(s.headline.duration)}.` : "";
      out.push({
        code: "underpowered",
        message: `${entry.role === "primary" ? "The primary metric" : `Guardrail ${entry.metric}`} reaches ${formatPower(end.power)} power by the planned end, below the planned ${formatPower(entry.power)}.${needed}`,
        fix: "Extend the window, enrol more traffic, or plan for a larger effect, and say which in the plan.",
        ...at
      });
    }
  }
  const atDesign = atPlanKey(loaded, ["design"]);
  out.push(...practiceFindings(plan, sizing, settings).map((f) => ({ ...f, ...atDesign })));
  const diluted = plan.exposure.reach < 1 ? dilution(sizing) : void 0;
  if (diluted) {
    out.push({
      code: "exposure-diluted",
      message: `Only ${Math.round(plan.exposure.reach * 100)}% of exposed units reach the change, so the effect is diluted: the test needs ${diluted.needs} instead of ${diluted.couldNeed} with exposure logged where the change is seen. ${diluted.verdict}`,
      fix: diluted.enough ? "Nothing is needed for this test; logging exposure where the change is seen (or analysing only the units that reach it) would make the next one shorter." : "Log the exposure event where the change is actually seen (or analyse only the units that reach it), or extend the window.",
      ...atPlanKey(loaded, ["exposure", "reach"])
    });
  }
  return out;
});
function dilution(sizing) {
  const asLogged = lengthSetter(sizing, (s) => s.diluted);
  const triggered = lengthSetter(sizing, (s) => s.triggered);
  if (!asLogged || !triggered) return void 0;
  const ends = sizing.metrics.flatMap((m) => m.result.ok && m.result.value.atPlannedEnd?.power !== void 0 ? [{ power: m.result.value.atPlannedEnd.power, target: m.power }] : []);
  const shortest = ends.length ? ends.reduce((a, b) => b.power - b.target < a.power - a.target ? b : a) : void 0;
  const weakest = shortest?.power;
  const plannedPower = shortest?.target ?? 0;
  const enough = shortest !== void 0 && ends.every((e) => e.power >= e.target);
  const planned = sizing.plannedDays !== void 0 ? countOf(sizing.plannedDays, "day") : void 0;
  const verdict = weakest === void 0 || planned === void 0 ? "Without a planned window it cannot be said whether the test runs long enough." : enough ? `The planned ${planned} still suffice: every metric reaches at least ${formatPower(weakest)} power by the end.` : `The planned ${planned} do not suffice: the weakest metric reaches ${formatPower(weakest)} power by the end, below the planned ${formatPower(plannedPower)}.`;
  return { needs: formatWeeks(asLogged.duration, describeSetter(asLogged)), couldNeed: formatWeeks(triggered.duration), verdict, enough };
}
var RETURNING = /\b(returning|repeat|regulars?|existing|loyal|weekly|monthly|past orders?|subscribers?|members?|logged[- ]in)\b/i;
function populationReturns(plan) {
  return RETURNING.test(`${plan.population.segment ?? ""} ${plan.hypothesis.change}`);
}
function practiceFindings(plan, sizing, settings) {
  const out = [];
  for (const entry of sizing.metrics) {
    if (!entry.result.ok) continue;
    const f = entry.result.value.feasibility;
    if (f && !f.feasible) {
      out.push({
        code: "not-feasible",
        message: `${entry.role === "primary" ? "The primary metric" : `Guardrail ${entry.metric}`} is not feasible at this traffic: ${f.reason}.`,
        fix: "Plan for a larger effect, pick a more sensitive metric, or ship as a guarded rollout without a test; the sizing shows what the longest window can detect."
      });
    }
  }
  if (populationReturns(plan) && plan.design.dailyUnits !== void 0 && !plan.design.uniqueUnits) {
    out.push({
      code: "returning-units",
      message: "The population comes back (returning or regular users), but traffic is given only as design.daily-units, which sizing reads as new units each day.",
      fix: "Give design.unique-units: the different units seen in the first 7 days and over the planned window, e.g. [{ days: 7, units: 40000 }, { days: 28, units: 60000 }]."
    });
  }
  const primary = sizing.metrics[0]?.result;
  const groups = primary?.ok ? primary.value.headline?.clusters : void 0;
  if (groups !== void 0 && plan.design.groupsAvailable !== void 0 && groups > plan.design.groupsAvailable) {
    out.push({
      code: "groups-short",
      message: `The design needs ${countOf(groups, "group")}, but only ${formatCount(plan.design.groupsAvailable)} exist.`,
      fix: "Plan for a larger effect, reduce the intra-cluster correlation with a pre-period adjustment, or randomize a smaller unit if spillover allows."
    });
  }
  const metrics = [plan.metrics.primary, ...plan.metrics.guardrails];
  for (const metric of metrics) {
    if (metric.kind !== "ratio" || !metric.denominatorMayMove) continue;
    const secondaryEvents = new Set(plan.metrics.secondary.flatMap((m) => m.events));
    const covered = plan.metrics.secondary.filter((m) => m.events.every((e) => metric.events.includes(e))).length >= 2 && metric.events.every((e) => secondaryEvents.has(e));
    if (!covered) {
      out.push({
        code: "ratio-denominator",
        message: `${metric.name} is a ratio whose denominator the change may move: a ratio can rise because its denominator falls.`,
        fix: `List the numerator and the denominator of ${metric.name} as secondary metrics (each from its events), so the readout shows which moved.`
      });
    }
  }
  const { start, end } = plan.window;
  if (start && end) {
    for (const period of settings.sizing.atypicalPeriods) {
      if (period.start <= end && period.end >= start) {
        out.push({
          code: "atypical-period",
          message: `The planned window overlaps ${period.name} (${period.start} to ${period.end}), when behaviour is unusual.`,
          fix: "Move or extend the window so that typical weeks dominate, or say in the plan why the period is the one to test."
        });
      }
    }
    if (populationReturns(plan) && end >= start && inclusiveDays(start, end) < 14) {
      out.push({
        code: "novelty-window",
        message: `The change is aimed at returning users and the window is ${countOf(inclusiveDays(start, end), "day")}: early reactions to something new fade.`,
        fix: "Plan at least two weeks so that the novelty effect can wear off, and compare the first week with the second at the readout."
      });
    }
  }
  return out;
}

// src/core/checks/outcome.ts
var outcomeRecorded = (context) => context.linked.flatMap(({ loaded, readout, ending }) => {
  const outcome = loaded.plan.outcome;
  const where = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
  const kept = ending && "arm" in ending.kept ? ending.kept : void 0;
  if (!outcome?.class && !(kept && readout?.readout)) return [];
  if (!readout) {
    return [{ code: "outcome-mismatch", message: `${loaded.plan.id} records the outcome "${outcome.class}" without the totals file it was read from.`, fix: "Add outcome.totals (the arm-totals file) so the review can apply the rule to it, or run plumbline readout --record.", ...where }];
  }
  if (!readout.readout) {
    return outcome?.class ? [{ code: "outcome-mismatch", message: `${loaded.plan.id}: the recorded outcome cannot be checked: ${readout.problem}.`, fix: "Fix the totals file, then record again with plumbline readout --record.", ...where }] : [];
  }
  const read = readout.readout;
  const computed = read.verdict;
  const ships = armsToShip(read);
  const shipped = [.../* @__PURE__ */ new Set([...outcome?.override?.ship ?? [], ...kept ? [kept.arm] : []])];
  const strayArms = shipped.filter((a) => !ships.includes(a));
  const classDiffers = outcome?.class !== void 0 && computed !== outcome.class;
  const departs = classDiffers || strayArms.length > 0;
  if (!departs && !outcome?.override) return [];
  const keptStray = kept && strayArms.includes(kept.arm);
  const what = classDiffers ? `records "${outcome.class}" but the registered rule gives "${computed}" on ${readout.file}` : keptStray ? `: this change removes ${ending.flags.map((k) => `\`${k}\``).join(", ")} and keeps ${kept.arm}, but the registered rule gives "${computed}" on ${readout.file}, which ${ships.length ? `ships ${ships.join(", ")}` : "names no arm to ship"}` : `ships ${strayArms.join(", ")}, which the rule does not name`;
  const said = what.startsWith(":") ? what : ` ${what}`;
  if (outcome?.override) {
    return [{ code: "outcome-override", message: `${loaded.plan.id} departs from its registered rule${departs ? said.startsWith(":") ? said : `:${said}` : ": an override is recorded"}. Reason given: \xAB${outcome.override.reason}\xBB`, fix: "Judge the reason: an override is the one decision in this change the rule did not make.", ...where }];
  }
  const fix = keptStray ? `Keep the arm the rule ships (${ships.join(", ") || "none: read the test again"}), or record outcome.override with ship: [${kept.arm}] and a reason.` : "Record what the rule gives (plumbline readout --record), or add outcome.override with a reason.";
  return [{ code: "outcome-mismatch", message: `${loaded.plan.id}${said}.`, fix, ...where }];
});

// src/core/checks/readout-links.ts
var endedWithoutReadout = (context) => context.linked.flatMap(({ loaded, ending, readout }) => {
  const { plan } = loaded;
  if (!ending || readout || plan.outcome) return [];
  const over = plan.state === "concluded" || plan.window.end !== void 0 && plan.window.end < context.today;
  if (!over) return [];
  const flags = ending.flags.map((k) => `\`${k}\``).join(", ");
  return [
    {
      code: "readout-missing",
      message: `This change removes the last read of ${flags}, ending ${plan.id}, without a readout: no arm totals for it were found (a readouts/ folder or a *.totals.yaml file) and its plan records no outcome.`,
      fix: `Add the test's arm totals (see docs/totals-reference.md) and run plumbline readout ${plan.id} --totals <file> --record, or record outcome: { date, reason } in ${loaded.file} when the test ended without data.`,
      plan: plan.id,
      file: loaded.file,
      line: loaded.line
    }
  ];
});
var ruleAtLaunch = (context) => context.linked.flatMap(({ loaded, readout }) => {
  const rule = readout?.readout?.rule;
  if (!rule || !readout) return [];
  const where = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
  if (rule.status === "changed") {
    return [
      {
        code: "rule-changed",
        message: `The rule was changed after launch: ${loaded.plan.id} at the plan-commit of ${readout.file} (${rule.commit}) differs from today's plan in ${rule.changes.map((c) => `${c.field} (${c.before} \u2192 ${c.after})`).join("; ")}, and no amendment records it. The readout applies the rule as registered at launch.`,
        fix: "Put the plan back as registered, or, if the change was decided before the data was seen, append an entry under amendments: with date, changed and reason.",
        ...where
      }
    ];
  }
  if (rule.status === "unavailable") {
    return [
      {
        code: "launch-plan-unavailable",
        message: `${readout.file} names plan-commit ${rule.commit}, but the plan as registered then cannot be read: ${rule.why}. The readout uses today's plan and cannot show that it is the rule registered at launch.`,
        fix: "Write the commit of the plan when the test launched as plan-commit (git log --format=%h -1 -- the plan file, at launch); in CI, check out with fetch-depth: 0.",
        ...where
      }
    ];
  }
  return [];
});

// src/core/checks/treatment-change.ts
var import_picomatch2 = __toESM(require_picomatch(), 1);

// src/core/scan/flag-files.ts
var import_yaml2 = __toESM(require_dist(), 1);
var DEFAULT_FLAG_FILES = ["**/flags.json", "**/*.flags.json", "**/*.flagd.json", "**/flags.yaml", "**/flags.yml", "**/*.flags.yaml", "**/*.flags.yml"];
function flagDefinitions(text) {
  if (text === void 0) return /* @__PURE__ */ new Map();
  let value;
  try {
    value = (0, import_yaml2.parse)(text, { maxAliasCount: 100, logLevel: "silent" });
  } catch {
    return void 0;
  }
  if (value === null || typeof value !== "object" || Array.isArray(value)) return void 0;
  const record = value;
  const flags = record.flags !== null && typeof record.flags === "object" && !Array.isArray(record.flags) ? record.flags : record;
  return new Map(Object.entries(flags).map(([key, definition]) => [key, JSON.stringify(definition)]));
}
function isPlainKeyLine(line, key) {
  const rest = line.trimStart();
  return rest.startsWith(key) && rest.slice(key.length).trimStart().startsWith(":");
}
function flagDefinitionTouches(path, before, after) {
  const old = flagDefinitions(before) ?? /* @__PURE__ */ new Map();
  const now = flagDefinitions(after) ?? /* @__PURE__ */ new Map();
  const lineOf = (text, key) => {
    if (!text) return 1;
    const index = text.split("\n").findIndex((l) => l.includes(`"${key}"`) || l.includes(`'${key}'`) || isPlainKeyLine(l, key));
    return index < 0 ? 1 : index + 1;
  };
  const touches = [];
  for (const [key, definition] of now) {
    if (old.get(key) !== definition) touches.push({ key, file: path, line: lineOf(after, key), side: "added", via: "definition" });
  }
  for (const key of old.keys()) {
    if (!now.has(key)) touches.push({ key, file: path, line: lineOf(before, key), side: "removed", via: "definition" });
  }
  return touches;
}

// src/core/checks/treatment-change.ts
function treatmentLines(text, path, read, spread) {
  const blocks = blocksOf(text, path);
  const holder = enclosingFunction(blocks, read.start) ?? enclosing(blocks, read.start).at(-1);
  if (!holder) return { from: read.line - spread, to: read.endLine + spread };
  const lineOf = lineIndex(text);
  return { from: lineOf(holder.headerStart), to: lineOf(holder.close) };
}
function codeLines(text, path, lines) {
  const comments = commentsOfText(text, path);
  const all = text.split("\n");
  const starts = lineStarts(text);
  return new Set(
    lines.filter((n) => {
      const line = all[n - 1] ?? "";
      const first = line.search(/\S/);
      return first !== -1 && !insideRanges(comments, starts[n - 1] + first);
    })
  );
}
function changeNearRead(text, path, lines, keys, patterns, spread) {
  if (text === void 0 || lines.length === 0) return void 0;
  const reads = flagReadsOf(text, path, patterns, keys);
  if (reads.length === 0) return void 0;
  const changed = codeLines(text, path, lines);
  for (const read of reads) {
    const { from, to } = treatmentLines(text, path, read, spread);
    const hit = [...changed].sort((a, b) => a - b).find((n) => n >= from && n <= to && (n < read.line || n > read.endLine));
    if (hit !== void 0) return hit;
  }
  return void 0;
}
function codeChange(entry, file, patterns, spread) {
  const keys = new Set(entry.flags);
  const atHead = changeNearRead(file.head, file.path, file.added, keys, patterns, spread);
  const atBase = atHead === void 0 ? changeNearRead(file.base, file.basePath, file.removed, keys, patterns, spread) : void 0;
  if (atHead === void 0 && atBase === void 0) return void 0;
  return {
    code: "treatment-changed",
    message: `This change edits the code around the read of ${entry.flags.map((k) => `\`${k}\``).join(", ")} (${atHead !== void 0 ? `line ${atHead}` : `line ${atBase} at the base commit`}), which the started test ${entry.id} (${ownersOf(entry)}) randomizes: people assigned before and after the change have had different treatments.`,
    fix: `Ask ${ownersOf(entry)}: restart ${entry.id}, or record the change date under amendments: in its plan so the analysis can be split there.`,
    plan: entry.id,
    file: atHead !== void 0 ? file.path : file.basePath,
    line: atHead ?? atBase,
    ...atHead === void 0 ? { side: "base" } : {}
  };
}
var treatmentChanged = (context) => {
  const patterns = flagPatternsOf(context.settings);
  const isFlagFile = (0, import_picomatch2.default)(DEFAULT_FLAG_FILES, { dot: true });
  const started = /* @__PURE__ */ new Map();
  const ended = new Set(context.registry.entries.filter(hasOutcome).map((e) => e.id));
  for (const e of context.baseEntries) if (hasStarted(e, context.today) && !ended.has(e.id)) started.set(e.id, e);
  const findings = [];
  for (const entry of started.values()) {
    for (const file of context.changedCode) {
      if (isFlagFile(file.path) || evidenceKindOf(file.path) !== "code") continue;
      const found = codeChange(entry, file, patterns, context.settings.treatmentLines);
      if (found) {
        findings.push(found);
        break;
      }
    }
    const ramp = context.touches.find((t) => t.via === "definition" && entry.flags.includes(t.key));
    if (ramp) {
      findings.push({
        code: "treatment-changed",
        message: `This change edits the definition of \`${ramp.key}\` in ${ramp.file} (arms, weights, rollout or targeting), which the started test ${entry.id} (${ownersOf(entry)}) randomizes; pooling data from before and after a ramp biases the result.`,
        fix: `Ask ${ownersOf(entry)}: keep the allocation until the planned end, or restart ${entry.id} (or record the change date under amendments: and analyse the periods apart).`,
        plan: entry.id,
        file: ramp.file,
        line: ramp.line,
        ...ramp.side === "removed" ? { side: "base" } : {}
      });
    }
  }
  return findings;
};

// src/core/checks/unit.ts
var spillover = ({ linked, settings }) => linked.flatMap(({ loaded }) => {
  const { plan } = loaded;
  const shared = settings.groupSurfaces.find((s) => isSameOrBelow(plan.surface.path, s));
  if (!shared || GROUP_UNITS.includes(plan.unit.randomization)) return [];
  return [
    {
      code: "spillover",
      message: `${plan.surface.path} is shared between people (group-surfaces: ${shared}), but the plan randomizes by ${plan.unit.randomization}: treated and control people interact, so the difference between arms is biased.`,
      fix: `Randomize the group they share (unit.randomization: team, organization or household) and size with design.cluster.`,
      ...atPlanKey(loaded, ["unit", "randomization"])
    }
  ];
});
var analysisUnitDiffers = ({ linked }) => linked.filter(({ loaded }) => loaded.plan.unit.analysis !== loaded.plan.unit.randomization).map(({ loaded }) => ({
  code: "analysis-unit-differs",
  message: `Units are randomized by ${loaded.plan.unit.randomization} but metrics are averaged per ${loaded.plan.unit.analysis}: observations within one ${loaded.plan.unit.randomization} are not independent.`,
  fix: "Compute the variance with the delta method or cluster-robust standard errors, not the naive per-unit formula.",
  ...atPlanKey(loaded, ["unit", "analysis"])
}));

// src/core/checks/index.ts
var CHECKS = [
  planInvalid,
  fileWarnings,
  outcomeRecorded,
  ruleAtLaunch,
  frozenPlans,
  decisionsMissing,
  reviewMissing,
  eventRemoved,
  endedEarly,
  endedWithoutReadout,
  treatmentChanged,
  flagWithoutPlan,
  reasonMissing,
  guardrailsMissing,
  windowChecks,
  bundleUnexplained,
  populationChecks,
  sizingChecks,
  effectImplausible,
  spillover,
  analysisUnitDiffers,
  collisionCheck,
  eventMissing,
  exposureOneArm,
  bugFixUnmeasured
];
var CHANGE_CHECKS = /* @__PURE__ */ new Set([planInvalid, frozenPlans, eventRemoved, endedEarly, treatmentChanged, flagWithoutPlan, exposureOneArm, bugFixUnmeasured]);
var PLAN_CHECKS = CHECKS.filter((check) => !CHANGE_CHECKS.has(check));

// src/core/review/finding.ts
var FINDING_CODES = {
  "flag-without-plan": { severity: "warn", about: "a changed feature flag has no plan (and is not exempt)" },
  "plan-invalid": { severity: "block", about: "a plan the change touches cannot be loaded" },
  "file-warning": { severity: "warn", about: "a plan the change is about, or a plan or registry file it edits, loads with a warning (a renamed key, a default taken), as validate reports it" },
  "decisions-missing": { severity: "block", about: "a decision rule (win, flat, loss, guardrail breach) is not written" },
  "reason-missing": { severity: "warn", about: "the hypothesis does not say why the change should work" },
  "guardrails-missing": { severity: "warn", about: "no guardrail metric" },
  "end-missing": { severity: "warn", about: "no planned end date" },
  "window-short": { severity: "warn", about: "the planned window is shorter than 7 days" },
  "window-partial-week": { severity: "note", about: "the planned window is not a whole number of weeks" },
  "review-missing": { severity: "block", about: "a sensitive area has no named review" },
  "bundle-unexplained": { severity: "warn", about: "several flags in one plan without a rationale" },
  "population-undeclared": { severity: "warn", about: "platforms or locales are not declared" },
  "readiness-missing": { severity: "warn", about: "the change is not declared ready on a platform or locale of its population" },
  underpowered: { severity: "warn", about: "the planned window gives less than the planned power" },
  "sizing-incomplete": { severity: "note", about: "the plan lacks the figures sizing needs" },
  "sizing-impossible": { severity: "warn", about: "the plan\u2019s figures cannot be sized" },
  "exposure-diluted": { severity: "note", about: "exposure is logged before the change is reached; says whether the planned window still suffices (when it does not, underpowered warns)" },
  "not-feasible": { severity: "warn", about: "the test needs more than the longest sensible window at this traffic" },
  "returning-units": { severity: "note", about: "the population returns, but traffic is given only as units a day" },
  "groups-short": { severity: "warn", about: "the design needs more groups than exist" },
  "ratio-denominator": { severity: "note", about: "a ratio metric whose denominator may move lacks its parts as secondary metrics" },
  "atypical-period": { severity: "note", about: "the planned window overlaps a holiday, sale or other atypical period" },
  "novelty-window": { severity: "note", about: "a change for returning users planned for less than two weeks" },
  spillover: { severity: "warn", about: "people randomized one by one on a surface they share" },
  "analysis-unit-differs": { severity: "note", about: "metrics are averaged over another unit than the one randomized" },
  collision: { severity: "warn", about: "the test overlaps a running test on the same surface; says what isolating them would cost" },
  "known-overlap": { severity: "note", about: "the test overlaps a running test it declares" },
  "event-missing": { severity: "warn", about: "an event the plan names is not logged in the code" },
  "event-removed": { severity: "block", about: "the change removes an event a running test depends on" },
  "severity-unknown-code": { severity: "warn", about: "the settings name a finding code that does not exist" },
  "outcome-mismatch": { severity: "block", about: "a recorded outcome differs from what the registered rule gives on its totals, or the change ships (keeps, removing the flag) an arm the rule does not name, without an override" },
  "outcome-override": { severity: "warn", about: "a recorded outcome departs from the registered rule with an override and a reason to judge" },
  "readout-missing": { severity: "warn", about: "the change removes the last read of a concluded or overdue test\u2019s flag, and the test has neither arm totals nor a recorded outcome" },
  "rule-changed": { severity: "block", about: "a readout\u2019s plan differs from the plan at its plan-commit in what decides the outcome, without an amendment; the launch rule is applied" },
  "launch-plan-unavailable": { severity: "warn", about: "the plan at a readout\u2019s plan-commit cannot be read (commit not in the repository, no history), so the readout uses today\u2019s plan" },
  "effect-implausible": { severity: "warn", about: "once five or more tests recorded outcomes on the primary metric: the planned minimum detectable effect is above nine in ten of the effects measured on it before" },
  "plan-frozen": { severity: "block", about: "a started test\u2019s plan changes what decides its result without an amendment" },
  "plan-amended": { severity: "note", about: "a started test\u2019s plan changes what decides its result and records why (shown before and after)" },
  "plan-deleted": { severity: "block", about: "the change deletes the plan of a started test that has no outcome" },
  "base-unread": { severity: "warn", about: "the base commit could not be read (the Action\u2019s files-API mode), so the started tests\u2019 plans the change edits or deletes were not compared with it" },
  "plan-end-moved": { severity: "warn", about: "a started test\u2019s planned end moves later, or earlier without interim looks" },
  "test-ended-early": { severity: "block", about: "the change removes the last read of a started test\u2019s flag before its planned end, with no outcome recorded" },
  "outcome-missing": { severity: "note", about: "the change removes the flag of a test past its planned end whose outcome is not recorded" },
  "exposure-one-arm": { severity: "warn", about: "the exposure event is logged inside a branch on the flag or after an early return on it, so not in every arm" },
  "treatment-changed": { severity: "warn", about: "code around a started test\u2019s flag read, or its flag definition, changes mid-test" },
  "refs-swapped": { severity: "warn", about: "head is an ancestor of base and differs from it: the refs look swapped (or the change is already in the base), so the change from base to head is empty" },
  "bug-fix-unmeasured": { severity: "note", about: "a bug fix changes product code without a flag or a check test" }
};
var CHANGE_BOUND = /* @__PURE__ */ new Set([
  "plan-frozen",
  "plan-amended",
  "plan-deleted",
  "plan-end-moved",
  "test-ended-early",
  "outcome-missing",
  "readout-missing",
  "treatment-changed",
  "exposure-one-arm",
  "event-removed"
]);
var ALWAYS_BLOCKS = /* @__PURE__ */ new Set(["decisions-missing"]);

// src/core/review/build-review.ts
var CHECKLIST = [
  { label: "Decision rules written for a win, a flat result, a loss and a guardrail breach", codes: ["decisions-missing"] },
  { label: "Hypothesis says why the change should work", codes: ["reason-missing"] },
  { label: "One primary metric and at least one guardrail", codes: ["guardrails-missing"] },
  { label: "Planned end, at least a week, in whole weeks", codes: ["end-missing", "window-short", "window-partial-week"] },
  { label: "Enough power by the planned end", codes: ["underpowered", "sizing-incomplete", "sizing-impossible", "not-feasible", "groups-short", "effect-implausible"] },
  { label: "Exposure logged in every arm where the change is seen (the logging call read against the flag read, not only the plan\u2019s reach)", codes: ["exposure-diluted", "exposure-one-arm"] },
  { label: "Randomization unit fits the surface", codes: ["spillover"] },
  { label: "No collision with a running test", codes: ["collision"] },
  { label: "Every event the plan names is logged in the code", codes: ["event-missing"] },
  { label: "Population and readiness declared (platforms, locales)", codes: ["population-undeclared", "readiness-missing"] },
  { label: "Sensitive areas have their named review", codes: ["review-missing"], when: (p) => p.loaded.plan.sensitive.length > 0 },
  { label: "Bundled flags are explained", codes: ["bundle-unexplained"], when: (p) => p.loaded.plan.flags.length > 1 }
];
function severityFor(code, overrides) {
  const fallback = FINDING_CODES[code]?.severity ?? "warn";
  if (ALWAYS_BLOCKS.has(code)) return "block";
  const chosen = overrides[code];
  return chosen === "block" || chosen === "warn" || chosen === "note" || chosen === "off" ? chosen : fallback;
}
var ORDER = { block: 0, warn: 1, note: 2 };
function findingKey(f) {
  return [f.code, f.plan ?? "", f.message.replace(/\d+(?:[.,]\d+)*/g, "#")].join("\0");
}
function knownAtBase(base) {
  if (!base) return /* @__PURE__ */ new Set();
  return new Set(
    PLAN_CHECKS.flatMap((check) => check(base)).filter((f) => f.plan !== void 0 && !CHANGE_BOUND.has(f.code)).map(findingKey)
  );
}
function planReadout(linked) {
  const outcome = linked.loaded.plan.outcome;
  const read = linked.readout?.readout;
  const override = outcome?.override ? { override: outcome.override } : {};
  if (!read || !linked.readout) return override;
  const ending = linked.ending;
  return {
    readout: {
      file: linked.readout.file,
      source: linked.readout.source,
      verdict: read.verdict,
      arms: read.verdictArms,
      ships: armsToShip(read),
      ...read.decision ? { decision: read.decision.text } : {},
      ...outcome?.class ? { recorded: outcome.class } : {},
      ...read.verdict !== "not-read" ? { primary: read.primary } : {},
      ...ending ? { removes: { flags: ending.flags, ..."arm" in ending.kept ? { kept: ending.kept.arm } : { unknown: ending.kept.unknown } } } : {},
      ...read.rule ? { rule: read.rule } : {}
    },
    ...override
  };
}
function countFindings(findings) {
  const counts = { block: 0, warn: 0, note: 0, known: 0 };
  for (const f of findings) {
    if (f.origin === "known") counts.known++;
    else counts[f.severity]++;
  }
  return counts;
}
function refsSwapped(named) {
  return {
    code: "refs-swapped",
    message: `${named.head} is an ancestor of ${named.base}: the refs look swapped; the change from base to head is empty, so nothing was reviewed.`,
    fix: "Name the commit the change starts from as base and the commit with the change as head; if the change is already merged into the base, there is nothing left to review."
  };
}
function byMention(a, b) {
  const named = (p) => p.reasons.includes("named in the description") ? 0 : 1;
  return named(a) - named(b);
}
function buildReview(context, change, base) {
  const raw = CHECKS.flatMap((check) => check(context));
  if (change.swapped) raw.push(refsSwapped(change.swapped));
  const codes = Object.keys(FINDING_CODES);
  for (const code of Object.keys(context.settings.severity)) {
    if (codes.includes(code)) continue;
    const suggestion = closestName(code, codes);
    raw.push({
      code: "severity-unknown-code",
      message: `The settings set a severity for "${code}", which is not a finding code${suggestion ? `; did you mean "${suggestion}"?` : "."}`,
      fix: `Use one of: ${codes.join(", ")}.`
    });
  }
  const known = knownAtBase(base);
  const findings = [];
  for (const finding2 of raw) {
    const severity = severityFor(finding2.code, context.settings.severity);
    const origin = finding2.plan !== void 0 && known.has(findingKey(finding2)) ? "known" : "introduced";
    const side = finding2.file !== void 0 ? { side: finding2.side ?? "head" } : {};
    if (severity !== "off") findings.push({ ...finding2, ...side, severity, origin });
  }
  const originOrder = (f) => f.origin === "introduced" ? 0 : 1;
  findings.sort((a, b) => ORDER[a.severity] - ORDER[b.severity] || originOrder(a) - originOrder(b));
  const counts = countFindings(findings);
  const codesByPlan = /* @__PURE__ */ new Map();
  for (const f of findings) {
    if (f.plan === void 0) continue;
    const codes2 = codesByPlan.get(f.plan) ?? /* @__PURE__ */ new Set();
    codes2.add(f.code);
    codesByPlan.set(f.plan, codes2);
  }
  const plans = context.linked.map((linked) => {
    const { plan } = linked.loaded;
    const mine = codesByPlan.get(plan.id) ?? /* @__PURE__ */ new Set();
    return {
      id: plan.id,
      title: plan.title,
      file: linked.loaded.file,
      line: linked.loaded.line,
      state: plan.state,
      owners: plan.owners,
      reasons: linked.reasons,
      checklist: CHECKLIST.filter((item) => !item.when || item.when(linked)).map((item) => ({ label: item.label, done: !item.codes.some((c) => mine.has(c)) })),
      sizing: linked.sizing,
      power: plan.design.power,
      window: plan.window,
      events: eventStatuses(context, plan.id),
      ...planReadout(linked)
    };
  });
  plans.sort(byMention);
  const planned = /* @__PURE__ */ new Map();
  for (const e of context.registry.entries) for (const f of e.flags) planned.set(f, [...planned.get(f) ?? [], e.id]);
  const exempt = new Set(context.settings.exemptFlags);
  const flags = context.touches.map((t) => ({ ...t, plans: planned.get(t.key) ?? [], exempt: exempt.has(t.key) }));
  const collisions = collisionsOfLinked(context).map(({ plan, collision: c }) => ({
    plan,
    other: c.other.id,
    owners: c.other.owners,
    otherSurface: c.other.surface.path,
    ...c.overlapDays !== void 0 ? { overlapDays: c.overlapDays } : {},
    ...c.overlapWindow ? { overlapWindow: c.overlapWindow } : {},
    platforms: c.platforms,
    locales: c.locales,
    trafficShare: c.trafficShare,
    known: c.known
  }));
  const nothing = context.touches.length === 0 && context.linked.length === 0 && context.invalidPlanFiles.length === 0 && findings.length === 0;
  const verdict = nothing ? "nothing-to-check" : findings.some((f) => f.severity === "block") ? "blocked" : findings.some((f) => f.severity === "warn") ? "warnings" : "clear";
  const nudge = findings.some((f) => f.code === "bug-fix-unmeasured") ? bugFixNudge(context) : void 0;
  return { verdict, counts, base: change.base, head: change.head, findings, plans, flags, collisions, ...nudge ? { nudge } : {} };
}

// src/core/review/link-plans.ts
function linkPlans(options) {
  const links = /* @__PURE__ */ new Map();
  const add = (id, reason) => {
    const reasons = links.get(id) ?? [];
    if (!reasons.includes(reason)) reasons.push(reason);
    links.set(id, reasons);
  };
  const body = options.pr.body ?? "";
  const touched = new Set(options.touches.map((t) => t.key));
  for (const { plan, file } of options.plans) {
    if (body.includes(file) || mentionsWord(body, plan.id)) add(plan.id, "named in the description");
    if (options.changedPaths.has(file)) add(plan.id, "plan file changed");
    if (plan.flags.some((f) => touched.has(f))) add(plan.id, "flag touched");
    if (options.readouts?.has(plan.id)) add(plan.id, "readout changed");
  }
  return links;
}
var WORD_CHAR = /[A-Za-z0-9_]/;
function mentionsWord(text, word) {
  if (word === "") return false;
  for (let at = text.indexOf(word); at >= 0; at = text.indexOf(word, at + 1)) {
    const before = text.charAt(at - 1);
    const after = text.charAt(at + word.length);
    const startsWord = before === "" || !(WORD_CHAR.test(before) || before === "/" || before === "-");
    const endsWord = after === "" || !(WORD_CHAR.test(after) || after === "-");
    if (startsWord && endsWord) return true;
  }
  return false;
}

// src/core/scan/diff.ts
var HUNK = /^@@ -(\d+)(?:,\d+)? \+(\d+)(?:,\d+)? @@/;
function unquote(path) {
  if (!path.startsWith('"')) return path;
  const bytes = [];
  const body = path.slice(1, -1);
  for (let i = 0; i < body.length; i++) {
    const c = body[i];
    if (c !== "\\") {
      bytes.push(...Buffer.from(c, "utf8"));
      continue;
    }
    const next = body[++i];
    if (/[0-7]/.test(next)) {
      bytes.push(parseInt(body.slice(i, i + 3), 8));
      i += 2;
    } else bytes.push({ n: 10, t: 9, '"': 34, "\\": 92 }[next] ?? next.charCodeAt(0));
  }
  return Buffer.from(bytes).toString("utf8");
}
function stripPrefix(path, prefix) {
  const plain = unquote(path);
  return plain.startsWith(prefix) ? plain.slice(prefix.length) : plain;
}
function parseUnifiedDiff(text) {
  const files = [];
  let current;
  let oldLine = 0;
  let newLine = 0;
  for (const raw of text.split("\n")) {
    if (raw.startsWith("diff --git ")) {
      current = { path: "", added: [], removed: [], binary: false };
      files.push(current);
      continue;
    }
    if (!current) continue;
    if (raw.startsWith("--- ")) {
      const from = raw.slice(4);
      if (from !== "/dev/null") current.previousPath = stripPrefix(from, "a/");
      continue;
    }
    if (raw.startsWith("+++ ")) {
      const to = raw.slice(4);
      current.path = to === "/dev/null" ? current.previousPath ?? "" : stripPrefix(to, "b/");
      if (current.previousPath === current.path) delete current.previousPath;
      continue;
    }
    if (raw.startsWith("rename from ")) {
      current.previousPath = unquote(raw.slice("rename from ".length));
      continue;
    }
    if (raw.startsWith("rename to ")) {
      current.path = unquote(raw.slice("rename to ".length));
      continue;
    }
    if (raw.startsWith("Binary files ")) {
      current.binary = true;
      const match = / and (?:b\/)?(.+) differ$/.exec(raw);
      if (match && !current.path) current.path = match[1] === "/dev/null" ? "" : match[1];
      continue;
    }
    const hunk = HUNK.exec(raw);
    if (hunk) {
      oldLine = Number(hunk[1]);
      newLine = Number(hunk[2]);
      continue;
    }
    if (raw.startsWith("+")) current.added.push({ line: newLine++, text: raw.slice(1) });
    else if (raw.startsWith("-")) current.removed.push({ line: oldLine++, text: raw.slice(1) });
    else if (raw.startsWith(" ")) {
      oldLine++;
      newLine++;
    }
  }
  return files.filter((f) => f.path !== "");
}

// src/core/scan/aho-corasick.ts
var WIDE_TABLE_BYTES = 4 * 1024 * 1024;
function buildAutomaton(names) {
  const encoded = names.map((n) => new TextEncoder().encode(n));
  const classOf = new Uint8Array(256);
  let classes = 1;
  for (const bytes of encoded) for (const b of bytes) if (classOf[b] === 0) classOf[b] = classes++;
  if (classes > 255) throw new Error("too many distinct bytes in names");
  let capacity = 1 + encoded.reduce((s, b) => s + b.length, 0);
  let next = new Int32Array(capacity * classes).fill(-1);
  const output = new Int32Array(capacity).fill(-1);
  let states = 1;
  const duplicates = [];
  encoded.forEach((bytes, index) => {
    let s = 0;
    for (const b of bytes) {
      const slot = s * classes + classOf[b];
      if (next[slot] === -1) next[slot] = states++;
      s = next[slot];
    }
    if (output[s] === -1) output[s] = index;
    else duplicates.push([output[s], index]);
  });
  capacity = states;
  next = next.slice(0, capacity * classes);
  const fail = new Int32Array(capacity);
  const dictionary = new Int32Array(capacity).fill(-1);
  const queue = new Int32Array(capacity);
  let head = 0;
  let tail = 0;
  for (let c = 0; c < classes; c++) {
    const child = next[c];
    if (child === -1) next[c] = 0;
    else {
      fail[child] = 0;
      queue[tail++] = child;
    }
  }
  while (head < tail) {
    const s = queue[head++];
    const f = fail[s];
    dictionary[s] = output[f] !== -1 ? f : dictionary[f];
    for (let c = 0; c < classes; c++) {
      const slot = s * classes + c;
      const child = next[slot];
      if (child === -1) next[slot] = next[f * classes + c];
      else {
        fail[child] = next[f * classes + c];
        queue[tail++] = child;
      }
    }
  }
  const wide = capacity * 256 * 4 <= WIDE_TABLE_BYTES;
  const width = wide ? 256 : classes;
  const delta = new Int32Array(capacity * width);
  for (let s = 0; s < capacity; s++) {
    for (let column = 0; column < width; column++) delta[s * width + column] = next[s * classes + (wide ? classOf[column] : column)] * width;
  }
  const reports = new Uint8Array(capacity * width);
  for (let s = 0; s < capacity; s++) reports[s * width] = output[s] !== -1 || dictionary[s] !== -1 ? 1 : 0;
  const lengths = Int32Array.from(encoded, (b) => b.length);
  const twins = /* @__PURE__ */ new Map();
  for (const [first, other] of duplicates) twins.set(first, [...twins.get(first) ?? [], other]);
  const report = (row, end, onMatch) => {
    const s = row / width;
    for (let t = output[s] !== -1 ? s : dictionary[s]; t !== -1; t = dictionary[t]) {
      const name = output[t];
      onMatch(name, end);
      const same = twins.get(name);
      if (same) for (const other of same) onMatch(other, end);
    }
  };
  const found = new Int32Array(2 * 4096);
  return {
    names,
    lengths,
    search(bytes, onMatch) {
      let row = 0;
      let from = 0;
      for (; ; ) {
        const count = wide ? scanWide(delta, reports, bytes, from, row, found) : scanNarrow(delta, classOf, reports, bytes, from, row, found);
        for (let k = 0; k < count; k += 2) report(found[k], found[k + 1], onMatch);
        if (count < found.length) return;
        row = found[count - 2];
        from = found[count - 1] + 1;
      }
    }
  };
}
function scanWide(delta, reports, bytes, from, row, found) {
  let count = 0;
  const length = bytes.length;
  for (let i = from; i < length; i++) {
    row = delta[row + bytes[i]];
    if (reports[row] === 0) continue;
    found[count++] = row;
    found[count++] = i;
    if (count === found.length) return count;
  }
  return count;
}
function scanNarrow(delta, classOf, reports, bytes, from, row, found) {
  let count = 0;
  const length = bytes.length;
  for (let i = from; i < length; i++) {
    row = delta[row + classOf[bytes[i]]];
    if (reports[row] === 0) continue;
    found[count++] = row;
    found[count++] = i;
    if (count === found.length) return count;
  }
  return count;
}

// src/core/scan/name-scan.ts
var QUOTES = /* @__PURE__ */ new Set([34, 39, 96]);
function looksBinary(bytes) {
  return bytes.subarray(0, 8e3).indexOf(0) !== -1;
}
function createNameScanner(names, callPatterns = []) {
  const unique = [...new Set(names)].filter((n) => n.length > 0 && !n.includes("\n"));
  const automaton = buildAutomaton(unique);
  const hits = unique.map(() => ({}));
  let files = 0;
  let bytesSeen = 0;
  let skippedBinary = 0;
  return {
    scanFile(path, bytes) {
      if (looksBinary(bytes)) {
        skippedBinary++;
        return;
      }
      files++;
      bytesSeen += bytes.length;
      const product = evidenceKindOf(path) === "code";
      let comments;
      let countedTo = 0;
      let line = 1;
      let lineStart = 0;
      const locate = (start, end) => {
        for (let nl = bytes.indexOf(10, countedTo); nl !== -1 && nl < end; nl = bytes.indexOf(10, nl + 1)) {
          line++;
          lineStart = nl + 1;
        }
        countedTo = end;
        return { file: path, line, column: start - lineStart + 1 };
      };
      automaton.search(bytes, (name, end) => {
        const h = hits[name];
        if (h.first && h.firstQuoted && (h.firstCall || callPatterns.length === 0)) return;
        const start = end - automaton.lengths[name] + 1;
        const here = locate(start, end);
        h.first ??= here;
        const quote = bytes[start - 1];
        if (quote === void 0 || !QUOTES.has(quote) || bytes[end + 1] !== quote) return;
        if (!product) {
          h.firstMention ??= here;
          return;
        }
        comments ??= commentsOfBytes(bytes, path);
        if (insideRanges(comments, start)) {
          h.firstMention ??= here;
          return;
        }
        h.firstQuoted ??= here;
        if (!h.firstCall && callPatterns.length && isLoggedAt(bytes, lineStart, start - 1, unique[name], callPatterns)) h.firstCall = here;
      });
    },
    results() {
      return new Map(unique.map((n, i) => [n, hits[i]]));
    },
    stats() {
      return { files, bytes: bytesSeen, skippedBinary };
    }
  };
}
var CALL_LOOKBACK_LINES = 3;
function isLoggedAt(bytes, lineStart, quoteAt, name, patterns) {
  let from = lineStart;
  for (let n = 0; n < CALL_LOOKBACK_LINES && from > 0; n++) from = from >= 2 ? bytes.lastIndexOf(10, from - 2) + 1 : 0;
  let lineEnd = bytes.indexOf(10, quoteAt);
  if (lineEnd === -1) lineEnd = bytes.length;
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length);
  const window = buffer.toString("utf8", from, lineEnd);
  const quoteIndex = buffer.toString("utf8", from, quoteAt).length;
  for (const pattern of patterns) {
    pattern.lastIndex = 0;
    for (const match of window.matchAll(pattern)) {
      if (match.groups?.event !== name) continue;
      if (match.index + match[0].lastIndexOf(name) - 1 === quoteIndex) return true;
    }
  }
  return false;
}

// src/core/review/kept-arm.ts
var IDENT = /[A-Za-z_$][\w$]*/y;
function closing(text, open) {
  const pairs = { "(": ")", "[": "]", "{": "}" };
  const stack = [];
  for (let i = open; i < text.length; i++) {
    const c = text[i];
    if (c === '"' || c === "'" || c === "`") {
      i = endOfString(text, i);
      continue;
    }
    if (pairs[c]) stack.push(pairs[c]);
    else if (c === ")" || c === "]" || c === "}") {
      if (stack.pop() !== c) return -1;
      if (stack.length === 0) return i + 1;
    }
  }
  return -1;
}
function endOfString(text, at) {
  const quote = text[at];
  for (let i = at + 1; i < text.length; i++) {
    if (text[i] === "\\") i++;
    else if (text[i] === quote) return i;
    else if (text[i] === "\n" && quote !== "`") return i;
  }
  return text.length;
}
var skipSpace = (text, at) => {
  while (at < text.length && /\s/.test(text[at])) at++;
  return at;
};
var skipSpaceBack = (text, at) => {
  while (at > 0 && /\s/.test(text[at - 1])) at--;
  return at;
};
function operandEnd(text, at, stopAtColon) {
  let nestedTernaries = 0;
  for (let i = at; i < text.length; i++) {
    const c = text[i];
    if (c === '"' || c === "'" || c === "`") i = endOfString(text, i);
    else if (c === "(" || c === "[" || c === "{") {
      const end = closing(text, i);
      if (end < 0) return text.length;
      i = end - 1;
    } else if (c === ")" || c === "]" || c === "}" || c === ";" || c === ",") return i;
    else if (c === "?" && text[i + 1] !== "." && text[i + 1] !== "?" && text[i - 1] !== "?") nestedTernaries++;
    else if (c === ":" && stopAtColon) {
      if (nestedTernaries === 0) return i;
      nestedTernaries--;
    } else if (c === "\n" && !stopAtColon && /^\s*(?:\n|$)/.test(text.slice(i + 1, i + 2))) return i;
  }
  return text.length;
}
function statementEnd(text, at) {
  if (text[at] === "{") return closing(text, at);
  const end = operandEnd(text, at, false);
  return text[end] === ";" ? end + 1 : end;
}
function branchesAfter(text, start, end) {
  let negated = false;
  let from = skipSpaceBack(text, start);
  while (text[from - 1] === "!") {
    negated = !negated;
    from = skipSpaceBack(text, from - 1);
  }
  const after = skipSpace(text, end);
  if (text[after] === "?" && text[after + 1] !== "." && text[after + 1] !== "?") {
    const colon = operandEnd(text, after + 1, true);
    if (text[colon] !== ":") return void 0;
    const last = operandEnd(text, colon + 1, false);
    return { truthy: text.slice(after + 1, colon), falsy: text.slice(colon + 1, last), negated };
  }
  if (text[after] !== ")" || text[from - 1] !== "(") return void 0;
  const keyword = skipSpaceBack(text, from - 1);
  if (!/(?:^|[^\w$])if$/.test(text.slice(Math.max(0, keyword - 3), keyword))) return void 0;
  const bodyAt = skipSpace(text, after + 1);
  const bodyEnd = statementEnd(text, bodyAt);
  if (bodyEnd < 0) return void 0;
  const elseAt = skipSpace(text, bodyEnd);
  let falsy = "";
  if (text.startsWith("else", elseAt) && !/[\w$]/.test(text[elseAt + 4] ?? "")) {
    const elseBody = skipSpace(text, elseAt + 4);
    const elseEnd = statementEnd(text, elseBody);
    if (elseEnd < 0) return void 0;
    falsy = text.slice(elseBody, elseEnd);
  }
  return { truthy: text.slice(bodyAt, bodyEnd), falsy, negated };
}
function comparedArm(text, end) {
  const m = /^\s*(===|!==|==|!=)\s*(["'`])([^"'`\n]{1,100})\2/.exec(text.slice(end, end + 140));
  return m ? { end: end + m[0].length, literal: m[3], negated: m[1].startsWith("!") } : void 0;
}
function branchesOfRead(text, callStart, callEnd, plan) {
  const open = text.indexOf("(", callStart);
  const closed = open >= 0 && open < callEnd ? closing(text, open) : -1;
  if (closed < 0) return { unknown: "the flag read\u2019s call does not close" };
  let start = callStart;
  while (start > 0 && /[\w$.?]/.test(text[start - 1])) start--;
  const beforeAwait = skipSpaceBack(text, start);
  if (text.slice(beforeAwait - 5, beforeAwait) === "await") start = beforeAwait - 5;
  const arms = armsOf(plan);
  const toBranches = (b, whenTrue, whenFalse) => {
    const [truthyArm, falsyArm] = b.negated ? [whenFalse, whenTrue] : [whenTrue, whenFalse];
    return { truthy: b.truthy, falsy: b.falsy, ...truthyArm ? { truthyArm } : {}, ...falsyArm ? { falsyArm } : {} };
  };
  const onValue = (valueStart, valueEnd) => {
    const compared = comparedArm(text, valueEnd);
    if (compared) {
      const b2 = branchesAfter(text, valueStart, compared.end);
      if (!b2 || !plan.design.arms.some((a) => a.name === compared.literal)) return void 0;
      const other = plan.design.arms.length === 2 ? plan.design.arms.find((a) => a.name !== compared.literal).name : void 0;
      return compared.negated ? toBranches(b2, other, compared.literal) : toBranches(b2, compared.literal, other);
    }
    const b = branchesAfter(text, valueStart, valueEnd);
    return b && toBranches(b, arms?.treatment, arms?.control);
  };
  const direct = onValue(start, closed);
  if (direct) return direct;
  const assigned = /(?:^|[\s;{(,])(?:(?:const|let|var|val|final|auto)\s+)?([A-Za-z_$][\w$]*)\s*(?::\s*[\w$<>[\]| ]+)?=\s*$/.exec(text.slice(Math.max(0, start - 200), start));
  if (!assigned) return { unknown: "the flag\u2019s value is neither branched on nor assigned to a variable" };
  const name = assigned[1];
  for (let at = text.indexOf(name, closed); at >= 0; at = text.indexOf(name, at + name.length)) {
    IDENT.lastIndex = at;
    const whole = IDENT.exec(text)?.[0] === name && !/[\w$.]/.test(text[at - 1] ?? "");
    if (!whole) continue;
    const found = onValue(at, at + name.length);
    if (found) return found;
  }
  return { unknown: `no ternary or if/else on \`${name}\`` };
}
function armsOf(plan) {
  const treatments = plan.design.arms.filter((a) => a.name !== plan.design.control);
  return treatments.length === 1 ? { treatment: treatments[0].name, control: plan.design.control } : void 0;
}
function statementsOf(code) {
  return code.split(/[;\n]/).map((s) => s.replace(/\s+/g, "").replace(/^[{}]+|[{}]+$/g, "")).filter((s) => s.length >= 4);
}
function presence(code, head) {
  const statements = statementsOf(code);
  if (statements.length === 0) return "empty";
  const found = statements.filter((s) => head.includes(s)).length;
  return found === statements.length ? "all" : found === 0 ? "none" : "some";
}
function keptInOneFile(b, headText) {
  const head = headText.replace(/\s+/g, "");
  const t = presence(b.truthy, head);
  const f = presence(b.falsy, head);
  if (statementsOf(b.truthy).join() === statementsOf(b.falsy).join()) return { unknown: "both branches hold the same code" };
  let kept;
  if (t === "all" && (f === "none" || f === "empty")) kept = "truthy";
  else if (f === "all" && (t === "none" || t === "empty")) kept = "falsy";
  else if (t === "none" && f === "empty") kept = "falsy";
  if (!kept) return { unknown: "the code of both branches, or parts of each, is still there" };
  const arm = kept === "truthy" ? b.truthyArm : b.falsyArm;
  return arm ? { arm } : { unknown: "the branch kept does not name one arm of the plan" };
}
function keptArm(plan, reads, code, flagPatterns) {
  const keys = new Set(plan.flags);
  const answers = [];
  for (const read of reads) {
    const changed = code.find((c) => c.basePath === read.file);
    if (!changed?.base) {
      answers.push({ unknown: `${read.file} could not be read at the base commit` });
      continue;
    }
    const base = changed.base;
    const call = findCalls(base, read.file, flagPatterns).find((s) => s.line <= read.line && read.line <= s.endLine && keys.has(s.groups.key ?? resolveConstant(base, s.groups.ident ?? "") ?? ""));
    if (!call) {
      answers.push({ unknown: `no flag call at ${read.file}:${read.line}` });
      continue;
    }
    const branches = branchesOfRead(base, call.start, call.end, plan);
    if ("unknown" in branches) {
      answers.push({ unknown: `${read.file}:${read.line}: ${branches.unknown}` });
      continue;
    }
    const kept = changed.head !== void 0 ? keptInOneFile(branches, changed.head) : { unknown: `${read.file} is deleted` };
    answers.push("arm" in kept ? { arm: kept.arm, file: read.file, line: read.line } : { unknown: `${read.file}:${read.line}: ${kept.unknown}` });
  }
  const unknown = answers.find((a) => "unknown" in a);
  if (unknown) return unknown;
  const arms = [...new Set(answers.map((a) => "arm" in a ? a.arm : ""))];
  if (arms.length !== 1) return { unknown: arms.length === 0 ? "no flag read to read it from" : `the reads keep different arms (${arms.join(", ")})` };
  const first = answers[0];
  return { arm: first.arm, where: { file: first.file, line: first.line } };
}

// src/run/review-readouts.ts
async function attachReadouts(linked, files, options = {}) {
  const ending = linked.filter((l) => l.ending && !l.loaded.plan.outcome?.totals && !options.changedTotals?.has(l.loaded.plan.id)).map((l) => l.loaded.plan.id);
  const found = options.tracked && ending.length ? await latestTotals(ending, options.tracked, files) : /* @__PURE__ */ new Map();
  for (const l of linked) {
    const { plan, file: planFile } = l.loaded;
    const pick = plan.outcome?.totals ? { file: plan.outcome.totals, source: "outcome" } : options.changedTotals?.has(plan.id) ? { file: options.changedTotals.get(plan.id), source: "changed" } : found.has(plan.id) ? { ...found.get(plan.id), source: "latest" } : void 0;
    if (!pick) continue;
    const { file, source } = pick;
    const text = pick.text ?? await files.readText(file);
    if (text === void 0) {
      l.readout = { file, source, problem: `the totals file ${file} named by the outcome is not in the repository` };
      continue;
    }
    const read = await readTotalsAgainstPlan({ plan, planFile, totalsFile: file, totalsText: text, ...options.history ? { history: options.history } : {} });
    l.readout = read.ok ? { file, source, readout: read.readout } : { file, source, problem: `${file} cannot be read out: ${read.errors.map((e) => `line ${e.line}: ${e.field}: ${e.message}`).join("; ")}` };
  }
}

// src/run/load-base-plans.ts
async function loadBaseWorkspace(change, settingsPath) {
  try {
    const loaded = await loadWorkspace({ files: change.filesAt("base"), ...settingsPath ? { settingsPath } : {} });
    return loaded.ok ? loaded.workspace : void 0;
  } catch (error) {
    if (error instanceof UsageError) return void 0;
    throw error;
  }
}

// src/run/review-change.ts
function swappedRefs(change, named) {
  const { baseTip } = change;
  if (baseTip === void 0 || change.base !== change.head || baseTip === change.head) return void 0;
  return named ?? { base: `base ${baseTip.slice(0, 7)}`, head: `head ${change.head.slice(0, 7)}` };
}
async function contextAtBase(base, baseFiles, head, removed, history) {
  if (!base) return void 0;
  const events = new Map(head.events);
  for (const [event, at] of removed) {
    const hits = events.get(event);
    if (!hits?.firstCall && !hits?.firstQuoted) events.set(event, { ...hits, first: at, firstQuoted: at });
  }
  const atBase = new Map(base.plans.map((p) => [p.plan.id, p]));
  const linked = head.linked.flatMap((l) => {
    const then = atBase.get(l.loaded.plan.id);
    return then ? [{ loaded: then, reasons: l.reasons, sizing: finiteSizing(sizePlan(then.plan, sizingPolicy(head.settings))) }] : [];
  });
  await attachReadouts(linked, baseFiles, history ? { history } : {});
  return { ...head, linked, invalidPlanFiles: [], fileWarnings: base.problems.filter((p) => p.severity === "warning"), registry: base.registry, events };
}
async function reviewChange(options) {
  const { change } = options;
  const trackedAtHead = change.trackedFiles("head");
  const changedAndDiff = Promise.all([change.changedFiles(), change.diff()]);
  changedAndDiff.catch(() => void 0);
  const baseWorkspace = change.baseUnreadable ? Promise.resolve(void 0) : loadBaseWorkspace(change, options.settingsPath);
  baseWorkspace.catch(() => void 0);
  const head = change.filesAt("head");
  const loaded = await loadWorkspace({ files: head, ...options.settingsPath ? { settingsPath: options.settingsPath } : {}, ...options.onProgress ? { onProgress: options.onProgress } : {} });
  if (!loaded.ok) return { kind: "settings-invalid", settingsFile: loaded.settingsFile, problems: loaded.settingsProblems };
  const { workspace } = loaded;
  const { settings } = workspace;
  const baseEntries = change.baseUnreadable ? Promise.resolve(workspace.registry.entries) : baseWorkspace.then((w) => w?.registry.entries ?? []);
  baseEntries.catch(() => void 0);
  const [changed, diffText] = await changedAndDiff;
  const diffs = parseUnifiedDiff(diffText);
  const changedPaths = new Set(changed.filter((f) => f.status !== "deleted").map((f) => f.path));
  const textual = diffs.filter((d) => !d.binary);
  const headPaths = textual.filter((d) => changedPaths.has(d.path)).map((d) => d.path);
  const basePaths = textual.map((d) => d.previousPath ?? d.path);
  const [headTexts, baseTexts] = await Promise.all([head.readTexts(headPaths), change.filesAt("base").readTexts(basePaths)]);
  const textAt = { added: new Map(headPaths.map((p, i) => [p, headTexts[i]])), removed: new Map(basePaths.map((p, i) => [p, baseTexts[i]])) };
  const isFlagFile = globMatcher(DEFAULT_FLAG_FILES, { dot: true });
  const definitionTouches = changed.filter((f) => isFlagFile(f.path) || f.previousPath !== void 0 && isFlagFile(f.previousPath)).flatMap((f) => flagDefinitionTouches(f.path, textAt.removed.get(f.previousPath ?? f.path), f.status === "deleted" ? void 0 : textAt.added.get(f.path)));
  const definedKeys = [...textAt.added.entries()].filter(([p]) => isFlagFile(p)).flatMap(([, text]) => [...flagDefinitions(text)?.keys() ?? []]);
  const knownKeys = /* @__PURE__ */ new Set([...workspace.registry.entries.flatMap((e) => e.flags), ...settings.exemptFlags, ...definedKeys]);
  const flagPatterns = flagPatternsOf(settings);
  const codeTouches = findFlagTouches({
    diffs: textual.filter((d) => !isFlagFile(d.path)),
    patterns: flagPatterns,
    knownKeys,
    textOf: (side, path) => textAt[side].get(path)
  });
  const touches = [...definitionTouches, ...codeTouches];
  const pr = options.pr ?? {};
  const changedTotals = totalsInChange(textAt.added);
  const links = linkPlans({ plans: workspace.plans, changedPaths, touches, pr, readouts: new Set(changedTotals.keys()) });
  const linked = workspace.plans.filter((p) => links.has(p.plan.id)).map((p) => ({ loaded: p, reasons: links.get(p.plan.id), sizing: finiteSizing(sizePlan(p.plan, sizingPolicy(settings))) }));
  const brokenPlans = [...new Set(workspace.problems.filter((p) => p.severity === "error" && workspace.planFiles.includes(p.file)).map((p) => p.file))];
  const brokenFlags = (await head.readTexts(brokenPlans)).map(declaredFlags);
  const touchedKeys = new Set(touches.map((t) => t.key));
  const invalidPlanFiles = brokenPlans.map((file, i) => ({ file, flags: brokenFlags[i], problems: workspace.problems.filter((p) => p.file === file) })).filter((f) => changedPaths.has(f.file) || f.flags.some((k) => touchedKeys.has(k)));
  const running = [...runningEntries(workspace.registry.entries), ...runningEntries(await baseEntries)];
  const startedFlags = [...[...workspace.registry.entries, ...await baseEntries].filter((e) => e.state !== "concluded").flatMap((e) => e.flags), ...linked.flatMap((l) => l.loaded.plan.flags)];
  const names = [.../* @__PURE__ */ new Set([...linked.flatMap((l) => eventsOfPlan(l.loaded.plan)), ...running.flatMap((e) => e.events), ...startedFlags])];
  const logPatterns = logPatternsOf(settings);
  const scanner = createNameScanner(names, logPatterns);
  if (names.length) {
    const ownFiles = ownFilesOf(workspace);
    const inScope = scanMatcher(settings.scan);
    const paths = (await trackedAtHead).filter((p) => !ownFiles.has(p) && !isFlagFile(p) && inScope(p));
    let done = 0;
    await change.streamFiles("head", paths, (path, bytes) => {
      scanner.scanFile(path, bytes);
      options.onProgress?.(++done, paths.length, "files");
    });
  }
  const runningEvents = new Set(running.flatMap((e) => e.events));
  const linkedEvents = new Set(linked.flatMap((l) => eventsOfPlan(l.loaded.plan)));
  const removedEvents = /* @__PURE__ */ new Map();
  const removedLinked = /* @__PURE__ */ new Map();
  for (const diff of textual) {
    for (const { line, text } of diff.removed) {
      for (const match of text.matchAll(QUOTED_STRING)) {
        const event = match[2];
        const at = { file: diff.previousPath ?? diff.path, line, column: match.index + 2 };
        if (runningEvents.has(event) && !removedEvents.has(event)) removedEvents.set(event, at);
        if (linkedEvents.has(event) && !removedLinked.has(event)) removedLinked.set(event, at);
      }
    }
  }
  const hits = scanner.results();
  const changedCode = changedCodeOf(textual, textAt);
  markEndings(linked, touches, hits, changedCode, flagPatterns);
  await attachReadouts(linked, head, { changedTotals, tracked: await trackedAtHead, ...options.history ? { history: options.history } : {} });
  const codeAtHead = new Map([...textAt.added].filter((entry) => entry[1] !== void 0));
  const exposureFiles = [...new Set(linked.flatMap((l) => l.loaded.plan.exposure.event ? [hits.get(l.loaded.plan.exposure.event)?.firstCall?.file] : []))].filter((f) => f !== void 0 && !codeAtHead.has(f));
  (await head.readTexts(exposureFiles)).forEach((text, i) => text !== void 0 && codeAtHead.set(exposureFiles[i], text));
  const context = {
    settings,
    pr,
    linked,
    invalidPlanFiles,
    fileWarnings: workspace.problems.filter((p) => p.severity === "warning"),
    changedPaths: [...changedPaths],
    touches,
    registry: workspace.registry,
    events: hits,
    flagsAtHead: hits,
    codeAtHead,
    removedEvents,
    changedCode,
    ...change.baseUnreadable ? { baseUnreadable: change.baseUnreadable } : {},
    today: options.today ?? todayIn(settings.digest.timeZone, /* @__PURE__ */ new Date()),
    baseEntries: await baseEntries
  };
  const baseContext = await contextAtBase(await baseWorkspace, change.filesAt("base"), context, removedLinked, options.history);
  const swapped = swappedRefs(change, options.refNames);
  const review = buildReview(context, { base: change.base, head: change.head, ...swapped ? { swapped } : {} }, baseContext);
  const stats = scanner.stats();
  return { kind: "review", review, scanned: { files: stats.files, bytes: stats.bytes } };
}
function totalsInChange(added) {
  const latest = latestByPlan([...added].map(([file, text]) => ({ file, text })));
  return new Map([...latest].map(([id, { file }]) => [id, file]));
}
function markEndings(linked, touches, hits, code, flagPatterns) {
  const removed = touches.filter((t) => t.side === "removed" && (t.via === "call" || t.via === "constant"));
  for (const l of linked) {
    const { plan } = l.loaded;
    const gone = plan.flags.filter((k) => removed.some((t) => t.key === k) && hits.get(k)?.firstCall === void 0 && hits.get(k)?.firstQuoted === void 0);
    if (gone.length === 0) continue;
    const reads = removed.filter((t) => gone.includes(t.key)).map((t) => ({ file: t.file, line: t.line }));
    l.ending = { flags: gone, kept: keptArm(plan, reads, code, flagPatterns) };
  }
}
function changedCodeOf(diffs, textAt) {
  return diffs.map((d) => {
    const basePath = d.previousPath ?? d.path;
    const head = textAt.added.get(d.path);
    const base = textAt.removed.get(basePath);
    return { path: d.path, basePath, added: d.added.map((l) => l.line), removed: d.removed.map((l) => l.line), ...head !== void 0 ? { head } : {}, ...base !== void 0 ? { base } : {} };
  });
}

export {
  reviewChange
};
