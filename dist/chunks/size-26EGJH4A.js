#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  findNamedPlan
} from "./chunk-FBZ7MJNX.js";
import {
  designSummary
} from "./chunk-UDHHIPK7.js";
import "./chunk-7H6MHGDI.js";
import {
  sizingPolicy
} from "./chunk-XZ7PS274.js";
import {
  finiteSizing
} from "./chunk-G6K6KKMR.js";
import {
  requireWorkspace
} from "./chunk-ZWIGW2MY.js";
import "./chunk-V65C5FSR.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-TLWZYCJO.js";
import {
  sizeMetric,
  sizePlan
} from "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-J3CQQVSX.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-OICJSZPX.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";

// src/run/size.ts
async function sizeNamedPlan(options) {
  const workspace = await requireWorkspace(options);
  const found = findNamedPlan(workspace, options.plan, "size");
  const { plan } = found;
  return {
    sizing: finiteSizing(sizePlan(plan, sizingPolicy(workspace.settings))),
    power: plan.design.power,
    context: {
      title: `Sizing for ${plan.id} (${found.file})`,
      designLine: designSummary({ ...plan.design, reach: plan.exposure.reach }),
      window: plan.window
    }
  };
}
function sizeFromRequest(request, window) {
  const sizing = finiteSizing({
    planId: "command-line",
    ...request.plannedDays !== void 0 ? { plannedDays: request.plannedDays } : {},
    ...request.dailyUnits !== void 0 ? { dailyUnits: request.dailyUnits } : {},
    metrics: [{ metric: "metric", role: "primary", kind: request.baseline.kind, direction: request.direction, sides: request.sides, alpha: request.alpha, power: request.power, result: sizeMetric(request) }]
  });
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
