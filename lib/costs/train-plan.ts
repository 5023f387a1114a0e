import type { StageType } from "@/lib/engine";
import { planFromInventory, type InventoryVessel, type StageNeed } from "./inventory";

/** One designed stage as the engine returns it: volume, vessels bought and their purchase cost. */
export interface DesignedStage {
  type: StageType;
  /** Reaction volume of the whole stage, m3. */
  volume: number;
  vessels: { count: number; sizeEach: number };
  /** Purchase cost of the stage's new vessels. */
  cost: number | null;
}

/** One vessel position ("slot") of a stage and how it is equipped. */
export interface SlotPlan {
  /** The inventory vessel reused, or null when a new vessel is bought. */
  vesselId: string | null;
  tag: string | null;
  /** Volume of the reused vessel, or of the new vessel bought (a standard size), m3. */
  volume: number;
  /** Reuse cost of the vessel, or the installed cost of the new one. */
  cost: number;
}

export interface StagePlan {
  stage: number;
  type: StageType;
  /** Reaction volume the stage needs, m3, and each parallel vessel's share of it. */
  volumeNeeded: number;
  volumeEach: number;
  slots: SlotPlan[];
  reused: number;
  bought: number;
  cost: number;
  /** Installed cost had the stage been bought new. */
  allNewCost: number;
}

export interface TrainPlan {
  stages: StagePlan[];
  /** Installed cost with reuse (reuse costs + installed cost of what is bought). */
  totalCost: number;
  allNewCost: number;
  saving: number;
  reusedCount: number;
}

/** A vessel of the team's inventory as snapshotted on a sweep. */
export interface SnapshotVessel extends InventoryVessel {
  tag: string;
}

/**
 * The least-cost way to equip a designed train from the inventory. A stage of several identical
 * parallel vessels is split into that many slots, each needing the stage's volume divided by the
 * count (the flow is split equally, so a vessel at least that large does at least as well as the
 * new one); each slot may be taken by a reused vessel or bought new, independently of the
 * others. Purchase costs are the new vessels' costs times the installation factor; reuse costs
 * are taken as given (they are already the cost of bringing a vessel into service).
 */
export function planTrain(stages: readonly DesignedStage[], inventory: readonly SnapshotVessel[], installationFactor: number): TrainPlan {
  const slots: (StageNeed & { stage: number })[] = [];
  stages.forEach((s, i) => {
    const count = Math.max(1, s.vessels.count);
    for (let k = 0; k < count; k++) {
      slots.push({ stage: i, type: s.type, volume: s.volume / count, purchaseCost: ((s.cost ?? 0) / count) * installationFactor });
    }
  });
  const plan = planFromInventory(slots, [...inventory]);
  const byId = new Map(inventory.map((v) => [v.id, v]));
  const stagePlans: StagePlan[] = stages.map((s, i) => {
    const count = Math.max(1, s.vessels.count);
    const mine = plan.assignments.filter((a) => slots[a.stage].stage === i);
    const slotPlans = mine.map((a): SlotPlan => {
      const v = a.vesselId ? byId.get(a.vesselId) : undefined;
      return v ? { vesselId: v.id, tag: v.tag, volume: v.volume, cost: a.cost } : { vesselId: null, tag: null, volume: s.vessels.sizeEach, cost: a.cost };
    });
    const reused = slotPlans.filter((p) => p.vesselId).length;
    return {
      stage: i,
      type: s.type,
      volumeNeeded: s.volume,
      volumeEach: s.volume / count,
      slots: slotPlans,
      reused,
      bought: count - reused,
      cost: slotPlans.reduce((t, p) => t + p.cost, 0),
      allNewCost: (s.cost ?? 0) * installationFactor,
    };
  });
  const reusedCount = stagePlans.reduce((t, s) => t + s.reused, 0);
  return { stages: stagePlans, totalCost: plan.totalCost, allNewCost: plan.allNewCost, saving: plan.allNewCost - plan.totalCost, reusedCount };
}
