import { normalCdf, normalQuantile, normalUpper, normalUpperQuantile } from './distributions.js';
import type { BoundaryKind } from './choices.js';
import { findRoot } from './root.js';
import { fail, ok, type StatsResult } from './result.js';

/**
 * Group sequential designs with K analyses at equal information fractions t_k = k/K.
 *
 * Boundary crossing probabilities come from recursive numerical integration of the score
 * process (Armitage, McPherson & Rowe 1969; Jennison & Turnbull 2000, ch. 19): S_k = Z_k * sqrt(t_k)
 * is Brownian motion with drift eta observed at t_k; the sub-density of S_k on the continuation
 * region is carried from look to look on a Simpson grid. No table lookup is involved.
 *
 * Two-sided designs are symmetric and spend alpha/2 on each side. Power counts crossings of the
 * boundary on the side of the effect only (a crossing on the far side stops the test without a
 * win), the convention of Jennison & Turnbull's tables of maximum-sample-size inflation.
 */

export { BOUNDARY_KINDS, type BoundaryKind } from './choices.js';

export interface SequentialDesign {
  kind: BoundaryKind;
  /** Number of analyses, interim looks plus the final one (1 to 30). */
  looks: number;
  alpha: number;
  sides: 1 | 2;
}

export interface SequentialBoundaries {
  /** Critical |Z| at each look. */
  z: number[];
  /** Nominal two-sided (or one-sided) p-value at each look. */
  nominalP: number[];
  /** Type I error spent by each look (both sides together when two-sided). */
  alphaSpent: number[];
}

/** Simpson panels per look: 100 already agrees with 1,200 to 1e-6 in every boundary and inflation factor; 160 leaves margin. */
const PANELS = 160;
/**
 * A boundary this large is never crossed (P(Z > 40) underflows to 0); used where a look spends no
 * alpha at all. Early O'Brien-Fleming-type boundaries reach 10 to 12 with 20 to 30 looks, so the
 * search for a boundary must reach well beyond them.
 */
const NEVER = 40;

interface Grid {
  points: Float64Array;
  weights: Float64Array;
}

function simpsonGrid(lo: number, hi: number): Grid {
  const points = new Float64Array(PANELS + 1);
  const weights = new Float64Array(PANELS + 1);
  const h = (hi - lo) / PANELS;
  for (let i = 0; i <= PANELS; i++) {
    points[i] = lo + i * h;
    weights[i] = (h / 3) * (i === 0 || i === PANELS ? 1 : i % 2 === 1 ? 4 : 2);
  }
  return { points, weights };
}

/** Probabilities of crossing each boundary at each look, for drift eta (0 under the null). */
interface Crossings {
  upper: number[];
  lower: number[];
}

/**
 * Walks the looks. `boundaryAt(k, upperGiven)` chooses look k's boundary; it may ask what crossing a
 * candidate boundary would cost given the looks before
 * (spending functions do).
 */
function walk(
  looks: number,
  sides: 1 | 2,
  eta: number,
  boundaryAt: (k: number, upperGiven: (b: number) => number) => number,
  fractions: readonly number[] = Array.from({ length: looks }, (_, i) => (i + 1) / looks),
): { crossings: Crossings; boundaries: number[] } {
  const upper: number[] = [];
  const lower: number[] = [];
  const boundaries: number[] = [];
  let grid: Grid | undefined;
  let density: Float64Array | undefined;
  let previousT = 0;
  for (let k = 1; k <= looks; k++) {
    const t = fractions[k - 1]!;
    const dt = t - previousT;
    const sdStep = Math.sqrt(dt);
    const mean = eta * dt;
    // P(S_k >= c and continued until k-1), for a boundary c on the S scale.
    const upperMass = (c: number): number => {
      if (!grid || !density) return normalCdf((eta * t - c) / Math.sqrt(t));
      let sum = 0;
      for (let i = 0; i < grid.points.length; i++) sum += grid.weights[i]! * density[i]! * normalCdf((grid.points[i]! + mean - c) / sdStep);
      return sum;
    };
    const lowerMass = (c: number): number => {
      if (!grid || !density) return normalCdf((-c - eta * t) / Math.sqrt(t));
      let sum = 0;
      for (let i = 0; i < grid.points.length; i++) sum += grid.weights[i]! * density[i]! * normalCdf((-c - grid.points[i]! - mean) / sdStep);
      return sum;
    };
    const b = boundaryAt(k, (z) => upperMass(z * Math.sqrt(t)));
    boundaries.push(b);
    const c = b * Math.sqrt(t);
    upper.push(upperMass(c));
    lower.push(sides === 2 ? lowerMass(c) : 0);
    if (k === looks) break;

    // Carry the sub-density of S_k over the continuation region to the next look.
    const floor = sides === 2 ? -c : Math.min(-c, eta * t - 10 * Math.sqrt(t));
    const next = simpsonGrid(floor, c);
    const nextDensity = new Float64Array(next.points.length);
    for (let j = 0; j < next.points.length; j++) {
      const s = next.points[j]!;
      if (!grid || !density) {
        const u = (s - eta * t) / Math.sqrt(t);
        nextDensity[j] = Math.exp(-0.5 * u * u) / Math.sqrt(2 * Math.PI * t);
        continue;
      }
      let sum = 0;
      for (let i = 0; i < grid.points.length; i++) {
        const u = (s - grid.points[i]! - mean) / sdStep;
        sum += grid.weights[i]! * density[i]! * Math.exp(-0.5 * u * u);
      }
      nextDensity[j] = sum / (sdStep * Math.sqrt(2 * Math.PI));
    }
    grid = next;
    density = nextDensity;
    previousT = t;
  }
  return { crossings: { upper, lower }, boundaries };
}

