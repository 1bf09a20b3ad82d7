#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  terminalSafe,
  terminalStyle
} from "./chunk-D7CL2H7J.js";

// src/core/report/validation.ts
var VALIDATION_JSON_FORMAT = "plumbline.validation/1";
function validationJson(report) {
  return { format: VALIDATION_JSON_FORMAT, valid: report.errors === 0, ...report };
}
function renderValidationText(report, options) {
  const style = terminalStyle(options.color);
  const lines = report.problems.map((problem) => {
    const line = terminalSafe(formatProblem(problem));
    return problem.severity === "error" ? line.replace(": error: ", `: ${style.red("error")}: `) : line.replace(": warning: ", `: ${style.yellow("warning")}: `);
  });
  const invalid = report.planFiles - report.validPlans;
  const files = `${count(report.planFiles, "plan file")}${report.registryFiles ? ` and ${count(report.registryFiles, "registry file")}` : ""}`;
  const verdict = report.errors === 0 ? style.green(report.warnings ? `valid, with ${count(report.warnings, "warning")}` : "all valid") : style.red(`${count(report.errors, "error")}${invalid ? ` in ${count(invalid, "plan file")}` : ""}`) + (report.warnings ? `, ${count(report.warnings, "warning")}` : "");
  const settings = settingsNote(report.settingsFile);
  if (report.planFiles === 0) lines.push(style.yellow(noPlanFilesHint(report.settingsFile)));
  lines.push(`${style.bold("Checked")} ${files}${settings}: ${verdict}.`);
  return lines.join("\n");
}
function settingsNote(settingsFile) {
  return settingsFile ? ` (settings: ${settingsFile})` : " (no settings file: defaults)";
}
function noPlanFilesHint(settingsFile) {
  return `No plan files found${settingsNote(settingsFile)}. Create one with: plumbline new <flag-key>`;
}
function count(n, noun) {
  return `${n} ${noun}${n === 1 ? "" : "s"}`;
}

export {
  VALIDATION_JSON_FORMAT,
  validationJson,
  renderValidationText,
  noPlanFilesHint,
  count
};
