#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  PLAN_SCHEMA_ID,
  planJsonSchema
} from "./chunk-U6SIM7M4.js";
import "./chunk-4RUMT5Y4.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  PLAN_SCHEMA_ID,
  planJsonSchema
};
