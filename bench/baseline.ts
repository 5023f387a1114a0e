/**
 * A straightforward optimiser to compare against: for each sequence separately, cyclic golden-section
 * searches on the intermediate conversions, with adaptive Simpson quadrature; the tolerances are tightened
 * until the volumes agree to 1e-4 relative. Isothermal liquid power law in A only (enough for the benchmark).
 */

export interface BaselineCase {
  fa0: number;
  ca0: number;
  k: number;
  order: number;
  target: number;
  maxStages: number;
}

type Type = "CSTR" | "PFR";

function simpson(f: (x: number) => number, a: number, b: number, tol: number): number {
  const fa = f(a);
  const fb = f(b);
  const m = 0.5 * (a + b);
  const fm = f(m);
  const whole = ((b - a) / 6) * (fa + 4 * fm + fb);
  const rec = (a: number, b: number, fa: number, fm: number, fb: number, whole: number, tol: number, depth: number): number => {
    const m = 0.5 * (a + b);
    const lm = 0.5 * (a + m);
    const rm = 0.5 * (m + b);
    const flm = f(lm);
    const frm = f(rm);
    const left = ((m - a) / 6) * (fa + 4 * flm + fm);
    const right = ((b - m) / 6) * (fm + 4 * frm + fb);
    if (depth > 40 || Math.abs(left + right - whole) <= 15 * tol) return left + right + (left + right - whole) / 15;
    return rec(a, m, fa, flm, fm, left, tol / 2, depth + 1) + rec(m, b, fm, frm, fb, right, tol / 2, depth + 1);
  };
  return rec(a, b, fa, fm, fb, whole, tol, 0);
}

function totalVolume(c: BaselineCase, seq: Type[], x: number[], tol: number): number {
  const inv = (v: number) => c.fa0 / (c.k * Math.pow(c.ca0 * (1 - v), c.order));
  let s = 0;
  for (let i = 0; i < seq.length; i++) {
    const a = x[i];
    const b = x[i + 1];
    if (b <= a) continue;
    s += seq[i] === "CSTR" ? (b - a) * inv(b) : simpson(inv, a, b, tol * Math.abs(inv(b)) * (b - a));
  }
  return s;
}

function golden(f: (t: number) => number, lo: number, hi: number, tol: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > tol) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  return 0.5 * (a + b);
}

function optimiseSequence(c: BaselineCase, seq: Type[], tol: number): number {
  const n = seq.length;
  const x = Array.from({ length: n + 1 }, (_, i) => (c.target * i) / n);
  let prev = Infinity;
  for (let sweep = 0; sweep < 200; sweep++) {
    for (let i = 1; i < n; i++) {
      x[i] = golden((t) => totalVolume(c, seq, [...x.slice(0, i), t, ...x.slice(i + 1)], tol), x[i - 1], x[i + 1], tol);
    }
    const v = totalVolume(c, seq, x, tol);
    if (Math.abs(prev - v) <= tol * v) return v;
    prev = v;
  }
  return prev;
}

function sequences(maxStages: number): Type[][] {
  const out: Type[][] = [];
  let level: Type[][] = [[]];
  for (let n = 1; n <= maxStages; n++) {
    level = level.flatMap((s) => (["CSTR", "PFR"] as const).map((t) => [...s, t]));
    out.push(...level);
  }
  return out;
}

/** Optimal total volume of every sequence, tightening the tolerance until volumes agree to 1e-4. */
export function baselineOptimise(c: BaselineCase): number[] {
  let tol = 1e-3;
  let prev = sequences(c.maxStages).map((s) => optimiseSequence(c, s, tol));
  for (;;) {
    tol /= 10;
    const next = sequences(c.maxStages).map((s) => optimiseSequence(c, s, tol));
    const worst = Math.max(...next.map((v, i) => Math.abs(v - prev[i]) / v));
    prev = next;
    if (worst < 1e-4 || tol < 1e-12) return next;
  }
}
