/**
 * Brent's method (Brent 1973, "Algorithms for Minimization without Derivatives", ch. 4): a root of
 * f in [lo, hi] where f(lo) and f(hi) differ in sign, to within `tolerance`. Returns undefined when
 * the interval does not bracket a root.
 */
export function findRoot(f: (x: number) => number, lo: number, hi: number, tolerance = 1e-12, maxIterations = 200): number | undefined {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) return undefined;
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) return undefined;
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
      let p: number;
      let q: number;
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
    if (!Number.isFinite(fb)) return undefined;
  }
  return b;
}

/**
 * Finds where an increasing function reaches `target`, starting from a guess: the bracket is
 * widened by doubling (as R's uniroot does with extendInt = "upX") until it holds the root.
 */
export function solveIncreasing(f: (x: number) => number, target: number, guess: number, min: number, max: number, tolerance = 1e-10): number | undefined {
  const g = (x: number) => f(x) - target;
  let lo = Math.max(min, guess / 2);
  let hi = Math.min(max, Math.max(guess * 2, lo * 2));
  while (g(lo) > 0 && lo > min) lo = Math.max(min, lo / 4);
  while (g(hi) < 0 && hi < max) hi = Math.min(max, hi * 4);
  return findRoot(g, lo, hi, tolerance * Math.max(1, Math.abs(guess)));
}
