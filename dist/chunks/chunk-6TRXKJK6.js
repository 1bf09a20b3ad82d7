#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  fail,
  ok
} from "./chunk-X2H4NLT2.js";

// src/core/stats/traffic.ts
var LAST_DAY = 36500;
function dailyCurve(perDay) {
  if (!(perDay > 0 && Number.isFinite(perDay))) return fail("daily-units", "zero traffic: no test can reach its sample");
  return ok({
    unitsBy: (day) => perDay * day,
    dayFor: (units) => {
      const day = Math.max(1, Math.ceil(units / perDay - 1e-9));
      return Number.isFinite(day) && day <= LAST_DAY ? day : void 0;
    },
    source: { kind: "daily", perDay }
  });
}
function uniqueUnitsCurve(points) {
  if (points.length !== 2) return fail("unique-units", "exactly two points are needed, e.g. the first 7 days and 28 days");
  const [first, second] = [...points].sort((a, b) => a.days - b.days);
  if (!(first.days > 0 && first.units > 0)) return fail("unique-units", "days and units must be above 0");
  if (first.days === second.days) return fail("unique-units", `the two points must count different spans; both are ${first.days} days`);
  if (second.units < first.units) {
    return fail("unique-units", `${second.units} different units over ${second.days} days is fewer than the ${first.units} over the first ${first.days}; a longer span sees at least as many`);
  }
  const exponent = Math.log(second.units / first.units) / Math.log(second.days / first.days);
  if (exponent > 1 + 1e-12) {
    return fail("unique-units", `${second.units} over ${second.days} days grows faster than the first ${first.days} days' rate; if every unit is new, give daily-units instead`);
  }
  const unitsBy = (day) => day <= 0 ? 0 : first.units * (day / first.days) ** exponent;
  return ok({
    unitsBy,
    dayFor: (units) => {
      if (exponent <= 0) return units <= first.units ? first.days : void 0;
      const exact = first.days * (units / first.units) ** (1 / exponent);
      if (!Number.isFinite(exact) || exact > LAST_DAY) return void 0;
      let day = Math.max(1, Math.ceil(exact - 1e-9));
      while (day > 1 && unitsBy(day - 1) >= units) day--;
      while (unitsBy(day) < units * (1 - 1e-12)) day++;
      return day;
    },
    source: { kind: "unique", points: [first, second], exponent }
  });
}
function unitsAmount(n) {
  if (!Number.isFinite(n)) return String(n);
  if (Math.abs(n) >= 100) return Math.round(n).toLocaleString("en-US");
  return Number(n.toPrecision(3)).toLocaleString("en-US", { maximumFractionDigits: 8 });
}

export {
  dailyCurve,
  uniqueUnitsCurve,
  unitsAmount
};
