#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  daysBetween
} from "./chunk-BRB7BNQY.js";
import {
  require_picomatch
} from "./chunk-LNPMABAN.js";
import {
  entryFromPlan
} from "./chunk-NUQJLPGC.js";
import {
  __toESM
} from "./chunk-FUJ7I5KY.js";

// src/core/config/scan-files.ts
var import_picomatch = __toESM(require_picomatch(), 1);
function scanMatcher(scan) {
  const include = (0, import_picomatch.default)([...scan.include], { dot: true });
  const exclude = scan.exclude.length ? (0, import_picomatch.default)([...scan.exclude], { dot: true }) : () => false;
  return (path) => include(path) && !exclude(path);
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
  const ga = a.surface.exclusionGroup;
  const gb = b.surface.exclusionGroup;
  if (ga && gb && ga.name === gb.name) {
    const overlap = Math.min(ga.slice.to, gb.slice.to) - Math.max(ga.slice.from, gb.slice.from);
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
  return context.linked.flatMap(
    ({ loaded }) => findCollisions(entryFromPlan(loaded.plan, loaded.file, loaded.line), running).map((collision) => ({ plan: loaded.plan.id, collision }))
  );
}
var list = (values) => values === "all" ? "everyone" : values.join(", ");
var collisionCheck = (context) => collisionsOfLinked(context).map(({ plan, collision: c }) => {
  const linked = context.linked.find((l) => l.loaded.plan.id === plan);
  const where = c.surface === "same" ? `the same surface (${c.other.surface.path})` : `${c.other.surface.path}, ${c.surface === "above" ? "which contains this surface" : "inside this surface"}`;
  const when = c.overlapDays !== void 0 ? `${c.overlapDays} days (${c.overlapWindow.start} to ${c.overlapWindow.end})` : "an unknown stretch (a window is not set)";
  const message = `Overlaps ${c.other.id} (${c.other.owners.join(", ")}) on ${where} for ${when}; platforms ${list(c.platforms)}, locales ${list(c.locales)}; about ${Math.round(c.trafficShare * 100)}% of eligible units would be in both.`;
  return c.known ? { code: "known-overlap", message: `${message} Both tests declare this overlap.`, fix: "Check for an interaction between the two when reading out.", plan, file: linked.loaded.file, line: linked.loaded.line } : {
    code: "collision",
    message,
    fix: `Put both in one exclusion group with disjoint slices, move the window, or declare the overlap under surface.overlaps-with after agreeing it with ${c.other.owners.join(", ")}.`,
    plan,
    file: linked.loaded.file,
    line: linked.loaded.line
  };
});

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
  `(?:\\b|\\.)(?:track|trackEvent|track_event|logEvent|log_event|event|capture|emit|record|recordEvent|record_event)\\s*\\(\\s*(?:(?:name|event)\\s*[:=]\\s*)?${Q}(?<event>[^"'\`\\n]+)\\k<q>`
];
function constantDefinition(name) {
  const escaped = name.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  return new RegExp(`(?:^|[^\\w$.])${escaped}\\s*(?::\\s*[\\w<>\\[\\]]+\\s*)?(?:=|:)\\s*${Q}${KEY}`, "mu");
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
      for (const { line, text } of diff[side]) {
        for (const pattern of inputs.patterns) {
          pattern.lastIndex = 0;
          for (const match of text.matchAll(pattern)) {
            const groups = match.groups ?? {};
            if (groups.key) add({ key: groups.key, file, line, side, via: "call" });
            else if (groups.ident) {
              const key = resolveConstant(inputs.textOf(side, file), groups.ident);
              if (key) add({ key, file, line, side, via: "constant" });
            }
          }
        }
        for (const match of text.matchAll(QUOTED_STRING)) {
          if (inputs.knownKeys.has(match[2])) add({ key: match[2], file, line, side, via: "literal" });
        }
      }
    }
  }
  return touches;
}
function resolveConstant(text, ident) {
  if (!text) return void 0;
  const name = ident.slice(ident.lastIndexOf(".") + 1);
  return constantDefinition(name).exec(text)?.groups?.key;
}

export {
  scanMatcher,
  isSameOrBelow,
  findCollisions,
  runningEntries,
  collisionsOfLinked,
  collisionCheck,
  QUOTED_STRING,
  flagPatternsOf,
  logPatternsOf,
  findFlagTouches,
  resolveConstant
};
