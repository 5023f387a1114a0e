/**
 * The sweep builder's form values and their mapping to the POST /api/projects/:id/sweeps body,
 * with the counts shown before submitting. Pure.
 */
import { z } from "zod";
import { labelFor } from "@/lib/schemas/field-labels";
import { sweepCreateSchema, type SweepCreate } from "@/lib/schemas/sweeps";
import { toSI, type UnitKind } from "@/lib/units/display";
import type { TrainStageType } from "@/lib/engine";
import { sequenceFromKey, STAGE_TYPES, TRAIN_STAGE_TYPES } from "@/lib/stage-types";
import { listIn, numberIn, type BuilderIssue } from "./typed-numbers";

const vessel = z.object({ a: z.string(), b: z.string(), n: z.string() });
const axis = z.object({
  field: z.string(),
  customField: z.string(),
  unit: z.string(),
  kind: z.enum(["values", "range"]),
  values: z.string(),
  from: z.string(),
  to: z.string(),
  steps: z.string(),
  scale: z.enum(["linear", "log"]),
});

export const builderValuesSchema = z.object({
  name: z.string(),
  kineticsVersionId: z.string(),
  target: z.string(),
  trainMode: z.enum(["range", "candidates", "multiset"]),
  maxStages: z.string(),
  useCSTR: z.boolean(),
  usePFR: z.boolean(),
  /** Tubes with recycle among the stage types (Up to N stages). */
  usePFRrecycle: z.boolean().optional(),
  /** A tube with recycle's recycle ratio: chosen with the stage conversions, or the one typed in `recycleRatio`. */
  recycleMode: z.enum(["optimised", "fixed"]).optional(),
  recycleRatio: z.string().optional(),
  candidates: z.array(z.object({ seq: z.string() })),
  multisetCSTR: z.string(),
  multisetPFR: z.string(),
  equalVolume: z.boolean(),
  objective: z.enum(["volume", "cost"]),
  vesselCSTR: vessel,
  vesselPFR: vessel,
  standardSizes: z.string(),
  sizeUnit: z.string(),
  maxVessel: z.string(),
  /** Installed cost = purchase × this factor; blank for purchase cost only. */
  installationFactor: z.string(),
  reuseInventory: z.boolean(),
  grid: z.array(axis),
});
export type BuilderValues = z.infer<typeof builderValuesSchema>;
export type AxisValues = z.infer<typeof axis>;

export interface GridField {
  /** The field's path in the sweep body (a kinetics spec field), or "custom" for one named by hand. */
  field: string;
  /** What the form and the results call it: labelFor's words, so it reads as on the kinetics form and in the report. */
  label: string;
  /** The unit kind of its values; null for a plain number (in the units `basis` names, if any). */
  kind: UnitKind | null;
  defaultUnit: string;
  /** For a number without a unit kind: the units it is counted in, said beside its name. */
  basis?: string;
}

const gridField = (field: string, kind: UnitKind | null, defaultUnit: string, basis?: string): GridField => ({
  field,
  label: basis ? `${labelFor(field)} (${basis})` : labelFor(field),
  kind,
  defaultUnit,
  basis,
});

/**
 * The one list of inputs one can vary by picking: the builder offers them, the results page names
 * its axes and scenarios from them.
 */
export const GRID_FIELDS: GridField[] = [
  gridField("feed.flowA", "molarFlow", "mol/s"),
  gridField("target.conversion", null, ""),
  gridField("feed.temperature", "temperature", "K"),
  gridField("feed.concA", "concentration", "mol/L"),
  // The engine keeps k on a cubic metre, mole and second basis whatever the model was typed in.
  gridField("reaction.rate.k", null, "", "m³, mol, s basis"),
  gridField("reaction.rate.activationEnergy", "energyPerMol", "kJ/mol"),
  gridField("reaction.thermal.adiabaticRise", "temperatureDifference", "K"),
  gridField("reaction.thermal.maxTemperature", "temperature", "K"),
  { field: "custom", label: "Another input, by its name in a sweep file (SI units)", kind: null, defaultUnit: "" },
];

/** The offered field at this path, if it is one. */
export const gridFieldAt = (field: string): GridField | undefined => GRID_FIELDS.find((g) => g.field === field);

export function newAxis(field = "feed.flowA"): AxisValues {
  const f = gridFieldAt(field) ?? GRID_FIELDS[0];
  return { field, customField: "", unit: f.defaultUnit, kind: "values", values: "", from: "", to: "", steps: "3", scale: "linear" };
}

