import { stoichiometricLimit } from "./concentrations";
import { EngineError, ensure } from "./errors";
import type { SizingBasis, TemperatureBounds, TemperatureChoice } from "./sizing-basis";
import { resolveRate } from "./rate-law";
import type { FeedSpec, Quantity, ReactionSpec, TemperatureRange } from "./types";
import { DIM, toSI, toTemperatureDifference } from "./units";

/** The resolved basis and facts the feasibility checks use. */
export interface ResolvedProblem {
  readonly basis: SizingBasis;
  /** Conversion range where the rate is defined (a table's range, else [0, 1]). */
  readonly rateRange: readonly [number, number];
}

function positiveSI(value: FeedSpec["flowA"], dim: string, path: string, what: string): number {
  const v = toSI(value, dim, path);
  ensure(v > 0, `${what} must be > 0`, path);
  return v;
}

function temperatureOf(value: Quantity, path: string, what: string): number {
  return positiveSI(value, DIM.temperature, path, what);
}

/** A range {min, max} of temperatures in K, checked: both above 0 K, min <= max. */
function rangeOf(range: TemperatureRange, path: string, what: string): TemperatureBounds {
  const lo = temperatureOf(range.min, `${path}.min`, `the lowest ${what}`);
  const hi = temperatureOf(range.max, `${path}.max`, `the highest ${what}`);
  ensure(lo <= hi, `the lowest ${what} ${lo} K is above the highest ${hi} K`, `${path}.min`);
  return [lo, hi];
}

function isRange(v: Quantity | TemperatureRange | undefined): v is TemperatureRange {
  return typeof v === "object" && v !== null;
}

interface ResolvedThermal {
  readonly rise: number;
  readonly interstage: number | null;
  readonly maxTemperature: number;
  readonly choice?: TemperatureChoice;
}

function resolveThermal(reaction: ReactionSpec, t0: number): ResolvedThermal {
  const th = reaction.thermal ?? { mode: "isothermal" as const };
  const P = "reaction.thermal";
  if (th.mode === "isothermal") return { rise: 0, interstage: null, maxTemperature: Infinity };
  if (th.mode === "stageTemperature") {
    // Every stage isothermal at its own temperature: no rise, each stage's temperature chosen in the range.
    const range = rangeOf({ min: th.min, max: th.max }, P, "stage temperature");
    return { rise: 0, interstage: null, maxTemperature: range[1], choice: { first: range, later: range } };
  }
  const rise = toTemperatureDifference(th.adiabaticRise, `${P}.adiabaticRise`);
  const maxTemperature = th.maxTemperature === undefined ? Infinity : positiveSI(th.maxTemperature, DIM.temperature, `${P}.maxTemperature`, "maximum temperature");
  const given = th.interstageTemperature;
  const later = isRange(given) ? rangeOf(given, `${P}.interstageTemperature`, "interstage temperature") : null;
  const interstage = given === undefined ? null : later ? later[0] : temperatureOf(given as Quantity, `${P}.interstageTemperature`, "interstage temperature");
  const first = th.feedTemperature === undefined ? null : rangeOf(th.feedTemperature, `${P}.feedTemperature`, "feed temperature");
  // A chosen feed temperature with later stages carrying the previous outlet would tie every stage to that
  // one choice (a shared path), which the stage-by-stage search cannot split.
  ensure(
    first === null || given !== undefined,
    "a feed temperature range needs the interstage temperature (each later stage's inlet) given or given as a range",
    `${P}.feedTemperature`,
  );
  if (first === null) ensure(t0 <= maxTemperature, `the feed temperature ${t0} K is above the maximum temperature ${maxTemperature} K, so no stage can keep it`, `${P}.maxTemperature`);
  else ensure(first[0] <= maxTemperature, `the lowest feed temperature ${first[0]} K is above the maximum temperature ${maxTemperature} K`, `${P}.feedTemperature.min`);
  const at = later ? `${P}.interstageTemperature.min` : `${P}.interstageTemperature`;
  ensure(interstage === null || interstage <= maxTemperature, `the ${later ? "lowest " : ""}interstage temperature ${interstage} K is above the maximum temperature ${maxTemperature} K`, at);
  const choice = first || later ? { choice: { first, later } } : {};
  return { rise, interstage, maxTemperature, ...choice };
}

/** Resolves units, defaults and ranges of the feed and reaction into a SizingBasis. */
export function resolveSizingBasis(feed: FeedSpec, reaction: ReactionSpec): ResolvedProblem {
  const fa0 = positiveSI(feed.flowA, DIM.molarFlow, "feed.flowA", "feed rate of A");
  const ca0 = positiveSI(feed.concA, DIM.concentration, "feed.concA", "feed concentration of A");
  const t0 = positiveSI(feed.temperature ?? 298.15, DIM.temperature, "feed.temperature", "feed temperature");
  const resolved = resolveRate(reaction, feed, ca0, t0);
  const thermal = resolveThermal(reaction, t0);
  const basis: SizingBasis = {
    fa0,
    ca0,
    v0: fa0 / ca0,
    t0,
    rate: resolved.rate,
    temperatureDependent: resolved.temperatureDependent,
    reversible: resolved.reversible,
    ...thermal,
    maxConversion: stoichiometricLimit(resolved.basis.species),
    upper: Math.min(stoichiometricLimit(resolved.basis.species), resolved.range[1]),
  };
  return { basis, rateRange: resolved.range };
}

/**
 * Refuses temperatures given as ranges where a train is rated rather than designed: rating takes each
 * stage's temperatures as given.
 * @throws EngineError at the thermal field holding a range.
 */
export function ensureFixedTemperatures(basis: SizingBasis, reaction: ReactionSpec): void {
  if (!basis.choice) return;
  const th = reaction.thermal;
  const path = th?.mode === "stageTemperature" ? "reaction.thermal.mode" : th?.mode === "adiabatic" && th.feedTemperature ? "reaction.thermal.feedTemperature" : "reaction.thermal.interstageTemperature";
  throw new EngineError("invalid-spec", "rating a train needs fixed temperatures: give the temperature as one value, not a range to choose from", path);
}
