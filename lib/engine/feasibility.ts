import { EngineError, ensure } from "./errors";
import { sharedPath, type SizingBasis } from "./sizing-basis";
import { brentRoot } from "./root-finding";

const SCAN = 512;

/** First conversion in [lo, hi] where f stops being positive (refined by Brent), or null if it stays positive. */
export function firstNonPositive(f: (x: number) => number, lo: number, hi: number, n = SCAN): number | null {
  let prev = lo;
  if (!(f(lo) > 0)) return lo;
  for (let i = 1; i <= n; i++) {
    const x = lo + ((hi - lo) * i) / n;
    const v = f(x);
    if (!(v > 0)) {
      if (Number.isNaN(v)) return x;
      return brentRoot(f, prev, x);
    }
    prev = x;
  }
  return null;
}

/** Rate along the first stage's path (feed temperature plus the adiabatic rise). */
function feedPathRate(basis: SizingBasis): (x: number) => number {
  return (x) => basis.rate(x, basis.t0 + basis.rise * x);
}

/**
 * Equilibrium conversion along the first stage's temperature path, or null without a reverse term
 * (or when the rate stays positive up to the stoichiometric limit).
 */
export function equilibriumConversion(basis: SizingBasis): number | null {
  if (!basis.reversible) return null;
  return firstNonPositive(feedPathRate(basis), 0, basis.upper * (1 - 1e-12), 4 * SCAN);
}

function fmt(x: number): string {
  return Number(x.toPrecision(6)).toString();
}

function rateProblem(basis: SizingBasis, x: number, target: number, reset: boolean, path: string): EngineError {
  if (basis.reversible) {
    const limit = reset && basis.interstage !== null ? Math.max(x, firstNonPositive((v) => basis.rate(v, basis.interstage as number), 0, basis.upper * (1 - 1e-12), 4 * SCAN) ?? 1) : x;
    if (target >= limit) {
      return new EngineError(
        "equilibrium",
        `the target conversion ${fmt(target)} is at or beyond the equilibrium conversion ${fmt(limit)}; no train can pass it`,
        "target.conversion",
      );
    }
  }
  const r = basis.rate(x, basis.t0 + basis.rise * x);
  const what = Number.isNaN(r) ? "not a number" : "zero or negative";
  return new EngineError("infeasible", `the rate is ${what} at conversion ${fmt(x)}, before the target ${fmt(target)}`, path);
}

/**
 * Checks that the target can be approached at all: range, stoichiometry, rate table, temperature limit
 * and a positive rate up to the target (or the equilibrium conversion when the rate has a reverse term).
 * @throws EngineError with the path of the field at fault.
 */
export function checkTarget(basis: SizingBasis, target: number, rateRange: readonly [number, number], ratePath: string, feedMayBeIdle = false): void {
  const T = "target.conversion";
  ensure(Number.isFinite(target) && target > 0 && target < 1, "the target conversion must be within (0, 1)", T);
  ensure(
    target < basis.maxConversion,
    `the target conversion ${fmt(target)} needs more of a co-reactant than the feed holds; the stoichiometric limit is ${fmt(basis.maxConversion)}`,
    T,
  );
  ensure(target <= rateRange[1], `the target conversion ${fmt(target)} is outside the rate table's range [${fmt(rateRange[0])}, ${fmt(rateRange[1])}]`, T);
  if (basis.choice) {
    checkChosenTarget(basis, target, ratePath, feedMayBeIdle);
    return;
  }
  const shared = sharedPath(basis);
  if (shared) {
    const tOut = basis.t0 + basis.rise * target;
    if (tOut > basis.maxTemperature) {
      throw new EngineError(
        "infeasible",
        `reaching conversion ${fmt(target)} adiabatically takes the stream to ${fmt(tOut)} K, above the maximum temperature ${fmt(basis.maxTemperature)} K, so no stage can keep it; add an interstage temperature`,
        "reaction.thermal.maxTemperature",
      );
    }
    ensure(tOut > 0, `the adiabatic path falls to ${fmt(tOut)} K before the target`, "reaction.thermal.adiabaticRise");
  }
  const f = feedPathRate(basis);
  // feedMayBeIdle: a rate of exactly zero at the feed itself is allowed (a stage that mixes product in
  // can start there); just past the feed it must be positive.
  const from = feedMayBeIdle && f(0) === 0 ? 1e-9 * target : 0;
  const bad = firstNonPositive(f, from, shared ? target : Math.min(target, 1e-9));
  if (bad !== null) throw rateProblem(basis, bad, target, !shared, ratePath);
  if (!shared && basis.reversible) {
    const x = equilibriumConversion(basis);
    if (x !== null) {
      const err = rateProblem(basis, x, target, true, ratePath);
      if (err.code === "equilibrium") throw err;
    }
  }
}

/** Lowest and highest temperatures any stage may run at when inlet temperatures are chosen. */
function chosenSpan(basis: SizingBasis): [number, number] {
  const c = basis.choice;
  const firstLow = c?.first?.[0] ?? basis.t0;
  const laterLow = c?.later?.[0] ?? basis.interstage ?? firstLow;
  const lowest = Math.min(firstLow, laterLow);
  const top = Math.max(c?.first?.[1] ?? basis.t0, c?.later?.[1] ?? basis.interstage ?? basis.t0);
  const highest = Number.isFinite(basis.maxTemperature) ? basis.maxTemperature : Math.max(top, top + basis.rise);
  return [lowest, Math.max(lowest, highest)];
}

/**
 * With chosen inlet temperatures: a positive rate just past the feed at the first stage's lowest inlet, and
 * a target below the highest equilibrium conversion over the temperatures a stage can take (each stage
 * stops at the equilibrium of its own temperature; an isothermal equilibrium at 9 temperatures across the span).
 */
function checkChosenTarget(basis: SizingBasis, target: number, ratePath: string, feedMayBeIdle: boolean): void {
  const t1 = basis.choice?.first?.[0] ?? basis.t0;
  const f = (x: number): number => basis.rate(x, t1);
  const from = feedMayBeIdle && f(0) === 0 ? 1e-9 * target : 0;
  const bad = firstNonPositive(f, from, Math.min(target, 1e-9));
  if (bad !== null) {
    const r = f(bad);
    throw new EngineError("infeasible", `the rate is ${Number.isNaN(r) ? "not a number" : "zero or negative"} at conversion ${fmt(bad)}, before the target ${fmt(target)}`, ratePath);
  }
  if (!basis.reversible) return;
  const [lo, hi] = chosenSpan(basis);
  let best = 0;
  for (let i = 0; i < 9; i++) {
    const t = hi > lo ? lo + ((hi - lo) * i) / 8 : lo;
    const eq = firstNonPositive((x) => basis.rate(x, t), 0, basis.upper * (1 - 1e-12), 4 * SCAN);
    best = Math.max(best, eq ?? 1);
  }
  if (target >= best) {
    throw new EngineError(
      "equilibrium",
      `the target conversion ${fmt(target)} is at or beyond the highest equilibrium conversion ${fmt(best)} within the temperatures allowed; no train can pass it`,
      "target.conversion",
    );
  }
}
