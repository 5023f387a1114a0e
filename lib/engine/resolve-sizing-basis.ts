import { stoichiometricLimit } from "./concentrations";
import { ensure } from "./errors";
import type { SizingBasis } from "./sizing-basis";
import { resolveRate } from "./rate-law";
import type { FeedSpec, ReactionSpec } from "./types";
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

function resolveThermal(reaction: ReactionSpec, t0: number) {
  const th = reaction.thermal ?? { mode: "isothermal" as const };
  if (th.mode === "isothermal") return { rise: 0, interstage: null, maxTemperature: Infinity };
  const P = "reaction.thermal";
  const rise = toTemperatureDifference(th.adiabaticRise, `${P}.adiabaticRise`);
  const maxTemperature = th.maxTemperature === undefined ? Infinity : positiveSI(th.maxTemperature, DIM.temperature, `${P}.maxTemperature`, "maximum temperature");
  const interstage = th.interstageTemperature === undefined ? null : positiveSI(th.interstageTemperature, DIM.temperature, `${P}.interstageTemperature`, "interstage temperature");
  ensure(t0 <= maxTemperature, `the feed temperature ${t0} K is above the maximum temperature ${maxTemperature} K, so no stage can keep it`, `${P}.maxTemperature`);
  ensure(interstage === null || interstage <= maxTemperature, `the interstage temperature ${interstage} K is above the maximum temperature ${maxTemperature} K`, `${P}.interstageTemperature`);
  return { rise, interstage, maxTemperature };
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
