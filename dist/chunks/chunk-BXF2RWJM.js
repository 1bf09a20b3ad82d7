#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/stats/choices.ts
var BOUNDARY_KINDS = ["obrien-fleming-spending", "pocock-spending", "obrien-fleming", "pocock"];
var SRM_ALARM_P = 5e-4;

export {
  BOUNDARY_KINDS,
  SRM_ALARM_P
};
