import { DIM, rateTrain, toSI, type RatingResult, type RatingSpec } from "@/lib/engine";

export interface LargestFeed {
  /** Largest molar feed of A (mol/s) at which the train still reaches the target; null when none was found. */
  flowA: number | null;
  /** Feed volumetric flow v0 = FA0 / CA0 at that feed, m3/s. */
  feedVolumetricFlow: number | null;
  /** Conversion the train reaches at that feed. */
  conversion: number | null;
  /** Why there is no answer, when flowA is null. */
  reason: string | null;
  evaluations: number;
}

const MAX_STEPS = 60;

/**
 * The largest feed rate of A at which a fixed train still reaches `target`, by bisection on
 * feed.flowA at fixed feed concentration. Raising FA0 at fixed CA0 raises v0 = FA0/CA0 and so
 * shortens every stage's space time τ = V/v0: the conversion falls as the feed rises, which is what
 * makes the bracket-and-bisect search valid. (With several steady states the train follows the
 * lowest one, so the answer is conservative.)
 */
export function largestFeed(spec: RatingSpec, target: number, relTol = 1e-10): LargestFeed {
  const concA = toSI(spec.feed.concA, DIM.concentration, "feed.concA");
  let evaluations = 0;
  const conversionAt = (flowA: number) => {
    evaluations += 1;
    return rateTrain({ ...spec, feed: { ...spec.feed, flowA } }).conversionOut;
  };
  const start = toSI(spec.feed.flowA, DIM.molarFlow, "feed.flowA");
  let lo: number;
  let hi: number;
  if (conversionAt(start) >= target) {
    lo = start;
    hi = 2 * start;
    let steps = 0;
    while (conversionAt(hi) >= target) {
      if (++steps > MAX_STEPS) return none("The train reaches the target at every feed tried", evaluations);
      lo = hi;
      hi *= 2;
    }
  } else {
    hi = start;
    lo = start / 2;
    let steps = 0;
    while (conversionAt(lo) < target) {
      if (++steps > MAX_STEPS) return none("The train does not reach the target even at a vanishing feed (equilibrium or a too small train)", evaluations);
      hi = lo;
      lo /= 2;
    }
  }
  while ((hi - lo) / hi > relTol) {
    const mid = (lo + hi) / 2;
    if (conversionAt(mid) >= target) lo = mid;
    else hi = mid;
  }
  return { flowA: lo, feedVolumetricFlow: lo / concA, conversion: conversionAt(lo), reason: null, evaluations };
}

function none(reason: string, evaluations: number): LargestFeed {
  return { flowA: null, feedVolumetricFlow: null, conversion: null, reason, evaluations };
}

export type { RatingResult };
