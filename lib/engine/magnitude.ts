import { EngineError } from "./errors";
import type { SizingBasis } from "./sizing-basis";

/**
 * Plausible range of a reaction volume, m3. Below 1 nL or above 1 km3 a result says more about a
 * typing slip in the rate constant or the expression than about a vessel, so the engine refuses to
 * print it as if it were a design.
 */
export const VOLUME_LIMITS = { min: 1e-12, max: 1e9 } as const;

/**
 * Largest vessel volume a rating accepts, m3: the design's own upper limit, so that every train the
 * design offers can be rated back, while a slip like 1e30 m3 is refused.
 */
export const MAX_RATED_VESSEL = VOLUME_LIMITS.max;

const SCAN = 512;

function fmt(x: number): string {
  return Number(x.toPrecision(3)).toString();
}

/**
 * Scans the rate along the feed path up to `hi` and refuses one that overflows (Infinity), is not a
 * number, or is so small that FA0/(-rA) overflows: each of these would otherwise print as 0 or as an
 * endless volume instead of saying what went wrong.
 */
export function checkRateMagnitude(basis: SizingBasis, hi: number, path: string): void {
  for (let i = 0; i <= SCAN; i++) {
    const x = (hi * i) / SCAN;
    const r = basis.rate(x, basis.t0 + basis.rise * x);
    if (r === Infinity || r === -Infinity) {
      throw new EngineError("infeasible", `the rate overflows at X = ${fmt(x)} (too large to compute); check the rate constant and the rate expression`, path);
    }
    if (r > 0 && !Number.isFinite(basis.fa0 / r)) {
      throw new EngineError("infeasible", `the rate underflows at X = ${fmt(x)} (too small to compute); check the rate constant and the rate expression`, path);
    }
  }
}

/**
 * Refuses a designed volume outside VOLUME_LIMITS, naming what it is, so that a result of 1e-300 m3
 * never prints as "0 L" and 1e300 m3 never prints as a number at all.
 */
export function checkVolumeMagnitude(volume: number, what: string, path: string): void {
  if (!Number.isFinite(volume)) {
    throw new EngineError("infeasible", `${what} cannot be computed (the volume is not finite); check the rate constant and the rate expression`, path);
  }
  if (volume < VOLUME_LIMITS.min) {
    throw new EngineError(
      "infeasible",
      `${what} comes out at ${fmt(volume)} m3, below 1 nL; the rate is implausibly fast, check the rate constant and the rate expression`,
      path,
    );
  }
  if (volume > VOLUME_LIMITS.max) {
    throw new EngineError(
      "infeasible",
      `${what} comes out at ${fmt(volume)} m3, above 1 km3; the rate is implausibly slow, check the rate constant and the rate expression`,
      path,
    );
  }
}
