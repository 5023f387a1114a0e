import { z } from "zod";
import type { NetworkDesignSpec } from "@/lib/engine/network/design-types";
import type { StageType } from "@/lib/engine";
import { STAGE_TYPES } from "@/lib/stage-types";
import { dimensionless } from "./dimensionless";
import { checkNetwork, checkNetworkKinetics, leadingNumber, SPECIES_NAME } from "./network-spec-checks";
import { shownUnitsSchema } from "./shown-units";
import { quantity } from "./sweep-spec";
import { keyText, multilineText } from "./text";

/**
 * The network spec (several reactions) read by `npm run sweep` and the web app: the single source of
 * truth of its shape (docs/sweep-spec.md, "Several reactions"). A spec with `"reaction"` is today's
 * one-reaction spec (sweep-spec.ts); one with `"reactions"` is this.
 *
 * Quantities stay as given (an SI number or a string with a unit, the same `quantity` as today's spec):
 * the engine converts them with its unit tables, which the browser should not load. What can be told
 * without converting is checked here so the message names the field: the form of a quantity, its sign
 * (the sign of the number it starts with, for every unit that only scales), and every cross-field rule.
 */

export const MAX_NETWORK_SPECIES = 12;
export const MAX_NETWORK_REACTIONS = 10;
export const MAX_NETWORK_STAGES = 5;
/** Every distinct sequence of 1..5 stages of two types: 2 + 4 + 8 + 16 + 32. */
export const MAX_NETWORK_CANDIDATES = 62;
/** Feed temperature when none is given, K. */
export const DEFAULT_FEED_TEMPERATURE = 298.15;

type Sign = "positive" | "nonNegative" | "any";

/** A quantity whose leading number has the sign the field needs; `example` is shown when a string has no number. */
function quantityField(sign: Sign, example: string) {
  return quantity.superRefine((value, ctx) => {
    const lead = leadingNumber(value);
    if (lead === null) ctx.addIssue({ code: "custom", message: `give a number, or a number and its unit such as ${example}` });
    else if (sign === "positive" && lead.value <= 0) ctx.addIssue({ code: "custom", message: "must be above zero" });
    else if (sign === "nonNegative" && lead.value < 0) ctx.addIssue({ code: "custom", message: "must not be negative" });
  });
}

/** A temperature: above absolute zero when in K (or a plain number); degC and degF are left to the engine's conversion. */
function temperatureField(example: string) {
  return quantity.superRefine((value, ctx) => {
    const lead = leadingNumber(value);
    if (lead === null) ctx.addIssue({ code: "custom", message: `give a number, or a number and its unit such as ${example}` });
    else if ((lead.unit === "" || lead.unit === "K") && lead.value <= 0) ctx.addIssue({ code: "custom", message: "must be above absolute zero (0 K)" });
  });
}

const speciesKey = keyText().min(1, "name the species").max(40, "Use at most 40 characters");
const stageType = z.enum(STAGE_TYPES);

const coefficient = dimensionless("Stoichiometric coefficient").refine((v) => v !== 0, "must not be zero; leave out a species the reaction does not change");
const order = dimensionless("Order").refine((v) => v >= 0, "must be zero or more");

const stoichiometry = z
  .record(speciesKey, coefficient)
  .refine((r) => Object.keys(r).length > 0, "give at least one species with its coefficient (negative when consumed, positive when formed)");

const orders = z.record(speciesKey, order);

const powerRate = z.strictObject({
  law: z.literal("power"),
  k: quantityField("nonNegative", "0.5 L/(mol*s)"),
  orders,
  activationEnergy: quantityField("nonNegative", "65 kJ/mol").optional(),
  referenceTemperature: temperatureField("350 K").optional(),
  reverse: z
    .strictObject({
      k: quantityField("nonNegative", "0.02 1/s"),
      orders,
      activationEnergy: quantityField("nonNegative", "80 kJ/mol").optional(),
      // Where the contract is silent: the reverse term shares the forward reference temperature unless it gives its own.
      referenceTemperature: temperatureField("350 K").optional(),
    })
    .optional(),
});

