import type { Kinetics } from "./kinetics";

/**
 * Species held at exactly zero along a tube after running out, and the rate fractions that keep them
 * there. For a held species i, the reactions that would keep consuming it at zero concentration
 * (`depleting`) run at the fraction s = (formation of i by the other reactions) / (their full
 * consumption of i), capped at 1, so that dF_i/dV = 0: what is formed is consumed at once. This is the
 * tube form of "a zero-order reaction stops when its reactant runs out"; when formation would exceed
 * the full consumption (s >= 1), the species is released and accumulates again.
 */
export interface HeldRates {
  /** Production rates with the held species at zero and their consumers scaled; writes out. */
  production(y: Float64Array, out: Float64Array): void;
  /** Species not held that a depleting reaction consumes: watched for running out. */
  watched(F: Float64Array): number[];
  /** Holds every species at zero (or below) that is still consumed on balance; sets it to exactly zero. */
  holdRunOut(F: Float64Array): void;
  /** True when some held species is formed at least as fast as its consumers could take it. */
  releaseDue(y: Float64Array): boolean;
  /** Releases the species that releaseDue found. */
  release(F: Float64Array): void;
  count(): number;
}

export function makeHeldRates(kin: Kinetics, T: number): HeldRates {
  const net = kin.net;
  const n = net.nSpecies;
  const m = net.nReactions;
  const held = new Set<number>();
  const yy = new Float64Array(n);
  const r = new Float64Array(m);
  const R = new Float64Array(n);

  /** Formation by the others minus full consumption by the depleting reactions, and that consumption. */
  const balanceOf = (i: number): { formed: number; consumed: number } => {
    let formed = 0;
    let consumed = 0;
    const dep = net.depleting[i];
    for (let j = 0; j < m; j++) {
      const term = net.nu[i * m + j] * r[j];
      if (dep.includes(j)) consumed -= term;
      else formed += term;
    }
    return { formed, consumed };
  };

  const prepare = (y: Float64Array) => {
    yy.set(y);
    for (const i of held) yy[i] = 0;
    kin.weight.fill(1);
    kin.rates(yy, T, r);
  };

  const production = (y: Float64Array, out: Float64Array) => {
    if (held.size === 0) {
      kin.weight.fill(1);
      kin.production(y, T, out);
      return;
    }
    prepare(y);
    for (const i of held) {
      const { formed, consumed } = balanceOf(i);
      const s = consumed > 0 ? Math.min(1, Math.max(0, formed / consumed)) : 1;
      for (const j of net.depleting[i]) kin.weight[j] *= s;
    }
    kin.production(yy, T, out);
    for (const i of held) out[i] = 0;
  };

  const due = (y: Float64Array): number[] => {
    if (held.size === 0) return [];
    prepare(y);
    return [...held].filter((i) => {
      const { formed, consumed } = balanceOf(i);
      return formed >= consumed;
    });
  };

  return {
    production,
    watched(F) {
      const out: number[] = [];
      net.depleting.forEach((list, i) => {
        if (!held.has(i) && list.length > 0 && F[i] >= 0) out.push(i);
      });
      return out;
    },
    holdRunOut(F) {
      for (let round = 0; round <= n; round++) {
        production(F, R);
        let changed = false;
        net.depleting.forEach((list, i) => {
          if (held.has(i) || list.length === 0 || F[i] > 0 || R[i] >= 0) return;
          F[i] = 0;
          held.add(i);
          changed = true;
        });
        if (!changed) return;
      }
    },
    releaseDue: (y) => due(y).length > 0,
    release(F) {
      for (const i of due(F)) {
        held.delete(i);
        F[i] = Math.max(F[i], 0);
      }
    },
    count: () => held.size,
  };
}
