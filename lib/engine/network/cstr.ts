import { ensure } from "../errors";
import { newtonCstr } from "./cstr-newton";
import type { Kinetics } from "./kinetics";
import { kineticsOf, pfrOutlet } from "./pfr";
import type { ResolvedNetwork } from "./resolve";
import type { NetworkSteadyState } from "./types";

/**
 * Every steady state of a stirred tank: F_out - F_in - V R(C_out, T) = 0.
 *
 * Method: damped Newton (analytic Jacobian for power laws) from several starts — the feed itself (the
 * state a tank starts from when filled with feed) and the compositions a tube fed with the same stream
 * reaches at volumes from 1e-4 V to 1e4 V (factor 10^(1/3) apart), which run from "nothing has reacted"
 * to "as far as the reactions go" — and the compositions each reaction alone reaches at half and all of its
 * largest extent from the feed (a tube can miss a state where a reaction the tube hardly runs dominates: an
 * ignited autocatalytic tank past its fold) — then rounds until one finds nothing new: from points 1/12 ... 11/12 of
 * the way between consecutive states found, by plain Newton and, when that lands on a known state, by
 * deflated Newton (cstr-newton.ts); and from every other start again, deflated.
 * States found are merged when their flows agree to 1e-7 of the flow in.
 * Each state found satisfies the balances to 1e-11 of the largest flow in them (cstr-newton.ts).
 *
 * Guarantee: every state returned is a true steady state; that ALL states are found is not proven in
 * general (no finite set of starts can promise it for arbitrary rate expressions). Measured: across the
 * regions of multiplicity of cubic autocatalysis (beta 0.002..0.1, Da 0.1..1000, 2005 tanks) and of
 * substrate inhibition written as an expression (C_A0 10..50, tau 3..3000, 450 tanks) the number of states
 * found equals the number of roots of the balance counted on a fine grid, without exception;
 * tests/unit/engine/network/cstr-multiplicity.test.ts keeps a part of that sweep. Without the deflation
 * rounds about 10% of the unstable middle states were missed. With `starts: 0` only the state Newton
 * reaches from the feed is sought (about 100 times cheaper).
 *
 * A species consumed by a reaction that would keep going at zero concentration (a zero order) and whose
 * supply is less than that demand leaves at exactly zero: its balance then fixes the rate fraction at
 * which those reactions run (cstr-newton.ts).
 */
export interface CstrOptions {
  /** Field an error is reported against. @default "" */
  path?: string;
  /** Number of tube compositions used as starts besides the feed; 0 seeks only the state reached from the feed. @default 25 */
  starts?: number;
  /** Newton's first start instead of the feed (with `starts: 0`, the only one besides `seeds`); a tank of one state may start anywhere. */
  startFrom?: ArrayLike<number>;
  /** Further starts for Newton, tried after the feed (e.g. the states of a slightly smaller tank, when following a locus). */
  seeds?: readonly ArrayLike<number>[];
}

const MERGE = 1e-7;
/** Fractions of the way between consecutive states tried as starts: an unstable state's basin can be narrow. */
const BETWEEN = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11].map((q) => q / 12);

