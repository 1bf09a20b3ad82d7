#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  sizingPolicy
} from "./chunk-XZ7PS274.js";
import {
  finiteSizing
} from "./chunk-G6K6KKMR.js";
import {
  lineOfKey,
  ownFilesOf,
  requireWorkspace,
  require_picomatch
} from "./chunk-ZWIGW2MY.js";
import {
  addDays,
  daysBetween,
  inclusiveDays,
  sizePlan
} from "./chunk-JLYO35IC.js";
import {
  entryFromPlan
} from "./chunk-J3CQQVSX.js";
import {
  countOf,
  formatCount,
  formatMultiplier
} from "./chunk-ACAADDFF.js";
import {
  __toESM
} from "./chunk-FUJ7I5KY.js";

// src/core/config/scan-files.ts
var import_picomatch = __toESM(require_picomatch(), 1);
function globMatcher(globs, options) {
  const expressions = globs.map((glob) => import_picomatch.default.makeRe(glob, options));
  return (path) => {
    for (const expression of expressions) if (expression.test(path)) return true;
    return false;
  };
}
function scanMatcher(scan) {
  const include = globMatcher(scan.include, { dot: true });
  const exclude = globMatcher(scan.exclude, { dot: true });
  return (path) => include(path) && !exclude(path);
}

// src/core/checks/plan-key.ts
function atPlanKey(loaded, path) {
  return { plan: loaded.plan.id, file: loaded.file, line: lineOfKey(loaded, path) };
}
function metricPath(plan, name) {
  if (plan.metrics.primary.name === name) return ["metrics", "primary"];
  const guardrail = plan.metrics.guardrails.findIndex((m) => m.name === name);
  if (guardrail >= 0) return ["metrics", "guardrails", guardrail];
  const secondary = plan.metrics.secondary.findIndex((m) => m.name === name);
  return secondary >= 0 ? ["metrics", "secondary", secondary] : ["metrics"];
}

// src/core/checks/test-length.ts
function lengthSetter(sizing, pick = (s) => s.headline) {
  let longest;
  for (const entry of sizing.metrics) {
    const duration = entry.result.ok ? pick(entry.result.value)?.duration : void 0;
    if (duration && (!longest || duration.days > longest.duration.days)) longest = { metric: entry.metric, role: entry.role, duration };
  }
  return longest;
}
function describeSetter(setter) {
  return setter.role === "primary" ? "the primary metric sets the length" : `guardrail ${setter.metric} sets the length`;
}

// src/core/checks/surfaces.ts
function isSameOrBelow(path, ancestor) {
  return path === ancestor || path.startsWith(`${ancestor}/`);
}
function surfacesMeet(a, b) {
  return isSameOrBelow(a, b) || isSameOrBelow(b, a);
}

