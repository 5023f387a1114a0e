import { ensure } from "./errors";
import { stageTemperature, type SizingBasis } from "./sizing-basis";
import { integrate } from "./quadrature";
import { ensureFixedTemperatures, resolveSizingBasis } from "./resolve-sizing-basis";
import { brentRoot } from "./root-finding";
import { recycleSteadyStates } from "./rating";
import { stageRatio } from "./rate-train";
import { levenspielHeight, temperatureFeasible } from "./stages";
import type { RatingSpec, ReactionSpec } from "./types";

/**
 * Whether -rA cannot rise with conversion at constant temperature, so a CSTR has one steady state and
 * the rate, positive at the top of the range, is positive all the way there: an isothermal liquid with
 * an irreversible power law whose orders are all on consumed species, or saturation kinetics without
 * substrate inhibition.
 */
function monotoneIsothermal(reaction: ReactionSpec): boolean {
  if ((reaction.thermal?.mode ?? "isothermal") !== "isothermal" || (reaction.phase ?? "liquid") !== "liquid") return false;
  const law = reaction.rate;
  const stoich = reaction.stoichiometry ?? { A: -1 };
  const nu = (name: string): number => (name === "A" ? -1 : (stoich[name] ?? 0));
  if (law.law === "power") {
    return law.reverse === undefined && Object.entries(law.orders).every(([name, n]) => n === 0 || (n > 0 && nu(name) < 0));
  }
  return law.law === "saturation" && law.ki === undefined;
}

/** reachLimit, skipping its scan where the rate cannot dip (the scan could only confirm the top). */
function leanReachLimit(basis: SizingBasis, first: boolean, a: number, monotone: boolean): number {
  if (monotone) {
    const top = basis.upper * (1 - 1e-12);
    if (temperatureFeasible(basis, first, a, top) && basis.rate(top, stageTemperature(basis, first, a, top)) > 0) return top;
  }
  return scannedReachLimit(basis, first, a);
}

/**
 * Width of bracket at which the PFR solve stops: far inside the 1e-9 promised, and above the spacing of
 * doubles near X = 1, where a step's integral is all round-off and costs hundreds of evaluations.
 */
const BRACKET = 1e-13;

/**
 * PFR outlet by safeguarded Newton on V(a, x) = V, as pfrOutlet, but each volume is the previous one
 * plus the integral over the step just taken, so no iterate integrates from the inlet again and the
 * volume to the reach limit (a near-singular integral) is never needed.
 */
function leanPfrOutlet(basis: SizingBasis, first: boolean, a: number, volume: number, monotone: boolean): number {
  if (volume <= 0) return a;
  const hi = leanReachLimit(basis, first, a, monotone);
  const height = (x: number): number => levenspielHeight(basis, first, a, x);
  let lo = a;
  let up = hi;
  let x = a;
  let vx = 0;
  for (let i = 0; i < 200; i++) {
    const hx = height(x);
    let next = x + (volume - vx) / hx;
    if (!(next > lo && next < up)) next = 0.5 * (lo + up);
    // An error dV in the volume moves the outlet by dV / h, so a step is integrated to 1e-11 of itself
    // or to what moves X by 1e-12, whichever is looser: near X = 1 the round-off of 1 - x keeps the
    // relative error from ever reaching 1e-11, and chasing it costs thousands of evaluations.
    const hn = height(next);
    const xTol = 1e-12 * Math.min(hx, hn);
    const step = integrate(height, x, next, 1e-11, Math.max(1e-13 * volume, Number.isFinite(xTol) ? xTol : 0)).value;
    const vn = vx + step;
    if (!Number.isFinite(vn)) {
      up = next;
      if (up - lo <= BRACKET) return lo;
      continue;
    }
    // Below these the residual is round-off, not a step to take.
    if (Math.abs(vn - volume) <= Math.max(1e-11 * volume, Number.isFinite(hn) ? 1e-12 * hn : 0)) return next;
    if (vn > volume) up = next;
    else lo = next;
    if (Math.abs(next - x) <= 1e-15 * Math.max(1, Math.abs(x)) || up - lo <= BRACKET) return next;
    x = next;
    vx = vn;
  }
  return x;
}

/**
 * Lowest CSTR steady state above the inlet, as cstrSteadyStates()[0]: the same bracket scan, stopped at
 * the first sign change; one Brent solve over the whole range when the rate cannot rise with conversion.
 */
function leanCstrOutlet(basis: SizingBasis, first: boolean, a: number, volume: number, monotone: boolean): number {
  if (volume <= 0) return a;
  const hi = leanReachLimit(basis, first, a, monotone);
  const f = (x: number): number => (x - a) * basis.fa0 - volume * basis.rate(x, stageTemperature(basis, first, a, x));
  if (monotone) {
    const fhi = f(hi);
    if (fhi === 0) return hi;
    const x = fhi > 0 ? brentRoot(f, a, hi) : hi;
    return x > a ? x : hi;
  }
  return firstRootOnGrid(f, a, hi, basis.rise === 0 ? 200 : 2000) ?? hi;
}

const GROUP = 8;

