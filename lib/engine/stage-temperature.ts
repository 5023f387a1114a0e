import { optimalRecycle, recycleInletConversion, recycleVolume } from "./recycle";
import { chosenRange, type SizingBasis } from "./sizing-basis";
import { kronrod15, kronrod15WithError } from "./quadrature";
import { compositeKronrod, idealStageVolume, pfrVolume, type StagePlace } from "./stages";

/*
 * Stage inlet temperatures as decision variables. A stage's volume depends only on its inlet conversion a,
 * its outlet conversion b and its own inlet temperature T (its path is T + rise (X - a)); nothing else in
 * the train sees T. So the least volume of a stage over T, V*(a, b) = min over T of V(a, b, T), is again a
 * function of (a, b) alone, and the train's optimum over conversions and temperatures is the optimum over
 * conversions of the sum of V*: the conversion grid's dynamic programme and the refinement take V* in
 * place of V, unchanged in structure.
 */

/** Points of the scan over the temperature range before the root solve (see searchTemperature in stage-temperature-search.ts). */
export const TEMPERATURE_SCAN = 13;

/** A stage at its best inlet temperature. */
export interface StageTemperatureDesign {
  /** Inlet temperature, K (NaN when no temperature of the range works). */
  readonly temperature: number;
  /** Volume there, m3 (Infinity when infeasible). */
  readonly volume: number;
  /** Whether the temperature sits on the cap maxTemperature - rise (b - a), which moves with a and b. */
  readonly capped: boolean;
}

/**
 * The basis of one stage whose inlet temperature is T: computed as a later stage (first = false) reset to T,
 * its path its own.
 */
export function stageBasisAt(basis: SizingBasis, temperature: number): SizingBasis {
  // A stage's volume, slope and gradient are asked at one temperature in turn: the last basis is kept.
  const last = lastAt.get(basis);
  if (last && last.t0 === temperature) return last;
  const at = { ...basis, t0: temperature, interstage: temperature, choice: undefined, ownPath: true };
  lastAt.set(basis, at);
  return at;
}

const lastAt = new WeakMap<SizingBasis, SizingBasis>();

/**
 * Inlet temperatures a stage from a to b may have: the range given, below the cap that keeps the stage
 * within the maximum temperature (an exothermic stage heats by rise (b - a)); null when none.
 */
export function inletBounds(basis: SizingBasis, first: boolean, a: number, b: number): { lo: number; hi: number; cap: number } | null {
  const range = chosenRange(basis, first);
  if (!range) return null;
  const heat = basis.rise * (b - a);
  const cap = basis.maxTemperature - Math.max(0, heat);
  const lo = Math.max(range[0], heat < 0 ? -heat * (1 + 1e-12) : 0);
  const hi = Math.min(range[1], cap);
  return hi >= lo ? { lo, hi, cap } : null;
}

/** Volume of a stage from a to b entering at temperature T, m3 (the recycle ratio chosen or fixed as asked). */
export function volumeAtTemperature(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number, relTol = 1e-12): number {
  const at = stageBasisAt(basis, temperature);
  if (place.type === "PFR") return pfrVolume(at, false, a, b, relTol);
  if (place.type !== "PFR-recycle") return idealStageVolume(at, { type: place.type, first: false }, a, b);
  if (place.recycleRatio !== undefined && place.recycleRatio !== null) return recycleVolume(at, false, a, b, place.recycleRatio);
  return optimalRecycle(at, false, a, b).volume;
}

/** The integrand of dV/dT over [lo, b] and its factor (see temperatureSlope); a stirred tank has none. */
function slopeIntegrand(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number) {
  const at = stageBasisAt(basis, temperature);
  const f = (x: number): number => {
    const t = temperature + basis.rise * (x - a);
    const r = at.rate(x, t);
    const ht = 1e-5 * t;
    return -(at.rate(x, t + ht) - at.rate(x, t - ht)) / (2 * ht) / (r * r);
  };
  let lo = a;
  let scale = basis.fa0;
  if (place.type === "PFR-recycle") {
    const ratio = place.recycleRatio ?? optimalRecycle(at, false, a, b).ratio;
    lo = recycleInletConversion(a, b, ratio);
    scale *= ratio + 1;
  }
  return { f, lo, scale };
}

/**
 * dV/dT of a stage from a to b entering at temperature T, m3/K: FA0 times the integral of d(1/(-rA))/dT
 * along the stage's path (every point of the path moves with its inlet temperature), over the tube (from the
 * mixed inlet X_1 for a tube with recycle, times R + 1 at its best R: the envelope theorem), or at the outlet
 * for a stirred tank. dr/dT by central differences (relative step 1e-5). The integral is taken by the
 * 15-point Gauss–Kronrod rule on fixed panels: `panels` equal ones, or the breakpoints given (fractions of
 * the tube from its inlet, see slopeBreakpoints). Fixed panels, not an adaptive rule at each call: the
 * integrand carries the differencing's noise (about 1e-10 relative), which would drive an adaptive rule to
 * its panel limit, and fixed panels keep the slope a smooth function of T for the root solves.
 */
export function temperatureSlope(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number, panels: number | readonly number[] = 1): number {
  if (b <= a) return 0;
  const { f, lo, scale } = slopeIntegrand(basis, place, a, b, temperature);
  if (place.type === "CSTR") return basis.fa0 * (b - a) * f(b);
  if (typeof panels === "number") return scale * compositeKronrod(f, lo, b, panels);
  let sum = 0;
  for (let k = 0; k + 1 < panels.length; k++) sum += kronrod15(f, lo + (b - lo) * panels[k], panels[k + 1] === 1 ? b : lo + (b - lo) * panels[k + 1]);
  return scale * sum;
}

/**
 * Panels for temperatureSlope that take its integral at temperature T to `relTol` (1e-7; QUADPACK's error
 * estimate; the panel of largest error bisected, at most 24 panels): found once per stage and then kept
 * while its best temperature is solved, so the slope is accurate where the integrand is steep (a stage ending
 * near its equilibrium, where one panel was seen to move the best temperature by 0.01 K) and still smooth in T.
 */
export function slopeBreakpoints(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number, relTol = 1e-7): number[] {
  if (b <= a || place.type === "CSTR") return [0, 1];
  const { f, lo } = slopeIntegrand(basis, place, a, b, temperature);
  const span = b - lo;
  const panels: { p: number; q: number; value: number; error: number }[] = [];
  const add = (p: number, q: number) => {
    const [value, error] = kronrod15WithError(f, lo + span * p, q === 1 ? b : lo + span * q);
    panels.push({ p, q, value, error });
  };
  add(0, 1);
  while (panels.length < 24) {
    let total = 0;
    let error = 0;
    let worst = 0;
    for (let i = 0; i < panels.length; i++) {
      total += panels[i].value;
      error += panels[i].error;
      if (panels[i].error > panels[worst].error) worst = i;
    }
    if (!Number.isFinite(total) || error <= relTol * Math.abs(total)) break;
    const { p, q } = panels[worst];
    panels.splice(worst, 1);
    add(p, 0.5 * (p + q));
    add(0.5 * (p + q), q);
  }
  return [0, ...panels.map((x) => x.q).sort((u, v) => u - v)];
}
