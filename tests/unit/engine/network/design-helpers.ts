import type { NetworkDesignSpec, NetworkObjective, NetworkTrainSpec, NetworkConstraints } from "../../../../lib/engine/network/design-types";
import type { StageType } from "../../../../lib/engine/types";
import { firstOrder, liquid } from "./helpers";

export const CA0 = 580;
export const V0 = 1e-3;

/** A -> B -> C, both first order, liquid, fed with A only; rank by the yield of B unless told otherwise. */
export function seriesDesign(
  k1: number,
  k2: number,
  train: NetworkTrainSpec,
  constraints?: NetworkConstraints,
  objective: NetworkObjective = { maximise: "yield", product: "B" },
): NetworkDesignSpec {
  return { ...liquid({ A: CA0, B: 0, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", k2)], "A", V0), train, objective, ...(constraints ? { constraints } : {}) };
}

export const only = (...sequences: StageType[][]): NetworkTrainSpec => ({ candidates: sequences });
export const tanks = (n: number): StageType[] => new Array<StageType>(n).fill("CSTR");
