import { z } from "zod";
import { COLUMN_ROLES, DATASET_UNITS } from "@/lib/datasets/units";
import { uuidSchema } from "./ids";
import { keyText, multilineText, text } from "./text";

const unitOf = (kind: keyof typeof DATASET_UNITS, what: string) => {
  const keys = Object.keys(DATASET_UNITS[kind]) as [string, ...string[]];
  return z.enum(keys, { error: `Unit of ${what} must be one of ${keys.join(", ")}` });
};

/**
 * How the user reads an uploaded table: which header holds which quantity, and in what unit.
 * Stored as given with each dataset version.
 */
export const datasetMappingSchema = z.strictObject({
  columns: z
    .record(keyText().trim().min(1, "A column name is empty").max(200, "Use at most 200 characters"), z.enum(COLUMN_ROLES, { error: "Choose what the column holds from the list" }))
    .refine((c) => Object.keys(c).length <= 100, "At most 100 columns"),
  units: z
    .strictObject({
      conversion: unitOf("conversion", "conversion").optional(),
      concA: unitOf("concentration", "the concentration of A").optional(),
      concR: unitOf("concentration", "the concentration of R").optional(),
      rate: unitOf("rate", "the rate").optional(),
      temperature: unitOf("temperature", "temperature").optional(),
    })
    .default({}),
});
export type DatasetMapping = z.infer<typeof datasetMappingSchema>;

export const datasetNameSchema = text({ error: "Name is required" }).trim().min(2, "Use at least 2 characters").max(120, "Use at most 120 characters");
const note = multilineText().trim().max(2000, "Use at most 2000 characters").default("");

/** Feed concentration of A, mol/m3, for data given as concentrations. Form fields arrive as text. */
const feedConcA = z.coerce
  .number({ error: "Feed concentration must be a number (mol/m³)" })
  .positive("Feed concentration must be above 0")
  .finite("Feed concentration must be finite")
  .optional();

const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);

/** The text fields of an upload (multipart form-data, besides `file`). */
export const datasetPreviewFieldsSchema = z.strictObject({ mapping: datasetMappingSchema });
export const datasetCreateFieldsSchema = z.strictObject({
  name: datasetNameSchema,
  mapping: datasetMappingSchema,
  feedConcA: z.preprocess(blankToUndefined, feedConcA),
  note,
});
export const datasetVersionFieldsSchema = datasetCreateFieldsSchema.omit({ name: true });

/** Uses a dataset version as a measured rate table: a new kinetics model, or a new version of one. */
export const tableKineticsSchema = z
  .strictObject({
    modelName: datasetNameSchema.optional(),
    modelId: uuidSchema.optional(),
    feed: z.strictObject({
      flowA: z.number({ error: "Feed flow of A is required (mol/s)" }).positive("Feed flow of A must be above 0").finite(),
      concA: z.number({ error: "Feed concentration of A is required (mol/m³)" }).positive("Feed concentration of A must be above 0").finite(),
      temperature: z.number({ error: "Temperature must be a number (K)" }).positive("Temperature must be above 0 K").finite().optional(),
    }),
    stoichiometry: z.record(keyText().regex(/^[A-Za-z][A-Za-z0-9_]*$/, "Use a species name such as A or R"), z.number().finite()).optional(),
    phase: z.enum(["liquid", "gas"]).optional(),
    note: multilineText().trim().max(2000, "Use at most 2000 characters").optional(),
  })
  .refine((b) => (b.modelName === undefined) !== (b.modelId === undefined), { message: "Give either a new model name or the model to add a version to", path: ["modelName"] });
export type TableKineticsInput = z.infer<typeof tableKineticsSchema>;

/** The multipart bodies as the OpenAPI document describes them (the file itself is binary). */
const fileDoc = z.string().describe("The CSV or XLSX file (binary)");
const mappingDoc = z.string().describe("JSON of { columns: { header: role }, units: { role: unit } }");
export const previewFormDoc = z.object({ file: fileDoc, mapping: mappingDoc });
export const createFormDoc = z.object({ name: z.string(), file: fileDoc, mapping: mappingDoc, feedConcA: z.string().optional().describe("mol/m³"), note: z.string().optional() });
export const versionFormDoc = createFormDoc.omit({ name: true });
