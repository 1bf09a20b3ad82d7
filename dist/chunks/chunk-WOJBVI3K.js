#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  external_exports
} from "./chunk-NZOXBD7U.js";

// src/core/source/fields.ts
function asDescription(expected) {
  return `${expected.charAt(0).toUpperCase()}${expected.slice(1)}.`;
}
var text = (expected) => external_exports.string({ error: expected }).trim().min(1, { error: expected }).describe(asDescription(expected));
var optionalText = (expected) => text(expected).optional();
var kebabName = (expected) => external_exports.string({ error: expected }).regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: expected }).describe(asDescription(expected));
var openShare = (expected) => external_exports.number({ error: expected }).gt(0, { error: expected }).lt(1, { error: expected }).describe(asDescription(expected));
var positiveShare = (expected) => external_exports.number({ error: expected }).gt(0, { error: expected }).lte(1, { error: expected }).describe(asDescription(expected));
var positiveNumber = (expected) => external_exports.number({ error: expected }).gt(0, { error: expected }).describe(asDescription(expected));
var nonNegativeNumber = (expected) => external_exports.number({ error: expected }).gte(0, { error: expected }).describe(asDescription(expected));
var finiteNumber = (expected) => external_exports.number({ error: expected }).describe(asDescription(expected));
var wholeNumber = (expected, min, max) => external_exports.number({ error: expected }).int({ error: expected }).gte(min, { error: expected }).lte(max, { error: expected }).describe(asDescription(expected));
var CALENDAR_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
function isCalendarDate(value) {
  const match = CALENDAR_DATE.exec(value);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}
var calendarDate = (expected) => external_exports.string({ error: expected }).regex(CALENDAR_DATE, { error: expected }).refine(isCalendarDate, { error: `${expected}, on a day that exists in the calendar` }).describe(asDescription(expected));
var uniqueList = (item, expected, min = 0, fewMessage = expected) => external_exports.array(item, { error: expected }).min(min, { error: fewMessage }).refine((items) => new Set(items.map((i) => JSON.stringify(i))).size === items.length, {
  error: `${expected}, each listed once`
}).describe(asDescription(expected));

export {
  asDescription,
  text,
  optionalText,
  kebabName,
  openShare,
  positiveShare,
  positiveNumber,
  nonNegativeNumber,
  finiteNumber,
  wholeNumber,
  isCalendarDate,
  calendarDate,
  uniqueList
};
