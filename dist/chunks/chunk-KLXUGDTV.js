#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  noncentralTUpper,
  normalCdf,
  normalQuantile,
  studentQuantile
} from "./chunk-SNSXL25Y.js";
import {
  fail,
  finite,
  ok
} from "./chunk-X2H4NLT2.js";
import {
  inclusiveDays
} from "./chunk-BRB7BNQY.js";
import {
  GROUP_UNITS
} from "./chunk-6GTMEVTP.js";

// src/core/stats/adjustments.ts
function designEffect(meanSize, icc, sizeCv = 0) {
  return Math.max(1, 1 + ((sizeCv * sizeCv + 1) * meanSize - 1) * icc);
}
function varianceReduction(rho) {
  return 1 - rho * rho;
}
function bonferroniAlpha(alpha, comparisons) {
  return alpha / Math.max(1, comparisons);
}

// src/core/stats/duration.ts
function durationFor(unitsNeeded, unitsPerDay) {
  if (!(unitsPerDay > 0) || !Number.isFinite(unitsNeeded) || !Number.isFinite(unitsPerDay)) return void 0;
  const days = Math.max(1, Math.ceil(unitsNeeded / unitsPerDay - 1e-9));
  return { days, weeks: Math.ceil(days / 7) };
}

// src/core/stats/inputs.ts
function checkSettings(settings, power) {
  if (!(settings.alpha > 0 && settings.alpha < 1)) return fail("alpha", `the significance level must be strictly between 0 and 1; got ${settings.alpha}`);
  if (settings.sides !== 1 && settings.sides !== 2) return fail("sides", "a test is one-sided (1) or two-sided (2)");
  if (!(settings.ratio > 0 && Number.isFinite(settings.ratio))) return fail("ratio", `the allocation ratio must be above 0; got ${settings.ratio}`);
  if (power !== void 0) {
    if (!(power > 0 && power < 1)) return fail("power", `power must be strictly between 0 and 1; got ${power}`);
    if (power <= settings.alpha) return fail("power", `power (${power}) must exceed the significance level (${settings.alpha}): a test cannot be likelier to detect an effect than to raise a false alarm`);
  }
  return void 0;
}
function upperQuantileLevel(settings) {
  return 1 - settings.alpha / settings.sides;
}

// src/core/stats/root.ts
function findRoot(f, lo, hi, tolerance = 1e-12, maxIterations = 200) {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) return void 0;
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) return void 0;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p;
      let q;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) return void 0;
  }
  return b;
}
function solveIncreasing(f, target, guess, min, max, tolerance = 1e-10) {
  const g = (x) => f(x) - target;
  let lo = Math.max(min, guess / 2);
  let hi = Math.min(max, Math.max(guess * 2, lo * 2));
  while (g(lo) > 0 && lo > min) lo = Math.max(min, lo / 4);
  while (g(hi) < 0 && hi < max) hi = Math.min(max, hi * 4);
  return findRoot(g, lo, hi, tolerance * Math.max(1, Math.abs(guess)));
}

