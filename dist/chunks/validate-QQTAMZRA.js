#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  loadWorkspace
} from "./chunk-GP32HYB2.js";
import "./chunk-I3AB5CE6.js";
import "./chunk-JBVNQSW6.js";
import "./chunk-CD6WOGVM.js";
import "./chunk-54OF2UQO.js";
import "./chunk-WFNG3OL5.js";
import "./chunk-ACARCTR5.js";
import "./chunk-J5RDXJJD.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-TEADBEZM.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-7GKTQ2BG.js";
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
