#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  loadWorkspace
} from "./chunk-ZWIGW2MY.js";
import "./chunk-V65C5FSR.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-TLWZYCJO.js";
import "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-J3CQQVSX.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-OICJSZPX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";

// src/run/validate.ts
async function validateRepository(options) {
  const loaded = await loadWorkspace(options);
  if (!loaded.ok) return { kind: "settings-invalid", settingsFile: loaded.settingsFile, problems: loaded.settingsProblems };
  const { workspace } = loaded;
  return {
    kind: "report",
    report: {
      ...workspace.settingsFile ? { settingsFile: workspace.settingsFile } : {},
      planFiles: workspace.planFiles.length,
      validPlans: workspace.plans.length,
      registryFiles: workspace.settings.registryFiles.length,
      registryEntries: workspace.registry.entries.length,
      errors: workspace.problems.filter((p) => p.severity === "error").length,
      warnings: workspace.problems.filter((p) => p.severity === "warning").length,
      problems: workspace.problems
    }
  };
}
export {
  validateRepository
};
