#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  REVIEW_JSON_FORMAT,
  reviewJson,
  reviewReportSchema
} from "./chunk-JNKJNCKE.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  REVIEW_JSON_FORMAT,
  reviewJson,
  reviewReportSchema
};
