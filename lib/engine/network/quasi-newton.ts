/**
 * Projected quasi-Newton (BFGS) minimisation in a box with central-difference gradients, for the polish of
 * trains whose stages also choose their temperatures: there Nelder–Mead in 2n variables needs about 1,500
 * evaluations for five stages, while the objective is smooth away from the box's faces and a quasi-Newton
 * step converges in a few dozen gradients.
 *
 * Variables on a face of the box whose gradient pushes outwards are held there (the active set); the step
 * is -H g on the others, projected onto the box, with Armijo backtracking. H is the BFGS inverse Hessian,
 * updated only when the curvature condition s.y > 0 holds and reset to the identity (scaled) when a step
 * fails. Differences use the step h, one-sided at a face. The search ends when no step along the projected
 * direction lowers the value by more than fTolerance relative, or after maxIterations.
 *
 * The caller keeps Nelder–Mead's result when this does worse (it cannot cross kinks: a stage reaching zero
 * volume mid-step is a face here, an exact penalty's kink is not).
 */
export interface QuasiNewtonOptions {
  lower: readonly number[];
  upper: readonly number[];
  /** Difference step in the variables' own units. @default 1e-4 */
  h?: number;
  /** @default 1e-12 */
  fTolerance?: number;
  /** @default 60 */
  maxIterations?: number;
}

export interface QuasiNewtonResult {
  x: number[];
  value: number;
  evaluations: number;
}

export function quasiNewton(f: (x: readonly number[]) => number, x0: readonly number[], options: QuasiNewtonOptions): QuasiNewtonResult {
  const n = x0.length;
  const { lower, upper } = options;
  const h = options.h ?? 1e-4;
  const fTol = options.fTolerance ?? 1e-12;
  const maxIterations = options.maxIterations ?? 60;
  let evaluations = 0;
  const evaluate = (x: readonly number[]) => {
    evaluations++;
    const v = f(x);
    return Number.isFinite(v) ? v : Number.POSITIVE_INFINITY;
  };
  const clamp = (x: number[]) => x.map((v, i) => Math.min(upper[i], Math.max(lower[i], v)));

  const gradient = (x: number[], fx: number): number[] =>
    x.map((v, i) => {
      const up = Math.min(v + h, upper[i]);
      const down = Math.max(v - h, lower[i]);
      const at = (t: number) => {
        if (t === v) return fx;
        const y = [...x];
        y[i] = t;
        return evaluate(y);
      };
      const fu = at(up);
      const fd = at(down);
      return up > down ? (fu - fd) / (up - down) : 0;
    });

  let x = clamp([...x0]);
  let fx = evaluate(x);
  if (!Number.isFinite(fx)) return { x, value: fx, evaluations };
  let g = gradient(x, fx);
  const identity = (): number[][] => Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  let H = identity();
  for (let iter = 0; iter < maxIterations; iter++) {
    const active = x.map((v, i) => (v <= lower[i] && g[i] > 0) || (v >= upper[i] && g[i] < 0));
    const d = new Array<number>(n).fill(0);
    for (let i = 0; i < n; i++) {
      if (active[i]) continue;
      for (let j = 0; j < n; j++) if (!active[j]) d[i] -= H[i][j] * g[j];
    }
    let slope = 0;
    for (let i = 0; i < n; i++) slope += d[i] * g[i];
    if (!(slope < 0)) {
      // Not a descent direction: start the curvature model again along the plain gradient.
      H = identity();
      for (let i = 0; i < n; i++) d[i] = active[i] ? 0 : -g[i];
      slope = d.reduce((s, di, i) => s + di * g[i], 0);
      if (!(slope < 0)) break;
    }
    let alpha = 1;
    let next: number[] | null = null;
    let fNext = fx;
    for (let k = 0; k < 30; k++, alpha /= 2) {
      const trial = clamp(x.map((v, i) => v + alpha * d[i]));
      const ft = evaluate(trial);
      if (ft <= fx + 1e-4 * alpha * slope) {
        next = trial;
        fNext = ft;
        break;
      }
    }
    if (next === null) break;
    const gNext = gradient(next, fNext);
    const s = next.map((v, i) => v - x[i]);
    const y = gNext.map((v, i) => v - g[i]);
    const sy = s.reduce((a, si, i) => a + si * y[i], 0);
    const decrease = fx - fNext;
    x = next;
    g = gNext;
    const previous = fx;
    fx = fNext;
    if (sy > 1e-300) {
      // H+ = (I - rho s y^T) H (I - rho y s^T) + rho s s^T
      const rho = 1 / sy;
      const Hy = H.map((row) => row.reduce((a, hij, j) => a + hij * y[j], 0));
      const yHy = y.reduce((a, yi, i) => a + yi * Hy[i], 0);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) H[i][j] += -rho * (Hy[i] * s[j] + s[i] * Hy[j]) + (rho * rho * yHy + rho) * s[i] * s[j];
    }
    if (decrease <= fTol * (1 + Math.abs(previous))) break;
  }
  return { x, value: fx, evaluations };
}