// src/core/stats/mean.ts
function minimumControlUnits(ratio) {
  return 2.01 / (1 + ratio);
}
function checkMoments(delta, sd) {
  if (!(sd > 0 && Number.isFinite(sd))) return fail("baseline.sd", `the standard deviation must be above 0; got ${sd}`);
  if (!Number.isFinite(delta) || delta === 0) return fail("effect", "the effect is zero: there is nothing to detect");
  return void 0;
}
function powerUnchecked(test, n1) {
  const n2 = test.ratio * n1;
  const standardError = test.sd * Math.sqrt(1 / n1 + 1 / n2);
  const shift = Math.abs(test.delta) / standardError;
  const level = upperQuantileLevel(test);
  if (test.method === "normal") return normalCdf(shift - normalQuantile(level));
  const df = n1 + n2 - 2;
  return noncentralTUpper(studentQuantile(level, df), df, shift);
}
function meanPower(test, n1) {
  const problem = checkSettings(test) ?? checkMoments(test.delta, test.sd);
  if (problem) return problem;
  if (!(n1 >= minimumControlUnits(test.ratio))) return fail("n", `at least ${minimumControlUnits(test.ratio)} control units are needed for a t test; got ${n1}`);
  return finite(powerUnchecked(test, n1), "n", "power");
}
function meanSampleSize(test, power) {
  const problem = checkSettings(test, power) ?? checkMoments(test.delta, test.sd);
  if (problem) return problem;
  const z = normalQuantile(upperQuantileLevel(test)) + normalQuantile(power);
  const normal = (test.sd * z / test.delta) ** 2 * (1 + 1 / test.ratio);
  if (test.method === "normal") return finite(normal, "effect", "the sample size");
  const min = minimumControlUnits(test.ratio);
  if (powerUnchecked(test, min) >= power) return ok(min);
  const n1 = solveIncreasing((n) => powerUnchecked(test, n), power, Math.max(normal, min), min, 1e12, 1e-12);
  return n1 === void 0 ? fail("effect", "the sample size cannot be computed for these inputs") : ok(n1);
}
function meanDetectable(settings, n1, power) {
  const problem = checkSettings(settings, power) ?? checkMoments(1, settings.sd);
  if (problem) return problem;
  if (!(n1 >= minimumControlUnits(settings.ratio))) return fail("n", `at least ${minimumControlUnits(settings.ratio)} control units are needed; got ${n1}`);
  const z = normalQuantile(upperQuantileLevel(settings)) + normalQuantile(power);
  const guess = settings.sd * z * Math.sqrt(1 / n1 + 1 / (settings.ratio * n1));
  if (settings.method === "normal") return finite(guess, "n", "the detectable effect");
  const delta = solveIncreasing((d) => powerUnchecked({ ...settings, delta: d }, n1), power, guess, 1e-300, 1e300, 1e-12);
  return delta === void 0 ? fail("n", "the detectable effect cannot be computed for these inputs") : ok(delta);
}

// src/core/stats/proportion.ts
function checkRates(p1, p2) {
  if (!(p1 > 0 && p1 < 1)) return fail("baseline.rate", `a baseline rate must be strictly between 0 and 1; got ${p1}`);
  if (!(p2 > 0 && p2 < 1)) return fail("effect", `the effect takes the rate from ${p1} to ${p2}, outside (0, 1)`);
  if (p1 === p2) return fail("effect", "the effect is zero: there is nothing to detect");
  return void 0;
}
function unitErrors(test) {
  const { p1, p2, ratio } = test;
  const pooled = (p1 + ratio * p2) / (1 + ratio);
  return {
    null0: Math.sqrt(pooled * (1 - pooled) * (1 + 1 / ratio)),
    alt1: Math.sqrt(p1 * (1 - p1) + p2 * (1 - p2) / ratio)
  };
}
function powerUnchecked2(test, n1) {
  const z = normalQuantile(upperQuantileLevel(test));
  const { null0, alt1 } = unitErrors(test);
  return normalCdf((Math.sqrt(n1) * Math.abs(test.p2 - test.p1) - z * null0) / alt1);
}
function proportionPower(test, n1) {
  const problem = checkSettings(test) ?? checkRates(test.p1, test.p2);
  if (problem) return problem;
  if (!(n1 > 0)) return fail("n", `the sample size must be above 0; got ${n1}`);
  return finite(powerUnchecked2(test, n1), "n", "power");
}
function proportionSampleSize(test, power) {
  const problem = checkSettings(test, power) ?? checkRates(test.p1, test.p2);
  if (problem) return problem;
  const za = normalQuantile(upperQuantileLevel(test));
  const zb = normalQuantile(power);
  const { null0, alt1 } = unitErrors(test);
  const n1 = ((za * null0 + zb * alt1) / (test.p2 - test.p1)) ** 2;
  return finite(n1, "effect", "the sample size");
}
function proportionDetectable(settings, n1, power, direction) {
  const problem = checkSettings(settings, power);
  if (problem) return problem;
  const { p1 } = settings;
  if (!(p1 > 0 && p1 < 1)) return fail("baseline.rate", `a baseline rate must be strictly between 0 and 1; got ${p1}`);
  if (!(n1 > 0)) return fail("n", `the sample size must be above 0; got ${n1}`);
  const edge = direction === "increase" ? 1 - 1e-12 : 1e-12;
  const gap = (p22) => powerUnchecked2({ ...settings, p2: p22 }, n1) - power;
  if (gap(edge) < 0) {
    return fail("n", `even a rate of ${direction === "increase" ? 1 : 0} would be detected with less than ${power} power at ${n1.toFixed(0)} units per arm`);
  }
  const near = direction === "increase" ? p1 + 1e-12 : p1 - 1e-12;
  const p2 = findRoot(gap, near, edge, 1e-13);
  return p2 === void 0 ? fail("n", "no detectable rate found") : ok(p2);
}

