#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  dailyCurve,
  uniqueUnitsCurve,
  unitsAmount
} from "./chunk-6TRXKJK6.js";
import {
  noncentralTUpper,
  normalCdf,
  normalQuantile,
  normalUpper,
  normalUpperQuantile,
  studentQuantile
} from "./chunk-B52SKDPA.js";
import {
  GROUP_UNITS
} from "./chunk-XJ3K7LET.js";
import {
  fail,
  finite,
  ok
} from "./chunk-X2H4NLT2.js";

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

// src/core/stats/adjustments.ts
function designEffect(meanSize, icc, sizeCv = 0) {
  return Math.max(1, 1 + ((sizeCv * sizeCv + 1) * meanSize - 1) * icc);
}
function varianceReduction(rho, coverage = 1) {
  return 1 - coverage * rho * rho;
}
function bonferroniAlpha(alpha, comparisons) {
  return alpha / Math.max(1, comparisons);
}

// src/core/stats/non-inferiority.ts
function check(test) {
  if (!(test.p > 0 && test.p < 1)) return fail("baseline.rate", `a baseline rate must be strictly between 0 and 1; got ${test.p}`);
  if (!(test.alpha > 0 && test.alpha < 1)) return fail("alpha", `the significance level must be strictly between 0 and 1; got ${test.alpha}`);
  if (!(test.ratio > 0)) return fail("ratio", `the allocation ratio must be above 0; got ${test.ratio}`);
  return void 0;
}
var spread = (test) => Math.sqrt(test.p * (1 - test.p) * (1 + 1 / test.ratio));
function nonInferiorityProportionSize(test, margin, power) {
  const problem = check(test);
  if (problem) return problem;
  if (!(margin > 0)) return fail("tolerance", "the tolerance must be above 0");
  if (!(power > test.alpha && power < 1)) return fail("power", `power must be between the significance level and 1; got ${power}`);
  const z = normalUpperQuantile(test.alpha) + normalQuantile(power);
  return finite((z * spread(test) / margin) ** 2, "tolerance", "the sample size");
}
function nonInferiorityProportionPower(test, margin, n1) {
  const problem = check(test);
  if (problem) return problem;
  if (!(n1 > 0)) return fail("n", `the sample size must be above 0; got ${n1}`);
  return finite(normalCdf(Math.sqrt(n1) * margin / spread(test) - normalUpperQuantile(test.alpha)), "n", "power");
}
function nonInferiorityProportionMargin(test, n1, power) {
  const problem = check(test);
  if (problem) return problem;
  if (!(n1 > 0)) return fail("n", `the sample size must be above 0; got ${n1}`);
  const z = normalUpperQuantile(test.alpha) + normalQuantile(power);
  return finite(z * spread(test) / Math.sqrt(n1), "n", "the detectable margin");
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
function criticalZ(settings) {
  return normalUpperQuantile(settings.alpha / settings.sides);
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
  if (test.method === "normal") return normalCdf(shift - criticalZ(test));
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
  const z = criticalZ(test) + normalQuantile(power);
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
  const z = criticalZ(settings) + normalQuantile(power);
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
  const z = criticalZ(test);
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
  const za = criticalZ(test);
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
var NEVER = 40;
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
function walk(looks, sides, eta, boundaryAt, fractions = Array.from({ length: looks }, (_, i) => (i + 1) / looks)) {
  const upper = [];
  const lower = [];
  const boundaries = [];
  let grid;
  let density;
  let previousT = 0;
  for (let k = 1; k <= looks; k++) {
    const t = fractions[k - 1];
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
  return kind === "obrien-fleming-spending" ? 2 * normalUpper(normalUpperQuantile(a / 2) / Math.sqrt(t)) : a * Math.log(1 + (Math.E - 1) * t);
}
function spendingBoundaryAt(kind, alpha, sides, fractions) {
  if (!(alpha > 0 && alpha < 1)) return fail("alpha", `the significance level must be strictly between 0 and 1; got ${alpha}`);
  if (fractions.length === 0 || fractions.some((t, i) => !(t > 0 && t <= 1) || i > 0 && !(t > fractions[i - 1]))) {
    return fail("information fraction", "information fractions must increase within (0, 1]");
  }
  const oneSide = alpha / sides;
  const { boundaries } = walk(
    fractions.length,
    sides,
    0,
    (k, upperGiven) => {
      const increment = spentByTime(kind, oneSide, fractions[k - 1]) - (k > 1 ? spentByTime(kind, oneSide, fractions[k - 2]) : 0);
      if (increment <= 1e-30) return NEVER;
      return findRoot((b) => upperGiven(b) - increment, 0, NEVER, 1e-12) ?? NEVER;
    },
    fractions
  );
  return ok(boundaries[boundaries.length - 1]);
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
      if (!(increment > 0)) return NEVER;
      const root = findRoot((b) => upperGiven(b) - increment, 0, NEVER, 1e-12);
      return root ?? NEVER;
    }).boundaries;
  } else {
    const shape = (k) => design.kind === "pocock" ? 1 : Math.sqrt(looks / k);
    const total = (c2) => {
      const { crossings: crossings2 } = walk(looks, design.sides, 0, (k) => c2 * shape(k));
      return crossings2.upper.reduce((a, b) => a + b, 0);
    };
    const c = findRoot((x) => total(x) - oneSide, normalUpperQuantile(oneSide) * 0.5, NEVER, 1e-12);
    if (c === void 0) return fail("interim-looks", "no boundary constant found");
    z = Array.from({ length: looks }, (_, i) => c * shape(i + 1));
  }
  const { crossings } = walk(looks, design.sides, 0, (k) => z[k - 1]);
  return ok({
    z,
    nominalP: z.map((b) => design.sides * normalUpper(b)),
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
  const fixed = normalUpperQuantile(design.alpha / design.sides) + normalQuantile(power);
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
function rangeOf(kind) {
  return kind === "proportion" ? { low: 0, high: 1, text: "0\u2013100%" } : void 0;
}
function enrolledText(expected) {
  if (expected < 1) return `fewer than 1 unit (${unitsAmount(expected)} expected)`;
  const whole = Math.floor(expected);
  return `${unitsAmount(whole)} ${whole === 1 ? "unit" : "units"}`;
}
var ABSURD_UNITS = 1e12;
var DEFAULT_LONGEST_DAYS = 56;
function comparisonFor(request, ratio, alpha, method) {
  const settings = { alpha, sides: request.sides, ratio };
  const sign = request.direction === "increase" ? 1 : -1;
  const { baseline } = request;
  if (baseline.kind === "proportion") {
    const p1 = baseline.rate;
    if (!(p1 > 0 && p1 < 1)) return fail("baseline.rate", `a baseline rate must be strictly between 0 and 1; got ${p1}`);
    if (request.hypothesis === "non-inferiority") {
      const test = { p: p1, alpha, ratio };
      return ok({
        value: p1,
        controlUnits: (d) => nonInferiorityProportionSize(test, d, request.power),
        power: (d, n1) => nonInferiorityProportionPower(test, d, n1),
        detectable: (n1) => nonInferiorityProportionMargin(test, n1, request.power)
      });
    }
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
function chooseMethod(request, normal, enrolledAtEnd) {
  if (request.method === "normal" || request.method === "exact") return request.method;
  if (request.baseline.kind === "proportion") return "normal";
  let n1;
  if (request.effect) {
    const d = effectIn(request.effect, normal.value, request.baseline.kind);
    const size = d.ok ? normal.controlUnits(d.value * request.reach) : void 0;
    n1 = size?.ok ? size.value : void 0;
  } else if (enrolledAtEnd !== void 0) {
    n1 = enrolledAtEnd;
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
  const coverage = request.prePeriodCoverage ?? 1;
  if (!(coverage > 0 && coverage <= 1)) return fail("pre-period.coverage", `the share of units with a pre-period value must be in (0, 1]; got ${coverage}`);
  const curve = request.uniqueUnits ? uniqueUnitsCurve(request.uniqueUnits) : request.dailyUnits !== void 0 ? dailyCurve(request.dailyUnits) : void 0;
  if (curve && !curve.ok) return curve;
  const traffic = curve?.value;
  const longestDays = request.longestDays ?? DEFAULT_LONGEST_DAYS;
  const totalWeight = request.arms.reduce((s, a) => s + a.weight, 0);
  const alphaPerComparison = request.armCorrection === false ? request.alpha : bonferroniAlpha(request.alpha, treatments.length);
  const sequential = request.interimLooks > 0 ? sequentialInflation({ kind: request.boundary, looks: request.interimLooks + 1, alpha: alphaPerComparison, sides: request.sides }, request.power) : ok({ inflation: 1, boundaries: void 0 });
  if (!sequential.ok) return sequential;
  const boundaries = sequential.value.boundaries;
  const de = request.cluster ? designEffect(request.cluster.meanSize, request.cluster.icc, request.cluster.sizeCv) : 1;
  const vr = varianceReduction(request.prePeriodCorrelation, coverage);
  const inflate = de * vr * sequential.value.inflation;
  const enrolledBy = traffic ? (day) => traffic.unitsBy(day) * request.trafficShare : void 0;
  const enrolledPerDay = enrolledBy?.(1);
  const probe = comparisonFor(request, 1, alphaPerComparison, "normal");
  if (!probe.ok) return probe;
  const method = chooseMethod(request, probe.value, request.plannedDays !== void 0 && enrolledBy ? enrolledBy(request.plannedDays) : void 0);
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
  const sizeFromTotal = (total, reachShare) => {
    let perArm = request.arms.map((a) => ({ arm: a.name, units: Math.max(2, units(total * a.weight / totalWeight)) }));
    let clustersPerArm;
    if (request.cluster) {
      const groups = wholeGroupsPerArm(perArm, request.cluster.meanSize, alphaPerComparison, request.sides, request.power);
      clustersPerArm = groups;
      perArm = groups.map((g) => ({ arm: g.arm, units: units(g.groups * request.cluster.meanSize) }));
    }
    const totalUnits = perArm.reduce((s, a) => s + a.units, 0);
    const day = traffic && reachShare !== void 0 && totalUnits < ABSURD_UNITS ? traffic.dayFor(totalUnits / (request.trafficShare * reachShare)) : void 0;
    const duration = day === void 0 ? void 0 : { days: day, weeks: Math.ceil(day / 7) };
    return {
      perArm,
      totalUnits,
      ...clustersPerArm ? { clusters: clustersPerArm.reduce((s, g) => s + g.groups, 0), clustersPerArm } : {},
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
    triggered = sizeFromTotal(trig.value, traffic ? request.reach : void 0);
    if (dilutedAnalysis) {
      const dil = totalFor(d.value * request.reach);
      if (!dil.ok) return dil;
      diluted = sizeFromTotal(dil.value, traffic ? 1 : void 0);
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
  const range = rangeOf(request.baseline.kind);
  const detectableAt = (expected) => {
    const within = range ? `no change within ${range.text}` : "no change";
    const none = { ok: false, reason: `${within} is detectable with ${enrolledText(expected)}` };
    const n1 = controlAt(Math.floor(expected));
    if (!(n1 > 0)) return none;
    let detectable = 0;
    for (const c of comparisons) {
      const dd = c.detectable(n1);
      if (!dd.ok) return dd.error.input === "n" ? none : { ok: false, reason: dd.error.message };
      detectable = Math.max(detectable, dd.value / headlineScale);
    }
    const sign = request.direction === "increase" ? 1 : -1;
    const to = value + sign * detectable;
    if (range && !(to >= range.low && to <= range.high)) return none;
    return { ok: true, value: { absolute: sign * detectable, relative: value === 0 ? 0 : sign * detectable / Math.abs(value), to } };
  };
  let atPlannedEnd;
  if (request.plannedDays !== void 0 && enrolledBy && !request.sampleSizeOnly) {
    const expected = enrolledBy(request.plannedDays) * headlineReach;
    const totalUnits = Math.floor(expected);
    atPlannedEnd = { days: request.plannedDays, totalUnits };
    if (effect) {
      const p = totalUnits > 0 ? powerAt(totalUnits, Math.abs(effect.absolute)) : void 0;
      if (p?.ok) atPlannedEnd.power = p.value;
      else atPlannedEnd.noPower = p && p.error.input !== "n" ? { reason: p.error.message } : { reason: `${enrolledText(expected)} by then, too few to analyse`, tooFewUnits: true };
    }
    const detectable = detectableAt(expected);
    if (detectable.ok) atPlannedEnd.detectable = detectable.value;
    else atPlannedEnd.noneDetectable = { reason: detectable.reason };
  }
  const headline = diluted ?? triggered;
  const available = request.cluster?.available;
  if (headline?.clusters !== void 0 && available !== void 0 && headline.clusters > available) {
    notes.push(`The design needs ${headline.clusters.toLocaleString("en-US")} groups, but only ${available.toLocaleString("en-US")} exist: plan for a larger effect, a pre-period adjustment, or a smaller randomization unit.`);
  }
  let powerByDay;
  if (effect && enrolledBy && headline?.duration && !request.sampleSizeOnly) {
    const horizon = Math.max(headline.duration.days, request.plannedDays ?? 0);
    const step = horizon <= 21 ? 1 : 7;
    const last = Math.min(30 * step, Math.ceil(horizon / step) * step + step);
    powerByDay = [];
    for (let day = step; day <= last; day += step) {
      const p = powerAt(enrolledBy(day) * headlineReach, Math.abs(effect.absolute));
      if (p.ok) powerByDay.push({ day, power: p.value });
    }
  }
  let feasibility;
  if (headline) {
    const tooMany = headline.totalUnits >= ABSURD_UNITS;
    const tooLong = enrolledBy !== void 0 && (headline.duration === void 0 || headline.duration.days > longestDays);
    if (tooMany || tooLong) {
      const reason = tooMany ? `it needs more than ${ABSURD_UNITS.toExponential(0).replace("e+", " \xD7 10^")} units` : headline.duration ? `it needs ${unitsAmount(headline.duration.days)} days, beyond the longest sensible window of ${longestDays} days` : `the traffic never reaches its sample`;
      const atLongest = enrolledBy && !request.sampleSizeOnly ? detectableAt(enrolledBy(longestDays) * headlineReach) : void 0;
      feasibility = {
        feasible: false,
        longestDays,
        reason,
        ...atLongest ? atLongest.ok ? { detectableAtLongest: atLongest.value } : { noneDetectableAtLongest: { reason: atLongest.reason } } : {}
      };
    } else feasibility = { feasible: true, longestDays };
  }
  let squareRootAllocation;
  const k = treatments.length;
  if (k >= 2 && headline && !request.cluster && !request.sampleSizeOnly) {
    const treatmentWeight = treatments.reduce((s, a) => s + a.weight, 0) / k;
    const controlWeight = Math.sqrt(k) * treatmentWeight;
    if (Math.abs(control.weight / treatmentWeight - Math.sqrt(k)) > 0.05) {
      const better = sizeMetric({ ...request, arms: [{ name: control.name, weight: controlWeight }, ...treatments.map((a) => ({ name: a.name, weight: treatmentWeight }))] });
      const betterHeadline = better.ok ? better.value.headline : void 0;
      if (betterHeadline && betterHeadline.totalUnits < headline.totalUnits) {
        squareRootAllocation = { controlWeight, treatmentWeight, totalUnits: betterHeadline.totalUnits, unitsSaved: headline.totalUnits - betterHeadline.totalUnits };
      }
    }
  }
  return ok({
    baselineValue: value,
    ...probe.value.sd !== void 0 ? { sd: probe.value.sd } : {},
    ...effect ? { effect } : {},
    multipliers: {
      comparisons: request.armCorrection === false ? 1 : treatments.length,
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
    ...traffic ? { traffic: traffic.source } : {},
    ...feasibility ? { feasibility } : {},
    ...squareRootAllocation ? { squareRootAllocation } : {},
    notes
  });
}
function wholeGroupsPerArm(perArm, meanSize, alpha, sides, power) {
  const zSum = normalUpperQuantile(alpha / sides) + normalQuantile(power);
  let groups = perArm.map((a) => ({ arm: a.arm, groups: Math.max(2, Math.ceil(a.units / meanSize - 1e-9)) }));
  for (let round = 0; round < 50; round++) {
    const df = groups.reduce((s, g) => s + g.groups, 0) - 2;
    const tSum = studentQuantile(1 - alpha / sides, df) + studentQuantile(power, df);
    const factor = (tSum / zSum) ** 2;
    const next = perArm.map((a) => ({ arm: a.arm, groups: Math.max(2, Math.ceil(a.units * factor / meanSize - 1e-9)) }));
    if (next.every((g, i) => g.groups === groups[i].groups)) return next;
    groups = next;
  }
  return groups;
}

// src/core/stats/plan-sizing.ts
var DEFAULT_SIZING_POLICY = { guardrailAlpha: 0.05, guardrailPower: 0.8, guardrailArmCorrection: false, longestDays: DEFAULT_LONGEST_DAYS };
function baselineOf(metric) {
  if (metric.kind === "proportion") return { kind: "proportion", rate: metric.baseline.rate };
  if (metric.kind === "mean") return { kind: "mean", mean: metric.baseline.mean, sd: metric.baseline.sd };
  return { kind: "ratio", ...metric.baseline };
}
function prePeriodOf(metric, plan, role) {
  if (metric.prePeriod) return { prePeriodCorrelation: metric.prePeriod.correlation, prePeriodCoverage: metric.prePeriod.coverage };
  return { prePeriodCorrelation: role === "primary" ? plan.design.prePeriodCorrelation : 0, prePeriodCoverage: 1 };
}
function sizePlan(plan, policy = DEFAULT_SIZING_POLICY, options = {}) {
  const { design } = plan;
  const plannedDays = plan.window.start && plan.window.end && plan.window.end >= plan.window.start ? inclusiveDays(plan.window.start, plan.window.end) : void 0;
  const clustered = GROUP_UNITS.includes(plan.unit.randomization) && plan.unit.analysis !== plan.unit.randomization && design.cluster;
  const common = {
    arms: design.arms,
    control: design.control,
    trafficShare: design.trafficShare,
    reach: plan.exposure.reach,
    interimLooks: design.interimLooks,
    boundary: design.interimBoundary,
    longestDays: policy.longestDays,
    ...options.sampleSizeOnly ? { sampleSizeOnly: true } : {},
    ...design.dailyUnits !== void 0 ? { dailyUnits: design.dailyUnits } : {},
    ...design.uniqueUnits ? { uniqueUnits: design.uniqueUnits } : {},
    ...clustered && design.cluster ? { cluster: { ...design.cluster, ...design.groupsAvailable !== void 0 ? { available: design.groupsAvailable } : {} } } : {},
    ...plannedDays !== void 0 ? { plannedDays } : {}
  };
  const primary = plan.metrics.primary;
  const primaryAlpha = primary.alpha ?? design.alpha;
  const primaryPower = primary.power ?? design.power;
  const analyses = design.interimLooks + 1;
  const entries = [
    {
      metric: primary.name,
      role: "primary",
      kind: primary.kind,
      direction: primary.direction,
      sides: design.sides,
      alpha: primaryAlpha,
      power: primaryPower,
      result: sizeMetric({
        ...common,
        ...prePeriodOf(primary, plan, "primary"),
        alpha: primaryAlpha,
        power: primaryPower,
        baseline: baselineOf(primary),
        direction: primary.direction,
        sides: design.sides,
        ...design.minDetectableEffect ? { effect: design.minDetectableEffect } : {}
      })
    },
    ...plan.metrics.guardrails.map((metric) => {
      const harm = metric.direction === "increase" ? "decrease" : "increase";
      const alpha = metric.alpha ?? policy.guardrailAlpha;
      const power = metric.power ?? policy.guardrailPower;
      return {
        metric: metric.name,
        role: "guardrail",
        kind: metric.kind,
        direction: harm,
        sides: 1,
        alpha,
        power,
        ...analyses > 1 ? { guardrailLooks: { looks: analyses, falseAlarm: falseAlarmAtSomeLook(analyses, alpha) } } : {},
        result: sizeMetric({
          ...common,
          ...prePeriodOf(metric, plan, "guardrail"),
          interimLooks: 0,
          alpha,
          power,
          hypothesis: "non-inferiority",
          armCorrection: policy.guardrailArmCorrection,
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
    ...design.uniqueUnits ? { uniqueUnits: design.uniqueUnits } : {},
    metrics: entries,
    ...familyOf(entries)
  };
}
var falseAlarms = /* @__PURE__ */ new Map();
function falseAlarmAtSomeLook(looks, alpha) {
  const key = `${looks}:${alpha}`;
  let chance = falseAlarms.get(key);
  if (chance === void 0) {
    chance = sequentialPower(Array.from({ length: looks }, () => normalUpperQuantile(alpha)), 1, 0);
    if (falseAlarms.size >= 1e3) falseAlarms.clear();
    falseAlarms.set(key, chance);
  }
  return chance;
}
function familyOf(entries) {
  const [primary, ...guardrails] = entries;
  if (!primary?.result.ok || guardrails.length === 0) return {};
  const omitted = (reason) => ({ familyOmitted: { reason } });
  const powerOf = (entry, sizing) => {
    const end = sizing.atPlannedEnd;
    if (!end) return entry.power;
    return end.power ?? `${entry.metric} has no power by the planned end; ${end.noPower?.reason ?? "it could not be computed"}`;
  };
  if (!primary.result.value.effect) return omitted(`the primary metric ${primary.metric} has no minimum detectable effect`);
  const primaryPower = powerOf(primary, primary.result.value);
  if (typeof primaryPower === "string") return omitted(primaryPower);
  let noFalseAlarm = 1;
  let allClear = 1;
  for (const g of guardrails) {
    if (!g.result.ok) return omitted(`guardrail ${g.metric} cannot be sized`);
    if (!g.result.value.effect) return omitted(`guardrail ${g.metric} has no tolerance, so the harm it must rule out is not known`);
    noFalseAlarm *= 1 - (g.guardrailLooks?.falseAlarm ?? g.alpha);
    const power = powerOf(g, g.result.value);
    if (typeof power === "string") return omitted(power);
    allClear *= power;
  }
  return { family: { primaryPower, noFalseAlarm: primaryPower * noFalseAlarm, allGuardrailsClear: primaryPower * allClear } };
}

// src/core/plan/number-rules.ts
var METRIC_FIGURE = { min: 1e-12, max: 1e15, why: "a figure from 1e-12 to 1e15 in size (or 0 where 0 is allowed)" };
var RELATIVE_EFFECT = { min: 1e-6, max: 100, why: "a relative change from 0.000001 to 100 (one in a million to a 101-fold change)" };
var DAILY_UNITS = { min: 0.01, max: 1e10, why: "from 0.01 (one unit in a hundred days) to 10,000,000,000 (more than the world\u2019s population)" };
var ARM_WEIGHT = { min: 1e-6, max: 1e6, why: "a weight from 0.000001 to 1,000,000" };
var SMALLEST_ARM_SHARE = 1e-3;
var CLUSTER_MEAN_SIZE = { min: 1, max: 1e7, why: "a mean group size from 1 to 10,000,000" };
var CLUSTER_SIZE_CV = { min: 0, max: 10, why: "a coefficient of variation of group sizes from 0 to 10" };
function checkBound(report, path, value, bound, zeroAllowed = false) {
  if (value === void 0) return;
  const size = Math.abs(value);
  if (zeroAllowed && value === 0) return;
  if (size >= bound.min && size <= bound.max) return;
  report({
    severity: "error",
    code: "plan/number-out-of-range",
    path,
    message: `${value} is ${size < bound.min ? "too small" : "too large"} for sizing to give a meaningful figure`,
    expected: bound.why
  });
}
function metricFigures(metric, path, report) {
  const baseline = [...path, "baseline"];
  if (metric.kind === "mean") {
    checkBound(report, [...baseline, "mean"], metric.baseline.mean, METRIC_FIGURE, true);
    checkBound(report, [...baseline, "sd"], metric.baseline.sd, METRIC_FIGURE);
  }
  if (metric.kind === "ratio") {
    for (const part of ["numerator", "denominator"]) {
      checkBound(report, [...baseline, part, "mean"], metric.baseline[part].mean, METRIC_FIGURE, true);
      checkBound(report, [...baseline, part, "sd"], metric.baseline[part].sd, METRIC_FIGURE, true);
    }
  }
  if (metric.tolerance) effectFigures(metric.tolerance, [...path, "tolerance"], report);
}
function effectFigures(effect, path, report) {
  checkBound(report, [...path, "relative"], effect.relative, RELATIVE_EFFECT);
  checkBound(report, [...path, "absolute"], effect.absolute, METRIC_FIGURE);
}
function numbersInRange(plan, report) {
  const { design } = plan;
  checkBound(report, ["design", "daily-units"], design.dailyUnits, DAILY_UNITS);
  if (design.minDetectableEffect) effectFigures(design.minDetectableEffect, ["design", "min-detectable-effect"], report);
  design.arms.forEach((arm, i) => checkBound(report, ["design", "arms", i, "weight"], arm.weight, ARM_WEIGHT));
  const total = design.arms.reduce((sum, arm) => sum + arm.weight, 0);
  const smallest = design.arms.reduce((min, arm, i) => arm.weight < design.arms[min].weight ? i : min, 0);
  if (design.arms.length > 0 && Number.isFinite(total) && design.arms[smallest].weight / total < SMALLEST_ARM_SHARE) {
    report({
      severity: "error",
      code: "plan/number-out-of-range",
      path: ["design", "arms", smallest, "weight"],
      message: `arm "${design.arms[smallest].name}" gets ${design.arms[smallest].weight} of ${total} weight, less than one unit in ${1 / SMALLEST_ARM_SHARE}`,
      expected: `a weight giving every arm at least ${SMALLEST_ARM_SHARE * 100}% of the units`
    });
  }
  if (design.cluster) {
    checkBound(report, ["design", "cluster", "mean-size"], design.cluster.meanSize, CLUSTER_MEAN_SIZE);
    checkBound(report, ["design", "cluster", "size-cv"], design.cluster.sizeCv, CLUSTER_SIZE_CV, true);
  }
  metricFigures(plan.metrics.primary, ["metrics", "primary"], report);
  plan.metrics.guardrails.forEach((m, i) => metricFigures(m, ["metrics", "guardrails", i], report));
  plan.metrics.secondary.forEach((m, i) => metricFigures(m, ["metrics", "secondary", i], report));
}
function sizeable(plan, report) {
  const sizing = sizePlan({ ...plan, design: { ...plan.design, interimLooks: 0 } }, DEFAULT_SIZING_POLICY, { sampleSizeOnly: true });
  for (const entry of sizing.metrics) {
    if (entry.result.ok) continue;
    const { input, message } = entry.result.error;
    const guardrail = plan.metrics.guardrails.findIndex((m) => m.name === entry.metric);
    if (entry.role !== "primary" && guardrail < 0) continue;
    const metricPath = entry.role === "primary" ? ["metrics", "primary"] : ["metrics", "guardrails", guardrail];
    const effectPath = entry.role === "primary" ? ["design", "min-detectable-effect"] : [...metricPath, "tolerance"];
    let path;
    if (input === "effect") path = effectPath;
    else if (input === "baseline" || input.startsWith("baseline.")) path = [...metricPath, ...input.split(".")];
    if (!path) continue;
    const metric = entry.role === "primary" ? plan.metrics.primary : plan.metrics.guardrails[guardrail];
    const effect = entry.role === "primary" ? plan.design.minDetectableEffect : metric.tolerance;
    report({
      severity: "error",
      code: "plan/cannot-be-sized",
      path,
      message: `${entry.metric} cannot be sized: ${message}`,
      expected: input === "effect" ? expectedEffect(metric, effect, entry.direction) : expectedBaseline(metric, input)
    });
  }
}
var short = (x) => String(Number(x.toPrecision(4)));
function expectedEffect(metric, effect, direction) {
  if (!effect) return "an effect, relative or absolute";
  if (metric.kind === "proportion") {
    const rate = metric.baseline.rate;
    const room = direction === "increase" ? 1 - rate : rate;
    const change = effect.absolute ?? (effect.relative ?? 0) * rate;
    if (change >= room) {
      return `an effect that keeps the rate inside (0, 1): ${direction === "increase" ? "a rise" : "a fall"} of less than ${short(room)} absolute here (from ${short(rate)}), or less than ${short(room / rate)} relative`;
    }
  }
  const baseline = metric.kind === "mean" ? metric.baseline.mean : metric.kind === "ratio" ? metric.baseline.numerator.mean / metric.baseline.denominator.mean : void 0;
  if (baseline === 0 && effect.absolute === void 0) {
    return `an absolute effect in the metric's own units, as in { absolute: 0.5 }: a relative change of a baseline of 0 is 0`;
  }
  return "an effect above 0 that sizing can use, relative or absolute";
}
function expectedBaseline(metric, input) {
  if (metric.kind === "ratio" && input === "baseline") {
    return "a numerator and denominator that do not move in perfect step: a correlation below 1, or standard deviations not in the proportion of the means";
  }
  if (input.endsWith(".sd")) return "a standard deviation above 0";
  if (input === "baseline.denominator.mean") return "a denominator's mean above 0";
  if (input === "baseline.correlation") return "a correlation from -1 to 1";
  if (input === "baseline.rate") return "a rate strictly between 0 and 1";
  return "baseline figures sizing can use";
}
var numbersAreSizeable = ({ value: plan, report }) => {
  let outOfRange = 0;
  numbersInRange(plan, (problem) => {
    outOfRange++;
    report(problem);
  });
  if (outOfRange === 0) sizeable(plan, report);
};
var NUMBER_RULES = [numbersAreSizeable];

export {
  addDays,
  daysBetween,
  inclusiveDays,
  spendingBoundaryAt,
  sequentialBoundaries,
  sizeMetric,
  sizePlan,
  DAILY_UNITS,
  NUMBER_RULES
};