// src/core/checks/collisions.ts
function intersect(a, b) {
  if (a.length === 0 && b.length === 0) return "all";
  if (a.length === 0) return [...b];
  if (b.length === 0) return [...a];
  const common = a.filter((x) => b.includes(x));
  return common.length ? common : void 0;
}
function windowOverlap(a, b) {
  if (!a.start || !a.end || !b.start || !b.end) return {};
  const start = a.start > b.start ? a.start : b.start;
  const end = a.end < b.end ? a.end : b.end;
  if (end < start) return void 0;
  return { days: daysBetween(start, end) + 1, window: { start, end } };
}
function sharedTraffic(a, b) {
  const ga = a.surface.trafficSplit;
  const gb = b.surface.trafficSplit;
  if (ga && gb && ga.name === gb.name) {
    const overlap = Math.min(ga.range.end, gb.range.end) - Math.max(ga.range.start, gb.range.start);
    return Math.max(0, overlap) / 100;
  }
  return a.trafficShare * b.trafficShare;
}
function findCollisions(subject, others) {
  const collisions = [];
  for (const other of others) {
    if (other.id === subject.id || !surfacesMeet(subject.surface.path, other.surface.path)) continue;
    const when = windowOverlap(subject.window, other.window);
    if (!when) continue;
    const platforms = intersect(subject.population.platforms, other.population.platforms);
    const locales = intersect(subject.population.locales, other.population.locales);
    const regions = intersect(subject.population.regions, other.population.regions);
    if (!platforms || !locales || !regions) continue;
    const trafficShare = sharedTraffic(subject, other);
    if (trafficShare <= 0) continue;
    collisions.push({
      other,
      surface: subject.surface.path === other.surface.path ? "same" : isSameOrBelow(subject.surface.path, other.surface.path) ? "above" : "below",
      ...when.days !== void 0 ? { overlapDays: when.days } : {},
      ...when.window ? { overlapWindow: when.window } : {},
      platforms,
      locales,
      regions,
      trafficShare,
      known: subject.surface.overlapsWith.includes(other.id) || other.surface.overlapsWith.includes(subject.id)
    });
  }
  return collisions;
}
function runningEntries(entries) {
  return entries.filter((e) => e.state === "live");
}
function collisionsOfLinked(context) {
  const running = runningEntries(context.registry.entries);
  return context.linked.filter(({ loaded }) => loaded.plan.state !== "concluded").flatMap(
    ({ loaded }) => findCollisions(entryFromPlan(loaded.plan, loaded.file, loaded.line), running).map((collision) => ({ plan: loaded.plan.id, collision }))
  );
}
function declaredBy(id, mine, other) {
  const here = mine.includes(other.id);
  const there = other.surface.overlapsWith.includes(id);
  if (here && there) return "Both tests declare this overlap.";
  return here ? `This plan declares the overlap; ${other.id} does not.` : `${other.id} declares the overlap; this plan does not.`;
}
var list = (values) => values === "all" ? "everyone" : values.join(", ");
var percent = (share) => `${Math.round(share * 100)}%`;
function isolationCost(subject, other, settings) {
  const { plan } = subject.loaded;
  const wanted = plan.design.trafficShare;
  const free = 1 - other.trafficShare;
  if (free >= wanted - 1e-9) {
    return `Isolating costs this test nothing: ${other.id} leaves ${percent(free)} of eligible units free, enough for this test\u2019s ${percent(wanted)} in a traffic split.`;
  }
  const share = free > 1e-9 ? free : wanted / (wanted + other.trafficShare);
  const how = free > 1e-9 ? `taking only the ${percent(free)} that ${other.id} leaves free` : `splitting traffic with ${other.id} (which would restart it)`;
  const now = lengthSetter(subject.sizing);
  const isolated = lengthSetter(finiteSizing(sizePlan({ ...plan, design: { ...plan.design, trafficShare: share } }, sizingPolicy(settings))));
  if (now && isolated) {
    const weeks = now.duration.weeks === isolated.duration.weeks ? `still ${countOf(now.duration.weeks, "week")}` : `${countOf(now.duration.weeks, "week")} \u2192 ${countOf(isolated.duration.weeks, "week")}`;
    return `Isolating would cost this test time: ${how}, ${formatCount(now.duration.days)} \u2192 ${countOf(isolated.duration.days, "day")} (${weeks}).`;
  }
  return `Isolating would cost this test traffic: ${how}, ${percent(wanted)} \u2192 ${percent(share)} of eligible units, so it would run about ${formatMultiplier(wanted / share)} as long.`;
}
var collisionCheck = (context) => collisionsOfLinked(context).map(({ plan, collision: c }) => {
  const linked = context.linked.find((l) => l.loaded.plan.id === plan);
  const where = c.surface === "same" ? `the same surface (${c.other.surface.path})` : `${c.other.surface.path}, ${c.surface === "above" ? "which contains this surface" : "inside this surface"}`;
  const when = c.overlapDays !== void 0 ? `${countOf(c.overlapDays, "day")} (${c.overlapWindow.start} to ${c.overlapWindow.end})` : "an unknown stretch (a window is not set)";
  const message = `Overlaps ${c.other.id} (${c.other.owners.join(", ")}) on ${where} for ${when}; platforms ${list(c.platforms)}, locales ${list(c.locales)}; about ${percent(c.trafficShare)} of eligible units would be in both.`;
  const at = atPlanKey(linked.loaded, ["surface"]);
  return c.known ? { code: "known-overlap", message: `${message} ${declaredBy(linked.loaded.plan.id, linked.loaded.plan.surface.overlapsWith, c.other)}`, fix: "Check for an interaction between the two when reading out.", ...at } : {
    code: "collision",
    message: `${message} Independently assigned tests that overlap usually just share units and each still reads its own effect; it matters when both change the same elements, or one changes what the other measures. ${isolationCost(linked, c.other, context.settings)}`,
    fix: `Agree with ${c.other.owners.join(", ")} whether the two interact. If they do, isolate them (the same surface.traffic-split with ranges that do not overlap) or move the window; if not, declare the overlap under surface.overlaps-with and check for an interaction when reading out.`,
    ...at
  };
});