// src/core/stats/ratio.ts
function ratioMoments(baseline) {
  const { numerator: x, denominator: y, correlation: rho } = baseline;
  if (!(y.mean > 0)) return fail("baseline.denominator.mean", `the denominator's mean must be above 0; got ${y.mean}`);
  if (!(x.sd >= 0 && y.sd >= 0)) return fail("baseline", "standard deviations cannot be negative");
  if (!(rho >= -1 && rho <= 1)) return fail("baseline.correlation", `a correlation lies between -1 and 1; got ${rho}`);
  const ratio = x.mean / y.mean;
  const variance = (x.sd ** 2 - 2 * ratio * rho * x.sd * y.sd + ratio ** 2 * y.sd ** 2) / y.mean ** 2;
  if (!(variance > 0)) {
    return fail("baseline", "these moments give the ratio no variance (numerator and denominator move in perfect step); check sd and correlation");
  }
  return ok({ ratio, sd: Math.sqrt(variance) });
}

// src/core/stats/sequential.ts
var PANELS = 160;
var NEVER = 12;
function simpsonGrid(lo, hi) {
  const points = new Float64Array(PANELS + 1);
  const weights = new Float64Array(PANELS + 1);
  const h = (hi - lo) / PANELS;
  for (let i = 0; i <= PANELS; i++) {
    points[i] = lo + i * h;
    weights[i] = h / 3 * (i === 0 || i === PANELS ? 1 : i % 2 === 1 ? 4 : 2);
  }
  return { points, weights };
}
function walk(looks, sides, eta, boundaryAt) {
  const upper = [];
  const lower = [];
  const boundaries = [];
  let grid;
  let density;
  let previousT = 0;
  for (let k = 1; k <= looks; k++) {
    const t = k / looks;
    const dt = t - previousT;
    const sdStep = Math.sqrt(dt);
    const mean = eta * dt;
    const upperMass = (c2) => {
      if (!grid || !density) return normalCdf((eta * t - c2) / Math.sqrt(t));
      let sum = 0;
      for (let i = 0; i < grid.points.length; i++) sum += grid.weights[i] * density[i] * normalCdf((grid.points[i] + mean - c2) / sdStep);
      return sum;
    };
    const lowerMass = (c2) => {
      if (!grid || !density) return normalCdf((-c2 - eta * t) / Math.sqrt(t));
      let sum = 0;
      for (let i = 0; i < grid.points.length; i++) sum += grid.weights[i] * density[i] * normalCdf((-c2 - grid.points[i] - mean) / sdStep);
      return sum;
    };
    const b = boundaryAt(k, (z) => upperMass(z * Math.sqrt(t)));
    boundaries.push(b);
    const c = b * Math.sqrt(t);
    upper.push(upperMass(c));
    lower.push(sides === 2 ? lowerMass(c) : 0);
    if (k === looks) break;
    const floor = sides === 2 ? -c : Math.min(-c, eta * t - 10 * Math.sqrt(t));
    const next = simpsonGrid(floor, c);
    const nextDensity = new Float64Array(next.points.length);
    for (let j = 0; j < next.points.length; j++) {
      const s = next.points[j];
      if (!grid || !density) {
        const u = (s - eta * t) / Math.sqrt(t);
        nextDensity[j] = Math.exp(-0.5 * u * u) / Math.sqrt(2 * Math.PI * t);
        continue;
      }
      let sum = 0;
      for (let i = 0; i < grid.points.length; i++) {
        const u = (s - grid.points[i] - mean) / sdStep;
        sum += grid.weights[i] * density[i] * Math.exp(-0.5 * u * u);
      }
      nextDensity[j] = sum / (sdStep * Math.sqrt(2 * Math.PI));
    }
    grid = next;
    density = nextDensity;
    previousT = t;
  }
  return { crossings: { upper, lower }, boundaries };
}
function spentByTime(kind, a, t) {
  if (t <= 0) return 0;
  if (t >= 1) return a;
  return kind === "obrien-fleming-spending" ? 2 - 2 * normalCdf(normalQuantile(1 - a / 2) / Math.sqrt(t)) : a * Math.log(1 + (Math.E - 1) * t);
}
function checkDesign(design) {
  if (!Number.isInteger(design.looks) || design.looks < 1 || design.looks > 30) return fail("interim-looks", `between 0 and 29 interim looks are supported; got ${design.looks - 1}`);
  if (!(design.alpha > 0 && design.alpha < 1)) return fail("alpha", `the significance level must be strictly between 0 and 1; got ${design.alpha}`);
  return void 0;
}
function sequentialBoundaries(design) {
  const problem = checkDesign(design);
  if (problem) return problem;
  const oneSide = design.alpha / design.sides;
  const { looks } = design;
  let z;
  if (design.kind === "obrien-fleming-spending" || design.kind === "pocock-spending") {
    const kind = design.kind;
    z = walk(looks, design.sides, 0, (k, upperGiven) => {
      const increment = spentByTime(kind, oneSide, k / looks) - spentByTime(kind, oneSide, (k - 1) / looks);
      if (increment <= 1e-30) return NEVER;
      const root = findRoot((b) => upperGiven(b) - increment, 0, NEVER, 1e-12);
      return root ?? NEVER;
    }).boundaries;
  } else {
    const shape = (k) => design.kind === "pocock" ? 1 : Math.sqrt(looks / k);
    const total = (c2) => {
      const { crossings: crossings2 } = walk(looks, design.sides, 0, (k) => c2 * shape(k));
      return crossings2.upper.reduce((a, b) => a + b, 0);
    };
    const c = findRoot((x) => total(x) - oneSide, normalQuantile(1 - oneSide) * 0.5, NEVER, 1e-12);
    if (c === void 0) return fail("interim-looks", "no boundary constant found");
    z = Array.from({ length: looks }, (_, i) => c * shape(i + 1));
  }
  const { crossings } = walk(looks, design.sides, 0, (k) => z[k - 1]);
  return ok({
    z,
    nominalP: z.map((b) => design.sides * (1 - normalCdf(b))),
    alphaSpent: crossings.upper.map((u, i) => u + crossings.lower[i])
  });
}
function sequentialPower(z, sides, eta) {
  const { crossings } = walk(z.length, sides, eta, (k) => z[k - 1]);
  return crossings.upper.reduce((a, b) => a + b, 0);
}
var remembered = /* @__PURE__ */ new Map();
var REMEMBER_AT_MOST = 256;
function sequentialInflation(design, power) {
  const key = `${design.kind}:${design.looks}:${design.alpha}:${design.sides}:${power}`;
  const known = remembered.get(key);
  if (known) return known;
  const computed = integrateInflation(design, power);
  if (remembered.size >= REMEMBER_AT_MOST) remembered.delete(remembered.keys().next().value);
  remembered.set(key, computed);
  return computed;
}
function integrateInflation(design, power) {
  if (!(power > design.alpha && power < 1)) return fail("power", `power must be between the significance level and 1; got ${power}`);
  const bounds = sequentialBoundaries(design);
  if (!bounds.ok) return bounds;
  const fixed = normalQuantile(1 - design.alpha / design.sides) + normalQuantile(power);
  if (design.looks === 1) return ok({ boundaries: bounds.value, inflation: 1, expectedUnderAlternative: 1 });
  const eta = findRoot((e) => sequentialPower(bounds.value.z, design.sides, e) - power, fixed * 0.9, fixed * 2, 1e-11);
  if (eta === void 0) return fail("power", "no design reaches this power");
  const { crossings } = walk(design.looks, design.sides, eta, (k) => bounds.value.z[k - 1]);
  let continuing = 1;
  let expected = 0;
  for (let k = 0; k < design.looks; k++) {
    const stopHere = crossings.upper[k] + crossings.lower[k];
    expected += (k + 1) / design.looks * (k === design.looks - 1 ? continuing : stopHere);
    continuing -= stopHere;
  }
  const inflation = (eta / fixed) ** 2;
  return ok({ boundaries: bounds.value, inflation, expectedUnderAlternative: expected * inflation });
}

