#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  PLAN_SCHEMA_ID,
  planJsonSchema
} from "./chunk-ZPCHB3P2.js";
import "./chunk-6GTMEVTP.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-WOJBVI3K.js";
import "./chunk-NZOXBD7U.js";
import "./chunk-FUJ7I5KY.js";
export {
  PLAN_SCHEMA_ID,
  planJsonSchema
};