export function defaultBuilderValues(kineticsVersionId = ""): BuilderValues {
  return {
    name: "",
    kineticsVersionId,
    target: "0.9",
    trainMode: "range",
    maxStages: "3",
    useCSTR: true,
    usePFR: true,
    usePFRrecycle: false,
    recycleMode: "optimised",
    recycleRatio: "",
    candidates: [{ seq: "CSTR-PFR" }, { seq: "PFR" }],
    multisetCSTR: "2",
    multisetPFR: "1",
    equalVolume: false,
    objective: "volume",
    vesselCSTR: { a: "20000", b: "45000", n: "0.6" },
    vesselPFR: { a: "15000", b: "38000", n: "0.6" },
    standardSizes: "",
    sizeUnit: "m3",
    maxVessel: "",
    installationFactor: "",
    reuseInventory: false,
    grid: [],
  };
}

/** A listed train as the form keeps it: its sequence key ("CSTR-PFRrecycle"), unknown words dropped. */
export const parseSequence = (s: string): TrainStageType[] => (s ? sequenceFromKey(s).filter((t) => TRAIN_STAGE_TYPES.includes(t)) : []);

const factorial = (n: number): number => (n <= 1 ? 1 : n * factorial(n - 1));

/** How many sequences the train space holds (what the engine will optimise per scenario). */
export function sequenceCount(train: SweepCreate["train"]): number {
  if ("maxStages" in train) {
    const t = new Set<string>(train.types ?? STAGE_TYPES).size;
    let n = 0;
    for (let k = 1; k <= train.maxStages; k++) n += t ** k;
    return n;
  }
  if ("candidates" in train) return new Set(train.candidates.map((c) => c.join(" "))).size;
  const c = train.multiset.CSTR ?? 0;
  const p = train.multiset.PFR ?? 0;
  return c + p === 0 ? 0 : factorial(c + p) / (factorial(c) * factorial(p));
}

/** Values an axis takes (as the server expands it). */
export function axisLength(a: SweepCreate["grid"][number]): number {
  return "values" in a ? a.values.length : a.steps;
}

export function scenarioCountOf(grid: SweepCreate["grid"]): number {
  return grid.reduce((n, a) => n * axisLength(a), 1);
}

/** Every swept quantity is a positive amount once in base units (kelvin for temperatures). */
function positiveValues(values: readonly number[], path: string, issues: BuilderIssue[]): void {
  if (values.some((n) => Number.isFinite(n) && !(n > 0))) issues.push({ path, message: "Every value must be above zero (above absolute zero for a temperature)" });
}

/** Largest number of stages the engine designs (its MAX_STAGES; components may not import engine values). */
const MAX_STAGES = 8;

