#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  findCollisions,
  flagPatternsOf,
  resolveConstant,
  runningEntries,
  scanMatcher
} from "./chunk-AXMPQV5Z.js";
import {
  sizePlan
} from "./chunk-KLXUGDTV.js";
import {
  addDays,
  daysBetween,
  inclusiveDays
} from "./chunk-BRB7BNQY.js";
import {
  ownFilesOf,
  requireWorkspace
} from "./chunk-LNPMABAN.js";

// src/core/digest/build-digest.ts
function estimateSampleReached(entry, today) {
  if (!entry.plan || !entry.window.start) return void 0;
  const sizing = sizePlan(entry.plan).metrics[0];
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
      item(entry, "overdue", `Past its planned end (${end}) by ${days} day${days === 1 ? "" : "s"}; ${advice}.`, { daysOverdue: days, ...reached !== void 0 ? { sampleReached: reached } : {} });
    } else if (entry.state === "live" && end && end >= today && end <= soon) {
      item(entry, "ending-soon", `Ends on ${end}, in ${daysBetween(today, end)} day${daysBetween(today, end) === 1 ? "" : "s"}: prepare the readout.`);
    }
    if (entry.state === "draft" && start && start < today) {
      item(entry, "draft-past-start", `Planned to start on ${start} but still a draft: launch it, move the window, or drop it.`);
    }
    if (entry.state === "on-hold" && start && daysBetween(start, today) > settings.digest.onHoldDays) {
      item(entry, "long-on-hold", `On hold, ${daysBetween(start, today)} days after its start: its units and surface stay reserved; resume or conclude it.`);
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
      item(entry, "collision", `Runs on ${entry.surface.path} alongside ${c.other.id} (${c.other.owners.join(", ")}) on ${c.other.surface.path}${c.overlapDays !== void 0 ? ` for ${c.overlapDays} days` : ""}, with about ${Math.round(c.trafficShare * 100)}% of units in both.`);
    }
  }
  const covered = /* @__PURE__ */ new Set([...registry.entries.flatMap((e) => e.flags), ...settings.exemptFlags]);
  const orphanFlags = [...input.flagsInCode].filter(([key]) => !covered.has(key)).map(([key, location]) => ({ key, location })).sort((a, b) => a.key.localeCompare(b.key));
  const byOwner = /* @__PURE__ */ new Map();
  const ORDER = ["overdue", "flag-gone", "collision", "draft-past-start", "long-on-hold", "ending-soon"];
  for (const it of items.sort((a, b) => ORDER.indexOf(a.kind) - ORDER.indexOf(b.kind) || a.test.localeCompare(b.test))) {
    const entry = registry.entries.find((e) => e.id === it.test);
    for (const owner of entry.owners) byOwner.set(owner, [...byOwner.get(owner) ?? [], it]);
  }
  const counts = {
    overdue: 0,
    "ending-soon": 0,
    "draft-past-start": 0,
    "long-on-hold": 0,
    "flag-gone": 0,
    collision: 0,
    live: running.length,
    planned: registry.entries.filter((e) => e.state === "draft").length,
    orphanFlags: orphanFlags.length
  };
  for (const it of items) counts[it.kind]++;
  const timeline = registry.entries.filter((e) => (e.state === "live" || e.state === "draft" || e.state === "on-hold") && e.window.start && e.window.end).map((e) => ({ id: e.id, surface: e.surface.path, start: e.window.start, end: e.window.end, state: e.state, overdue: e.state === "live" && e.window.end < today })).sort((a, b) => a.surface.localeCompare(b.surface) || a.start.localeCompare(b.start));
  return {
    today,
    counts,
    owners: [...byOwner].sort(([a], [b]) => a.localeCompare(b)).map(([owner, list]) => ({ owner, items: list })),
    orphanFlags,
    timeline
  };
}

// src/run/digest.ts
function todayIn(timeZone, now) {
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
    const lines = text.split("\n");
    lines.forEach((line, n) => {
      for (const pattern of patterns) {
        for (const match of line.matchAll(pattern)) {
          const key = match.groups?.key ?? (match.groups?.ident ? resolveConstant(text, match.groups.ident) : void 0);
          if (key && !found.has(key)) found.set(key, { file: path, line: n + 1, column: (match.index ?? 0) + 1 });
        }
      }
    });
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
  todayIn,
  flagsInCode,
  digestRepository
};
