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

const field = z.enum(ROBUSTNESS_FIELDS, { error: "Choose an input from the list" });
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
