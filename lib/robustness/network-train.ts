/**
 * A train of several reactions as a robustness run rates it: built from its scenario's design spec
 * and its stages, the inputs it offers to be made uncertain, and the run with its nominal rating and
 * the cautions. Pure.
 */
import { CAUTIONS, EngineError, rateNetworkTrain, type NetworkSpec } from "@/lib/engine";
import { AppError } from "@/lib/errors";
import { labelFor } from "@/lib/schemas/field-labels";
import type { NetworkRobustnessRunResult, UncertainInput } from "@/lib/schemas/robustness";
import type { StoredNetworkStage } from "@/lib/sweeps/stored-json";
import { rateNetworkUnderUncertainty, type NetworkTrain } from "./network-monte-carlo";
import { siChemistry } from "./network-si";
import { valueAtPath } from "./numeric-path";

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/** The fixed train of a network candidate: its scenario's spec (after the scenario's values) and its stages. */
export function networkTrainOf(spec: Obj, stages: readonly StoredNetworkStage[], modelProduct: string | null = null): NetworkTrain {
  const constraints = obj(spec.constraints);
  const objective = obj(spec.objective);
  const ownTemperatures = obj(spec.thermal).mode === "stageTemperature";
  return {
    kind: "network",
    chemistry: siChemistry({ feed: spec.feed, phase: spec.phase, reactions: spec.reactions, keyReactant: spec.keyReactant }),
    // Isothermal trains follow the (possibly uncertain) feed temperature; others hold each stage at its own.
    stages: stages.map((s) => ({ type: s.type, volume: s.volume, ...(ownTemperatures ? { temperature: s.temperature } : {}) })),
    product: typeof objective.product === "string" ? objective.product : modelProduct,
    minConversion: num(constraints.minConversion),
    minYield: num(constraints.minYield),
  };
}

export const isNetworkTrain = (train: unknown): train is NetworkTrain => obj(train).kind === "network";

const RATE_CONSTANT_UNIT = "on a m³, mol, s basis";

/** The inputs a network train offers: each reaction's constants held as numbers, the feed's flow and temperature. */
export function offeredNetworkFields(train: NetworkTrain): { field: string; label: string; unit: string; value: number }[] {
  const c = train.chemistry;
  const out: { field: string; label: string; unit: string; value: number }[] = [];
  const offer = (field: string, unit: string, fallback?: number) => {
    const v = num(valueAtPath(c, field)) ?? fallback ?? null;
    if (v !== null) out.push({ field, label: labelFor(field), unit, value: v });
  };
  (Array.isArray(c.reactions) ? c.reactions : []).forEach((r, j) => {
    const rate = obj(obj(r).rate);
    if (rate.law !== "power") return;
    offer(`reactions.${j}.rate.k`, RATE_CONSTANT_UNIT);
    if (rate.reverse) offer(`reactions.${j}.rate.reverse.k`, RATE_CONSTANT_UNIT);
    if (rate.activationEnergy !== undefined) offer(`reactions.${j}.rate.activationEnergy`, "J/mol");
  });
  offer("feed.volumetricFlow", "m³/s");
  offer("feed.temperature", "K", 298.15);
  return out;
}

/** 400 naming uncertain.N.field for every input this train does not offer. */
export function checkNetworkUncertainFields(train: NetworkTrain, uncertain: UncertainInput[], prefix = "uncertain"): void {
  const offered = new Set(offeredNetworkFields(train).map((f) => f.field));
  const fields: Record<string, string[]> = {};
  uncertain.forEach((u, i) => {
    if (!offered.has(u.field)) fields[`${prefix}.${i}.field`] = [`${labelFor(u.field)} is not an input of this train that can be varied; choose one from the list`];
  });
  if (Object.keys(fields).length > 0) throw new AppError("bad_request", `Not inputs of this train: ${Object.values(fields).flat().join("; ")}`, { fields });
}

/** The run's summary with the train's rating at the nominal inputs and the cautions. */
export function rateNetworkRobustness(train: NetworkTrain, req: { uncertain: UncertainInput[]; samples: number; seed: number }): NetworkRobustnessRunResult {
  const result = rateNetworkUnderUncertainty({ train, ...req });
  let nominal: NetworkRobustnessRunResult["nominal"] = null;
  try {
    const r = rateNetworkTrain(train.chemistry as unknown as NetworkSpec, train.stages, train.product ?? undefined);
    nominal = { conversion: r.conversion, yield: r.yield, selectivity: r.selectivity };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
  }
  return { ...result, nominal, cautions: [...CAUTIONS] };
}
