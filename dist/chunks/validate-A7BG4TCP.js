#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  loadWorkspace
} from "./chunk-LNPMABAN.js";
import "./chunk-TEADBEZM.js";
import "./chunk-JUBH45I5.js";
import "./chunk-ZPCHB3P2.js";
import "./chunk-NUQJLPGC.js";
import "./chunk-7ABR6JAH.js";
import "./chunk-EIDPB5F5.js";
import "./chunk-6GTMEVTP.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-WOJBVI3K.js";
import "./chunk-NZOXBD7U.js";
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