/**
 * Visits the grid points 0..n in groups of 8, evaluating only each group's end, and hands to `fine` (in
 * order) every group whose ends are `notable` or that sits next to a turn of the values (a feature of f
 * narrower than one group needs f to turn there). Returns the first non-null answer of `fine`.
 * This finds what a point-by-point scan finds for any f that does not turn twice within one group.
 */
function groupedScan<T>(n: number, value: (i: number) => number, notable: (f0: number, f1: number) => boolean, fine: (i0: number, i1: number, f0: number) => T | null): T | null {
  const groups = Math.ceil(n / GROUP);
  const ends = [value(0)];
  let scanned = -1;
  for (let g = 1; g <= groups; g++) {
    const i0 = (g - 1) * GROUP;
    const i1 = Math.min(n, g * GROUP);
    const f0 = ends[g - 1];
    const f1 = value(i1);
    ends.push(f1);
    const turn = g >= 2 && Math.sign(f0 - ends[g - 2]) !== Math.sign(f1 - f0);
    if (turn && scanned < g - 1) {
      const hit = fine(i0 - GROUP, i0, ends[g - 2]);
      if (hit !== null) return hit;
    }
    if (turn || notable(f0, f1)) {
      const hit = fine(i0, i1, f0);
      if (hit !== null) return hit;
      scanned = g;
    }
  }
  return null;
}

/**
 * The first root above a that allRoots(f, a, hi, n) finds, on the same grid x_i = a + (hi - a) i / n
 * and with the same Brent solves, so the lowest steady state of cstrSteadyStates.
 */
function firstRootOnGrid(f: (x: number) => number, a: number, hi: number, n: number): number | null {
  const at = (i: number): number => a + ((hi - a) * i) / n;
  const differ = (f0: number, f1: number): boolean => !Number.isFinite(f0) || !Number.isFinite(f1) || f1 === 0 || f0 * f1 < 0;
  return groupedScan(n, (i) => f(at(i)), differ, (i0, i1, f0start) => {
    let x0 = at(i0);
    let f0 = f0start;
    for (let i = i0 + 1; i <= i1; i++) {
      const x1 = at(i);
      const f1 = f(x1);
      if (f1 === 0 && x1 > a) return x1;
      if (f0 !== 0 && Number.isFinite(f0) && Number.isFinite(f1) && f0 * f1 < 0) {
        const root = brentRoot(f, x0, x1);
        if (root > a) return root;
      }
      x0 = x1;
      f0 = f1;
    }
    return null;
  });
}

/**
 * reachLimit's answer (the first of its 256 grid points where the rate is not positive or the
 * temperature leaves its limits, then bisection), found with the grouped scan.
 */
function scannedReachLimit(basis: SizingBasis, first: boolean, a: number): number {
  const top = basis.upper * (1 - 1e-12);
  const at = (i: number): number => a + ((top - a) * i) / 256;
  const okValue = (x: number): number => (temperatureFeasible(basis, first, a, x) ? basis.rate(x, stageTemperature(basis, first, a, x)) : Number.NaN);
  const fails = (v: number): boolean => !(v > 0);
  const bad = groupedScan(256, (i) => (i === 0 ? okValue(a) : okValue(at(i))), (_, f1) => fails(f1), (i0, i1) => {
    for (let i = Math.max(1, i0 + 1); i <= i1; i++) if (fails(okValue(at(i)))) return i;
    return null;
  });
  if (bad === null) return top;
  let lo = bad === 1 ? a : at(bad - 1);
  let hi = at(bad);
  for (let i = 0; i < 80 && hi - lo > 1e-15; i++) {
    const mid = 0.5 * (lo + hi);
    if (fails(okValue(mid))) hi = mid;
    else lo = mid;
  }
  return lo;
}

/**
 * Outlet conversion of a given train, equal to rateTrain(spec).conversionOut to about 1e-9, for rating
 * the same train many times (Monte Carlo): give it a spec from normaliseRatingSpec so no units are parsed.
 * @throws EngineError for an invalid spec, as rateTrain.
 */
export function rateTrainOutlet(spec: RatingSpec): number {
  const { basis } = resolveSizingBasis(spec.feed, spec.reaction);
  ensureFixedTemperatures(basis, spec.reaction);
  ensure(spec.stages.length >= 1 && spec.stages.length <= 8, "give 1..8 stages", "stages");
  const monotone = monotoneIsothermal(spec.reaction);
  let a = 0;
  spec.stages.forEach((s, k) => {
    const volume = typeof s.volume === "number" ? s.volume : Number.NaN;
    ensure(Number.isFinite(volume) && volume >= 0, "a stage volume must be a number >= 0 (normalise the spec first)", `stages.${k}.volume`);
    if (s.type === "PFR-recycle") {
      // No lean path for the tube with recycle yet: the full rating's lowest steady state.
      a = recycleSteadyStates(basis, k === 0, a, volume, stageRatio(s, k) as number)[0].conversionOut;
      return;
    }
    a = s.type === "CSTR" ? leanCstrOutlet(basis, k === 0, a, volume, monotone) : leanPfrOutlet(basis, k === 0, a, volume, monotone);
  });
  return a;
}
