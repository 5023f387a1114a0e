import { z } from "zod";
import { uuidSchema } from "./ids";
import { text } from "./text";
import { TRAIN_STAGE_TYPES } from "@/lib/stage-types";

const finite = z.number({ error: "Must be a number" }).finite("Must be finite");
const source = text().trim().min(1, "Say where the number comes from, or write \"from memory\"").max(300, "Use at most 300 characters");

/** One correlation: purchase cost = a + b·S^n, S the volume of one vessel in m3. */
export const correlationSchema = z.strictObject({
  a: finite.min(0, "Must be 0 or more"),
  b: finite.min(0, "Must be 0 or more"),
  n: finite.gt(0, "Must be above 0").max(3, "Must be at most 3"),
  source,
});

/** Which volumes one can buy: R10 preferred numbers in a range, a list, or any size (m3). */
export const sizePolicySchema = z.discriminatedUnion(
  "mode",
  [
    z
      .strictObject({ mode: z.literal("r10"), min: finite.gt(0, "The smallest size must be above 0"), max: finite.gt(0, "The largest size must be above 0") })
      .refine((s) => s.max >= s.min, { message: "The largest size must be at least the smallest", path: ["max"] }),
    z.strictObject({ mode: z.literal("custom"), values: z.array(finite.gt(0, "Sizes must be above 0")).min(1, "Give at least one size").max(200, "At most 200 sizes") }),
    z.strictObject({ mode: z.literal("any") }),
  ],
  { error: "Choose preferred sizes, a list of sizes or any size" },
);

/** A project's cost basis; volumes in m3, money in `currency` of `basisYear`. */
export const costBasisSchema = z.strictObject({
  vessels: z.strictObject({ CSTR: correlationSchema, PFR: correlationSchema }),
  currency: text().trim().regex(/^[A-Z]{3}$/, "Use a three-letter currency code, e.g. USD"),
  basisYear: z.int("Year must be a whole number").min(1950, "Year must be 1950 or later").max(2100, "Year must be 2100 or earlier"),
  sizes: sizePolicySchema,
  /** Largest single vessel, m3; null for no limit. */
  maxVesselVolume: finite.gt(0, "The maximum vessel volume must be above 0").nullable(),
  installationFactor: z.strictObject({ value: finite.min(1, "An installation factor is at least 1").max(10, "An installation factor is at most 10"), source }),
});
export type CostBasis = z.infer<typeof costBasisSchema>;

/** The costing a sweep records beside its engine spec (baseSpec.costing). */
export const sweepCostingSchema = z.strictObject({
  installationFactor: finite.min(1, "An installation factor is at least 1").max(10, "An installation factor is at most 10"),
  currency: text().trim().regex(/^[A-Z]{3}$/, "Use a three-letter currency code, e.g. USD").optional(),
  reuseInventory: z.boolean().default(false),
});
export type SweepCosting = z.infer<typeof sweepCostingSchema>;

const volumeQuantity = z.union([finite.gt(0, "A volume must be above 0"), text().trim().min(1, "Give a volume, e.g. 2.5 m3").max(100, "Use at most 100 characters")]);

export const rateRequestSchema = z.strictObject({
  kineticsVersionId: uuidSchema,
  stages: z
    .array(
      z.union(
        [
          z
            .strictObject({
              type: z.enum(TRAIN_STAGE_TYPES, { error: "Choose CSTR, PFR or tube with recycle" }),
              volume: volumeQuantity,
              /** A tube with recycle's recycle ratio R (recycled flow over the flow leaving it); given for that type only. */
              recycleRatio: finite.min(0, "Give 0 or more, e.g. 0.5 (0 is a plain tube)").optional(),
            })
            .superRefine((s, ctx) => {
              if (s.type === "PFR-recycle" && s.recycleRatio === undefined) ctx.addIssue({ code: "custom", path: ["recycleRatio"], message: "Give the recycle ratio of the tube with recycle, e.g. 0.5" });
              if (s.type !== "PFR-recycle" && s.recycleRatio !== undefined) ctx.addIssue({ code: "custom", path: ["recycleRatio"], message: "Only a tube with recycle has a recycle ratio" });
            }),
          z.strictObject({ inventoryVesselId: uuidSchema }),
        ],
        { error: "Give a type and volume, or an inventory vessel" },
      ),
    )
    .min(1, "Give at least one stage")
    .max(8, "At most 8 stages"),
  target: z.number({ error: "Target conversion is required" }).gt(0, "Conversion must be above 0").lt(1, "Conversion must be below 1"),
});
export type RateRequest = z.infer<typeof rateRequestSchema>;
