import { z } from "zod";
import { designSpecSchema } from "./sweep-spec";
import { uuidSchema } from "./ids";
import { sweepCostingSchema } from "./costs";
import { sweepRobustnessSchema } from "./robustness";
import { multilineText, text } from "./text";
import { SORT_KEYS } from "@/lib/sweeps/sort-keys";
import { WRITTEN_SEQUENCE } from "@/lib/stage-types";
import { shownUnitsSchema } from "./shown-units";
import { isNetworkSpec, networkKineticsSpecSchema, networkParts, type NetworkKineticsSpec } from "./network-spec";

const spec = designSpecSchema.shape;

/** The chemistry of a kinetics version: what the engine calls feed and reaction, and the units shown. */
export const kineticsSpecSchema = z.strictObject({ feed: spec.feed, reaction: spec.reaction, shownUnits: shownUnitsSchema.optional() });
export type KineticsSpec = z.infer<typeof kineticsSpecSchema>;

const modelName = text({ error: "Name is required" }).trim().min(2, "Use at least 2 characters").max(120, "Use at most 120 characters");
const note = multilineText().trim().max(2000, "Use at most 2000 characters");

export const kineticsModelCreateSchema = z.strictObject({ name: modelName, spec: kineticsSpecSchema, note: note.default("") });
export const kineticsVersionCreateSchema = z.strictObject({ spec: kineticsSpecSchema, note: note.default("") });

/* A model of several reactions: the same bodies with the network's chemistry (routes pick with isNetworkSpec(body.spec)). */
export const networkKineticsModelCreateSchema = z.strictObject({ name: modelName, spec: networkKineticsSpecSchema, note: note.default("") });
export const networkKineticsVersionCreateSchema = z.strictObject({ spec: networkKineticsSpecSchema, note: note.default("") });
/** A model or version body whose chemistry has several reactions (the routes pick the schema with it). */
export const isNetworkKineticsBody = (body: unknown): boolean => typeof body === "object" && body !== null && isNetworkSpec((body as { spec?: unknown }).spec);
/** A kinetics version's chemistry of either kind: one reaction, or several. */
export type AnyKineticsSpec = KineticsSpec | NetworkKineticsSpec;

export const kineticsPreviewSchema = z.strictObject({
  spec: kineticsSpecSchema,
  /** Conversion to draw the curve to and size the single-stage references for. */
  targetConversion: z.number().gt(0, "Conversion must be above 0").lt(1, "Conversion must be below 1").optional(),
});

// Segments after the first may be array positions (reactions.0.rate.k) or species names (feed.concentrations.A).
const fieldPath = text({ error: "Choose an input to vary" })
  .max(200, "Use at most 200 characters")
  .regex(/^[A-Za-z_]\w*(\.\w+)+$/, "Choose an input to vary from the list");
const finite = z.number({ error: "Must be a number" }).finite("Must be finite");

export const gridAxisSchema = z.union([
  z.strictObject({ field: fieldPath, values: z.array(finite).min(1, "Give at least one value").max(1000, "At most 1000 values") }),
  z
    .strictObject({
      field: fieldPath,
      from: finite,
      to: finite,
      steps: z.int("Steps must be a whole number").min(2, "At least 2 steps").max(1000, "At most 1000 steps"),
      scale: z.enum(["linear", "log"]).optional(),
    })
    .refine((a) => a.scale !== "log" || (a.from > 0 && a.to > 0), { message: "A log range needs positive ends", path: ["from"] }),
]);

export const sweepCreateSchema = z
  .strictObject({
    name: text().trim().min(1, "Name the sweep").max(120, "Use at most 120 characters").optional(),
    kineticsVersionId: uuidSchema,
    target: spec.target,
    train: spec.train,
    objective: spec.objective,
    grid: z.array(gridAxisSchema).max(4, "Vary at most 4 inputs").default([]),
    /** Installation factor and reuse of idle vessels (cost objective only). */
    costing: sweepCostingSchema.optional(),
    /** Also rate every feasible train under uncertainty; fills each candidate's probabilityMeet. */
    robustness: sweepRobustnessSchema.optional(),
  })
  .refine((s) => new Set(s.grid.map((a) => a.field)).size === s.grid.length, { message: "Each input may be varied once", path: ["grid"] });
export type SweepCreate = z.infer<typeof sweepCreateSchema>;

const uniqueAxes = (s: { grid: { field: string }[] }) => new Set(s.grid.map((a) => a.field)).size === s.grid.length;

/**
 * A sweep of a model of several reactions: heat mode (isothermal unless given), trains, what to rank by
 * (the product named, as the command line requires) and limits, over a grid of the engine spec's numeric
 * fields. Rating under uncertainty during such a sweep is refused by the service until it is offered.
 */
export const networkSweepCreateSchema = z
  .strictObject({
    name: text().trim().min(1, "Name the sweep").max(120, "Use at most 120 characters").optional(),
    kineticsVersionId: uuidSchema,
    thermal: networkParts.thermal.default({ mode: "isothermal" }),
    train: networkParts.train,
    objective: networkParts.objective,
    constraints: networkParts.constraints.optional(),
    grid: z.array(gridAxisSchema).max(4, "Vary at most 4 inputs").default([]),
    robustness: sweepRobustnessSchema.optional(),
  })
  .refine(uniqueAxes, { message: "Each input may be varied once", path: ["grid"] });
export type NetworkSweepCreate = z.infer<typeof networkSweepCreateSchema>;

/**
 * A network sweep body, told apart from today's without parsing it: today's always has a target; a
 * network's has limits, a heat mode, or an objective that maximises or minimises.
 */
export function isNetworkSweepBody(body: unknown): boolean {
  if (typeof body !== "object" || body === null || Array.isArray(body) || "target" in body) return false;
  const b = body as Record<string, unknown>;
  const objective = b.objective;
  return "constraints" in b || "thermal" in b || (typeof objective === "object" && objective !== null && ("maximise" in objective || "minimise" in objective));
}

export const candidateQuerySchema = z.strictObject({
  sort: z.enum(SORT_KEYS, { error: "Choose a column to sort by" }).default("rank"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  feasible: z.enum(["true", "false"]).optional(),
  contains: text()
    .max(100, "Use at most 100 characters")
    .regex(WRITTEN_SEQUENCE, "Give stage types joined by '-', e.g. CSTR-PFR or CSTR-PFR-recycle")
    .optional(),
  stages: z.coerce.number().int().min(1).max(8).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  /** "levenspiel": each stage's plot points; "thumbnails": the same thinned for the ranked table's small charts. */
  include: z.enum(["levenspiel", "thumbnails"]).optional(),
});
export type CandidateQuery = z.infer<typeof candidateQuerySchema>;

export const compareQuerySchema = z.strictObject({
  ids: text({ error: "Choose the trains to compare" })
    .max(200, "Compare at most 4 candidates")
    .transform((s) => s.split(",").filter(Boolean))
    .pipe(z.array(uuidSchema).min(2, "Compare at least 2 candidates").max(4, "Compare at most 4 candidates")),
});

export const pinCreateSchema = z.strictObject({ note: note.default("") });
export const reviewSchema = z.strictObject({
  decision: z.enum(["approve", "reject"], { error: "Choose approve or reject" }),
  comment: multilineText({ error: "Say why" }).trim().min(1, "Say why").max(2000, "Use at most 2000 characters"),
});

export const tokenCreateSchema = z.strictObject({ name: text({ error: "Name the token" }).trim().min(1, "Name the token").max(80, "Use at most 80 characters") });
