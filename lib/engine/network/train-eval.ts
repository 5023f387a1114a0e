import { EngineError } from "../errors";
import { cstrSteadyStates } from "./cstr";
import { buildFeedTube, type FeedTube } from "./feed-tube";
import type { Kinetics } from "./kinetics";
import { pfrOutlet } from "./pfr";
import type { StageType } from "../types";

/**
 * What the optimiser needs to know of one design problem, and the outlet of a train at given residence
 * times. Isothermal stages at the feed temperature.
 *
 * The search scores what is reported: a train continues from each tank's state of lowest key-reactant
 * conversion. When the network provably gives every tank one state (cstr-uniqueness.ts) that state is the
 * one Newton reaches from the feed, the cheap mode of cstrSteadyStates; otherwise every tank is solved
 * with the full steady-state search, as the reported design is (design.ts).
 */
export interface DesignProblem {
  kin: Kinetics;
  /** Temperature of isothermal stages (the feed's), K. */
  T: number;
  /** Bounds of each stage's own temperature, K, when the optimiser chooses it; null when isothermal. */
  temperatures: { min: number; max: number } | null;
  /** Index of the product, or -1. */
  product: number;
  kind: "yield" | "selectivity" | "volume";
  minConversion: number | null;
  minYield: number | null;
  /** Largest total and per-stage residence time, s (Infinity when not limited). */
  maxTotalTau: number;
  maxStageTau: number;
  /** Residence-time scale of the scan: the smallest and largest grid value, s. */
  tauLo: number;
  tauHi: number;
  /** Relative tolerance of tube integrations during the search (the reported design is re-run at 1e-9). */
  searchRtol: number;
  /** True when every tank of this network has one steady state (cstr-uniqueness.ts): Newton from the feed then suffices. */
  tanksUnique: boolean;
  /** Points of the log-spaced scan grid (0 comes in addition) and designs polished per sequence. */
  gridPoints: number;
  polishStarts: number;
  /**
   * The last tank outlet solved at each stage position, Newton's first start for the next tank solved
   * there (only when tanks have one state, so any start that converges gives that state).
   */
  warmStarts?: (Float64Array | undefined)[];
  /** The tube fed with the feed, read off one fine integration (feed-tube.ts): built on first use, null when not applicable. */
  feedTube?: { value?: FeedTube | null };
}

/**
 * Below this fraction of the scan's smallest time a stage changes nothing measurable: it is taken as empty
 * (a tube a few hundred orders of magnitude shorter than the chemistry cannot even be integrated).
 */
export const NEGLIGIBLE_TAU_FRACTION = 1e-12;

export function stageOutlet(p: DesignProblem, type: StageType, Fin: Float64Array, tau: number, T = p.T, position = -1): Float64Array {
  if (tau <= NEGLIGIBLE_TAU_FRACTION * p.tauLo) return Fin;
  const V = tau * p.kin.net.v0;
  if (type === "PFR") return (Fin === p.kin.net.F0 && T === p.T ? feedTubeAt(p, tau) : null) ?? pfrOutlet(p.kin, Fin, T, V, { rtol: p.searchRtol }).flows;
  if (!p.tanksUnique) return cstrSteadyStates(p.kin, Fin, T, V)[0].flows;
  const warm = position >= 0 ? p.warmStarts?.[position] : undefined;
  let F: Float64Array | null = null;
  if (warm !== undefined) {
    try {
      F = cstrSteadyStates(p.kin, Fin, T, V, { starts: 0, startFrom: warm })[0].flows;
    } catch {
      // Newton from the last tank solved here did not converge: the feed's start follows.
    }
  }
  if (F === null) {
    try {
      F = cstrSteadyStates(p.kin, Fin, T, V, { starts: 0 })[0].flows;
    } catch {
      // Newton from the feed can fail for a large tank; the full search starts from a tube's compositions too.
      F = cstrSteadyStates(p.kin, Fin, T, V)[0].flows;
    }
  }
  if (position >= 0 && p.warmStarts) p.warmStarts[position] = F;
  return F;
}

