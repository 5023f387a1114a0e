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

/** Every root of f on [a, b] found by a scan of n sub-intervals and Brent's method in each sign change. */
export function allRoots(f: (x: number) => number, a: number, b: number, n: number): number[] {
  const roots: number[] = [];
  let x0 = a;
  let f0 = f(a);
  if (f0 === 0) roots.push(a);
  for (let i = 1; i <= n; i++) {
    const x1 = a + ((b - a) * i) / n;
    const f1 = f(x1);
    if (f1 === 0) roots.push(x1);
    else if (f0 !== 0 && Number.isFinite(f0) && Number.isFinite(f1) && f0 * f1 < 0) roots.push(brentRoot(f, x0, x1));
    x0 = x1;
    f0 = f1;
  }
  return roots;
}
