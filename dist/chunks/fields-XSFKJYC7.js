#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  asDescription,
  calendarDate,
  finiteNumber,
  isCalendarDate,
  kebabName,
  nonNegativeNumber,
  openShare,
  optionalText,
  positiveNumber,
  positiveShare,
  text,
  uniqueList,
  wholeNumber
} from "./chunk-WOJBVI3K.js";
import "./chunk-NZOXBD7U.js";
import "./chunk-FUJ7I5KY.js";
export {
  asDescription,
  calendarDate,
  finiteNumber,
  isCalendarDate,
  kebabName,
  nonNegativeNumber,
  openShare,
  optionalText,
  positiveNumber,
  positiveShare,
  text,
  uniqueList,
  wholeNumber
};
