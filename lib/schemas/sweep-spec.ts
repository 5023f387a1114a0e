import { z } from "zod";
import type { DesignSpec, RatingSpec } from "../engine/types";
import { dimensionless } from "./dimensionless";
import { keyText, multilineText, text } from "./text";
import { TRAIN_STAGE_TYPES } from "@/lib/stage-types";

/** A number in SI units or a string with a unit ("2 mol/L"). */
export const quantity = z.union([z.number(), text().min(1).max(100, "Use at most 100 characters")]);
const stageType = z.enum(TRAIN_STAGE_TYPES);
const numberMap = z.record(keyText().max(40, "Use at most 40 characters"), dimensionless("Each value"));
const ratioMap = z.record(keyText().max(40, "Use at most 40 characters"), dimensionless("Feed ratio to A"));

const reverse = z.strictObject({ k: quantity, orders: numberMap, activationEnergy: quantity.optional() });

const rate = z.discriminatedUnion("law", [
  z.strictObject({
    law: z.literal("power"),
    k: quantity,
    orders: numberMap,
    reverse: reverse.optional(),
    activationEnergy: quantity.optional(),
    referenceTemperature: quantity.optional(),
  }),
  z.strictObject({
    law: z.literal("saturation"),
    vmax: quantity,
    km: quantity,
    ki: quantity.optional(),
    activationEnergy: quantity.optional(),
    referenceTemperature: quantity.optional(),
  }),
  z.strictObject({ law: z.literal("expression"), expression: multilineText().max(2000, "Use at most 2000 characters"), parameters: z.record(keyText().max(40, "Use at most 40 characters"), quantity).optional() }),
  z.strictObject({ law: z.literal("table"), conversion: z.array(z.number()), rate: z.array(z.number()) }),
]);

const temperatureRange = z.strictObject({ min: quantity, max: quantity });

const thermal = z.discriminatedUnion("mode", [
  z.strictObject({ mode: z.literal("isothermal") }),
  z.strictObject({
    mode: z.literal("adiabatic"),
    adiabaticRise: quantity,
    maxTemperature: quantity.optional(),
    interstageTemperature: z.union([quantity, temperatureRange]).optional(),
    feedTemperature: temperatureRange.optional(),
  }),
  z.strictObject({ mode: z.literal("stageTemperature"), min: quantity, max: quantity }),
]);

const feed = z.strictObject({ flowA: quantity, concA: quantity, temperature: quantity.optional(), ratios: ratioMap.optional() });

const reaction = z.strictObject({
  stoichiometry: numberMap.optional(),
  phase: z.enum(["liquid", "gas"]).optional(),
  epsilon: dimensionless("Expansion factor").optional(),
  rate,
  thermal: thermal.optional(),
});

const equalVolume = z.boolean().optional();
// A ratio below zero has no meaning (R is recycled over leaving flow): refused here, naming the field, before the engine sees it.
const recycleRatio = dimensionless("Recycle ratio")
  .refine((r) => r >= 0, { message: "give 0 or more, e.g. 0.5 (0 is a plain tube)" })
  .optional();

const train = z.union([
  z.strictObject({ maxStages: z.number(), types: z.array(stageType).optional(), equalVolume, recycleRatio }),
  z.strictObject({ candidates: z.array(z.array(stageType)), equalVolume, recycleRatio }),
  z.strictObject({ multiset: z.strictObject({ CSTR: z.number().optional(), PFR: z.number().optional() }), equalVolume }),
]);

const vessel = z.strictObject({ a: z.number(), b: z.number(), n: z.number() });

const objective = z.discriminatedUnion("minimise", [
  z.strictObject({ minimise: z.literal("volume") }),
  z.strictObject({
    minimise: z.literal("cost"),
    vessels: z.strictObject({ CSTR: vessel.optional(), PFR: vessel.optional() }),
    standardSizes: z.array(quantity).optional(),
    maxVesselVolume: quantity.optional(),
  }),
]);

/** The design spec read by `npm run sweep` (and by the web app): the single source of truth of its shape. */
export const designSpecSchema = z.strictObject({
  feed,
  reaction,
  target: z.strictObject({ conversion: dimensionless("Target conversion", { percent: true }) }),
  train,
  objective: objective.optional(),
}) satisfies z.ZodType<DesignSpec>;

/** A rating spec: the same feed and reaction, and stages given by volume. */
export const ratingSpecSchema = z.strictObject({
  feed,
  reaction,
  stages: z.array(z.strictObject({ type: stageType, volume: quantity, recycleRatio })),
}) satisfies z.ZodType<RatingSpec>;

type Same<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
type Deep<T> = T extends readonly (infer U)[] ? Deep<U>[] : T extends object ? { [K in keyof T]: Deep<T[K]> } : T;

// Fails to compile when the schema and the engine's interfaces drift apart in either direction.
const designSame: Same<Deep<z.infer<typeof designSpecSchema>>, Deep<DesignSpec>> = true;
const ratingSame: Same<Deep<z.infer<typeof ratingSpecSchema>>, Deep<RatingSpec>> = true;
export const schemaMatchesEngineTypes = designSame && ratingSame;