// src/core/digest/build-digest.ts
function estimateSampleReached(entry, today) {
  if (!entry.plan || !entry.window.start) return void 0;
  const sizing = finiteSizing(sizePlan(entry.plan)).metrics[0];
  const headline = sizing?.result.ok ? sizing.result.value.headline : void 0;
  const daily = entry.plan.design.dailyUnits;
  if (!headline || daily === void 0) return void 0;
  const end = entry.window.end && entry.window.end < today ? entry.window.end : today;
  const days = Math.max(0, inclusiveDays(entry.window.start, end));
  const enrolled = days * daily * entry.plan.design.trafficShare;
  return enrolled >= headline.totalUnits;
}
function buildDigest(input) {
  const { registry, today, settings } = input;
  const items = [];
  const item = (entry, kind, detail, extra = {}) => items.push({ kind, test: entry.id, title: entry.title, file: entry.file, line: entry.line, detail, ...extra });
  const soon = addDays(today, settings.digest.endingSoonDays);
  for (const entry of registry.entries) {
    const { start, end } = entry.window;
    if (entry.state === "live" && end && end < today) {
      const days = daysBetween(end, today);
      const reached = estimateSampleReached(entry, today);
      const advice = reached === true ? "the planned sample should be in: read it out and decide" : reached === false ? "the planned sample is not in yet by the plan\u2019s own traffic estimate: decide whether to extend the plan or stop" : "read it out, or extend the plan with a reason";
      item(entry, "overdue", `Past its planned end (${end}) by ${countOf(days, "day")}; ${advice}.`, { daysOverdue: days, ...reached !== void 0 ? { sampleReached: reached } : {} });
    } else if (entry.state === "live" && end && end >= today && end <= soon) {
      item(entry, "ending-soon", `Ends on ${end}, in ${countOf(daysBetween(today, end), "day")}: prepare the readout.`);
    }
    if (entry.state === "draft" && start && start < today) {
      item(entry, "draft-past-start", `Planned to start on ${start} but still a draft: launch it, move the window, or drop it.`);
    }
    if (entry.state === "on-hold" && start && daysBetween(start, today) > settings.digest.onHoldDays) {
      item(entry, "long-on-hold", `On hold, ${countOf(daysBetween(start, today), "day")} after its start: its units and surface stay reserved; resume or conclude it.`);
    }
    if (entry.plan && !entry.plan.outcome && (entry.state === "concluded" || entry.state === "on-hold" && end && end < today)) {
      const due = end !== void 0 && end < today;
      const what = entry.state === "concluded" ? `Concluded${due ? `, past its planned end (${end})` : ""}` : `On hold past its planned end (${end})`;
      const fix = due ? `read it out against its plan (plumbline readout ${entry.id} --totals <file> --record), or, if it ended without data, add outcome: { date, reason }.` : "add outcome: { date, reason } with the decision in one line.";
      item(entry, "outcome-missing", `${what}, but no outcome is recorded: ${fix}`, { readoutDue: due });
    }
    const stillRead = entry.flags.filter((f) => input.flagsInCode.has(f));
    if (entry.plan && entry.state === "concluded" && stillRead.length) {
      const since = entry.plan.outcome?.date ?? entry.plan.outcome?.["recorded-on"] ?? end;
      const days = since !== void 0 && since <= today ? daysBetween(since, today) : void 0;
      const where = input.flagsInCode.get(stillRead[0]);
      item(
        entry,
        "concluded-flag-in-code",
        `Concluded${days !== void 0 ? ` ${days} day${days === 1 ? "" : "s"} ago (${since})` : ""}, but its flag${stillRead.length === 1 ? "" : "s"} ${stillRead.join(", ")} ${stillRead.length === 1 ? "is" : "are"} still read in the code (${where.file}:${where.line}): remove the flag and the code of the arm that lost.`,
        days !== void 0 ? { daysSinceConclusion: days } : {}
      );
    }
    if (entry.plan && entry.state === "live" && entry.flags.length && entry.flags.every((f) => !input.flagsInCode.has(f))) {
      item(entry, "flag-gone", `Live, but its flag${entry.flags.length === 1 ? "" : "s"} ${entry.flags.join(", ")} no longer appear${entry.flags.length === 1 ? "s" : ""} in the code: conclude the plan or restore the flag.`);
    }
  }
  const running = runningEntries(registry.entries);
  const seen = /* @__PURE__ */ new Set();
  for (const entry of running) {
    for (const c of findCollisions(entry, running)) {
      const pair = [entry.id, c.other.id].sort().join(" ");
      if (seen.has(pair) || c.known) continue;
      seen.add(pair);
      item(entry, "collision", `Runs on ${entry.surface.path} alongside ${c.other.id} (${c.other.owners.join(", ")}) on ${c.other.surface.path}${c.overlapDays !== void 0 ? ` for ${countOf(c.overlapDays, "day")}` : ""}, with about ${Math.round(c.trafficShare * 100)}% of units in both.`);
    }
  }
  const covered = /* @__PURE__ */ new Set([...registry.entries.flatMap((e) => e.flags), ...settings.exemptFlags]);
  const orphanFlags = [...input.flagsInCode].filter(([key]) => !covered.has(key)).map(([key, location]) => ({ key, location })).sort((a, b) => a.key.localeCompare(b.key));
  const ORDER = ["overdue", "outcome-missing", "flag-gone", "collision", "concluded-flag-in-code", "draft-past-start", "long-on-hold", "ending-soon"];
  const byTest = /* @__PURE__ */ new Map();
  for (const it of items.sort((a, b) => ORDER.indexOf(a.kind) - ORDER.indexOf(b.kind) || a.test.localeCompare(b.test))) {
    const entry = registry.entries.find((e) => e.id === it.test);
    const test = byTest.get(it.test) ?? { id: entry.id, title: entry.title, owners: entry.owners, file: entry.file, line: entry.line, items: [] };
    test.items.push(it);
    byTest.set(it.test, test);
  }
  const counts = {
    overdue: 0,
    "ending-soon": 0,
    "draft-past-start": 0,
    "long-on-hold": 0,
    "flag-gone": 0,
    collision: 0,
    "outcome-missing": 0,
    "concluded-flag-in-code": 0,
    live: running.length,
    planned: registry.entries.filter((e) => e.state === "draft").length,
    orphanFlags: orphanFlags.length
  };
  for (const it of items) counts[it.kind]++;
  const timeline = registry.entries.filter((e) => (e.state === "live" || e.state === "draft" || e.state === "on-hold") && e.window.start && e.window.end).map((e) => ({ id: e.id, surface: e.surface.path, start: e.window.start, end: e.window.end, state: e.state, overdue: e.state === "live" && e.window.end < today })).sort((a, b) => a.surface.localeCompare(b.surface) || a.start.localeCompare(b.start));
  return {
    today,
    counts,
    // Insertion order is urgency order: a test comes where its most urgent item sorted.
    tests: [...byTest.values()],
    orphanFlags,
    timeline
  };
}