/** The request body of the form, or the issues at form paths that keep it from being one. */
export function builderToRequest(v: BuilderValues): { body: SweepCreate | null; issues: BuilderIssue[] } {
  const issues: BuilderIssue[] = [];
  if (!v.kineticsVersionId) issues.push({ path: "kineticsVersionId", message: "Choose a kinetics version" });
  const targetRaw = numberIn(v.target, "target", issues);
  const target = targetRaw !== undefined && !(targetRaw > 0 && targetRaw < 1) ? undefined : targetRaw;
  if (targetRaw !== undefined && target === undefined) issues.push({ path: "target", message: "The target conversion is a number between 0 and 1, e.g. 0.9" });

  let train: SweepCreate["train"] | undefined;
  if (v.trainMode === "range") {
    const stagesRaw = numberIn(v.maxStages, "maxStages", issues);
    const maxStages = stagesRaw !== undefined && Number.isInteger(stagesRaw) && stagesRaw >= 1 && stagesRaw <= MAX_STAGES ? stagesRaw : undefined;
    if (stagesRaw !== undefined && maxStages === undefined) issues.push({ path: "maxStages", message: `Up to how many stages: a whole number from 1 to ${MAX_STAGES}` });
    const types: TrainStageType[] = [...(v.useCSTR ? (["CSTR"] as const) : []), ...(v.usePFR ? (["PFR"] as const) : []), ...(v.usePFRrecycle ? (["PFR-recycle"] as const) : [])];
    if (!types.length) issues.push({ path: "useCSTR", message: "Allow at least one stage type" });
    const recycle = recycleIn(v, types.includes("PFR-recycle"), issues);
    if (maxStages !== undefined) train = { maxStages, types, ...(v.equalVolume ? { equalVolume: true } : {}), ...recycle };
  } else if (v.trainMode === "candidates") {
    const candidates = v.candidates.map((c) => parseSequence(c.seq));
    candidates.forEach((c, i) => {
      if (!c.length) issues.push({ path: `candidates.${i}.seq`, message: "Add at least one stage" });
    });
    if (!candidates.length) issues.push({ path: "candidates", message: "List at least one sequence" });
    const recycle = recycleIn(v, candidates.some((c) => c.includes("PFR-recycle")), issues);
    train = { candidates, ...(v.equalVolume ? { equalVolume: true } : {}), ...recycle };
  } else {
    const CSTR = numberIn(v.multisetCSTR, "multisetCSTR", issues, false) ?? 0;
    const PFR = numberIn(v.multisetPFR, "multisetPFR", issues, false) ?? 0;
    if (CSTR + PFR < 1) issues.push({ path: "multisetCSTR", message: "The multiset needs at least one stage" });
    train = { multiset: { ...(CSTR ? { CSTR } : {}), ...(PFR ? { PFR } : {}) }, ...(v.equalVolume ? { equalVolume: true } : {}) };
  }

  let objective: SweepCreate["objective"] = { minimise: "volume" };
  if (v.objective === "cost") {
    const vessels: Record<string, { a: number; b: number; n: number }> = {};
    for (const type of STAGE_TYPES) {
      const src = type === "CSTR" ? v.vesselCSTR : v.vesselPFR;
      const key = type === "CSTR" ? "vesselCSTR" : "vesselPFR";
      const a = numberIn(src.a, `${key}.a`, issues);
      const b = numberIn(src.b, `${key}.b`, issues);
      const n = numberIn(src.n, `${key}.n`, issues);
      if (a !== undefined && b !== undefined && n !== undefined) vessels[type] = { a, b, n };
    }
    const sizes = v.standardSizes.trim() ? listIn(v.standardSizes, "standardSizes", issues).map((s) => toSI("volume", s, v.sizeUnit)) : undefined;
    const maxRaw = numberIn(v.maxVessel, "maxVessel", issues, false);
    objective = {
      minimise: "cost",
      vessels,
      ...(sizes ? { standardSizes: sizes } : {}),
      ...(maxRaw !== undefined ? { maxVesselVolume: toSI("volume", maxRaw, v.sizeUnit) } : {}),
    };
  }

  const costing = costingIn(v, issues);

  const grid: SweepCreate["grid"] = [];
  v.grid.forEach((a, i) => {
    const preset = gridFieldAt(a.field);
    const field = a.field === "custom" ? a.customField.trim() : a.field;
    if (!field) issues.push({ path: `grid.${i}.customField`, message: "Enter the input to vary" });
    const si = (n: number) => (preset?.kind && a.unit ? toSI(preset.kind, n, a.unit) : n);
    if (a.kind === "values") {
      const values = listIn(a.values, `grid.${i}.values`, issues).map(si);
      positiveValues(values, `grid.${i}.values`, issues);
      grid.push({ field, values });
    } else {
      const from = numberIn(a.from, `grid.${i}.from`, issues);
      const to = numberIn(a.to, `grid.${i}.to`, issues);
      const steps = numberIn(a.steps, `grid.${i}.steps`, issues);
      // A log range's own check ("positive ends") comes from the request schema.
      if (from !== undefined && a.scale !== "log") positiveValues([si(from)], `grid.${i}.from`, issues);
      if (to !== undefined && a.scale !== "log") positiveValues([si(to)], `grid.${i}.to`, issues);
      if (steps !== undefined && !(Number.isInteger(steps) && steps >= 1)) issues.push({ path: `grid.${i}.steps`, message: "Steps: a whole number of 1 or more" });
      if (from !== undefined && to !== undefined && steps !== undefined) grid.push({ field, from: si(from), to: si(to), steps, scale: a.scale });
    }
  });

  if (issues.length || target === undefined || !train) return { body: null, issues };
  const raw = { ...(v.name.trim() ? { name: v.name.trim() } : {}), kineticsVersionId: v.kineticsVersionId, target: { conversion: target }, train, objective, grid, ...(costing ? { costing } : {}) };
  const parsed = sweepCreateSchema.safeParse(raw);
  if (!parsed.success) return { body: null, issues: parsed.error.issues.map((i) => ({ path: builderPathOf(i.path.join(".")), message: i.message })) };
  return { body: parsed.data, issues: [] };
}

/**
 * The fixed recycle ratio of every tube with recycle, when the user typed one; nothing when the design chooses
 * it (the default) or no stage is a tube with recycle. Same-volume trains and standard sizes rate whole vessels,
 * which the engine does not do for a tube with recycle yet, so they are refused here in words.
 */
