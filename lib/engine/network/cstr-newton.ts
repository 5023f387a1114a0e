import { luFactor, luSolve } from "../small-lu";
import type { Kinetics } from "./kinetics";

/**
 * Damped Newton on a stirred tank's balances G(F) = F_in - F + V R(C(F), T) = 0.
 *
 * A species in `limited` has run out: its outlet flow is fixed at exactly zero and its unknown becomes
 * instead the fraction s (0..1) of their full rate at which the reactions that would keep consuming it
 * (cstr.ts, `depleting`) run, so that its balance closes with the supply: the stirred-tank form of "a
 * zero-order reaction stops when its reactant runs out".
 *
 * `known` deflates states already found (Farrell, Birkisson and Funke's deflation, SIAM J. Sci. Comput.
 * 37, 2015): Newton is applied to M(F) G(F) with M = prod_k (1/|F - F_k|^2 + 1), which does not vanish at
 * a known state, so Newton from the same start is driven to another state instead. The deflated step is
 * the plain Newton step scaled by 1/(1 - grad(ln M) . step).
 */
export interface NewtonResult {
  /** Outlet flows, mol/s. */
  flows: Float64Array;
  /** Rate fraction of each species' limited reactions (1 for a species not limited). */
  fractions: Float64Array;
  /**
   * Largest |G_i| relative to the largest flow in the balances: the total flow in, or V |nu_ij| times a
   * reaction's forward or reverse term when larger (near equilibrium those terms are large and nearly
   * cancel, and their round-off sets the floor of the balance).
   */
  residual: number;
  /** Balances of the end point, mol/s. */
  balances: Float64Array;
  converged: boolean;
}

const TOL = 1e-13;
const MAX_ITER = 80;

