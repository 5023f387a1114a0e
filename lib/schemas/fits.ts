import { z } from "zod";
import { designSpecSchema } from "./sweep-spec";
import { uuidSchema } from "./ids";
import { keyText, multilineText, text } from "./text";

/** Rate laws the fitter knows, in the order the screen lists them. */
export const FIT_LAWS = ["power", "reversible", "saturation", "saturation-inhibition", "power-arrhenius"] as const;
export type FitLaw = (typeof FIT_LAWS)[number];

/** What each law says, in plain text, and the units of its parameters (SI). */
export const FIT_LAW_INFO: Record<FitLaw, { label: string; formula: string; units: Record<string, string> }> = {
  power: { label: "Power law", formula: "-rA = k·C_A^n", units: { k: "(mol/m³)^(1−n)/s", n: "—" } },
  reversible: { label: "Reversible first order", formula: "-rA = kf·C_A − kr·C_R", units: { kf: "1/s", kr: "1/s" } },
  saturation: { label: "Saturation", formula: "-rA = vmax·C_A / (km + C_A)", units: { vmax: "mol/(m³·s)", km: "mol/m³" } },
  "saturation-inhibition": {
    label: "Saturation with substrate inhibition",
    formula: "-rA = vmax·C_A / (km + C_A + C_A²/ki)",
    units: { vmax: "mol/(m³·s)", km: "mol/m³", ki: "mol/m³" },
  },
  "power-arrhenius": {
    label: "Power law with Arrhenius temperature dependence",
    formula: "-rA = k_ref·exp(−Ea/R·(1/T − 1/T_ref))·C_A^n",
    units: { k_ref: "(mol/m³)^(1−n)/s", Ea: "J/mol", n: "—" },
  },
};

const lawSchema = z.enum(FIT_LAWS, { error: "Choose a rate law from the list" });
const feedConcA = z.number({ error: "Feed concentration must be a number (mol/m³)" }).finite().gt(0, "Feed concentration must be above 0");

/** POST /api/dataset-versions/:versionId/fits */
export const fitRequestSchema = z.strictObject({
  laws: z
    .array(lawSchema)
    .min(1, "Choose at least one rate law")
    .max(FIT_LAWS.length)
    .refine((l) => new Set(l).size === l.length, "Choose each law once"),
  /** C_A0 in mol/m3, when the rows hold conversion only (overrides the value stored with the version). */
  feedConcA: feedConcA.optional(),
});
export type FitRequest = z.infer<typeof fitRequestSchema>;

const modelName = text({ error: "Name is required" }).trim().min(2, "Use at least 2 characters").max(120, "Use at most 120 characters");
const spec = designSpecSchema.shape;

/** POST /api/dataset-versions/:versionId/kinetics: refit one law and save it as a kinetics version. */
export const fitSaveSchema = z
  .strictObject({
    law: lawSchema,
    /** A new model of the dataset's project by this name ... */
    modelName: modelName.optional(),
    /** ... or a new version of this existing model of the same project. */
    modelId: uuidSchema.optional(),
    feed: spec.feed,
    feedConcA: feedConcA.optional(),
    stoichiometry: z.record(keyText().max(40, "Use at most 40 characters"), z.number({ error: "Must be a number" }).finite()).optional(),
    phase: z.enum(["liquid", "gas"], { error: "Choose liquid or gas" }).optional(),
    note: multilineText().trim().max(2000, "Use at most 2000 characters").default(""),
  })
  .refine((b) => (b.modelName === undefined) !== (b.modelId === undefined), {
    message: "Give either a new model name or an existing model, not both",
    path: ["modelName"],
  });
export type FitSave = z.infer<typeof fitSaveSchema>;

export interface FitParameterOut {
  name: string;
  value: number;
  standardError: number;
  interval95: [number, number];
  unit: string;
}

export type LawFitOut =
  | {
      law: FitLaw;
      ok: true;
      formula: string;
      parameters: FitParameterOut[];
      referenceTemperature?: number;
      rss: number;
      rSquared: number;
      points: number;
      degreesOfFreedom: number;
      /** Akaike information criterion, least-squares form; null when RSS is 0. */
      aic: number | null;
      status: "converged" | "max-iterations";
      parity: [number, number][];
      residuals: number[];
    }
  | { law: FitLaw; ok: false; error: string };

export interface DataRange {
  points: number;
  conversion: [number, number] | null;
  concA: [number, number] | null;
  concR: [number, number] | null;
  temperature: [number, number] | null;
  rate: [number, number];
}

export interface FitResponse {
  dataset: { id: string; projectId: string; name: string; versionId: string; version: number; rowCount: number };
  feedConcA: number | null;
  assumptions: string[];
  range: DataRange;
  criterion: string;
  fits: LawFitOut[];
  cautions: string[];
}
