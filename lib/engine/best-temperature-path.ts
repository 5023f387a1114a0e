import { minimiseOnRange } from "./minimise-1d";
import { integrate } from "./quadrature";
import { brentRoot } from "./root-finding";
import type { SizingBasis } from "./sizing-basis";
import type { BestPathPoint, BestTemperaturePath, ReactionSpec } from "./types";
import { DIM, toSI } from "./units";

/** Points of the path returned for the conversion–temperature chart (from X = 0 to the target). */
export const BEST_PATH_POINTS = 41;
/** Samples of the temperature range before Brent's method, per conversion. */
const RATE_SCAN = 9;

/**
 * Whether the reaction is a reversible power law whose reverse activation energy is above the forward one:
 * then the heat of reaction E_f - E_r is negative (exothermic; van 't Hoff, with K = k_f/k_r) and at a fixed
 * conversion the rate rises with temperature, has a maximum, and falls to zero at the equilibrium temperature.
 */
export function reversibleExothermic(reaction: ReactionSpec): boolean {
  const law = reaction.rate;
  if (law.law !== "power" || !law.reverse) return false;
  const ef = toSI(law.activationEnergy ?? 0, DIM.energyPerMole, "reaction.rate.activationEnergy");
  const er = toSI(law.reverse.activationEnergy ?? 0, DIM.energyPerMole, "reaction.rate.reverse.activationEnergy");
  return er > ef && ef >= 0;
}

/** The temperature of the highest rate at conversion x within [lo, hi], and that rate. */
export function bestRateTemperature(basis: SizingBasis, x: number, lo: number, hi: number): { temperature: number; rate: number } {
  const m = minimiseOnRange((t) => -basis.rate(x, t), lo, hi, RATE_SCAN, 1e-12);
  return { temperature: m.x, rate: -m.value };
}

/** The temperature where the net rate at conversion x is zero (the equilibrium line), or null when none. */
export function equilibriumTemperature(basis: SizingBasis, x: number, start: number): number | null {
  const r = (t: number): number => basis.rate(x, t);
  let below = start;
  let above = start;
  if (r(start) > 0) {
    for (let i = 0; i < 60 && r(above) > 0; i++) {
      below = above;
      above *= 1.25;
    }
    if (!(r(above) <= 0)) return null;
  } else {
    for (let i = 0; i < 60 && !(r(below) > 0); i++) {
      above = below;
      below /= 1.25;
    }
    if (!(r(below) > 0)) return null;
  }
  return brentRoot(r, below, above, 1e-13 * above);
}

/**
 * The best temperature path from the feed to the target between the lowest and highest temperatures a
 * stage may take: at each conversion the temperature of the highest rate (Levenspiel, Chemical Reaction
 * Engineering, 3rd ed., ch. 9), and the volume of a tube that follows it, FA0 * integral of dX/(-rA)_max,
 * by adaptive Gauss–Kronrod quadrature (the integrand has a kink where the path leaves the highest
 * temperature; the adaptive rule resolves it). Null when the rate is not positive on the way.
 */
export function bestTemperaturePath(basis: SizingBasis, target: number, lowest: number, highest: number): BestTemperaturePath | null {
  const height = (x: number): number => {
    const r = bestRateTemperature(basis, x, lowest, highest).rate;
    return r > 0 ? basis.fa0 / r : Infinity;
  };
  const volume = integrate(height, 0, target, 1e-10).value;
  if (!Number.isFinite(volume) || volume <= 0) return null;
  const points: BestPathPoint[] = [];
  for (let k = 0; k < BEST_PATH_POINTS; k++) {
    const x = k === BEST_PATH_POINTS - 1 ? target : (target * k) / (BEST_PATH_POINTS - 1);
    const t = bestRateTemperature(basis, x, lowest, highest).temperature;
    const eq = x > 0 ? equilibriumTemperature(basis, x, t) : null;
    points.push(eq !== null ? { conversion: x, temperature: t, equilibriumTemperature: eq } : { conversion: x, temperature: t });
  }
  return { volume, lowestTemperature: lowest, highestTemperature: highest, points };
}

/**
 * The lowest and highest temperatures a stage of the train may take, for the best path: from the lowest
 * inlet temperature (feed, interstage, or the bottom of their ranges) to the maximum temperature; null
 * when there is no highest temperature or no temperature freedom at all (isothermal at the feed temperature).
 */
export function pathTemperatures(basis: SizingBasis): { lowest: number; highest: number } | null {
  if (!basis.choice && basis.rise === 0) return null;
  if (!Number.isFinite(basis.maxTemperature)) return null;
  const firstLow = basis.choice?.first?.[0] ?? basis.t0;
  const laterLow = basis.choice?.later?.[0] ?? basis.interstage ?? firstLow;
  const lowest = Math.min(firstLow, laterLow);
  return lowest <= basis.maxTemperature ? { lowest, highest: basis.maxTemperature } : null;
}
