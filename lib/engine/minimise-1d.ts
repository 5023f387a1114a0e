/** A minimum found by minimiseOnRange: where it is and the value there. */
export interface Minimum {
  readonly x: number;
  readonly value: number;
}

const BIG = 1e300;
const GOLD = (3 - Math.sqrt(5)) / 2;

/**
 * Brent's method for a local minimum of f on [a, b]: golden-section steps safeguarding parabolic
 * interpolation (R. P. Brent, Algorithms for Minimization without Derivatives, 1973, ch. 5). Values that
 * are not finite count as 1e300, so the parabola is rejected near them and the golden section continues.
 */
export function brentMinimum(f: (x: number) => number, a0: number, b0: number, relTol = 1e-10, maxIter = 100): Minimum {
  const g = (x: number): number => {
    const v = f(x);
    return Number.isFinite(v) ? v : BIG;
  };
  let a = Math.min(a0, b0);
  let b = Math.max(a0, b0);
  let x = a + GOLD * (b - a);
  let w = x;
  let v = x;
  let fx = g(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let iter = 0; iter < maxIter; iter++) {
    const m = 0.5 * (a + b);
    const tol = relTol * Math.abs(x) + 1e-300;
    const t2 = 2 * tol;
    if (Math.abs(x - m) <= t2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      if (Math.abs(p) < Math.abs(0.5 * q * e) && p > q * (a - x) && p < q * (b - x)) {
        e = d;
        d = p / q;
        const u = x + d;
        if (u - a < t2 || b - u < t2) d = x < m ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < m ? b : a) - x;
      d = GOLD * e;
    }
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = g(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, value: fx >= BIG ? Infinity : fx };
}

/**
 * The least value of f on [lo, hi]: a scan of `samples` evenly spaced points (ends included) picks the
 * basin, then Brent's method within the neighbouring samples; a minimum at an end of the range is taken
 * exactly there. A function with several minima narrower than the sample spacing can be misjudged: the
 * scan only chooses the basin.
 */
export function minimiseOnRange(f: (x: number) => number, lo: number, hi: number, samples: number, relTol = 1e-10): Minimum {
  if (!(hi > lo)) return { x: lo, value: f(lo) };
  const xs: number[] = [];
  const fs: number[] = [];
  let best = 0;
  for (let i = 0; i < samples; i++) {
    const x = i === samples - 1 ? hi : lo + ((hi - lo) * i) / (samples - 1);
    xs.push(x);
    fs.push(f(x));
    if (fs[i] < fs[best] || !Number.isFinite(fs[best])) best = i;
  }
  if (!Number.isFinite(fs[best])) return { x: xs[best], value: Infinity };
  const atEnd = best === 0 || best === samples - 1;
  if (atEnd) {
    // A minimum at an end (a rate rising across the whole range): checked just inside before any search.
    const inward = best === 0 ? 1 : -1;
    const near = xs[best] + inward * 1e-6 * (hi - lo);
    if (f(near) >= fs[best]) return { x: xs[best], value: fs[best] };
  }
  const m = brentMinimum(f, xs[Math.max(0, best - 1)], xs[Math.min(samples - 1, best + 1)], relTol);
  return m.value < fs[best] ? m : { x: xs[best], value: fs[best] };
}

/**
 * Golden-section search for the minimum of f on [lo, hi] (f unimodal there), until the interval is at
 * most `width(a, b)` or `maxIter` steps; `stop` ends it early at a point that is already good enough.
 */
export function goldenSection(
  f: (x: number) => number,
  lo: number,
  hi: number,
  opts: { maxIter: number; width: (a: number, b: number) => number; stop?: (fx: number) => boolean },
): number {
  const r = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - r * (b - a);
  let d = a + r * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let k = 0; k < opts.maxIter && b - a > opts.width(a, b); k++) {
    if (opts.stop?.(fc)) return c;
    if (opts.stop?.(fd)) return d;
    if (fc <= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - r * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + r * (b - a);
      fd = f(d);
    }
  }
  return fc <= fd ? c : d;
}
