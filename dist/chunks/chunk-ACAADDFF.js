#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/report/numbers.ts
var NOT_A_NUMBER = "n/a";
function formatCount(n) {
  if (!Number.isFinite(n)) return NOT_A_NUMBER;
  if (Math.abs(n) >= 1e15) {
    const [mantissa, exponent] = n.toExponential(2).split("e");
    return `${mantissa} \xD7 10^${Number(exponent)}`;
  }
  return Math.round(n).toLocaleString("en-US");
}
function formatRate(rate) {
  if (!Number.isFinite(rate)) return NOT_A_NUMBER;
  const percent = rate * 100;
  const digits = Math.abs(percent) >= 10 ? 1 : Math.abs(percent) >= 1 ? 2 : Math.max(2, 1 - Math.floor(Math.log10(Math.abs(percent) || 1)));
  return `${percent.toFixed(Math.min(digits, 4))}%`;
}
function formatRelative(change) {
  if (!Number.isFinite(change)) return NOT_A_NUMBER;
  const percent = change * 100;
  const text = Number(percent.toPrecision(3)).toString();
  return `${percent >= 0 ? "+" : ""}${text}%`;
}
function formatValue(value) {
  if (!Number.isFinite(value)) return NOT_A_NUMBER;
  if (value !== 0 && Math.abs(value) < 1e-3) return value.toExponential(2);
  return Number(value.toPrecision(4)).toLocaleString("en-US", { maximumFractionDigits: 6 });
}
function formatPower(power) {
  if (!Number.isFinite(power)) return NOT_A_NUMBER;
  if (power > 0.999) return ">99.9%";
  if (power < 1e-3) return "<0.1%";
  return `${(power * 100).toFixed(1)}%`;
}
function formatMultiplier(m) {
  return Number.isFinite(m) ? `\xD7${m >= 10 ? m.toFixed(1) : m.toFixed(2)}` : NOT_A_NUMBER;
}
function countOf(n, singular, plural = `${singular}s`) {
  return `${formatCount(n)} ${Math.round(n) === 1 ? singular : plural}`;
}
function formatWeeks(duration, why) {
  return `${countOf(duration.weeks, "week")} (${countOf(duration.days, "day")}${why ? `; ${why}` : ""})`;
}

export {
  formatCount,
  formatRate,
  formatRelative,
  formatValue,
  formatPower,
  formatMultiplier,
  countOf,
  formatWeeks
};
