#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  DECIMAL
} from "./chunk-PLTSYE6O.js";
import "./chunk-2ITRHRXB.js";
import "./chunk-5AUULDGE.js";
import {
  DAILY_UNITS
} from "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import {
  SIZING_FLAG_FIELDS
} from "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import {
  UsageError
} from "./chunk-OICJSZPX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";

// src/cli/size-request.ts
var EXAMPLES = {
  baseline: "0.12 (a rate) or 42.5 (a mean)",
  sd: "30",
  effect: "0.03 (3% relative)",
  alpha: "0.05",
  power: "0.8",
  arms: "50,50",
  "daily-units": "12000",
  days: "28"
};
function number(flag, text, required = "") {
  if (text === void 0) throw new UsageError(`--${flag} is required${required}`, `e.g. --${flag} ${EXAMPLES[flag] ?? "0.5"}`);
  const value = Number(text.trim());
  if (!DECIMAL.test(text.trim()) || !Number.isFinite(value)) {
    throw new UsageError(`--${flag} needs a decimal number; got ${JSON.stringify(text)}`, `e.g. --${flag} ${EXAMPLES[flag] ?? "0.5"}`);
  }
  return value;
}
function field(flag, text, schema, required = "") {
  const value = number(flag, text, required);
  const checked = schema.safeParse(value);
  if (!checked.success) throw new UsageError(`--${flag} needs ${checked.error.issues[0]?.message ?? "a valid value"}; got ${text}`);
  return checked.data;
}
function bounded(flag, value, bound) {
  if (value >= bound.min && value <= bound.max) return value;
  throw new UsageError(`--${flag} is ${value < bound.min ? "too small" : "too large"} for sizing to give a meaningful figure; got ${value}`, `expected ${bound.why}`);
}
function pair(flag, text, required, meanSchema) {
  if (text === void 0) throw new UsageError(`--${flag} is required${required}`, `e.g. --${flag} 0.9,1.4`);
  const parts = text.split(",");
  if (parts.length !== 2) throw new UsageError(`--${flag} needs a mean and a standard deviation separated by a comma`, `e.g. --${flag} 0.9,1.4`);
  return { mean: field(flag, parts[0], meanSchema), sd: field(flag, parts[1], F["moment-sd"]) };
}
var F = SIZING_FLAG_FIELDS;
function requestFromFlags(flags) {
  if (!flags.kind) throw new UsageError("name a plan (id or file), or describe the metric with --kind", "e.g. plumbline size checkout-wallet-first, or plumbline size --kind proportion --baseline 0.1 --effect 0.05");
  const forKind = ` for --kind ${flags.kind}`;
  let baseline;
  if (flags.kind === "proportion") baseline = { kind: "proportion", rate: field("baseline", flags.baseline, F.rate, forKind) };
  else if (flags.kind === "mean") baseline = { kind: "mean", mean: field("baseline", flags.baseline, F.mean, forKind), sd: field("sd", flags.sd, F.sd, forKind) };
  else {
    baseline = {
      kind: "ratio",
      numerator: pair("numerator", flags.numerator, forKind, F["moment-mean"]),
      denominator: pair("denominator", flags.denominator, forKind, F["denominator-mean"]),
      correlation: field("correlation", flags.correlation, F.correlation)
    };
  }
  const weights = flags.arms.split(",").map((w) => field("arms", w, F["arm-weight"]));
  if (weights.length < 2) throw new UsageError("--arms needs at least two weights, control first", "e.g. --arms 50,50");
  const arms = weights.map((weight, i) => ({ name: i === 0 ? "control" : weights.length === 2 ? "treatment" : `treatment-${i}`, weight }));
  const looks = field("interim-looks", flags.interimLooks, F["interim-looks"]);
  const days = flags.days === void 0 ? void 0 : number("days", flags.days);
  if (days !== void 0 && !(Number.isInteger(days) && days > 0)) throw new UsageError("--days needs a whole number of days above 0");
  const effect = flags.effect === void 0 ? void 0 : field("effect", flags.effect, flags.absolute ? F["effect-absolute"] : F.effect);
  const dailyUnits = flags.dailyUnits === void 0 ? void 0 : bounded("daily-units", field("daily-units", flags.dailyUnits, F["daily-units"]), DAILY_UNITS);
  if (effect === void 0 && (days === void 0 || dailyUnits === void 0)) {
    throw new UsageError(
      days === void 0 ? "--effect is required, unless --days and --daily-units ask what is detectable by then" : "--days without --effect asks what is detectable by then, which needs --daily-units",
      "e.g. --effect 0.03, or --days 28 --daily-units 12000"
    );
  }
  const clusterSize = flags.clusterSize === void 0 ? void 0 : field("cluster-size", flags.clusterSize, F["cluster-size"]);
  if (clusterSize === void 0 !== (flags.icc === void 0)) throw new UsageError("--cluster-size and --icc go together");
  const groupsAvailable = flags.groups === void 0 ? void 0 : field("groups", flags.groups, F["groups-available"]);
  return {
    baseline,
    direction: flags.direction,
    ...effect !== void 0 ? { effect: flags.absolute ? { absolute: effect } : { relative: effect } } : {},
    arms,
    control: "control",
    alpha: field("alpha", flags.alpha, F.alpha),
    power: field("power", flags.power, F.power),
    sides: flags.sides === "1" ? 1 : 2,
    ...dailyUnits !== void 0 ? { dailyUnits } : {},
    trafficShare: field("traffic-share", flags.trafficShare, F["traffic-share"]),
    reach: field("reach", flags.reach, F.reach),
    interimLooks: looks,
    boundary: flags.boundary,
    prePeriodCorrelation: field("pre-period-correlation", flags.prePeriodCorrelation, F["pre-period-correlation"]),
    ...clusterSize !== void 0 ? { cluster: { meanSize: clusterSize, icc: field("icc", flags.icc, F.icc), sizeCv: field("size-cv", flags.sizeCv, F["size-cv"]), ...groupsAvailable !== void 0 ? { available: groupsAvailable } : {} } } : {},
    ...days !== void 0 ? { plannedDays: days } : {},
    method: flags.method
  };
}
export {
  requestFromFlags
};
