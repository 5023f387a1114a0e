import solver from "javascript-lp-solver";

import type { StageType } from "@/lib/engine";

/** One stage of a designed train: the volume it needs and what a new vessel would cost. */
export interface StageNeed {
  type: StageType;
  /** Reaction volume needed, m3. */
  volume: number;
  /** Installed cost of buying this stage's vessels new. */
  purchaseCost: number;
}

/** A vessel the plant already owns. */
export interface InventoryVessel {
  id: string;
  type: StageType;
  /** Working volume, m3. */
  volume: number;
  available: boolean;
  /** Cost of bringing it into service (moving, inspection, re-piping). @default 0 */
  reuseCost?: number;
}

export interface StageAssignment {
  stage: number;
  /** The inventory vessel used, or null when the stage is bought new. */
  vesselId: string | null;
  cost: number;
}

export interface InventoryPlan {
  totalCost: number;
  /** What buying every stage new would cost, for comparison. */
  allNewCost: number;
  assignments: StageAssignment[];
}

/** An inventory vessel fits a stage when it is of the stage's type, available and large enough. */
export function fits(stage: StageNeed, vessel: InventoryVessel): boolean {
  return vessel.available && vessel.type === stage.type && vessel.volume >= stage.volume * (1 - 1e-9);
}

/**
 * The least-cost way to equip a train from inventory and purchases, as a mixed-integer
 * programme (javascript-lp-solver): binary x[s,v] uses vessel v for stage s, binary b[s] buys
 * stage s; each stage is equipped exactly once and each vessel used at most once.
 */
export function planFromInventory(stages: StageNeed[], inventory: InventoryVessel[]): InventoryPlan {
  const variables: Record<string, Record<string, number>> = {};
  const binaries: Record<string, 1> = {};
  const constraints: Record<string, { equal?: number; max?: number }> = {};
  stages.forEach((stage, s) => {
    constraints[`stage${s}`] = { equal: 1 };
    variables[`buy_${s}`] = { cost: stage.purchaseCost, [`stage${s}`]: 1 };
    binaries[`buy_${s}`] = 1;
    inventory.forEach((v, k) => {
      if (!fits(stage, v)) return;
      const name = `use_${s}_${k}`;
      variables[name] = { cost: v.reuseCost ?? 0, [`stage${s}`]: 1, [`vessel${k}`]: 1 };
      binaries[name] = 1;
      constraints[`vessel${k}`] = { max: 1 };
    });
  });
  const result = solver.Solve({ optimize: "cost", opType: "min", constraints, variables, binaries }) as Record<string, number | boolean>;
  if (!result.feasible) throw new Error("no assignment found");
  const assignments = stages.map((stage, s): StageAssignment => {
    const k = inventory.findIndex((_, k) => Number(result[`use_${s}_${k}`] ?? 0) > 0.5);
    return k >= 0 ? { stage: s, vesselId: inventory[k].id, cost: inventory[k].reuseCost ?? 0 } : { stage: s, vesselId: null, cost: stage.purchaseCost };
  });
  return {
    totalCost: assignments.reduce((t, a) => t + a.cost, 0),
    allNewCost: stages.reduce((t, s) => t + s.purchaseCost, 0),
    assignments,
  };
}
