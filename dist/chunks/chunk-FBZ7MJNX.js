#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatProblem
} from "./chunk-KAGGRZCD.js";
import {
  UsageError
} from "./chunk-OICJSZPX.js";

// src/run/find-plan.ts
function findNamedPlan(workspace, name, then) {
  const wanted = name.replace(/^\.\//, "");
  const found = workspace.plans.find((p) => p.plan.id === wanted || p.file === wanted);
  if (found) return found;
  const fileName = (file) => file.slice(file.lastIndexOf("/") + 1).replace(/\.ya?ml$/, "");
  const brokenFile = [...new Set(workspace.problems.filter((p) => p.severity === "error").map((p) => p.file))].find((file) => file === wanted || fileName(file) === wanted);
  if (brokenFile) {
    const broken = workspace.problems.filter((p) => p.file === brokenFile && p.severity === "error");
    throw new UsageError(`${brokenFile} has errors:
${broken.map(formatProblem).join("\n")}`, `fix them, then ${then} again`);
  }
  const known = workspace.plans.map((p) => p.plan.id);
  throw new UsageError(`no plan "${wanted}" in this repository`, known.length ? `known plans: ${known.join(", ")}` : "create one with plumbline new <flag-key>");
}

export {
  findNamedPlan
};
