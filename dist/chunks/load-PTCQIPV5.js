#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  loadTotals,
  totalsJsonSchema
} from "./chunk-EV3WVM2U.js";
import "./chunk-5N6F6GKY.js";
import "./chunk-YAMIXLAQ.js";
import "./chunk-EIDPB5F5.js";
import "./chunk-5CGVWF3A.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  loadTotals,
  totalsJsonSchema
};