const expressionRate = z.strictObject({
  law: z.literal("expression"),
  expression: multilineText().min(1, "required").max(2000, "Use at most 2000 characters"),
  parameters: z.record(keyText().min(1, "name the parameter").max(40, "Use at most 40 characters"), quantityField("any", "0.002 1/s")).optional(),
});

const reaction = z.strictObject({
  stoichiometry,
  rate: z.discriminatedUnion("law", [powerRate, expressionRate], { error: "choose a power law or an expression" }),
});

const feed = z.strictObject({
  volumetricFlow: quantityField("positive", "100 L/s"),
  concentrations: z
    .record(speciesKey, quantityField("nonNegative", "0.58 mol/L"))
    .refine((c) => Object.keys(c).length >= 1, "list every species with its feed concentration (0 if none is fed)")
    .refine((c) => Object.keys(c).length <= MAX_NETWORK_SPECIES, `list at most ${MAX_NETWORK_SPECIES} species`),
  temperature: temperatureField("300 K").default(DEFAULT_FEED_TEMPERATURE),
});

const thermal = z.discriminatedUnion(
  "mode",
  [
    z.strictObject({ mode: z.literal("isothermal") }),
    z.strictObject({ mode: z.literal("stageTemperature"), min: temperatureField("300 K"), max: temperatureField("450 K") }),
  ],
  { error: (issue) => (issue.input === undefined ? "required" : "choose isothermal stages, or a temperature range within which each stage's temperature is chosen") },
);

/** One of two forms, written flat so a mistake in either is reported at its own field rather than as "neither form". */
const train = z
  .strictObject({
    maxStages: z.number().int("must be a whole number").min(1, "must be 1 or more").max(MAX_NETWORK_STAGES, `must be ${MAX_NETWORK_STAGES} or less`).optional(),
    types: z.array(stageType).min(1, "give at least one stage type").optional(),
    candidates: z
      .array(z.array(stageType).min(1, "give at least one stage").max(MAX_NETWORK_STAGES, `give at most ${MAX_NETWORK_STAGES} stages`))
      .min(1, "give at least one train")
      .max(MAX_NETWORK_CANDIDATES, `give at most ${MAX_NETWORK_CANDIDATES} trains (every sequence of up to ${MAX_NETWORK_STAGES} stages)`)
      .optional(),
  })
  .superRefine((t, ctx) => {
    if (t.maxStages === undefined && t.candidates === undefined) ctx.addIssue({ code: "custom", path: ["maxStages"], message: "required, or list the trains to try" });
    if (t.maxStages !== undefined && t.candidates !== undefined) ctx.addIssue({ code: "custom", path: ["candidates"], message: "give either the largest number of stages or the trains to try, not both" });
    if (t.candidates !== undefined && t.types !== undefined) ctx.addIssue({ code: "custom", path: ["types"], message: "the listed trains already name their stage types; leave this out" });
    if (t.types && new Set(t.types).size !== t.types.length) ctx.addIssue({ code: "custom", path: ["types"], message: "names a stage type twice" });
    const seen = new Map<string, number>();
    t.candidates?.forEach((c, i) => {
      const first = seen.get(c.join(" "));
      if (first !== undefined) ctx.addIssue({ code: "custom", path: ["candidates", i], message: `the same train as train ${first + 1}` });
      else seen.set(c.join(" "), i);
    });
  })
  .transform((t): { maxStages: number; types?: StageType[] } | { candidates: StageType[][] } =>
    t.candidates !== undefined ? { candidates: t.candidates } : { maxStages: t.maxStages!, ...(t.types ? { types: t.types } : {}) },
  );

