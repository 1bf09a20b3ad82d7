#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  designSummary
} from "./chunk-FZSY7OIF.js";
import "./chunk-D7CL2H7J.js";
import {
  sizeMetric,
  sizePlan
} from "./chunk-KLXUGDTV.js";
import "./chunk-SNSXL25Y.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-BRB7BNQY.js";
import "./chunk-AAUUFJV7.js";
import {
  requireWorkspace
} from "./chunk-LNPMABAN.js";
import {
  UsageError
} from "./chunk-TEADBEZM.js";
import "./chunk-JUBH45I5.js";
import "./chunk-ZPCHB3P2.js";
import "./chunk-NUQJLPGC.js";
import "./chunk-7ABR6JAH.js";
import {
  formatProblem
} from "./chunk-EIDPB5F5.js";
import "./chunk-6GTMEVTP.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-WOJBVI3K.js";
import "./chunk-NZOXBD7U.js";
import "./chunk-FUJ7I5KY.js";

// src/run/size.ts
async function sizeNamedPlan(options) {
  const workspace = await requireWorkspace(options);
  const wanted = options.plan.replace(/^\.\//, "");
  const found = workspace.plans.find((p) => p.plan.id === wanted || p.file === wanted);
  if (!found) {
    const broken = workspace.problems.filter((p) => p.file === wanted && p.severity === "error");
    if (broken.length) throw new UsageError(`${wanted} has errors:
${broken.map(formatProblem).join("\n")}`, "fix them, then size again");
    const known = workspace.plans.map((p) => p.plan.id);
    throw new UsageError(`no plan "${wanted}" in this repository`, known.length ? `known plans: ${known.join(", ")}` : "create one with plumbline new <flag-key>");
  }
  const { plan } = found;
  return {
    sizing: sizePlan(plan),
    power: plan.design.power,
    context: {
      title: `Sizing for ${plan.id} (${found.file})`,
      designLine: designSummary({ ...plan.design, reach: plan.exposure.reach }),
      window: plan.window
    }
  };
}
function sizeFromRequest(request, window) {
  const sizing = {
    planId: "command-line",
    ...request.plannedDays !== void 0 ? { plannedDays: request.plannedDays } : {},
    ...request.dailyUnits !== void 0 ? { dailyUnits: request.dailyUnits } : {},
    metrics: [{ metric: "metric", role: "primary", kind: request.baseline.kind, direction: request.direction, sides: request.sides, result: sizeMetric(request) }]
  };
  return {
    sizing,
    power: request.power,
    context: { title: "Sizing from the command line", designLine: designSummary(request), ...window ? { window } : {} }
  };
}
export {
  sizeFromRequest,
  sizeNamedPlan
};
