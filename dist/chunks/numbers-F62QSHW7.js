#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  countOf,
  formatCount,
  formatMultiplier,
  formatPower,
  formatRate,
  formatRelative,
  formatValue,
  formatWeeks
} from "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";
export {
  countOf,
  formatCount,
  formatMultiplier,
  formatPower,
  formatRate,
  formatRelative,
  formatValue,
  formatWeeks
};