const objective = z
  .strictObject({
    maximise: z.enum(["yield", "selectivity"], { error: "choose yield or selectivity" }).optional(),
    minimise: z.literal("volume", { error: "choose volume" }).optional(),
    product: speciesKey.optional(),
  })
  .superRefine((o, ctx) => {
    if (o.maximise === undefined && o.minimise === undefined) ctx.addIssue({ code: "custom", path: ["maximise"], message: "required: the yield or the selectivity of a product, or the least volume" });
    if (o.maximise !== undefined && o.minimise !== undefined) ctx.addIssue({ code: "custom", path: ["minimise"], message: "rank by one thing: a product's yield or selectivity, or the least volume" });
    if (o.maximise !== undefined && o.product === undefined) ctx.addIssue({ code: "custom", path: ["product"], message: "required: the species whose yield or selectivity is ranked" });
  })
  .transform((o): { maximise: "yield" | "selectivity"; product: string } | { minimise: "volume"; product?: string } =>
    o.maximise !== undefined ? { maximise: o.maximise, product: o.product! } : { minimise: "volume", ...(o.product !== undefined ? { product: o.product } : {}) },
  );

const constraints = z.strictObject({
  minConversion: dimensionless("Minimum conversion", { percent: true }).refine((v) => v >= 0 && v <= 1, "must be between 0 and 1 (0 % and 100 %)").optional(),
  minYield: dimensionless("Minimum yield", { percent: true }).refine((v) => v >= 0, "must not be negative").optional(),
  maxTotalVolume: quantityField("positive", "2 m^3").optional(),
  maxStageVolume: quantityField("positive", "500 L").optional(),
});

const phase = z.enum(["liquid", "gas"], { error: "choose liquid or gas" });
const reactions = z.array(reaction).min(1, "give at least one reaction").max(MAX_NETWORK_REACTIONS, `give at most ${MAX_NETWORK_REACTIONS} reactions`);

/** The network spec: feed, phase, reactions, key reactant, heat mode, trains, objective and limits. */
export const networkSpecSchema = z
  .strictObject({
    feed,
    phase,
    reactions,
    keyReactant: speciesKey,
    thermal,
    train,
    objective,
    constraints: constraints.optional(),
  })
  .superRefine(checkNetwork);

/** The parts a web form or request reuses (kinetics models of several reactions, sweeps of them). */
export const networkParts = { feed, phase, reactions, keyReactant: speciesKey, thermal, train, objective, constraints };

/**
 * The chemistry of a kinetics model of several reactions, as a version stores it: the feed, the phase, the
 * reactions, the key reactant, optionally the wanted product (for the path and selectivity charts and as
 * the sweep's default product) and the units the engineer typed in. A sweep adds heat mode, trains,
 * objective and limits to make the engine's spec.
 */
export const networkKineticsSpecSchema = z
  .strictObject({
    feed,
    phase,
    reactions,
    keyReactant: speciesKey,
    product: speciesKey.optional(),
    shownUnits: shownUnitsSchema.optional(),
  })
  .superRefine(checkNetworkKinetics);
export type NetworkKineticsSpec = z.output<typeof networkKineticsSpecSchema>;
export type NetworkKineticsSpecInput = z.input<typeof networkKineticsSpecSchema>;

/** The spec as written in a file or a request (quantities as numbers or strings, defaults not filled in). */
export type NetworkSpecInput = z.input<typeof networkSpecSchema>;
/** The spec once read: dimensionless fields as numbers, the feed temperature filled in, train and objective in one form each. */
export type NetworkSpec = z.output<typeof networkSpecSchema>;

/** True for a value shaped like a network spec ("reactions", no "reaction"): the command line and the API pick the schema with it. */
export function isNetworkSpec(value: unknown): boolean {
  return typeof value === "object" && value !== null && !Array.isArray(value) && "reactions" in value && !("reaction" in value);
}

// The pattern species names follow, for screens that check a name as it is typed.
export { SPECIES_NAME };

// Fails to compile when what the schema gives can no longer be handed to the engine's designer as it is.
type Assignable<A, B> = [A] extends [B] ? true : false;
const networkFitsEngine: Assignable<NetworkSpec, NetworkDesignSpec> = true;
export const networkSchemaFitsEngine = networkFitsEngine;