/** Every steady state found, sorted by the key reactant's conversion, lowest first. */
export function cstrSteadyStates(network: ResolvedNetwork | Kinetics, FinLike: ArrayLike<number>, T: number, V: number, options: CstrOptions = {}): NetworkSteadyState[] {
  const kin = kineticsOf(network);
  const net = kin.net;
  const n = net.nSpecies;
  const path = options.path ?? "";
  ensure(V >= 0 && Number.isFinite(V), "a tank volume must be zero or more", path);
  ensure(T > 0, "a stage temperature must be above absolute zero", path);
  const Fin = Float64Array.from(FinLike);
  let FTin = 0;
  for (let i = 0; i < n; i++) FTin += Fin[i];
  const conversion = (F: Float64Array) => 1 - F[net.key] / net.F0[net.key];
  if (V === 0) return [{ flows: Fin, conversion: conversion(Fin), residual: 0 }];

  const count = options.starts ?? 25;
  const starts: Float64Array[] = [options.startFrom === undefined ? Fin : Float64Array.from(options.startFrom), ...(options.seeds ?? []).map((q) => Float64Array.from(q))];
  if (count > 0) {
    const half = (count - 1) / 2;
    const volumes = Array.from({ length: count }, (_, k) => V * 10 ** (((k - half) / half) * 4));
    try {
      const tube = pfrOutlet(kin, Fin, T, volumes[volumes.length - 1], { outputVolumes: volumes, rtol: 1e-4, atolFraction: 1e-8, path });
      for (const p of tube.profile) starts.push(p.flows);
    } catch {
      // A tube that cannot be integrated to 1e4 V only costs starts; the feed start remains.
    }
    starts.push(...extentStarts(kin, Fin));
  }

  const found: NetworkSteadyState[] = [];
  const add = (state: { flows: Float64Array; residual: number } | null): boolean => {
    if (!state) return false;
    const same = found.some((s) => {
      for (let i = 0; i < n; i++) if (Math.abs(s.flows[i] - state.flows[i]) > MERGE * FTin) return false;
      return true;
    });
    if (!same) found.push({ flows: state.flows, conversion: conversion(state.flows), residual: state.residual });
    return !same;
  };
  for (const start of starts) add(solveFrom(kin, Fin, T, V, start, FTin, []));
  // Further rounds: points between consecutive states found (an unstable state lies between two
  // stable ones, often in a narrow basin), by plain Newton and, when that lands on a known state, by
  // deflated Newton; and every other start again, deflated (plain Newton from them has been run).
  for (let round = 0; round < 4 && count > 0; round++) {
    const sorted = [...found].sort((a, b) => a.conversion - b.conversion);
    const between = sorted.slice(1).flatMap((s, q) => BETWEEN.map((w) => s.flows.map((f, i) => w * f + (1 - w) * sorted[q].flows[i])));
    let added = false;
    for (const start of between) {
      if (add(solveFrom(kin, Fin, T, V, start, FTin, []))) added = true;
      else if (add(solveFrom(kin, Fin, T, V, start, FTin, found.map((s) => s.flows)))) added = true;
    }
    for (let q = 0; q < starts.length; q += 2) {
      if (add(solveFrom(kin, Fin, T, V, starts[q], FTin, found.map((s) => s.flows)))) added = true;
    }
    if (!added) break;
  }
  kin.weight.fill(1);
  ensure(found.length > 0, "the stirred tank's balances could not be solved at this volume", path);
  return found.sort((a, b) => a.conversion - b.conversion);
}

/**
 * Newton from one start; when a species runs out under a reaction that does not slow down (Newton stalls
 * with it at zero and its balance negative), it is declared limited and the solve repeated; a limited
 * species whose rate fraction comes out at 1 or more was not limited after all and is released.
 */
function solveFrom(
  kin: Kinetics,
  Fin: Float64Array,
  T: number,
  V: number,
  start: Float64Array,
  FTin: number,
  known: readonly Float64Array[],
): { flows: Float64Array; residual: number } | null {
  const net = kin.net;
  const n = net.nSpecies;
  const limited = new Set<number>();
  let point: Float64Array = start;
  let fractions: Float64Array = new Float64Array(n).fill(0.5);
  for (let attempt = 0; attempt <= 2 * n; attempt++) {
    const res = newtonCstr(kin, Fin, T, V, point, fractions, limited, known);
    point = res.flows;
    fractions = res.fractions;
    if (res.converged) {
      const release = [...limited].filter((i) => res.fractions[i] >= 1 || res.fractions[i] < 0);
      if (release.length === 0) return { flows: res.flows, residual: res.residual };
      for (const i of release) {
        limited.delete(i);
        fractions[i] = 0.5;
      }
      continue;
    }
    const add: number[] = [];
    for (let i = 0; i < n; i++) {
      if (limited.has(i) || net.depleting[i].length === 0) continue;
      if (res.flows[i] <= 1e-12 * FTin && res.balances[i] < 0) add.push(i);
    }
    if (add.length === 0) return null;
    for (const i of add) {
      limited.add(i);
      fractions[i] = 0.5;
    }
  }
  return null;
}

/**
 * The feed advanced by one reaction alone to half and all of the largest extent its stoichiometry allows
 * (until something it consumes runs out), forward, and backward for a reversible one: the corners of the
 * compositions the tank can reach.
 */
function extentStarts(kin: Kinetics, Fin: Float64Array): Float64Array[] {
  const net = kin.net;
  const n = net.nSpecies;
  const m = net.nReactions;
  const out: Float64Array[] = [];
  for (let j = 0; j < m; j++) {
    const directions = net.rates[j].reverseOrders !== null || net.rates[j].opaque ? [1, -1] : [1];
    for (const d of directions) {
      let most = Number.POSITIVE_INFINITY;
      for (let i = 0; i < n; i++) {
        const nu = d * net.nu[i * m + j];
        if (nu < 0) most = Math.min(most, Fin[i] / -nu);
      }
      if (!(most > 0 && Number.isFinite(most))) continue;
      for (const f of [0.5, 1]) out.push(Fin.map((F, i) => Math.max(F + f * most * d * net.nu[i * m + j], 0)));
    }
  }
  return out;
}
