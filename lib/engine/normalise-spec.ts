import type { AdiabaticSpec, FeedSpec, Quantity, RateLawSpec, ReactionSpec, RatingSpec, TemperatureRange } from "./types";
import { anyToSI, DIM, rateConstantDimension, toSI, toTemperatureDifference } from "./units";

const P = "reaction.rate";

function totalOrder(orders: Record<string, number>): number {
  return Object.values(orders).reduce((s, v) => s + (Number.isFinite(v) ? v : 0), 0);
}

function opt<T extends Quantity | undefined>(v: T, f: (q: Quantity) => number): number | undefined {
  return v === undefined ? undefined : f(v);
}

function normaliseFeed(feed: FeedSpec): FeedSpec {
  return {
    ...feed,
    flowA: toSI(feed.flowA, DIM.molarFlow, "feed.flowA"),
    concA: toSI(feed.concA, DIM.concentration, "feed.concA"),
    temperature: toSI(feed.temperature ?? 298.15, DIM.temperature, "feed.temperature"),
  };
}

function normaliseRate(law: RateLawSpec): RateLawSpec {
  switch (law.law) {
    case "power":
      return {
        ...law,
        k: toSI(law.k, rateConstantDimension(totalOrder(law.orders)), `${P}.k`),
        activationEnergy: opt(law.activationEnergy, (q) => toSI(q, DIM.energyPerMole, `${P}.activationEnergy`)),
        referenceTemperature: opt(law.referenceTemperature, (q) => toSI(q, DIM.temperature, `${P}.referenceTemperature`)),
        reverse: law.reverse && {
          ...law.reverse,
          k: toSI(law.reverse.k, rateConstantDimension(totalOrder(law.reverse.orders)), `${P}.reverse.k`),
          activationEnergy: opt(law.reverse.activationEnergy, (q) => toSI(q, DIM.energyPerMole, `${P}.reverse.activationEnergy`)),
        },
      };
    case "saturation":
      return {
        ...law,
        vmax: toSI(law.vmax, DIM.rate, `${P}.vmax`),
        km: toSI(law.km, DIM.concentration, `${P}.km`),
        ki: opt(law.ki, (q) => toSI(q, DIM.concentration, `${P}.ki`)),
        activationEnergy: opt(law.activationEnergy, (q) => toSI(q, DIM.energyPerMole, `${P}.activationEnergy`)),
        referenceTemperature: opt(law.referenceTemperature, (q) => toSI(q, DIM.temperature, `${P}.referenceTemperature`)),
      };
    case "expression":
      return {
        ...law,
        parameters: Object.fromEntries(Object.entries(law.parameters ?? {}).map(([k, v]) => [k, anyToSI(v, `${P}.parameters.${k}`)])),
      };
    default:
      return law;
  }
}

function normaliseThermal(th: AdiabaticSpec): AdiabaticSpec {
  const T = "reaction.thermal";
  return {
    ...th,
    adiabaticRise: toTemperatureDifference(th.adiabaticRise, `${T}.adiabaticRise`),
    maxTemperature: opt(th.maxTemperature, (q) => toSI(q, DIM.temperature, `${T}.maxTemperature`)),
    interstageTemperature:
      typeof th.interstageTemperature === "object" ? range(th.interstageTemperature, `${T}.interstageTemperature`) : opt(th.interstageTemperature, (q) => toSI(q, DIM.temperature, `${T}.interstageTemperature`)),
    ...(th.feedTemperature ? { feedTemperature: range(th.feedTemperature, `${T}.feedTemperature`) } : {}),
  };
}

function range(r: TemperatureRange, path: string): TemperatureRange {
  return { min: toSI(r.min, DIM.temperature, `${path}.min`), max: toSI(r.max, DIM.temperature, `${path}.max`) };
}

function normaliseReaction(reaction: ReactionSpec): ReactionSpec {
  const out: ReactionSpec = { ...reaction, rate: normaliseRate(reaction.rate) };
  if (reaction.thermal?.mode === "adiabatic") out.thermal = normaliseThermal(reaction.thermal);
  if (reaction.thermal?.mode === "stageTemperature") out.thermal = { mode: "stageTemperature", ...range(reaction.thermal, "reaction.thermal") };
  return out;
}

/**
 * The feed and reaction of a spec (a rating spec, a design spec or a stored kinetics description)
 * with every quantity string converted to its SI number, the feed temperature's default written
 * out; other fields are kept as they are. The kinetics editor reads stored specs through it, so
 * the screens and the engine read a quantity the same way.
 * @throws EngineError naming the field for an unreadable or mismatched unit.
 */
export function normaliseKinetics<S extends { feed: FeedSpec; reaction: ReactionSpec }>(spec: S): S {
  return { ...spec, feed: normaliseFeed(spec.feed), reaction: normaliseReaction(spec.reaction) };
}

/**
 * The same rating spec with every quantity string converted to its SI number (the feed temperature's
 * default written out), so that numeric overrides can be applied to it field by field and each later
 * resolution parses no units. Rating the result gives what rating the original gives.
 * @throws EngineError naming the field for an unreadable or mismatched unit.
 */
export function normaliseRatingSpec(spec: RatingSpec): RatingSpec {
  return {
    ...normaliseKinetics(spec),
    stages: spec.stages.map((s, k) => ({ ...s, volume: toSI(s.volume, DIM.volume, `stages.${k}.volume`) })),
  };
}