export function newtonCstr(
  kin: Kinetics,
  Fin: Float64Array,
  T: number,
  V: number,
  start: Float64Array,
  fractions0: Float64Array,
  limited: ReadonlySet<number>,
  known: readonly Float64Array[] = [],
): NewtonResult {
  const net = kin.net;
  const n = net.nSpecies;
  let FTin = 0;
  for (let i = 0; i < n; i++) FTin += Fin[i];
  const m = net.nReactions;
  const { z, F, r, gross, G, J, A, pivots, trial, Gtrial, delta } = workArrays(n, m);
  for (let i = 0; i < n; i++) z[i] = limited.has(i) ? fractions0[i] : Math.max(start[i], 0);

  /** Flows and reaction weights from the unknowns, then the balances into out; returns their scaled norm. */
  const balances = (zz: Float64Array, out: Float64Array): number => {
    kin.weight.fill(1);
    for (let i = 0; i < n; i++) {
      if (limited.has(i)) {
        F[i] = 0;
        for (const j of net.depleting[i]) kin.weight[j] *= zz[i];
      } else F[i] = zz[i];
    }
    kin.rates(F, T, r);
    kin.grossRates(F, T, gross);
    let norm = 0;
    let largest = FTin;
    for (let i = 0; i < n; i++) {
      let Ri = 0;
      for (let j = 0; j < m; j++) {
        const nu = net.nu[i * m + j];
        Ri += nu * r[j];
        largest = Math.max(largest, V * Math.abs(nu) * gross[j]);
      }
      out[i] = Fin[i] - F[i] + V * Ri;
      norm = Math.max(norm, Math.abs(out[i]));
    }
    return norm / largest;
  };

  // Deflation works in the unknowns, scaled: flows by the total flow in, rate fractions as they are.
  const unit = (i: number) => (limited.has(i) ? 1 : FTin);
  const knownZ = known.map((F) => Float64Array.from(F, (f, i) => (limited.has(i) ? 1 : f)));
  const deflation = (zz: Float64Array): number => {
    let M = 1;
    for (const r of knownZ) {
      let d2 = 0;
      for (let i = 0; i < n; i++) d2 += ((zz[i] - r[i]) / unit(i)) ** 2;
      M *= 1 / d2 + 1;
    }
    return M;
  };
  /** grad(ln M) . step */
  const deflationSlope = (zz: Float64Array, step: Float64Array): number => {
    let g = 0;
    for (const r of knownZ) {
      let d2 = 0;
      let dot = 0;
      for (let i = 0; i < n; i++) {
        const e = (zz[i] - r[i]) / unit(i);
        d2 += e * e;
        dot += (e * step[i]) / unit(i);
      }
      // d ln(1/d2 + 1) = -(2/d2^2) / (1/d2 + 1) (e . step)
      g += ((-2 / (d2 * d2)) / (1 / d2 + 1)) * dot;
    }
    return g;
  };

  let norm = balances(z, G);
  let converged = norm <= TOL;
  for (let iter = 0; iter < MAX_ITER && !converged && Number.isFinite(norm); iter++) {
    // The Jacobian of G in the unknowns: analytic (-I + V dR/dF) when nothing is limited, else by
    // forward differences (a limited tank is the rare case and its columns are cheap).
    if (limited.size === 0) {
      kin.jacobian(F, T, J);
      for (let t = 0; t < n * n; t++) A[t] = V * J[t];
      for (let i = 0; i < n; i++) A[i * n + i] -= 1;
    } else {
      for (let k = 0; k < n; k++) {
        const saved = z[k];
        const h = limited.has(k) ? 1e-7 : 1e-7 * Math.max(Math.abs(saved), 1e-6 * FTin);
        z[k] = saved + h;
        balances(z, Gtrial);
        for (let i = 0; i < n; i++) A[i * n + k] = (Gtrial[i] - G[i]) / h;
        z[k] = saved;
      }
      balances(z, G);
    }
    if (!luFactor(A, n, pivots)) break;
    for (let i = 0; i < n; i++) delta[i] = -G[i];
    luSolve(A, n, pivots, delta);
    if (knownZ.length > 0) {
      const denominator = 1 - deflationSlope(z, delta);
      if (!(Math.abs(denominator) > 1e-12)) break;
      for (let i = 0; i < n; i++) delta[i] /= denominator;
      // A deflated step can be huge where the deflation's slope nearly cancels; no balance needs a flow
      // to move by more than the whole flow in within one step.
      let size = 0;
      for (let i = 0; i < n; i++) size = Math.max(size, Math.abs(delta[i]) / unit(i));
      if (size > 1) for (let i = 0; i < n; i++) delta[i] /= size;
    }
    const merit = norm * deflation(z);
    // Backtracking on the largest scaled balance; flows are kept non-negative by projection.
    let alpha = 1;
    let accepted = false;
    for (let halving = 0; halving < 30; halving++) {
      for (let i = 0; i < n; i++) {
        const v = z[i] + alpha * delta[i];
        trial[i] = limited.has(i) ? v : Math.max(v, 0);
      }
      const tn = balances(trial, Gtrial);
      if (tn * deflation(trial) < (1 - 1e-4 * alpha) * merit || tn <= TOL) {
        z.set(trial);
        G.set(Gtrial);
        norm = tn;
        accepted = true;
        break;
      }
      alpha /= 2;
    }
    if (!accepted) break;
    let stepSize = 0;
    for (let i = 0; i < n; i++) stepSize = Math.max(stepSize, Math.abs(alpha * delta[i]) / (limited.has(i) ? 1 : FTin));
    // Converged when the balances close to round-off, or when Newton's steps have become negligible
    // with the balances already closed far inside the promised 1e-9.
    converged = norm <= TOL || (stepSize <= 1e-14 && norm <= 1e-10);
  }
  norm = balances(z, G);
  const fractions = new Float64Array(n).fill(1);
  for (const i of limited) fractions[i] = z[i];
  return { flows: Float64Array.from(F), fractions, residual: norm, balances: Float64Array.from(G), converged: converged || norm <= 1e-11 };
}

/**
 * Work arrays by problem size, reused from call to call: the search solves thousands of small tanks, and
 * allocating a dozen arrays for each was a tenth of its time in garbage collection. newtonCstr does not
 * call itself and copies what it returns, so one set per size suffices.
 */
const work = new Map<string, ReturnType<typeof allocate>>();
function allocate(n: number, m: number) {
  const v = () => new Float64Array(n);
  return { z: v(), F: v(), r: new Float64Array(m), gross: new Float64Array(m), G: v(), J: new Float64Array(n * n), A: new Float64Array(n * n), pivots: new Int32Array(n), trial: v(), Gtrial: v(), delta: v() };
}
function workArrays(n: number, m: number) {
  const key = `${n} ${m}`;
  let w = work.get(key);
  if (!w) work.set(key, (w = allocate(n, m)));
  return w;
}
