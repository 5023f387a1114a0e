import type { ResolvedNetwork } from "./resolve";

/**
 * Rates of a resolved network as functions of the molar flows: concentrations from flows (liquid or
 * isobaric ideal gas), reaction rates r_j, production rates R_i = sum_j nu_ij r_j and the Jacobian
 * dR_i/dF_k. Scratch arrays are allocated once per kinetics object: the solvers call these thousands
 * of times per stage.
 */
export interface Kinetics {
  readonly net: ResolvedNetwork;
  /**
   * Weight of reaction j: 1 when it runs freely, 0 when it stopped because something it consumes ran out,
   * in between when a stirred tank's supply limits it (cstr.ts). Callers set it; r_j is scaled by it.
   */
  readonly weight: Float64Array;
  /** C_i (mol/m3) at temperature T from flows F (mol/s). */
  concentrations(F: Float64Array, T: number, out: Float64Array): void;
  /** weight_j r_j (mol/(m3 s)). */
  rates(F: Float64Array, T: number, out: Float64Array): void;
  /** weight_j times the gross rate of reaction j (forward plus reverse term, both positive), mol/(m3 s). */
  grossRates(F: Float64Array, T: number, out: Float64Array): void;
  /** R_i = sum_j nu_ij r_j, mol/(m3 s). */
  production(F: Float64Array, T: number, out: Float64Array): void;
  /** J[i * n + k] = dR_i/dF_k, (1/m3): analytic for power laws, central differences for expressions. */
  jacobian(F: Float64Array, T: number, J: Float64Array): void;
  /** Volumetric flow at T, m3/s. */
  volumetricFlow(F: Float64Array, T: number): number;
}

const SQRT_EPS = Math.sqrt(Number.EPSILON);
const CBRT_EPS = Math.cbrt(Number.EPSILON);

export function makeKinetics(net: ResolvedNetwork): Kinetics {
  const n = net.nSpecies;
  const m = net.nReactions;
  const weight = new Float64Array(m).fill(1);
  const C = new Float64Array(n);
  const r = new Float64Array(m);
  const g = new Float64Array(n);
  const dRdC = new Float64Array(n * n);
  const scale = Math.max(...net.C0);
  // Gas: C_i = c F_i / F_T with c = C_T0 T0 / T (isobaric ideal gas; inerts count in F_T).
  const totalFlow = (F: Float64Array) => {
    let ft = 0;
    for (let i = 0; i < n; i++) ft += F[i];
    return ft > net.FT0 * 1e-300 ? ft : net.FT0 * 1e-300;
  };

  const concentrations = (F: Float64Array, T: number, out: Float64Array) => {
    if (net.phase === "liquid") {
      for (let i = 0; i < n; i++) out[i] = F[i] / net.v0;
      return;
    }
    const c = ((net.FT0 / net.v0) * net.T0) / T / totalFlow(F);
    for (let i = 0; i < n; i++) out[i] = c * F[i];
  };

  const ratesAtC = (T: number, out: Float64Array) => {
    for (let j = 0; j < m; j++) out[j] = weight[j] === 0 ? 0 : weight[j] * net.rates[j].rate(C, T);
  };

  /** dr_j/dC into g: the law's own gradient, or differences (central where C allows, else forward). */
  const rateGradient = (j: number, T: number) => {
    const law = net.rates[j];
    if (law.gradient) {
      law.gradient(C, T, g);
      return;
    }
    const r0 = law.rate(C, T);
    for (let q = 0; q < n; q++) {
      const saved = C[q];
      const base = Math.max(Math.abs(saved), 1e-6 * scale);
      if (saved - CBRT_EPS * base > 0) {
        const h = CBRT_EPS * base;
        C[q] = saved + h;
        const up = law.rate(C, T);
        C[q] = saved - h;
        const down = law.rate(C, T);
        g[q] = (up - down) / (2 * h);
      } else {
        const h = SQRT_EPS * base;
        C[q] = Math.max(saved, 0) + h;
        g[q] = (law.rate(C, T) - r0) / (C[q] - Math.max(saved, 0));
      }
      C[q] = saved;
    }
  };

  return {
    net,
    weight,
    concentrations,
    rates(F, T, out) {
      concentrations(F, T, C);
      ratesAtC(T, out);
    },
    grossRates(F, T, out) {
      concentrations(F, T, C);
      for (let j = 0; j < m; j++) out[j] = weight[j] === 0 ? 0 : weight[j] * net.rates[j].gross(C, T);
    },
    production(F, T, out) {
      concentrations(F, T, C);
      ratesAtC(T, r);
      for (let i = 0; i < n; i++) {
        let s = 0;
        const row = i * m;
        for (let j = 0; j < m; j++) s += net.nu[row + j] * r[j];
        out[i] = s;
      }
    },
    jacobian(F, T, J) {
      concentrations(F, T, C);
      dRdC.fill(0);
      for (let j = 0; j < m; j++) {
        if (weight[j] === 0) continue;
        rateGradient(j, T);
        if (weight[j] !== 1) for (let q = 0; q < n; q++) g[q] *= weight[j];
        for (let i = 0; i < n; i++) {
          const v = net.nu[i * m + j];
          if (v === 0) continue;
          for (let q = 0; q < n; q++) dRdC[i * n + q] += v * g[q];
        }
      }
      if (net.phase === "liquid") {
        for (let t = 0; t < n * n; t++) J[t] = dRdC[t] / net.v0;
        return;
      }
      // dC_q/dF_k = (c/F_T)(delta_qk - F_q/F_T) with c = C_T0 T0/T; below c already holds the 1/F_T.
      const ft = totalFlow(F);
      const c = ((net.FT0 / net.v0) * net.T0) / T / ft;
      for (let i = 0; i < n; i++) {
        let weighted = 0;
        for (let q = 0; q < n; q++) weighted += dRdC[i * n + q] * F[q];
        weighted /= ft;
        for (let k = 0; k < n; k++) J[i * n + k] = c * (dRdC[i * n + k] - weighted);
      }
    },
    volumetricFlow(F, T) {
      if (net.phase === "liquid") return net.v0;
      return net.v0 * (totalFlow(F) / net.FT0) * (T / net.T0);
    },
  };
}

/** r_j (mol/(m3 s)) of every reaction at concentrations C (mol/m3, species order) and temperature T (K). */
export function reactionRatesAt(net: ResolvedNetwork, C: ArrayLike<number>, T: number): Float64Array {
  const c = Float64Array.from(C);
  return Float64Array.from(net.rates, (law) => law.rate(c, T));
}
