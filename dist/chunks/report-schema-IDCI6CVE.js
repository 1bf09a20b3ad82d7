#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  REVIEW_JSON_FORMAT,
  reviewJson,
  reviewReportSchema
} from "./chunk-LX36TRP3.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  REVIEW_JSON_FORMAT,
  reviewJson,
  reviewReportSchema
};
