#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  MAX_UNIT_COUNT,
  isUnitCount,
  sampleRatioMismatch
} from "./chunk-GIF3ITND.js";
import "./chunk-B52SKDPA.js";
import {
  SRM_ALARM_P
} from "./chunk-BXF2RWJM.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";
export {
  MAX_UNIT_COUNT,
  SRM_ALARM_P,
  isUnitCount,
  sampleRatioMismatch
};
