import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { findLabel, labelFor } from "@/lib/schemas/field-labels";
import { invitationAcceptSchema, invitationCreateSchema, linkSignInSchema, memberUpdateSchema, passwordSignInSchema } from "@/lib/schemas/accounts";
import { projectCreateSchema, projectUpdateSchema } from "@/lib/schemas/projects";
import { candidateQuerySchema, compareQuerySchema, kineticsModelCreateSchema, kineticsPreviewSchema, kineticsVersionCreateSchema, pinCreateSchema, reviewSchema, sweepCreateSchema, tokenCreateSchema } from "@/lib/schemas/sweeps";
import { costBasisSchema, rateRequestSchema } from "@/lib/schemas/costs";
import { robustnessCreateSchema } from "@/lib/schemas/robustness";
import { fitRequestSchema, fitSaveSchema } from "@/lib/schemas/fits";
import { datasetCreateFieldsSchema, datasetPreviewFieldsSchema, datasetVersionFieldsSchema, tableKineticsSchema } from "@/lib/schemas/datasets";
import { inventoryVesselSchema, inventoryVesselUpdateSchema } from "@/lib/schemas/inventory";
import { inventoryImportFieldsSchema } from "@/lib/schemas/inventory-import";
import { auditQuerySchema } from "@/lib/schemas/audit";
import { candidateExportQuerySchema } from "@/lib/schemas/report-exports";
import { designSpecSchema, ratingSpecSchema } from "@/lib/schemas/sweep-spec";
import { displayUnitsSchema } from "@/lib/schemas/display-units";
import { networkSpecSchema } from "@/lib/schemas/network-spec";
import { networkPreviewSchema } from "@/lib/schemas/network-preview";

/** Every schema a route handler, upload reader or the command line reads a body or query with. */
const BOUNDARY: Record<string, z.ZodType> = {
  passwordSignInSchema, linkSignInSchema, invitationCreateSchema, invitationAcceptSchema, memberUpdateSchema,
  projectCreateSchema, projectUpdateSchema, kineticsModelCreateSchema, kineticsVersionCreateSchema, kineticsPreviewSchema,
  sweepCreateSchema, candidateQuerySchema, compareQuerySchema, pinCreateSchema, reviewSchema, tokenCreateSchema,
  costBasisSchema, rateRequestSchema, robustnessCreateSchema, fitRequestSchema, fitSaveSchema, datasetPreviewFieldsSchema,
  datasetCreateFieldsSchema, datasetVersionFieldsSchema, tableKineticsSchema, inventoryVesselSchema, inventoryVesselUpdateSchema,
  inventoryImportFieldsSchema, auditQuerySchema, candidateExportQuerySchema, designSpecSchema, ratingSpecSchema, displayUnitsSchema, networkSpecSchema,
  networkPreviewSchema,
};

interface Def { type: string; shape?: Record<string, z.ZodType>; element?: z.ZodType; valueType?: z.ZodType; options?: z.ZodType[]; innerType?: z.ZodType; in?: z.ZodType; out?: z.ZodType; left?: z.ZodType; right?: z.ZodType }
const defOf = (s: z.ZodType) => (s as unknown as { _zod: { def: Def } })._zod.def;

/** Every path a person can get wrong, with "0" for an array index and "key" for a record key. */
function leafPaths(schema: z.ZodType, prefix: string[] = [], out = new Set<string>()): Set<string> {
  const def = defOf(schema);
  const here = () => out.add(prefix.join("."));
  switch (def.type) {
    case "object":
      if (prefix.length) here();
      for (const [k, v] of Object.entries(def.shape ?? {})) leafPaths(v, [...prefix, k], out);
      break;
    case "array":
      if (prefix.length) here();
      leafPaths(def.element!, [...prefix, "0"], out);
      break;
    case "record":
      if (prefix.length) here();
      leafPaths(def.valueType!, [...prefix, "key"], out);
      break;
    case "union":
      for (const o of def.options ?? []) leafPaths(o, prefix, out);
      break;
    case "intersection":
      leafPaths(def.left!, prefix, out);
      leafPaths(def.right!, prefix, out);
      break;
    case "pipe":
      // a transform's output is not typed by the user; its input is
      leafPaths(defOf(def.in!).type === "transform" ? def.out! : def.in!, prefix, out);
      break;
    case "optional": case "nullable": case "default": case "prefault": case "readonly": case "catch": case "nonoptional":
      leafPaths(def.innerType!, prefix, out);
      break;
    default:
      if (prefix.length) here();
  }
  return out;
}

describe("every field read at a boundary has a label", () => {
  for (const [name, schema] of Object.entries(BOUNDARY)) {
    it(name, () => {
      const paths = [...leafPaths(schema)];
      expect(paths.length).toBeGreaterThan(0);
      const missing = paths.filter((p) => findLabel(p) === null);
      expect(missing, `paths without a label in ${name}`).toEqual([]);
    });
  }

  it("finds nested fields of the engine's input inside request bodies", () => {
    expect(leafPaths(sweepCreateSchema)).toContain("train.maxStages");
    expect(leafPaths(kineticsModelCreateSchema)).toContain("spec.reaction.rate.orders.key");
    expect(leafPaths(costBasisSchema)).toContain("vessels.CSTR.a");
  });
});

describe("labels read as the form shows them", () => {
  it("numbers stages from 1 and names record keys", () => {
    expect(labelFor("stages.0.volume")).toBe("Stage 1 volume");
    expect(labelFor("stages.2.type")).toBe("Stage 3 type");
    expect(labelFor("spec.reaction.rate.orders.B")).toBe("Order in B");
    expect(labelFor("train.candidates.1.0")).toBe("Train 2, stage 1");
    expect(labelFor("feedConcA")).toBe("Feed concentration of A");
    expect(labelFor("vessels.CSTR.a")).toBe("CSTR cost: fixed part a");
    expect(labelFor("train.maxStages")).toBe("Largest number of stages");
    expect(labelFor("reaction.rate.k")).toBe("Rate constant k");
    expect(labelFor("robustness.uncertain.0.fraction")).toBe("Uncertain input 1: ± %");
  });

  it("never returns a dotted path or a camel-case key, even for a path it does not know", () => {
    const label = labelFor("reaction.somethingNew.0.innerKey");
    expect(label).toBe("Inner key");
    expect(label).not.toMatch(/\b[a-z]+[A-Z]\w*\b|\w+\.\d+\.\w+/);
  });
});

describe("a message that names its field is not labelled twice", () => {
  it("keeps one label before a schema's own sentence that starts with it", async () => {
    const { designSpecSchema } = await import("@/lib/schemas/sweep-spec");
    const { validationError } = await import("@/lib/errors");
    const parsed = designSpecSchema.safeParse({ target: { conversion: "ninety" } });
    expect(parsed.success).toBe(false);
    const message = validationError(parsed.error!).message;
    expect(message).toContain('Target conversion: cannot read "ninety"');
    expect(message).not.toContain("Target conversion: Target conversion");
  });
});