/**
 * The tube fed with the feed at the feed's temperature, read off the one fine integration (feed-tube.ts);
 * null when that does not apply: at 1e-9 or tighter (the repair, which sets a limit exactly, and the
 * reported design; the bench's finer search) every tube is integrated, as are lengths beyond the scan's range.
 */
function feedTubeAt(p: DesignProblem, tau: number): Float64Array | null {
  const holder = p.feedTube;
  if (holder === undefined || p.searchRtol <= 1e-9) return null;
  if (holder.value === undefined) {
    const end = Math.min(p.tauHi, p.maxStageTau, p.maxTotalTau);
    holder.value = buildFeedTube(p.kin, p.tauLo, end);
  }
  return holder.value?.at(tau) ?? null;
}

/** Outlets of a PFR fed with Fin at every residence time of `taus` (ascending), from one integration. */
export function pfrOutletsAt(p: DesignProblem, Fin: Float64Array, taus: readonly number[], T = p.T): Float64Array[] {
  const v0 = p.kin.net.v0;
  if (Fin === p.kin.net.F0 && T === p.T) {
    const read = taus.map((t) => (t > 0 ? feedTubeAt(p, t) : Fin));
    if (read.every((F) => F !== null)) return read as Float64Array[];
  }
  const positive = taus.filter((t) => t > 0);
  const res = positive.length === 0 ? null : pfrOutlet(p.kin, Fin, T, positive[positive.length - 1] * v0, { outputVolumes: positive.map((t) => t * v0), rtol: p.searchRtol });
  let q = 0;
  return taus.map((t) => (t > 0 ? res!.profile[q++].flows : Fin));
}

export interface Score {
  /** The quantity ranked, larger is better: yield, selectivity, or minus the total residence time. */
  value: number;
  /** Sum of the shortfalls below minConversion and minYield (0 when both are met). */
  violation: number;
  conversionShort: boolean;
  yieldShort: boolean;
}

const FEASIBLE_SLACK = 1e-9;

export function scoreOutlet(p: DesignProblem, F: Float64Array, totalTau: number): Score {
  const net = p.kin.net;
  const fk0 = net.F0[net.key];
  const consumed = fk0 - F[net.key];
  const X = consumed / fk0;
  const formed = p.product >= 0 ? F[p.product] - net.F0[p.product] : 0;
  const Y = formed / fk0;
  const S = Math.abs(consumed) <= 4 * Number.EPSILON * fk0 ? 0 : formed / consumed;
  const xShort = p.minConversion === null ? 0 : Math.max(0, p.minConversion - X);
  const yShort = p.minYield === null ? 0 : Math.max(0, p.minYield - Y);
  const value = p.kind === "yield" ? Y : p.kind === "selectivity" ? S : -totalTau;
  return { value, violation: xShort + yShort, conversionShort: xShort > FEASIBLE_SLACK, yieldShort: yShort > FEASIBLE_SLACK };
}

export function isFeasible(s: Score): boolean {
  return !s.conversionShort && !s.yieldShort;
}

/** Outlet flows after every stage of a train at residence times `taus`. */
export function trainOutlets(p: DesignProblem, sequence: readonly StageType[], taus: readonly number[], temps?: readonly number[]): Float64Array[] {
  const out: Float64Array[] = [];
  let F = p.kin.net.F0;
  sequence.forEach((type, s) => {
    F = stageOutlet(p, type, F, taus[s], temps?.[s] ?? p.T, s);
    out.push(F);
  });
  return out;
}

/** Score of a design whose stages could not be solved: worse than any design that could. */
export const UNSOLVED: Score = { value: Number.NEGATIVE_INFINITY, violation: Number.POSITIVE_INFINITY, conversionShort: true, yieldShort: false };

export function evaluateTrain(p: DesignProblem, sequence: readonly StageType[], taus: readonly number[], temps?: readonly number[]): Score {
  try {
    const outs = trainOutlets(p, sequence, taus, temps);
    return scoreOutlet(p, outs[outs.length - 1], taus.reduce((a, b) => a + b, 0));
  } catch (err) {
    // A tank whose balances cannot be solved at this size (or a tube that cannot be integrated) rules
    // out this design, not the whole search.
    if (err instanceof EngineError) return UNSOLVED;
    throw err;
  }
}
