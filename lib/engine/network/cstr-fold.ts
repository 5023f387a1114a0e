import { ensure } from "../errors";
import { luFactor, luSolve } from "../small-lu";
import { newtonCstr } from "./cstr-newton";
import type { Kinetics } from "./kinetics";
import { kineticsOf } from "./pfr";
import type { ResolvedNetwork } from "./resolve";

/**
 * Where the low branch of a stirred tank ends: the steady state a tank reaches from start-up (filled with
 * feed) is followed from V = 0 by natural continuation in V — a predictor along the branch's tangent
 * dF/dV = (I - V dR/dF)^-1 R, then Newton at the new volume — for as long as the state stays on the same
 * branch: Newton converges, det(I - V dR/dF) keeps the sign it has at V = 0 (it changes sign at a fold),
 * and the correction stays small next to the predicted move. Steps double after a success and halve after
 * a failure; when they fall below `relativeTolerance` of the volume reached, that volume is the fold.
 *
 * Returns null when the branch reaches Vmax without a fold. The volume returned lies below the fold by
 * less than relativeTolerance of it (the state there is still the low one): the design "at the fold"
 * a sweep may report. A failure of Newton for another reason (a rate that jumps) also ends the branch
 * and is reported the same way.
 */
export interface FoldResult {
  volume: number;
  flows: Float64Array;
  conversion: number;
}

export function lowBranchFold(
  network: ResolvedNetwork | Kinetics,
  FinLike: ArrayLike<number>,
  T: number,
  Vmax: number,
  relativeTolerance = 1e-7,
): FoldResult | null {
  const kin = kineticsOf(network);
  const net = kin.net;
  const n = net.nSpecies;
  ensure(Vmax > 0 && Number.isFinite(Vmax), "the largest tank volume must be above zero", "");
  const Fin = Float64Array.from(FinLike);
  let FTin = 0;
  for (let i = 0; i < n; i++) FTin += Fin[i];
  const J = new Float64Array(n * n);
  const A = new Float64Array(n * n);
  const pivots = new Int32Array(n);
  const R = new Float64Array(n);
  const none = new Set<number>();
  const ones = new Float64Array(n).fill(1);

  /** Factors I - V J at F; returns the sign of its determinant (0 when singular). */
  const factor = (F: Float64Array, V: number): number => {
    kin.weight.fill(1);
    kin.jacobian(F, T, J);
    for (let t = 0; t < n * n; t++) A[t] = -V * J[t];
    for (let i = 0; i < n; i++) A[i * n + i] += 1;
    if (!luFactor(A, n, pivots)) return 0;
    let sign = 1;
    for (let i = 0; i < n; i++) {
      if (pivots[i] !== i) sign = -sign;
      if (A[i * n + i] < 0) sign = -sign;
    }
    return sign;
  };
  const tangent = (F: Float64Array, V: number): Float64Array | null => {
    if (factor(F, V) <= 0) return null;
    kin.production(F, T, R);
    const d = Float64Array.from(R);
    luSolve(A, n, pivots, d);
    return d;
  };

  let V = 0;
  let F: Float64Array = Fin;
  let slope = tangent(F, V);
  if (!slope) return null;
  let h = Vmax * 1e-6;
  while (V < Vmax) {
    const step = Math.min(h, Vmax - V);
    const Vb = V + step;
    const predicted = F.map((f, i) => Math.max(f + step * (slope as Float64Array)[i], 0));
    const res = newtonCstr(kin, Fin, T, Vb, predicted, ones, none);
    let ok = res.converged;
    let nextSlope: Float64Array | null = null;
    if (ok) {
      let moved = 0;
      let corrected = 0;
      for (let i = 0; i < n; i++) {
        moved = Math.max(moved, Math.abs(predicted[i] - F[i]));
        corrected = Math.max(corrected, Math.abs(res.flows[i] - predicted[i]));
      }
      // A first-order predictor is off by O(step^2) on the same branch; a correction as large as the
      // move itself means Newton went to another branch.
      nextSlope = tangent(res.flows, Vb);
      ok = nextSlope !== null && corrected <= Math.max(0.5 * moved, 1e-9 * FTin);
    }
    if (ok) {
      V = Vb;
      F = res.flows;
      slope = nextSlope;
      h = step * 2;
      continue;
    }
    h = step / 2;
    if (h <= relativeTolerance * Math.max(V, Number.MIN_VALUE)) {
      kin.weight.fill(1);
      return { volume: V, flows: F, conversion: 1 - F[net.key] / net.F0[net.key] };
    }
  }
  kin.weight.fill(1);
  return null;
}
