/**
 * Monte Carlo rating of a fixed train of several reactions: each sample draws the uncertain rate
 * constants (and feed flow or temperature), rates the same stages with the engine's
 * rateNetworkTrain, and the run summarises the conversion and the yield of the wanted product, with
 * the chance of missing the minimum yield and of meeting every limit. Seeded, so a seed gives the
 * same answer everywhere.
 */
import { EngineError, rateNetworkTrain, type NetworkSpec, type StageType } from "@/lib/engine";
import type { NetworkRobustnessRunResult } from "@/lib/schemas/robustness";
import { sampler } from "./draws";
import type { Uncertainty } from "./monte-carlo";
import { siChemistry } from "./network-si";
import { valueAtPath, withNumbers } from "./numeric-path";
import { distributionOf } from "./sample-stats";

/** The fixed train a network run rates: the chemistry, the stages as pinned and the limits it must meet. */
export interface NetworkTrain {
  kind: "network";
  /** Feed, phase, reactions and key reactant, as the sweep's scenario had them. */
  chemistry: Record<string, unknown>;
  /** m3 each; a temperature (K) only where each stage is held at its own, else the stages follow the feed's. */
  stages: { type: StageType; volume: number; temperature?: number }[];
  product: string | null;
  minConversion: number | null;
  minYield: number | null;
}

export interface NetworkRobustnessRequest {
  train: NetworkTrain;
  uncertain: Uncertainty[];
  samples: number;
  seed: number;
}

export type NetworkSampledResult = Omit<NetworkRobustnessRunResult, "nominal" | "cautions">;

const FEED_TEMPERATURE_DEFAULT = 298.15;

/**
 * The chemistry a sample starts from. When the feed temperature is uncertain, each rate constant
 * without its own reference temperature is pinned to the nominal feed temperature: the constants were
 * given at that temperature, and a warmer feed should speed the reactions up rather than move the
 * reference with it.
 */
function baseChemistry(train: NetworkTrain, uncertain: readonly Uncertainty[]): Record<string, unknown> {
  // Units are read once here; each sample then replaces SI numbers (and ± spreads apply to SI values).
  const chemistry = siChemistry(train.chemistry);
  if (!uncertain.some((u) => u.field === "feed.temperature")) return chemistry;
  const t0 = valueAtPath(chemistry, "feed.temperature") ?? FEED_TEMPERATURE_DEFAULT;
  const pins: Record<string, number> = {};
  if (typeof t0 !== "number") return chemistry;
  (Array.isArray(chemistry.reactions) ? chemistry.reactions : []).forEach((r, j) => {
    const rate = (r as { rate?: { law?: string; referenceTemperature?: unknown } }).rate;
    if (rate?.law === "power" && rate.referenceTemperature === undefined) pins[`reactions.${j}.rate.referenceTemperature`] = t0;
  });
  return withNumbers(chemistry, pins);
}

/** The spec's own number at `field` (a ± spread needs one). */
function ownValue(chemistry: unknown, field: string): number {
  const v = field === "feed.temperature" ? (valueAtPath(chemistry, field) ?? FEED_TEMPERATURE_DEFAULT) : valueAtPath(chemistry, field);
  if (typeof v !== "number") throw new EngineError("invalid-spec", "this input is not held as a number; give a uniform or normal range for it instead", field);
  return v;
}

export function rateNetworkUnderUncertainty(req: NetworkRobustnessRequest): NetworkSampledResult {
  const { train } = req;
  const chemistry = baseChemistry(train, req.uncertain);
  const base = req.uncertain.map((u) => (u.kind === "plusMinus" ? ownValue(chemistry, u.field) : 0));
  const next = sampler(req.uncertain, base, req.seed);
  const product = train.product ?? undefined;
  const conversions: number[] = [];
  const yields: number[] = [];
  let refused = 0;
  let missYield = 0;
  let meet = 0;
  for (let s = 0; s < req.samples; s++) {
    const sample = withNumbers(chemistry, next()) as unknown as NetworkSpec;
    try {
      const r = rateNetworkTrain(sample, train.stages, product);
      conversions.push(r.conversion);
      if (r.yield !== null) yields.push(r.yield);
      const yieldShort = train.minYield !== null && (r.yield === null || r.yield < train.minYield);
      if (yieldShort) missYield++;
      if (!yieldShort && (train.minConversion === null || r.conversion >= train.minConversion)) meet++;
    } catch (err) {
      // A sample the engine cannot rate (a rate constant drawn below zero) counts as a miss of every limit.
      if (!(err instanceof EngineError)) throw err;
      refused++;
      missYield++;
    }
  }
  const n = req.samples;
  const pMeet = meet / n;
  const pMissYield = train.minYield === null ? null : missYield / n;
  const conversion = distributionOf(conversions);
  const step = Math.max(1, Math.ceil(conversions.length / 200));
  return {
    kind: "network",
    samples: n,
    seed: req.seed,
    product: train.product,
    target: train.minConversion,
    p5: conversion.p5,
    p50: conversion.p50,
    p95: conversion.p95,
    mean: conversion.mean,
    conversion,
    yield: train.product && yields.length ? distributionOf(yields) : null,
    minConversion: train.minConversion,
    minYield: train.minYield,
    probabilityMissMinYield: pMissYield,
    probabilityMissMinYieldStandardError: pMissYield === null ? null : Math.sqrt((pMissYield * (1 - pMissYield)) / n),
    probabilityMeet: pMeet,
    probabilityOfMissingTarget: 1 - pMeet,
    probabilityStandardError: Math.sqrt((pMeet * (1 - pMeet)) / n),
    refusedSamples: refused,
    distribution: conversions.filter((_, i) => i % step === 0),
  };
}
