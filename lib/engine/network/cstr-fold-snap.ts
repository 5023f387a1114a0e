import { EngineError } from "../errors";
import { lowBranchFold } from "./cstr-fold";
import type { SequenceDesign } from "./optimise";
import { stageOutlet, trainOutlets, type DesignProblem } from "./train-eval";

/** Relative accuracy of the volume at which a tank's lowest state jumps (the contract asks for 1e-6). */
const FOLD_TOLERANCE = 1e-10;
/** A tank within this fraction of a fold's volume counts as pressed against it. */
const FOLD_WINDOW = 1e-3;

/**
 * Each stirred tank of the design within FOLD_WINDOW of the fold of its low branch (for its own inlet) is
 * tried at both sides of the volume where its lowest state jumps: continuation (cstr-fold.ts) finds the
 * fold to about 1e-8, then bisection on the lowest state itself (the state the train continues from)
 * brackets the jump to FOLD_TOLERANCE; the better side is kept when it beats the polished design. Networks
 * whose tanks have one state have no fold and skip the work.
 */
export function snapToFolds(
  p: DesignProblem,
  d: SequenceDesign,
  redesign: (taus: number[]) => SequenceDesign,
  better: (a: SequenceDesign, b: SequenceDesign) => boolean,
): SequenceDesign {
  if (p.tanksUnique || !Number.isFinite(d.score.value)) return d;
  let best = d;
  const net = p.kin.net;
  const conversion = (F: Float64Array) => 1 - F[net.key] / net.F0[net.key];
  for (let s = 0; s < d.sequence.length; s++) {
    const tau = best.taus[s];
    const T = best.temps[s];
    if (d.sequence[s] !== "CSTR" || tau === 0) continue;
    let bracket: [number, number];
    try {
      const Fin = s === 0 ? net.F0 : trainOutlets(p, best.sequence.slice(0, s), best.taus.slice(0, s), best.temps.slice(0, s))[s - 1];
      const fold = lowBranchFold(p.kin, Fin, T, tau * net.v0 * (1 + FOLD_WINDOW), 1e-9);
      if (fold === null || fold.volume < tau * net.v0 * (1 - FOLD_WINDOW)) continue;
      // Past the fold the lowest state is far from the fold's; halfway marks the jump.
      let lo = fold.volume / net.v0;
      let hi = Math.max(tau, lo) * (1 + FOLD_WINDOW);
      const gap = Math.abs(conversion(stageOutlet(p, "CSTR", Fin, hi, T)) - fold.conversion);
      if (!(gap > 0)) continue;
      while (hi - lo > FOLD_TOLERANCE * hi) {
        const mid = 0.5 * (lo + hi);
        if (Math.abs(conversion(stageOutlet(p, "CSTR", Fin, mid, T)) - fold.conversion) > 0.5 * gap) hi = mid;
        else lo = mid;
      }
      bracket = [lo, hi];
    } catch (err) {
      if (err instanceof EngineError) continue;
      throw err;
    }
    for (const t of bracket) {
      const taus = [...best.taus];
      taus[s] = t;
      const trial = redesign(taus);
      if (better(trial, best)) best = trial;
    }
  }
  return best;
}
