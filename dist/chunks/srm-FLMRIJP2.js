#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  sampleRatioMismatch
} from "./chunk-ASHUOTMY.js";
import "./chunk-54OF2UQO.js";
import {
  SRM_ALARM_P
} from "./chunk-BXF2RWJM.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";
export {
  SRM_ALARM_P,
  sampleRatioMismatch
};
