/**
 * The sweep form for a kinetics model of several reactions: heat mode, trains, what to rank by, the
 * limits and the scenario grid, as the form holds them (strings as typed), and the request body they
 * make (`POST /api/projects/{id}/sweeps`, a network sweep: `thermal`, `train`, `objective`,
 * `constraints`, `grid`), with every problem at the field that shows it. Pure.
 */
import { z } from "zod";
import { networkParts, MAX_NETWORK_STAGES } from "@/lib/schemas/network-spec";
import { STAGE_TYPES } from "@/lib/stage-types";
import { isUnit, toSI, type UnitKind } from "@/lib/units/display";
import type { StageType } from "@/lib/engine";
import { parseSequence } from "./builder-form-state";
import { listIn, numberIn, type BuilderIssue } from "./typed-numbers";
import { networkBuilderPathOf } from "./network-field-paths";
import { networkGridFields, type NetworkGridField, type NetworkGridSource } from "./network-grid-fields";

/** What the form needs to know of a network kinetics version. */
export interface NetworkVersionInfo extends NetworkGridSource {
  id: string;
  label: string;
  kind: "network";
  species: string[];
  keyReactant: string;
  /** The model's wanted product, the default of a yield or selectivity objective. */
  product?: string;
  /** Per reaction: whether its rate law has a rate constant, a reverse term, an activation energy. */
  reactions: { power: boolean; reverse: boolean; arrhenius: boolean }[];
  units?: Partial<Record<UnitKind, string>>;
}

const axis = z.object({
  field: z.string(),
  unit: z.string(),
  kind: z.enum(["values", "range"]),
  values: z.string(),
  from: z.string(),
  to: z.string(),
  steps: z.string(),
  scale: z.enum(["linear", "log"]),
});
export type NetworkAxisValues = z.infer<typeof axis>;

export const networkBuilderValuesSchema = z.object({
  name: z.string(),
  kineticsVersionId: z.string(),
  heat: z.enum(["isothermal", "stageTemperature"]),
  tMin: z.string(),
  tMax: z.string(),
  tUnit: z.string(),
  trainMode: z.enum(["range", "candidates"]),
  maxStages: z.string(),
  useCSTR: z.boolean(),
  usePFR: z.boolean(),
  candidates: z.array(z.object({ seq: z.string() })),
  objective: z.enum(["yield", "selectivity", "volume"]),
  product: z.string(),
  /** Percentages as typed. */
  minConversion: z.string(),
  minYield: z.string(),
  maxTotalVolume: z.string(),
  maxStageVolume: z.string(),
  volumeUnit: z.string(),
  grid: z.array(axis),
});
export type NetworkBuilderValues = z.infer<typeof networkBuilderValuesSchema>;

/** The request body of a network sweep (the contract's shape). */
const networkSweepBodySchema = z.strictObject({
  name: z.string().min(1).max(120).optional(),
  kineticsVersionId: z.string().min(1),
  thermal: networkParts.thermal,
  train: networkParts.train,
  objective: networkParts.objective,
  constraints: networkParts.constraints.optional(),
  grid: z.array(
    z.union([
      z.strictObject({ field: z.string(), values: z.array(z.number()).min(1) }),
      z.strictObject({ field: z.string(), from: z.number(), to: z.number(), steps: z.number().int().min(2), scale: z.enum(["linear", "log"]) }),
    ]),
  ),
});
export type NetworkSweepBody = z.output<typeof networkSweepBodySchema>;

/** A sensible product for a model: its wanted product, else the first species that is not the key reactant. */
export function defaultProduct(version: Pick<NetworkVersionInfo, "product" | "species" | "keyReactant"> | undefined): string {
  if (!version) return "";
  return version.product ?? version.species.find((s) => s !== version.keyReactant) ?? "";
}

export function defaultNetworkValues(version?: NetworkVersionInfo): NetworkBuilderValues {
  const typed = version?.units ?? {};
  return {
    name: "",
    kineticsVersionId: version?.id ?? "",
    heat: "isothermal",
    tMin: "",
    tMax: "",
    tUnit: typed.temperature && isUnit("temperature", typed.temperature) ? typed.temperature : "K",
    trainMode: "range",
    maxStages: "3",
    useCSTR: true,
    usePFR: true,
    candidates: [{ seq: "CSTR-PFR" }, { seq: "PFR" }],
    objective: "yield",
    product: defaultProduct(version),
    minConversion: "",
    minYield: "",
    maxTotalVolume: "",
    maxStageVolume: "",
    volumeUnit: typed.volume && isUnit("volume", typed.volume) ? typed.volume : "m3",
    grid: [],
  };
}

