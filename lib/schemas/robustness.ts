import { z } from "zod";
import type { RatingSpec } from "@/lib/engine";

/** Numeric inputs of a train's spec that may be made uncertain (SI values after normalisation). */
export const ROBUSTNESS_FIELDS = [
  "reaction.rate.k",
  "reaction.rate.reverse.k",
  "reaction.rate.activationEnergy",
  "reaction.rate.vmax",
  "reaction.rate.km",
  "reaction.rate.ki",
  "feed.flowA",
  "feed.concA",
  "feed.temperature",
] as const;
export type RobustnessField = (typeof ROBUSTNESS_FIELDS)[number];

/** Labels and SI units the screens show beside each field. */
export const ROBUSTNESS_FIELD_LABELS: Record<RobustnessField, { label: string; unit: string }> = {
  "reaction.rate.k": { label: "Rate constant k", unit: "on a m³, mol, s basis" },
  "reaction.rate.reverse.k": { label: "Reverse rate constant", unit: "on a m³, mol, s basis" },
  "reaction.rate.activationEnergy": { label: "Activation energy", unit: "J/mol" },
  "reaction.rate.vmax": { label: "vmax", unit: "mol/(m³ s)" },
  "reaction.rate.km": { label: "km", unit: "mol/m³" },
  "reaction.rate.ki": { label: "ki", unit: "mol/m³" },
  "feed.flowA": { label: "Feed rate of A", unit: "mol/s" },
  "feed.concA": { label: "Feed concentration of A", unit: "mol/m³" },
  "feed.temperature": { label: "Feed temperature", unit: "K" },
};

/**
 * Uncertain inputs of a train of several reactions: each reaction's rate constants and activation
 * energy (by its place in the list, "reactions.0.rate.k"), the feed's volumetric flow and temperature.
 */
export type NetworkRobustnessField =
  | `reactions.${number}.rate.k`
  | `reactions.${number}.rate.reverse.k`
  | `reactions.${number}.rate.activationEnergy`
  | "feed.volumetricFlow"
  | "feed.temperature";
export const NETWORK_ROBUSTNESS_FIELD = /^(reactions\.\d{1,2}\.rate\.(k|reverse\.k|activationEnergy)|feed\.volumetricFlow|feed\.temperature)$/;

export const isNetworkRobustnessField = (v: unknown): v is NetworkRobustnessField => typeof v === "string" && NETWORK_ROBUSTNESS_FIELD.test(v);
const isOneReactionField = (v: unknown): v is RobustnessField => typeof v === "string" && (ROBUSTNESS_FIELDS as readonly string[]).includes(v);

const field = z.custom<RobustnessField | NetworkRobustnessField>((v) => isOneReactionField(v) || isNetworkRobustnessField(v), { error: "Choose an input from the list" });
const finite = z.number({ error: "Must be a number" }).finite("Must be finite");

export const uncertainInputSchema = z.discriminatedUnion(
  "kind",
  [
    z
      .strictObject({ field, kind: z.literal("uniform"), low: finite, high: finite })
      .refine((u) => u.high > u.low, { message: "The high value must be above the low value", path: ["high"] }),
    z.strictObject({ field, kind: z.literal("normal"), mean: finite, sd: finite.gt(0, "The standard deviation must be above 0") }),
    z.strictObject({
      field,
      kind: z.literal("plusMinus"),
      /**
       * ± spread as a fraction of the spec's own value, drawn uniformly: 0.2 is ±20 %. Forms take
       * percent and convert once (components/robustness/spread-percent.ts); messages speak percent.
       */
      fraction: finite.gt(0, "The ± spread must be above 0 %").lt(1, "The ± spread must be below 100 %"),
    }),
  ],
  { error: "Choose a spread: uniform, normal or ± %" },
);
export type UncertainInput = z.infer<typeof uncertainInputSchema>;

export const uncertainListSchema = z
  .array(uncertainInputSchema)
  .min(1, "Give at least one uncertain input")
  .max(6, "At most 6 uncertain inputs")
  .refine((list) => new Set(list.map((u) => u.field)).size === list.length, { message: "Each field may be uncertain once" });

