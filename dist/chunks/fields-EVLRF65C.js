#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  NAME_MAX_LENGTH,
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
} from "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  NAME_MAX_LENGTH,
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