// src/core/stats/sizing.ts
function comparisonFor(request, ratio, alpha, method) {
  const settings = { alpha, sides: request.sides, ratio };
  const sign = request.direction === "increase" ? 1 : -1;
  const { baseline } = request;
  if (baseline.kind === "proportion") {
    const p1 = baseline.rate;
    if (!(p1 > 0 && p1 < 1)) return fail("baseline.rate", `a baseline rate must be strictly between 0 and 1; got ${p1}`);
    return ok({
      value: p1,
      controlUnits: (d) => proportionSampleSize({ ...settings, p1, p2: p1 + sign * d }, request.power),
      power: (d, n1) => proportionPower({ ...settings, p1, p2: p1 + sign * d }, n1),
      detectable: (n1) => {
        const p2 = proportionDetectable({ ...settings, p1 }, n1, request.power, request.direction);
        return p2.ok ? ok(Math.abs(p2.value - p1)) : p2;
      }
    });
  }
  if (baseline.kind === "mean" && !(baseline.sd > 0)) return fail("baseline.sd", `the standard deviation must be above 0; got ${baseline.sd}`);
  const moments = baseline.kind === "mean" ? ok({ ratio: baseline.mean, sd: baseline.sd }) : ratioMoments(baseline);
  if (!moments.ok) return moments;
  const { ratio: value, sd } = moments.value;
  const chosen = method;
  return ok({
    value,
    sd,
    controlUnits: (d) => meanSampleSize({ ...settings, delta: d, sd, method: chosen }, request.power),
    power: (d, n1) => meanPower({ ...settings, delta: d, sd, method: chosen }, n1),
    detectable: (n1) => meanDetectable({ ...settings, sd, method: chosen }, n1, request.power)
  });
}
function effectIn(effect, value, kind) {
  if (effect.absolute !== void 0) return effect.absolute > 0 ? ok(effect.absolute) : fail("effect", "the effect must be above 0");
  if (effect.relative === void 0) return fail("effect", "give the effect as relative or absolute");
  if (!(effect.relative > 0)) return fail("effect", "the effect must be above 0");
  if (value === 0) return fail("effect", `a relative effect of a ${kind} whose baseline is 0 is 0; give an absolute effect`);
  return ok(Math.abs(value) * effect.relative);
}
var EXACT_T_LIMIT = 1e3;
function chooseMethod(request, normal, enrolledPerDay) {
  if (request.method === "normal" || request.method === "exact") return request.method;
  if (request.baseline.kind === "proportion") return "normal";
  let n1;
  if (request.effect) {
    const d = effectIn(request.effect, normal.value, request.baseline.kind);
    const size = d.ok ? normal.controlUnits(d.value * request.reach) : void 0;
    n1 = size?.ok ? size.value : void 0;
  } else if (request.plannedDays !== void 0 && enrolledPerDay !== void 0) {
    n1 = request.plannedDays * enrolledPerDay;
  }
  return n1 !== void 0 && n1 > EXACT_T_LIMIT ? "normal" : "exact";
}
function units(n) {
  return Math.ceil(n - 1e-9);
}
function sizeMetric(request) {
  const control = request.arms.find((a) => a.name === request.control);
  if (!control) return fail("arms", `the control arm "${request.control}" is not one of the arms`);
  const treatments = request.arms.filter((a) => a !== control);
  if (treatments.length === 0) return fail("arms", "at least one treatment arm is needed");
  if (request.arms.some((a) => !(a.weight > 0))) return fail("arms", "every arm weight must be above 0");
  if (!(request.trafficShare > 0 && request.trafficShare <= 1)) return fail("traffic-share", `the share of traffic must be in (0, 1]; got ${request.trafficShare}`);
  if (!(request.reach > 0 && request.reach <= 1)) return fail("exposure.reach", `reach must be in (0, 1]; got ${request.reach}`);
  if (request.dailyUnits !== void 0 && !(request.dailyUnits > 0)) return fail("daily-units", "zero traffic: no test can reach its sample");
  const totalWeight = request.arms.reduce((s, a) => s + a.weight, 0);
  const alphaPerComparison = bonferroniAlpha(request.alpha, treatments.length);
  const sequential = request.interimLooks > 0 ? sequentialInflation({ kind: request.boundary, looks: request.interimLooks + 1, alpha: alphaPerComparison, sides: request.sides }, request.power) : ok({ inflation: 1, boundaries: void 0 });
  if (!sequential.ok) return sequential;
  const boundaries = sequential.value.boundaries;
  const de = request.cluster ? designEffect(request.cluster.meanSize, request.cluster.icc, request.cluster.sizeCv) : 1;
  const vr = varianceReduction(request.prePeriodCorrelation);
  const inflate = de * vr * sequential.value.inflation;
  const enrolledPerDay = request.dailyUnits === void 0 ? void 0 : request.dailyUnits * request.trafficShare;
  const probe = comparisonFor(request, 1, alphaPerComparison, "normal");
  if (!probe.ok) return probe;
  const method = chooseMethod(request, probe.value, enrolledPerDay);
  const comparisons = [];
  for (const arm of treatments) {
    const built = comparisonFor(request, arm.weight / control.weight, alphaPerComparison, method);
    if (!built.ok) return built;
    comparisons.push({ ...built.value, weight: arm.weight });
  }
  const value = probe.value.value;
  const notes = [];
  const totalFor = (d) => {
    let worst = 0;
    for (const c of comparisons) {
      const n1 = c.controlUnits(d);
      if (!n1.ok) return n1;
      worst = Math.max(worst, n1.value * totalWeight / control.weight);
    }
    return ok(worst * inflate);
  };
  const sizeFromTotal = (total, perDay) => {
    const perArm = request.arms.map((a) => ({ arm: a.name, units: Math.max(2, units(total * a.weight / totalWeight)) }));
    const totalUnits = perArm.reduce((s, a) => s + a.units, 0);
    const duration = perDay === void 0 ? void 0 : durationFor(totalUnits, perDay);
    return {
      perArm,
      totalUnits,
      ...request.cluster ? { clusters: units(totalUnits / request.cluster.meanSize) } : {},
      ...duration ? { duration } : {}
    };
  };
  const dilutedAnalysis = request.reach < 1;
  let effect;
  let triggered;
  let diluted;
  let dilutionUnits = 1;
  let dilutionDays = 1;
  if (request.effect) {
    const d = effectIn(request.effect, value, request.baseline.kind);
    if (!d.ok) return d;
    const sign = request.direction === "increase" ? 1 : -1;
    effect = { absolute: sign * d.value, relative: value === 0 ? 0 : sign * d.value / Math.abs(value), from: value, to: value + sign * d.value };
    const trig = totalFor(d.value);
    if (!trig.ok) return trig;
    triggered = sizeFromTotal(trig.value, enrolledPerDay === void 0 ? void 0 : enrolledPerDay * request.reach);
    if (dilutedAnalysis) {
      const dil = totalFor(d.value * request.reach);
      if (!dil.ok) return dil;
      diluted = sizeFromTotal(dil.value, enrolledPerDay);
      dilutionUnits = dil.value / trig.value;
      dilutionDays = dilutionUnits * request.reach;
    }
  }
  const headlineReach = dilutedAnalysis ? 1 : request.reach;
  const headlineScale = dilutedAnalysis ? request.reach : 1;
  const controlAt = (totalEnrolled) => totalEnrolled * control.weight / totalWeight / inflate;
  const powerAt = (totalEnrolled, d) => {
    let weakest = 1;
    const n1 = controlAt(totalEnrolled);
    for (const c of comparisons) {
      const p = c.power(d * headlineScale, n1);
      if (!p.ok) return p;
      weakest = Math.min(weakest, p.value);
    }
    return ok(weakest);
  };
  let atPlannedEnd;
  if (request.plannedDays !== void 0 && enrolledPerDay !== void 0) {
    const totalUnits = Math.floor(request.plannedDays * enrolledPerDay * headlineReach);
    const n1 = controlAt(totalUnits);
    atPlannedEnd = { days: request.plannedDays, totalUnits };
    if (effect) {
      const p = powerAt(totalUnits, Math.abs(effect.absolute));
      if (p.ok) atPlannedEnd.power = p.value;
    }
    let detectable = 0;
    let failed;
    for (const c of comparisons) {
      const dd = c.detectable(n1);
      if (!dd.ok) {
        failed = dd.error.message;
        break;
      }
      detectable = Math.max(detectable, dd.value / headlineScale);
    }
    if (failed) notes.push(`No effect is detectable by the planned end: ${failed}.`);
    else {
      const sign = request.direction === "increase" ? 1 : -1;
      atPlannedEnd.detectable = { absolute: sign * detectable, relative: value === 0 ? 0 : sign * detectable / Math.abs(value), to: value + sign * detectable };
    }
    if (atPlannedEnd.power !== void 0 && atPlannedEnd.power < request.power) {
      notes.push(`The planned ${request.plannedDays} days give ${(atPlannedEnd.power * 100).toFixed(0)}% power, below the planned ${(request.power * 100).toFixed(0)}%.`);
    }
  }
  const headline = diluted ?? triggered;
  let powerByDay;
  if (effect && enrolledPerDay !== void 0 && headline?.duration) {
    const horizon = Math.max(headline.duration.days, request.plannedDays ?? 0);
    const step = horizon <= 21 ? 1 : 7;
    const last = Math.min(30 * step, Math.ceil(horizon / step) * step + step);
    powerByDay = [];
    for (let day = step; day <= last; day += step) {
      const p = powerAt(day * enrolledPerDay * headlineReach, Math.abs(effect.absolute));
      if (p.ok) powerByDay.push({ day, power: p.value });
    }
  }
  return ok({
    baselineValue: value,
    ...probe.value.sd !== void 0 ? { sd: probe.value.sd } : {},
    ...effect ? { effect } : {},
    multipliers: {
      comparisons: treatments.length,
      alphaPerComparison,
      designEffect: de,
      varianceReduction: vr,
      sequential: sequential.value.inflation,
      dilutionUnits,
      dilutionDays
    },
    ...boundaries ? { boundaries: { kind: request.boundary, z: boundaries.z, nominalP: boundaries.nominalP } } : {},
    ...triggered ? { triggered } : {},
    ...diluted ? { diluted } : {},
    ...headline ? { headline } : {},
    ...atPlannedEnd ? { atPlannedEnd } : {},
    ...powerByDay ? { powerByDay } : {},
    notes
  });
}

