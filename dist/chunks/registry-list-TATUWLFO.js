#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  noPlanFilesHint
} from "./chunk-SGDUUXBQ.js";
import "./chunk-KAGGRZCD.js";
import {
  formatTable,
  terminalSafe,
  terminalStyle
} from "./chunk-D7CL2H7J.js";
import "./chunk-FUJ7I5KY.js";

// src/core/report/registry-list.ts
var STATE_ORDER = { live: 0, "on-hold": 1, draft: 2, concluded: 3 };
function sortEntries(entries) {
  return [...entries].sort(
    (a, b) => STATE_ORDER[a.state] - STATE_ORDER[b.state] || (a.window.start ?? "9999").localeCompare(b.window.start ?? "9999") || a.id.localeCompare(b.id)
  );
}
function formatWindow(window) {
  if (!window.start && !window.end) return "not set";
  return `${window.start ?? "?"} to ${window.end ?? "open"}`;
}
var REGISTRY_JSON_FORMAT = "plumbline.registry/1";
function registryJson(registry) {
  return {
    format: REGISTRY_JSON_FORMAT,
    tests: sortEntries(registry.entries).map((e) => ({
      id: e.id,
      title: e.title,
      state: e.state,
      surface: e.surface.path,
      ...e.surface.trafficSplit ? { trafficSplit: e.surface.trafficSplit } : {},
      window: e.window,
      owners: e.owners,
      flags: e.flags,
      trafficShare: e.trafficShare,
      events: e.events,
      file: e.file,
      line: e.line
    }))
  };
}
function renderRegistryText(registry, options) {
  const style = terminalStyle(options.color);
  const entries = sortEntries(registry.entries);
  const rows = entries.map(
    (e) => [e.id, e.state, e.surface.path, formatWindow(e.window), e.owners.join(", "), `${e.file}:${e.line}`].map(terminalSafe)
  );
  const out = entries.length ? [formatTable(["ID", "STATE", "SURFACE", "WINDOW", "OWNERS", "FILE"], rows)] : ["The registry is empty."];
  const byState = ["live", "on-hold", "draft", "concluded"].map((s) => [s, entries.filter((e) => e.state === s).length]).filter(([, n]) => n > 0).map(([s, n]) => `${n} ${s}`);
  out.push(style.dim(`${entries.length} test${entries.length === 1 ? "" : "s"}${byState.length ? `: ${byState.join(", ")}` : ""}.`));
  if (options.noPlanFiles && entries.length === 0) out.push(style.yellow(noPlanFilesHint(options.noPlanFiles.settingsFile)));
  if (options.skippedFiles) {
    out.push(style.yellow(`${options.skippedFiles} file${options.skippedFiles === 1 ? "" : "s"} with errors left out; run plumbline validate.`));
  }
  return out.join("\n");
}
export {
  REGISTRY_JSON_FORMAT,
  formatWindow,
  registryJson,
  renderRegistryText,
  sortEntries
};