function recycleIn(v: BuilderValues, used: boolean, issues: BuilderIssue[]): { recycleRatio?: number } {
  if (!used) return {};
  if (v.equalVolume) issues.push({ path: "equalVolume", message: "All stages the same volume is not offered with a tube with recycle: untick it or remove the tube with recycle" });
  if (v.objective === "cost" && v.standardSizes.trim()) issues.push({ path: "standardSizes", message: "Standard sizes are not offered with a tube with recycle: clear them or remove the tube with recycle" });
  if (v.recycleMode !== "fixed") return {};
  if (!(v.recycleRatio ?? "").trim()) {
    issues.push({ path: "recycleRatio", message: "Enter the recycle ratio, e.g. 0.5, or let the design choose it" });
    return {};
  }
  const r = numberIn(v.recycleRatio ?? "", "recycleRatio", issues);
  if (r === undefined) return {};
  if (!(r >= 0)) {
    issues.push({ path: "recycleRatio", message: "Give 0 or more, e.g. 0.5 (0 is a plain tube)" });
    return {};
  }
  return { recycleRatio: r };
}

/** The sweep's costing (installation factor, reuse) when the cost objective has a factor. */
function costingIn(v: BuilderValues, issues: BuilderIssue[]): SweepCreate["costing"] {
  if (v.objective !== "cost") return undefined;
  const factor = numberIn(v.installationFactor ?? "", "installationFactor", issues, false);
  if (factor === undefined) {
    if (v.reuseInventory) issues.push({ path: "installationFactor", message: "Reuse compares installed costs: give the installation factor" });
    return undefined;
  }
  return { installationFactor: factor, reuseInventory: !!v.reuseInventory };
}

/** A request field path (from zod or the server) → the builder field that shows it. */
export function builderPathOf(path: string): string {
  if (path.startsWith("kineticsVersionId")) return "kineticsVersionId";
  if (path.startsWith("target")) return "target";
  if (path === "name") return "name";
  const g = /^grid\.(\d+)\.(\w+)/.exec(path);
  if (g) return g[2] === "field" ? `grid.${g[1]}.customField` : ["from", "to", "steps"].includes(g[2]) ? `grid.${g[1]}.${g[2]}` : `grid.${g[1]}.values`;
  if (path.startsWith("grid")) return "grid";
  if (path.startsWith("train.maxStages")) return "maxStages";
  if (path.startsWith("train.types")) return "useCSTR";
  if (path.startsWith("train.candidates")) return "candidates";
  if (path.startsWith("train.multiset")) return "multisetCSTR";
  if (path.startsWith("train.recycleRatio")) return "recycleRatio";
  if (path.startsWith("train.equalVolume")) return "equalVolume";
  if (path.startsWith("train")) return "trainMode";
  const o = /^objective\.vessels\.(CSTR|PFR)\.?(a|b|n)?/.exec(path);
  if (o) return `vessel${o[1]}.${o[2] ?? "a"}`;
  if (path.startsWith("objective.standardSizes")) return "standardSizes";
  if (path.startsWith("objective.maxVesselVolume")) return "maxVessel";
  if (path.startsWith("objective")) return "objective";
  if (path.startsWith("costing.reuse")) return "reuseInventory";
  if (path.startsWith("costing")) return "installationFactor";
  return "";
}

/** The form's error-shown-at field for each API field error; the rest are general. */
export function mapSweepServerFields(fields: Record<string, string[]>): { byField: Record<string, string>; rest: string[] } {
  const byField: Record<string, string> = {};
  const rest: string[] = [];
  for (const [key, messages] of Object.entries(fields)) {
    const field = builderPathOf(key);
    if (field) byField[field] = [byField[field], ...messages].filter(Boolean).join(" ");
    else rest.push(...messages);
  }
  return { byField, rest };
}

/** Scenarios, sequences and their product for the form as it stands (null while a part is unreadable). */
export function implied(v: BuilderValues): { scenarios: number | null; sequences: number | null; optimisations: number | null } {
  const { body } = builderToRequest({ ...v, kineticsVersionId: v.kineticsVersionId || "00000000-0000-4000-8000-000000000000" });
  if (!body) {
    // Still count what can be counted.
    return { scenarios: null, sequences: null, optimisations: null };
  }
  const scenarios = scenarioCountOf(body.grid);
  const sequences = sequenceCount(body.train);
  return { scenarios, sequences, optimisations: scenarios * sequences };
}