export const seedSchema = z.int("The random seed must be a whole number").min(0, "The random seed must be 0 or more").max(2 ** 31 - 1, "The random seed must be below 2,147,483,648");

/** Most samples a run may ask for; up to INLINE_SAMPLES are rated in the request, more by the worker. */
export const MAX_SAMPLES = 100_000;
export const INLINE_SAMPLES = 2_000;
/**
 * Up to this many samples of a train of several reactions are rated in the request: each sample solves
 * every stirred tank's balances in full (all steady states), some milliseconds a sample, so larger runs go to the worker.
 */
export const NETWORK_INLINE_SAMPLES = 200;

export const robustnessCreateSchema = z.strictObject({
  uncertain: uncertainListSchema,
  /** Conversion the train must reach; the scenario's target when absent. */
  target: finite.gt(0, "Target conversion must be above 0").lt(1, "Target conversion must be below 1").optional(),
  samples: z.int("Samples must be a whole number").min(1, "At least 1 sample").max(MAX_SAMPLES, `At most ${MAX_SAMPLES.toLocaleString("en")} samples`),
  seed: seedSchema,
});
export type RobustnessCreate = z.infer<typeof robustnessCreateSchema>;

/** What a sweep stores to rate every feasible train under uncertainty as well (sweeps.robustness). */
export const sweepRobustnessSchema = z.strictObject({
  uncertain: uncertainListSchema,
  samples: z.int("Samples must be a whole number").min(100, "At least 100 samples").max(INLINE_SAMPLES, `At most ${INLINE_SAMPLES} samples per train`),
  seed: seedSchema,
});
export type SweepRobustness = z.infer<typeof sweepRobustnessSchema>;

/** What a run was asked (robustness_runs.request): the inputs, the target used and the fixed train rated. */
export type RobustnessRunRequest = Required<Omit<RobustnessCreate, "target">> & { target: number; train: RatingSpec };

/** The stored summary of a finished run (robustness_runs.result). */
export interface RobustnessRunResult {
  samples: number;
  seed: number;
  target: number;
  p5: number;
  p50: number;
  p95: number;
  mean: number;
  probabilityOfMissingTarget: number;
  probabilityStandardError: number;
  refusedSamples: number;
  distribution: number[];
  /** Outlet conversion at the nominal inputs. */
  nominal: number | null;
  cautions: string[];
}

/** The spread of one measure over the rated samples, with its histogram. */
export interface SampledDistribution {
  p5: number;
  p50: number;
  p95: number;
  mean: number;
  /** 20 equal bins between the least and the greatest sample. */
  histogram: { from: number; to: number; count: number }[];
}

/**
 * The stored summary of a finished run on a train of several reactions. The conversion's percentiles
 * also sit at the top level, and the chance of missing any limit as probabilityOfMissingTarget, so a
 * reader of either kind of run finds the same names.
 */
export interface NetworkRobustnessRunResult extends Omit<RobustnessRunResult, "target" | "nominal"> {
  kind: "network";
  /** The sweep's minimum conversion, or null. */
  target: number | null;
  product: string | null;
  conversion: SampledDistribution;
  /** null without a wanted product. */
  yield: SampledDistribution | null;
  minConversion: number | null;
  minYield: number | null;
  /** Share of samples below the minimum yield (a sample that cannot be rated counts as a miss); null without one. */
  probabilityMissMinYield: number | null;
  probabilityMissMinYieldStandardError: number | null;
  /** Share of samples meeting every limit (minimum conversion and minimum yield). */
  probabilityMeet: number;
  nominal: { conversion: number; yield: number | null; selectivity: number | null } | null;
}

/** Either kind of stored result. */
export type AnyRobustnessRunResult = RobustnessRunResult | NetworkRobustnessRunResult;
export const isNetworkRobustnessResult = (r: AnyRobustnessRunResult | null | undefined): r is NetworkRobustnessRunResult => !!r && "kind" in r && r.kind === "network";