// src/core/scan/comments.ts
var HASH_ONLY = /\.(?:py|pyi|rb|sh|bash|zsh|ya?ml|toml|r|pl|pm|ex|exs|cr|nim|coffee|tf|cfg|ini|conf)$/i;
var HASH_AND_SLASH = /\.(?:php)$/i;
function commentSyntaxOf(path) {
  if (HASH_ONLY.test(path)) return { slash: false, hash: true };
  if (HASH_AND_SLASH.test(path)) return { slash: true, hash: true };
  return { slash: true, hash: false };
}
var SLASH = 47;
var STAR = 42;
var HASH = 35;
var NEWLINE = 10;
var BACKSLASH = 92;
var QUOTES = /* @__PURE__ */ new Set([34, 39, 96]);
function commentRanges(length, at, syntax) {
  const ranges = [];
  let i = 0;
  while (i < length) {
    const c = at(i);
    if (QUOTES.has(c)) {
      const quote = c;
      i++;
      while (i < length) {
        const d = at(i);
        if (d === BACKSLASH) i += 2;
        else if (d === quote) break;
        else if (d === NEWLINE && quote !== 96) break;
        else i++;
      }
      i++;
    } else if (syntax.slash && c === SLASH && at(i + 1) === SLASH || syntax.hash && c === HASH) {
      const start = i;
      while (i < length && at(i) !== NEWLINE) i++;
      ranges.push([start, i]);
    } else if (syntax.slash && c === SLASH && at(i + 1) === STAR) {
      const start = i;
      i += 2;
      while (i < length && !(at(i) === STAR && at(i + 1) === SLASH)) i++;
      i = Math.min(length, i + 2);
      ranges.push([start, i]);
    } else i++;
  }
  return ranges;
}
function insideRanges(ranges, index) {
  let lo = 0;
  let hi = ranges.length - 1;
  while (lo <= hi) {
    const mid = lo + hi >> 1;
    const [start, end] = ranges[mid];
    if (index < start) hi = mid - 1;
    else if (index >= end) lo = mid + 1;
    else return true;
  }
  return false;
}
function commentsOfText(text, path) {
  return commentRanges(text.length, (i) => text.charCodeAt(i), commentSyntaxOf(path));
}
function commentsOfBytes(bytes, path) {
  return commentRanges(bytes.length, (i) => bytes[i] ?? 0, commentSyntaxOf(path));
}

