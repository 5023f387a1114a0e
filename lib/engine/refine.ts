import { solveTridiagonal } from "./tridiagonal";

/**
 * A chain objective J = sum_k c_k(x_{k-1}, x_k) with x_0 and x_n fixed: stage k's contribution and its
 * partial derivatives with respect to its inlet (a) and outlet (b).
 */
export interface ChainObjective {
  readonly stages: number;
  value(k: number, a: number, b: number): number;
  gradient(k: number, a: number, b: number): [number, number];
  /** A cheaper gradient, smooth in (a, b), used only for the finite-difference Hessian. @default gradient */
  roughGradient?(k: number, a: number, b: number): [number, number];
  /**
   * Stage k's own second derivatives [d2/da2, d2/da db, d2/db2] (only those of free ends are used), when the
   * stage's contribution is an inner minimum that differencing its gradient would find anew at each point.
   * @default central differences of roughGradient
   */
  stageHessian?(k: number, a: number, b: number, needA: boolean, needB: boolean): [number, number, number];
  /**
   * Newton stops once a step moves no boundary by more than this. An objective that is itself an inner
   * minimum carries that minimum's round-off in its gradient, so its steps stall near 1e-12 rather than
   * shrinking further. @default 1e-13
   */
  readonly stepTolerance?: number;
}

interface Reduced {
  readonly active: number[];
  y: number[];
}

function total(obj: ChainObjective, r: Reduced, y: readonly number[]): number {
  let s = 0;
  for (let m = 0; m < r.active.length; m++) s += obj.value(r.active[m], y[m], y[m + 1]);
  return s;
}

function gradientOf(obj: ChainObjective, r: Reduced, y: readonly number[]): number[] {
  const grads = r.active.map((k, m) => obj.gradient(k, y[m], y[m + 1]));
  return grads.slice(1).map((g, i) => grads[i][1] + g[0]);
}

/** Tridiagonal Hessian of the reduced problem by central differences of the analytic stage gradients. */
function hessianOf(obj: ChainObjective, r: Reduced, y: readonly number[]): { diag: number[]; off: number[] } {
  const n = r.active.length - 1;
  if (obj.stageHessian) {
    const stage = obj.stageHessian.bind(obj);
    const hs = r.active.map((k, m) => stage(k, y[m], y[m + 1], m > 0, m < n));
    return { diag: Array.from({ length: n }, (_, i) => hs[i][2] + hs[i + 1][0]), off: Array.from({ length: n - 1 }, (_, i) => hs[i + 1][1]) };
  }
  const diag = new Array<number>(n).fill(0);
  const cross = new Array<number>(r.active.length).fill(0);
  const count = new Array<number>(r.active.length).fill(0);
  const grad = obj.roughGradient ?? obj.gradient;
  for (let i = 1; i <= n; i++) {
    const left = r.active[i - 1];
    const right = r.active[i];
    const h = Math.min(1e-6, 0.25 * (y[i] - y[i - 1]), 0.25 * (y[i + 1] - y[i]));
    const lp = grad(left, y[i - 1], y[i] + h);
    const lm = grad(left, y[i - 1], y[i] - h);
    const rp = grad(right, y[i] + h, y[i + 1]);
    const rm = grad(right, y[i] - h, y[i + 1]);
    diag[i - 1] = (lp[1] - lm[1] + rp[0] - rm[0]) / (2 * h);
    cross[i - 1] += (lp[0] - lm[0]) / (2 * h);
    count[i - 1]++;
    cross[i] += (rp[1] - rm[1]) / (2 * h);
    count[i]++;
  }
  const off = [];
  for (let i = 1; i < n; i++) off.push(cross[i] / count[i]);
  return { diag, off };
}

