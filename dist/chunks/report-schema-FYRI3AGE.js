#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  REVIEW_JSON_FORMAT,
  reviewJson,
  reviewReportSchema
} from "./chunk-7H6XXGZJ.js";
import "./chunk-NZOXBD7U.js";
import "./chunk-FUJ7I5KY.js";
export {
  REVIEW_JSON_FORMAT,
  reviewJson,
  reviewReportSchema
};
