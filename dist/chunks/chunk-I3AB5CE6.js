#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  writtenPlanSchema
} from "./chunk-J5RDXJJD.js";
import {
  external_exports
} from "./chunk-7GKTQ2BG.js";

// src/core/plan/json-schema.ts
var PLAN_SCHEMA_ID = "https://plumbline.dev/schema/plan.schema.json";
var cached;
function planJsonSchema() {
  cached ??= {
    $id: PLAN_SCHEMA_ID,
    title: "Plumbline experiment plan",
    ...external_exports.toJSONSchema(writtenPlanSchema, { io: "input", target: "draft-2020-12", unrepresentable: "any" })
  };
  return cached;
}

export {
  PLAN_SCHEMA_ID,
  planJsonSchema
};
