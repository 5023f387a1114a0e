import { ensure } from "./errors";
import type { CostObjectiveSpec, ObjectiveSpec, StageType, TrainStageType, VesselCostSpec } from "./types";
import { DIM, toSI } from "./units";

/** Resolved objective: volume, or vessel cost with optional sizes and a largest vessel. */
export interface CostModel {
  readonly kind: "volume" | "cost";
  readonly vessels: Readonly<Record<StageType, VesselCostSpec>>;
  /** Standard sizes ascending, m3, or null for any size. */
  readonly sizes: readonly number[] | null;
  /** Largest single vessel, m3 (the largest standard size when sizes are given and no limit is). */
  readonly maxVessel: number;
}

/** How one stage is bought. */
export interface Purchase {
  readonly count: number;
  readonly sizeEach: number;
  readonly cost: number;
  /** Index of the standard size (or -1): with count, identifies the piece of the cost function. */
  readonly sizeIndex: number;
}

const NONE: VesselCostSpec = { a: 0, b: 1, n: 1 };

function resolveVessel(spec: VesselCostSpec | undefined, type: StageType, used: boolean): VesselCostSpec {
  const path = `objective.vessels.${type}`;
  if (!spec) {
    ensure(!used, `a cost correlation for ${type} vessels is needed`, path);
    return NONE;
  }
  ensure(Number.isFinite(spec.a) && spec.a >= 0, "a must be a finite number >= 0", `${path}.a`);
  ensure(Number.isFinite(spec.b) && spec.b >= 0, "b must be a finite number >= 0", `${path}.b`);
  ensure(Number.isFinite(spec.n) && spec.n > 0 && spec.n <= 3, "n must be within (0, 3]", `${path}.n`);
  return spec;
}

/**
 * The vessel a stage type is bought as: a tube with recycle is a tube (its recycle pump and line are not
 * costed).
 */
export function vesselType(type: TrainStageType): StageType {
  return type === "PFR-recycle" ? "PFR" : type;
}

/** Resolves the objective; `used` are the stage types the train may contain. */
export function resolveCostModel(objective: ObjectiveSpec | undefined, usedTypes: readonly TrainStageType[]): CostModel {
  const used = usedTypes.map(vesselType);
  if (!objective || objective.minimise === "volume") {
    return { kind: "volume", vessels: { CSTR: NONE, PFR: NONE }, sizes: null, maxVessel: Infinity };
  }
  const o: CostObjectiveSpec = objective;
  const sizes = o.standardSizes?.map((s, i) => {
    const v = toSI(s, DIM.volume, `objective.standardSizes.${i}`);
    ensure(v > 0, "standard sizes must be > 0", `objective.standardSizes.${i}`);
    return v;
  });
  if (sizes) ensure(sizes.length > 0, "give at least one standard size", "objective.standardSizes");
  const sorted = sizes ? [...sizes].sort((p, q) => p - q) : null;
  let maxVessel = o.maxVesselVolume === undefined ? Infinity : toSI(o.maxVesselVolume, DIM.volume, "objective.maxVesselVolume");
  ensure(maxVessel > 0, "the maximum vessel volume must be > 0", "objective.maxVesselVolume");
  if (sorted) {
    const fitting = sorted.filter((s) => s <= maxVessel * (1 + 1e-12));
    ensure(fitting.length > 0, "no standard size fits within the maximum vessel volume", "objective.maxVesselVolume");
    maxVessel = fitting[fitting.length - 1];
  }
  return {
    kind: "cost",
    vessels: { CSTR: resolveVessel(o.vessels.CSTR, "CSTR", used.includes("CSTR")), PFR: resolveVessel(o.vessels.PFR, "PFR", used.includes("PFR")) },
    sizes: sorted,
    maxVessel,
  };
}

/** The fewest identical vessels that hold `volume`, each rounded up to a standard size, and their cost. */
export function purchase(cm: CostModel, type: TrainStageType, volume: number): Purchase {
  const count = volume <= cm.maxVessel * (1 + 1e-12) ? 1 : Math.ceil(volume / cm.maxVessel - 1e-12);
  const each = volume / count;
  let sizeEach = each;
  let sizeIndex = -1;
  if (cm.sizes) {
    sizeIndex = cm.sizes.findIndex((s) => each <= s * (1 + 1e-12));
    sizeEach = cm.sizes[sizeIndex];
  }
  const { a, b, n } = cm.vessels[vesselType(type)];
  return { count, sizeEach, cost: count * (a + b * Math.pow(sizeEach, n)), sizeIndex };
}

/** Objective value of one stage of a given volume (volume itself, or its purchase cost). */
export function stageObjective(cm: CostModel, type: TrainStageType, volume: number): number {
  if (!Number.isFinite(volume)) return Infinity;
  return cm.kind === "volume" ? volume : purchase(cm, type, volume).cost;
}
