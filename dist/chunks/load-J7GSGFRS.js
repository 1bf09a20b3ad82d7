#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  loadTotals,
  totalsJsonSchema
} from "./chunk-I36QVQA3.js";
import "./chunk-JBVNQSW6.js";
import "./chunk-ACARCTR5.js";
import "./chunk-J5RDXJJD.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  TOTALS_LIMITS,
  TOTALS_SCHEMA_ID,
  loadTotals,
  totalsJsonSchema
};
