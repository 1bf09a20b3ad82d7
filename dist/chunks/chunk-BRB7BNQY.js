#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/calendar.ts
var DAY_MS = 864e5;
function toUtcMs(date) {
  const [y, m, d] = date.split("-").map(Number);
  return Date.UTC(y, m - 1, d);
}
function addDays(date, days) {
  return new Date(toUtcMs(date) + days * DAY_MS).toISOString().slice(0, 10);
}
function daysBetween(from, to) {
  return Math.round((toUtcMs(to) - toUtcMs(from)) / DAY_MS);
}
function inclusiveDays(start, end) {
  return daysBetween(start, end) + 1;
}

export {
  addDays,
  daysBetween,
  inclusiveDays
};