// src/core/scan/calls.ts
function lineStarts(text) {
  const starts = [0];
  for (let i = text.indexOf("\n"); i !== -1; i = text.indexOf("\n", i + 1)) starts.push(i + 1);
  return starts;
}
function lineIndex(text) {
  const starts = lineStarts(text);
  return (offset) => {
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = lo + hi + 1 >> 1;
      if (starts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
}
function findCalls(text, path, patterns) {
  const comments = commentsOfText(text, path);
  const lineOf = lineIndex(text);
  const sites = [];
  for (const pattern of patterns) {
    pattern.lastIndex = 0;
    for (const match of text.matchAll(pattern)) {
      const start = match.index;
      if (insideRanges(comments, start)) continue;
      const end = start + match[0].length;
      const groups = { ...match.groups ?? {} };
      const value = groups.key ?? groups.event ?? groups.ident;
      const valueAt = value !== void 0 ? start + match[0].lastIndexOf(value) : start;
      const line = lineOf(start);
      sites.push({ groups, line, endLine: lineOf(Math.max(start, end - 1)), valueLine: lineOf(valueAt), column: start - text.lastIndexOf("\n", start - 1), start, end });
    }
  }
  return sites.sort((a, b) => a.start - b.start);
}

// src/core/scan/patterns.ts
var Q = `(?<q>["'\`])`;
var KEY = `(?<key>[^"'\`\\s]+)\\k<q>`;
var IDENT = `(?<ident>[A-Za-z_$][\\w$]*(?:\\.[A-Za-z_$][\\w$]*)*)\\s*[,)]`;
var TYPES = "(?:Boolean|String|Number|Integer|Int|Double|Float|Object)";
var TYPES_SNAKE = "(?:boolean|string|number|integer|float|object)";
var either = (prefix) => [`${prefix}${Q}${KEY}`, `${prefix}${IDENT}`];
var BUILTIN_FLAG_PATTERNS = [
  // TypeScript/JavaScript, Java/Kotlin, PHP: client.getBooleanValue('key', false); C#: GetBooleanValueAsync("key", false);
  // Swift: client.getBooleanValue(key: "key", defaultValue: false)
  ...either(`\\b[Gg]et${TYPES}(?:Value|Details)(?:Async)?\\s*\\(\\s*(?:key\\s*:\\s*)?`),
  // Python: client.get_boolean_value("key", False)
  ...either(`\\bget_${TYPES_SNAKE}_(?:value|details)\\s*\\(\\s*(?:flag_key\\s*=\\s*)?`),
  // Ruby: client.fetch_boolean_value(flag_key: "key", default_value: false)
  ...either(`\\bfetch_${TYPES_SNAKE}_(?:value|details)\\s*\\(?\\s*(?:flag_key\\s*:\\s*)?`),
  // Go: client.BooleanValue(ctx, "key", false, evalCtx).
  // The first argument is the context: a name or a call without arguments (context.Background()).
  ...either(`\\b(?:Boolean|String|Int|Float|Object)Value(?:Details)?\\s*\\(\\s*[A-Za-z_][\\w.]*(?:\\(\\))?\\s*,\\s*`),
  // React: useBooleanFlagValue('key', false), useFlag('key', default)
  ...either(`\\buse(?:${TYPES})?Flag(?:Value|Details)?\\s*\\(\\s*`),
  // Helpers many codebases write around their flag client.
  ...either(`\\b(?:isEnabled|isFeatureEnabled|featureEnabled|is_enabled|is_feature_enabled|feature_enabled|isOn|getFlag|get_flag|flagValue|flag_value)\\s*\\(\\s*`)
];
var BUILTIN_LOG_PATTERNS = [
  `(?:\\b|\\.)(?:[Tt]rack|[Tt]rackEvent|track_event|[Ll]ogEvent|log_event|[Ee]vent|[Cc]apture|[Ee]mit|[Rr]ecord|[Rr]ecordEvent|record_event)(?:Async)?\\s*\\(\\s*(?:(?:ctx|context|context\\.\\w+\\(\\))\\s*,\\s*)?(?:(?:name|event)\\s*[:=]\\s*)?${Q}(?<event>[^"'\`\\n]+)\\k<q>`
];
var CONSTANT_VALUE = new RegExp(`\\s*(?::\\s*[\\w<>\\[\\]]+\\s*)?(?:=|:)\\s*${Q}${KEY}`, "uy");
var IDENT_CHAR = /[\w$.]/u;
function constantValue(text, name) {
  if (name === "") return void 0;
  for (let at = text.indexOf(name); at >= 0; at = text.indexOf(name, at + 1)) {
    if (at > 0 && IDENT_CHAR.test(text.charAt(at - 1))) continue;
    CONSTANT_VALUE.lastIndex = at + name.length;
    const key = CONSTANT_VALUE.exec(text)?.groups?.key;
    if (key !== void 0) return key;
  }
  return void 0;
}
var QUOTED_STRING = /(["'`])([^"'`\n]{1,200})\1/g;
function compilePatterns(patterns) {
  return patterns.map((p) => new RegExp(p, "gu"));
}
function flagPatternsOf(settings) {
  return compilePatterns([...settings.builtinPatterns ? BUILTIN_FLAG_PATTERNS : [], ...settings.flagCalls]);
}
function logPatternsOf(settings) {
  return compilePatterns([...settings.builtinPatterns ? BUILTIN_LOG_PATTERNS : [], ...settings.logCalls]);
}

// src/core/scan/flag-touches.ts
function findFlagTouches(inputs) {
  const touches = [];
  const seen = /* @__PURE__ */ new Set();
  const add = (touch) => {
    const id = `${touch.key}\0${touch.file}\0${touch.line}\0${touch.side}`;
    if (!seen.has(id)) {
      seen.add(id);
      touches.push(touch);
    }
  };
  for (const diff of inputs.diffs) {
    if (diff.binary) continue;
    for (const side of ["added", "removed"]) {
      const file = side === "removed" ? diff.previousPath ?? diff.path : diff.path;
      const text = inputs.textOf(side, file);
      const changed = new Set(diff[side].map((l) => l.line));
      if (text !== void 0) {
        for (const site of findCalls(text, file, inputs.patterns)) {
          let touched = false;
          for (let line = site.line; line <= site.endLine && !touched; line++) touched = changed.has(line);
          if (!touched) continue;
          const key = flagKeyOf(text, site);
          if (key) add({ key, file, line: site.valueLine, side, via: site.groups.key ? "call" : "constant" });
        }
      } else {
        for (const { line, text: lineText } of diff[side]) {
          for (const pattern of inputs.patterns) {
            pattern.lastIndex = 0;
            for (const match of lineText.matchAll(pattern)) if (match.groups?.key) add({ key: match.groups.key, file, line, side, via: "call" });
          }
        }
      }
      const comments = text !== void 0 ? commentsOfText(text, file) : [];
      const lineStart = text !== void 0 ? lineStarts(text) : [];
      for (const { line, text: lineText } of diff[side]) {
        for (const match of lineText.matchAll(QUOTED_STRING)) {
          if (!inputs.knownKeys.has(match[2])) continue;
          if (text !== void 0 && insideRanges(comments, (lineStart[line - 1] ?? 0) + match.index)) continue;
          add({ key: match[2], file, line, side, via: "literal" });
        }
      }
    }
  }
  return touches;
}
function flagKeyOf(text, site) {
  return site.groups.key ?? (site.groups.ident ? resolveConstant(text, site.groups.ident) : void 0);
}
function flagReadsOf(text, path, patterns, keys) {
  return findCalls(text, path, patterns).filter((site) => {
    const key = flagKeyOf(text, site);
    return key !== void 0 && keys.has(key);
  });
}
function resolveConstant(text, ident) {
  if (!text) return void 0;
  const name = ident.slice(ident.lastIndexOf(".") + 1);
  return constantValue(text, name);
}

// src/run/digest.ts
function todayIn(timeZone, now) {
  if (timeZone === "UTC") return now.toISOString().slice(0, 10);
  return new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).format(now);
}
async function flagsInCode(files, settings, skip) {
  const patterns = flagPatternsOf(settings);
  const inScope = scanMatcher(settings.scan);
  const paths = (await files.listFiles("")).filter((p) => inScope(p) && !skip.has(p));
  const found = /* @__PURE__ */ new Map();
  const texts = await files.readTexts(paths);
  paths.forEach((path, i) => {
    const text = texts[i];
    if (text === void 0 || text.includes("\0")) return;
    for (const site of findCalls(text, path, patterns)) {
      const key = flagKeyOf(text, site);
      if (key && !found.has(key)) found.set(key, { file: path, line: site.valueLine, column: site.column });
    }
  });
  return found;
}
async function digestRepository(options) {
  const workspace = await requireWorkspace({ files: options.files, ...options.settingsPath ? { settingsPath: options.settingsPath } : {} });
  const { settings } = workspace;
  const skip = ownFilesOf(workspace);
  const digest = buildDigest({
    registry: workspace.registry,
    today: options.today ?? todayIn(settings.digest.timeZone, options.now),
    settings,
    flagsInCode: await flagsInCode(options.files, settings, skip)
  });
  return { digest, settings };
}

export {
  globMatcher,
  scanMatcher,
  atPlanKey,
  metricPath,
  lengthSetter,
  describeSetter,
  isSameOrBelow,
  runningEntries,
  collisionsOfLinked,
  collisionCheck,
  insideRanges,
  commentsOfText,
  commentsOfBytes,
  lineStarts,
  lineIndex,
  findCalls,
  QUOTED_STRING,
  flagPatternsOf,
  logPatternsOf,
  findFlagTouches,
  flagReadsOf,
  resolveConstant,
  todayIn,
  flagsInCode,
  digestRepository
};
