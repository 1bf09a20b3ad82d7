#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  loadTotals,
  totalsJsonSchema
} from "./chunk-TH3NNBTK.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  loadTotals,
  totalsJsonSchema
};