export function newNetworkAxis(field: NetworkGridField): NetworkAxisValues {
  return { field: field.field, unit: field.defaultUnit, kind: "values", values: "", from: "", to: "", steps: "3", scale: "linear" };
}


/** A percentage typed in the form as a fraction for the request; a problem at its field. */
function percentIn(text: string, path: string, label: string, issues: BuilderIssue[], max = 100): number | undefined {
  const n = numberIn(text, path, issues, false);
  if (n === undefined) return undefined;
  if (n < 0 || n > max) {
    issues.push({ path, message: `${label} is a percentage from 0 to ${max}` });
    return undefined;
  }
  return n / 100;
}

/** A positive volume in the form's unit, as m³. */
function volumeIn(text: string, path: string, unit: string, issues: BuilderIssue[]): number | undefined {
  const n = numberIn(text, path, issues, false);
  if (n === undefined) return undefined;
  if (!(n > 0)) {
    issues.push({ path, message: "Must be above zero" });
    return undefined;
  }
  return toSI("volume", n, unit);
}

/** The request body of the form, or the issues at form paths that keep it from being one. */
export function networkBuilderToRequest(v: NetworkBuilderValues, version: NetworkVersionInfo | undefined): { body: NetworkSweepBody | null; issues: BuilderIssue[] } {
  const issues: BuilderIssue[] = [];
  if (!v.kineticsVersionId || !version) issues.push({ path: "kineticsVersionId", message: "Choose a kinetics version" });

  let thermal: NetworkSweepBody["thermal"] = { mode: "isothermal" };
  if (v.heat === "stageTemperature") {
    const lo = numberIn(v.tMin, "tMin", issues);
    const hi = numberIn(v.tMax, "tMax", issues);
    const loK = lo === undefined ? undefined : toSI("temperature", lo, v.tUnit);
    const hiK = hi === undefined ? undefined : toSI("temperature", hi, v.tUnit);
    if (loK !== undefined && !(loK > 0)) issues.push({ path: "tMin", message: "Must be above absolute zero" });
    if (loK !== undefined && hiK !== undefined && !(hiK > loK)) issues.push({ path: "tMax", message: "The highest stage temperature must be above the lowest" });
    if (loK !== undefined && hiK !== undefined) thermal = { mode: "stageTemperature", min: loK, max: hiK };
  }

  let train: { maxStages: number; types: StageType[] } | { candidates: StageType[][] } | undefined;
  if (v.trainMode === "range") {
    const n = numberIn(v.maxStages, "maxStages", issues);
    const ok = n !== undefined && Number.isInteger(n) && n >= 1 && n <= MAX_NETWORK_STAGES;
    if (n !== undefined && !ok) issues.push({ path: "maxStages", message: `Up to how many stages: a whole number from 1 to ${MAX_NETWORK_STAGES}` });
    const types = STAGE_TYPES.filter((t) => (t === "CSTR" ? v.useCSTR : v.usePFR));
    if (!types.length) issues.push({ path: "useCSTR", message: "Allow at least one stage type" });
    if (ok) train = { maxStages: n, types: [...types] };
  } else {
    // A network's trains are of stirred tanks and tubes only (its editor offers no tube with recycle).
    const candidates = v.candidates.map((c) => parseSequence(c.seq).filter((t): t is StageType => t !== "PFR-recycle"));
    const seen = new Map<string, number>();
    candidates.forEach((c, i) => {
      if (!c.length) issues.push({ path: `candidates.${i}.seq`, message: "Add at least one stage" });
      else if (c.length > MAX_NETWORK_STAGES) issues.push({ path: `candidates.${i}.seq`, message: `At most ${MAX_NETWORK_STAGES} stages` });
      const key = c.join("-");
      if (c.length && seen.has(key)) issues.push({ path: `candidates.${i}.seq`, message: `The same train as train ${seen.get(key)! + 1}` });
      else seen.set(key, i);
    });
    if (!candidates.length) issues.push({ path: "candidates", message: "List at least one train" });
    train = { candidates };
  }

  const minConversion = percentIn(v.minConversion, "minConversion", "Minimum conversion", issues);
  const minYield = percentIn(v.minYield, "minYield", "Minimum yield", issues);
  const maxTotalVolume = volumeIn(v.maxTotalVolume, "maxTotalVolume", v.volumeUnit, issues);
  const maxStageVolume = volumeIn(v.maxStageVolume, "maxStageVolume", v.volumeUnit, issues);

  const product = v.product.trim();
  const productNeeded = v.objective !== "volume" || minYield !== undefined;
  if (productNeeded && !product) issues.push({ path: "product", message: "Choose the wanted product" });
  else if (product && version && !version.species.includes(product)) issues.push({ path: "product", message: "Choose a species of the model" });
  else if (product && version && product === version.keyReactant) issues.push({ path: "product", message: "The wanted product cannot be the key reactant" });
  if (v.objective === "volume" && minConversion === undefined && !v.minConversion.trim()) issues.push({ path: "minConversion", message: "The least total volume needs a minimum conversion to reach" });
  const objective: NetworkSweepBody["objective"] =
    v.objective === "volume" ? { minimise: "volume", ...(product && productNeeded ? { product } : {}) } : { maximise: v.objective, product };

  const fields = version ? networkGridFields(version) : [];
  const grid: NetworkSweepBody["grid"] = [];
  v.grid.forEach((a, i) => {
    const preset = fields.find((f) => f.field === a.field);
    if (!preset) issues.push({ path: `grid.${i}.field`, message: "Choose an input of this model to vary" });
    if (v.grid.findIndex((b) => b.field === a.field) !== i) issues.push({ path: `grid.${i}.field`, message: "Each input may be varied once" });
    const si = (n: number) => (preset?.kind && a.unit ? toSI(preset.kind, n, a.unit) : n);
    const positive = (values: number[], path: string) => {
      if (values.some((n) => Number.isFinite(n) && !(n > 0))) issues.push({ path, message: "Every value must be above zero (above absolute zero for a temperature)" });
    };
    if (a.kind === "values") {
      const values = listIn(a.values, `grid.${i}.values`, issues).map(si);
      positive(values, `grid.${i}.values`);
      grid.push({ field: a.field, values });
    } else {
      const from = numberIn(a.from, `grid.${i}.from`, issues);
      const to = numberIn(a.to, `grid.${i}.to`, issues);
      const steps = numberIn(a.steps, `grid.${i}.steps`, issues);
      if (from !== undefined) positive([si(from)], `grid.${i}.from`);
      if (to !== undefined) positive([si(to)], `grid.${i}.to`);
      if (steps !== undefined && !(Number.isInteger(steps) && steps >= 2)) issues.push({ path: `grid.${i}.steps`, message: "Steps: a whole number of 2 or more" });
      if (from !== undefined && to !== undefined && steps !== undefined) grid.push({ field: a.field, from: si(from), to: si(to), steps, scale: a.scale });
    }
  });

  if (issues.length || !train) return { body: null, issues };
  const constraints = {
    ...(minConversion !== undefined ? { minConversion } : {}),
    ...(minYield !== undefined ? { minYield } : {}),
    ...(maxTotalVolume !== undefined ? { maxTotalVolume } : {}),
    ...(maxStageVolume !== undefined ? { maxStageVolume } : {}),
  };
  const raw = {
    ...(v.name.trim() ? { name: v.name.trim() } : {}),
    kineticsVersionId: v.kineticsVersionId,
    thermal,
    train,
    objective,
    ...(Object.keys(constraints).length ? { constraints } : {}),
    grid,
  };
  const parsed = networkSweepBodySchema.safeParse(raw);
  if (!parsed.success) return { body: null, issues: parsed.error.issues.map((i) => ({ path: networkBuilderPathOf(i.path.join(".")) || "kineticsVersionId", message: i.message })) };
  return { body: parsed.data, issues: [] };
}

/** Scenarios and trains the form as it stands would size (null while a part is unreadable). */
export function networkImplied(v: NetworkBuilderValues, version: NetworkVersionInfo | undefined): { scenarios: number | null; sequences: number | null; optimisations: number | null } {
  const { body } = networkBuilderToRequest(v, version);
  if (!body) return { scenarios: null, sequences: null, optimisations: null };
  const scenarios = body.grid.reduce((n, a) => n * ("values" in a ? a.values.length : a.steps), 1);
  const t = body.train;
  let sequences = 0;
  if ("maxStages" in t) {
    const types = new Set(t.types ?? STAGE_TYPES).size;
    for (let k = 1; k <= t.maxStages; k++) sequences += types ** k;
  } else sequences = t.candidates.length;
  return { scenarios, sequences, optimisations: scenarios * sequences };
}

