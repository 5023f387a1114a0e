import { goldenSection } from "./minimise-1d";

/**
 * Brent's method for a root of f in [a, b] where f(a) and f(b) differ in sign
 * (Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4).
 */
export function brentRoot(f: (x: number) => number, a0: number, b0: number, tol = 1e-14, maxIter = 200): number {
  let a = a0;
  let b = b0;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIter; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/**
 * Every root of f on [a, b] found by a scan of n sub-intervals and Brent's method in each sign change.
 * Two roots within one sub-interval leave no sign change (an adiabatic stirred tank's middle and ignited
 * states at a small volume lie that close): above the first root found by a sign change, where samples
 * of one sign have an interior local minimum of |f|, |f| is minimised between the neighbouring samples,
 * and a minimum across zero gives both roots. Below that first root nothing more is sought, so the
 * lowest root stays the first sign change (the robustness rating's lean scan, outlet-rating.ts, relies
 * on that).
 */
export function allRoots(f: (x: number) => number, a: number, b: number, n: number): number[] {
  const roots: number[] = [];
  const xs = new Float64Array(n + 1);
  const fs = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) {
    xs[i] = i === 0 ? a : a + ((b - a) * i) / n;
    fs[i] = f(xs[i]);
  }
  if (fs[0] === 0) roots.push(a);
  for (let i = 1; i <= n; i++) {
    const f0 = fs[i - 1];
    const f1 = fs[i];
    if (f1 === 0) roots.push(xs[i]);
    else if (f0 !== 0 && Number.isFinite(f0) && Number.isFinite(f1) && f0 * f1 < 0) roots.push(brentRoot(f, xs[i - 1], xs[i]));
  }
  if (roots.length === 0) return roots;
  const lowest = Math.min(...roots);
  for (let i = 1; i < n; i++) {
    if (xs[i - 1] < lowest) continue;
    const [fl, fm, fr] = [fs[i - 1], fs[i], fs[i + 1]];
    if (!(Number.isFinite(fl) && Number.isFinite(fm) && Number.isFinite(fr))) continue;
    const sign = Math.sign(fm);
    if (sign === 0 || Math.sign(fl) !== sign || Math.sign(fr) !== sign) continue;
    if (!(Math.abs(fm) <= Math.abs(fl) && Math.abs(fm) <= Math.abs(fr))) continue;
    const g = (x: number) => sign * f(x);
    const xm = goldenMinimum(g, xs[i - 1], xs[i + 1]);
    if (!(g(xm) < 0)) continue;
    roots.push(brentRoot(f, xs[i - 1], xm), brentRoot(f, xm, xs[i + 1]));
  }
  return roots.sort((p, q) => p - q);
}

/** The minimum of g on [lo, hi] by golden-section search to round-off of the interval (g unimodal there). */
function goldenMinimum(g: (x: number) => number, lo: number, hi: number): number {
  // Stop early once the minimum is below zero: two roots are then bracketed.
  return goldenSection(g, lo, hi, { maxIter: 200, width: (a, b) => 4 * Number.EPSILON * Math.max(Math.abs(a), Math.abs(b), 1e-300), stop: (v) => v < 0 });
}
