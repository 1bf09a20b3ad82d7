#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatProblem
} from "./chunk-PDUGBP5Q.js";
import {
  UsageError
} from "./chunk-OICJSZPX.js";

// src/run/find-plan.ts
function findNamedPlan(workspace, name, then) {
  const wanted = name.replace(/^\.\//, "");
  const found = workspace.plans.find((p) => p.plan.id === wanted || p.file === wanted);
  if (found) return found;
  const broken = workspace.problems.filter((p) => p.file === wanted && p.severity === "error");
  if (broken.length) throw new UsageError(`${wanted} has errors:
${broken.map(formatProblem).join("\n")}`, `fix them, then ${then} again`);
  const known = workspace.plans.map((p) => p.plan.id);
  throw new UsageError(`no plan "${wanted}" in this repository`, known.length ? `known plans: ${known.join(", ")}` : "create one with plumbline new <flag-key>");
}

export {
  findNamedPlan
};