function newtonDirection(diag: number[], off: number[], g: number[]): number[] {
  const scale = Math.max(...diag.map(Math.abs), 1e-300);
  let mu = 1e-10 * scale;
  for (let attempt = 0; attempt < 30; attempt++) {
    const d = solveTridiagonal(diag, off, g.map((v) => -v), mu);
    if (d) return d;
    mu = Math.max(mu * 10, 1e-6 * scale);
  }
  return g.map((v) => -v / scale);
}

/** Largest step fraction keeping every active stage of non-negative length, and the stage that closes. */
function stepLimit(y: readonly number[], d: readonly number[]): { alpha: number; closing: number } {
  let alpha = 1;
  let closing = -1;
  for (let m = 0; m + 1 < y.length; m++) {
    const dl = (m + 1 < y.length - 1 ? d[m] : 0) - (m > 0 ? d[m - 1] : 0);
    const length = y[m + 1] - y[m];
    if (dl < 0 && length + dl < 0) {
      const a = length / -dl;
      if (a < alpha) {
        alpha = a;
        closing = m;
      }
    }
  }
  return { alpha, closing };
}

function moved(y: readonly number[], d: readonly number[], alpha: number): number[] {
  return y.map((v, m) => (m === 0 || m === y.length - 1 ? v : v + alpha * d[m - 1]));
}

/** Makes stage m of zero length exactly, moving whichever of its ends is free. */
function closeStage(y: number[], m: number): void {
  if (m + 1 < y.length - 1) y[m + 1] = y[m];
  else y[m] = y[m + 1];
}

/** Newton iterations on the reduced problem; returns the index (in active) of a stage that closed, or -1. */
function newton(obj: ChainObjective, r: Reduced, maxIterations: number): number {
  let j = total(obj, r, r.y);
  for (let iter = 0; iter < maxIterations; iter++) {
    const g = gradientOf(obj, r, r.y);
    const { diag, off } = hessianOf(obj, r, r.y);
    const d = newtonDirection(diag, off, g);
    const { alpha: limit, closing } = stepLimit(r.y, d);
    let alpha = limit;
    let accepted = false;
    for (let k = 0; k < 30; k++) {
      const y = moved(r.y, d, alpha);
      if (alpha === limit && closing >= 0) closeStage(y, closing);
      const v = total(obj, r, y);
      if (v <= j + 1e-14 * Math.abs(j)) {
        const step = Math.max(...y.map((p, i) => Math.abs(p - r.y[i])));
        r.y = y;
        j = v;
        accepted = true;
        if (alpha === limit && closing >= 0) return closing;
        if (step < (obj.stepTolerance ?? 1e-13)) return -1;
        break;
      }
      alpha *= 0.5;
    }
    if (!accepted) return -1;
  }
  return -1;
}

/**
 * Refines stage boundaries to a stationary point of a chain objective by a damped Newton method on the
 * tridiagonal system, closing stages whose optimal length is zero (an active-set method).
 * @param x boundaries x_0..x_n (x_0 and x_n stay fixed), e.g. from the grid optimum.
 * @param closed stages fixed at zero length.
 * @param maxIterations Newton iterations per active set.
 * @returns refined boundaries.
 */
export function refineChain(obj: ChainObjective, x: readonly number[], closed: readonly boolean[], maxIterations = 60): number[] {
  const isClosed = closed.slice();
  let current = x.slice();
  for (let round = 0; round <= obj.stages; round++) {
    const active = [];
    for (let k = 0; k < obj.stages; k++) if (!isClosed[k]) active.push(k);
    if (active.length <= 1) break;
    const r: Reduced = { active, y: [current[0], ...active.map((k) => current[k + 1])] };
    const closing = newton(obj, r, maxIterations);
    const next = [current[0]];
    let m = 0;
    for (let k = 0; k < obj.stages; k++) {
      if (!isClosed[k]) m++;
      next.push(isClosed[k] ? next[k] : r.y[m]);
    }
    next[obj.stages] = current[obj.stages];
    current = next;
    if (closing < 0) break;
    isClosed[active[closing]] = true;
  }
  return current;
}