/** Lan & DeMets (1983) spending functions, for a one-sided level a: the share of a spent by information time t. */
export function spentByTime(kind: 'obrien-fleming-spending' | 'pocock-spending', a: number, t: number): number {
  if (t <= 0) return 0;
  if (t >= 1) return a;
  // 2 * (1 - Phi(x)) written as an upper tail, which keeps its digits when it is 1e-20.
  return kind === 'obrien-fleming-spending' ? 2 * normalUpper(normalUpperQuantile(a / 2) / Math.sqrt(t)) : a * Math.log(1 + (Math.E - 1) * t);
}

/**
 * The spending boundary (critical |Z|) at an analysis taken at information fraction `fractions[last]`,
 * after earlier analyses at the other fractions (increasing, in (0, 1]): each analysis spends
 * what the spending function has reached by its fraction, less what the earlier ones spent.
 */
export function spendingBoundaryAt(kind: 'obrien-fleming-spending' | 'pocock-spending', alpha: number, sides: 1 | 2, fractions: readonly number[]): StatsResult<number> {
  if (!(alpha > 0 && alpha < 1)) return fail('alpha', `the significance level must be strictly between 0 and 1; got ${alpha}`);
  if (fractions.length === 0 || fractions.some((t, i) => !(t > 0 && t <= 1) || (i > 0 && !(t > fractions[i - 1]!)))) {
    return fail('information fraction', 'information fractions must increase within (0, 1]');
  }
  const oneSide = alpha / sides;
  const { boundaries } = walk(
    fractions.length,
    sides,
    0,
    (k, upperGiven) => {
      const increment = spentByTime(kind, oneSide, fractions[k - 1]!) - (k > 1 ? spentByTime(kind, oneSide, fractions[k - 2]!) : 0);
      if (increment <= 1e-30) return NEVER;
      return findRoot((b) => upperGiven(b) - increment, 0, NEVER, 1e-12) ?? NEVER;
    },
    fractions,
  );
  return ok(boundaries[boundaries.length - 1]!);
}

function checkDesign(design: SequentialDesign): StatsResult<never> | undefined {
  if (!Number.isInteger(design.looks) || design.looks < 1 || design.looks > 30) return fail('interim-looks', `between 0 and 29 interim looks are supported; got ${design.looks - 1}`);
  if (!(design.alpha > 0 && design.alpha < 1)) return fail('alpha', `the significance level must be strictly between 0 and 1; got ${design.alpha}`);
  return undefined;
}