// src/core/stats/plan-sizing.ts
function baselineOf(metric) {
  if (metric.kind === "proportion") return { kind: "proportion", rate: metric.baseline.rate };
  if (metric.kind === "mean") return { kind: "mean", mean: metric.baseline.mean, sd: metric.baseline.sd };
  return { kind: "ratio", ...metric.baseline };
}
function sizePlan(plan) {
  const { design } = plan;
  const plannedDays = plan.window.start && plan.window.end && plan.window.end >= plan.window.start ? inclusiveDays(plan.window.start, plan.window.end) : void 0;
  const clustered = GROUP_UNITS.includes(plan.unit.randomization) && plan.unit.analysis !== plan.unit.randomization && design.cluster;
  const common = {
    arms: design.arms,
    control: design.control,
    alpha: design.alpha,
    power: design.power,
    trafficShare: design.trafficShare,
    reach: plan.exposure.reach,
    interimLooks: design.interimLooks,
    boundary: design.interimBoundary,
    prePeriodCorrelation: design.prePeriodCorrelation,
    ...design.dailyUnits !== void 0 ? { dailyUnits: design.dailyUnits } : {},
    ...clustered && design.cluster ? { cluster: design.cluster } : {},
    ...plannedDays !== void 0 ? { plannedDays } : {}
  };
  const primary = plan.metrics.primary;
  const entries = [
    {
      metric: primary.name,
      role: "primary",
      kind: primary.kind,
      direction: primary.direction,
      sides: design.sides,
      result: sizeMetric({
        ...common,
        baseline: baselineOf(primary),
        direction: primary.direction,
        sides: design.sides,
        ...design.minDetectableEffect ? { effect: design.minDetectableEffect } : {}
      })
    },
    ...plan.metrics.guardrails.map((metric) => {
      const harm = metric.direction === "increase" ? "decrease" : "increase";
      return {
        metric: metric.name,
        role: "guardrail",
        kind: metric.kind,
        direction: harm,
        sides: 1,
        result: sizeMetric({
          ...common,
          baseline: baselineOf(metric),
          direction: harm,
          sides: 1,
          ...metric.tolerance ? { effect: metric.tolerance } : {}
        })
      };
    })
  ];
  return {
    planId: plan.id,
    ...plannedDays !== void 0 ? { plannedDays } : {},
    ...design.dailyUnits !== void 0 ? { dailyUnits: design.dailyUnits } : {},
    metrics: entries
  };
}

export {
  sizeMetric,
  sizePlan
};