/** The critical values of a design, computed under the null hypothesis. */
export function sequentialBoundaries(design: SequentialDesign): StatsResult<SequentialBoundaries> {
  const problem = checkDesign(design);
  if (problem) return problem;
  const oneSide = design.alpha / design.sides;
  const { looks } = design;
  let z: number[];

  if (design.kind === 'obrien-fleming-spending' || design.kind === 'pocock-spending') {
    const kind = design.kind;
    z = walk(looks, design.sides, 0, (k, upperGiven) => {
      const increment = spentByTime(kind, oneSide, k / looks) - spentByTime(kind, oneSide, (k - 1) / looks);
      if (!(increment > 0)) return NEVER;
      const root = findRoot((b) => upperGiven(b) - increment, 0, NEVER, 1e-12);
      return root ?? NEVER;
    }).boundaries;
  } else {
    // Classical boundaries: Pocock's is constant on the Z scale, O'Brien & Fleming's is c * sqrt(K / k).
    const shape = (k: number) => (design.kind === 'pocock' ? 1 : Math.sqrt(looks / k));
    const total = (c: number) => {
      const { crossings } = walk(looks, design.sides, 0, (k) => c * shape(k));
      return crossings.upper.reduce((a, b) => a + b, 0);
    };
    const c = findRoot((x) => total(x) - oneSide, normalUpperQuantile(oneSide) * 0.5, NEVER, 1e-12);
    if (c === undefined) return fail('interim-looks', 'no boundary constant found');
    z = Array.from({ length: looks }, (_, i) => c * shape(i + 1));
  }
  const { crossings } = walk(looks, design.sides, 0, (k) => z[k - 1]!);
  return ok({
    z,
    nominalP: z.map((b) => design.sides * normalUpper(b)),
    alphaSpent: crossings.upper.map((u, i) => u + crossings.lower[i]!),
  });
}

/** Power of a design with boundaries `z` when the drift at full information is eta. */
export function sequentialPower(z: readonly number[], sides: 1 | 2, eta: number): number {
  const { crossings } = walk(z.length, sides, eta, (k) => z[k - 1]!);
  return crossings.upper.reduce((a, b) => a + b, 0);
}

export interface SequentialInflation {
  boundaries: SequentialBoundaries;
  /** Maximum sample size of the sequential design over the fixed-sample size, for the same power. */
  inflation: number;
  /** Expected sample size under the alternative, as a share of the fixed-sample size. */
  expectedUnderAlternative: number;
}

/**
 * Designs are few (a handful of boundary kinds, looks and levels) while plans are many, and each
 * design costs tens of milliseconds to integrate; the answers are remembered. Pure: the same
 * inputs always give the same value.
 */
const remembered = new Map<string, StatsResult<SequentialInflation>>();
const REMEMBER_AT_MOST = 256;

/** The maximum-sample-size inflation factor R that keeps `power` (Jennison & Turnbull's R_P and R_B). */
export function sequentialInflation(design: SequentialDesign, power: number): StatsResult<SequentialInflation> {
  const key = `${design.kind}:${design.looks}:${design.alpha}:${design.sides}:${power}`;
  const known = remembered.get(key);
  if (known) return known;
  const computed = integrateInflation(design, power);
  if (remembered.size >= REMEMBER_AT_MOST) remembered.delete(remembered.keys().next().value!);
  remembered.set(key, computed);
  return computed;
}

/** The same as sequentialInflation, always integrated afresh (what the cache saves). */
export function integrateInflation(design: SequentialDesign, power: number): StatsResult<SequentialInflation> {
  if (!(power > design.alpha && power < 1)) return fail('power', `power must be between the significance level and 1; got ${power}`);
  const bounds = sequentialBoundaries(design);
  if (!bounds.ok) return bounds;
  const fixed = normalUpperQuantile(design.alpha / design.sides) + normalQuantile(power);
  if (design.looks === 1) return ok({ boundaries: bounds.value, inflation: 1, expectedUnderAlternative: 1 });
  const eta = findRoot((e) => sequentialPower(bounds.value.z, design.sides, e) - power, fixed * 0.9, fixed * 2, 1e-11);
  if (eta === undefined) return fail('power', 'no design reaches this power');
  const { crossings } = walk(design.looks, design.sides, eta, (k) => bounds.value.z[k - 1]!);
  let continuing = 1;
  let expected = 0;
  for (let k = 0; k < design.looks; k++) {
    const stopHere = crossings.upper[k]! + crossings.lower[k]!;
    expected += ((k + 1) / design.looks) * (k === design.looks - 1 ? continuing : stopHere);
    continuing -= stopHere;
  }
  const inflation = (eta / fixed) ** 2;
  return ok({ boundaries: bounds.value, inflation, expectedUnderAlternative: expected * inflation });
}
