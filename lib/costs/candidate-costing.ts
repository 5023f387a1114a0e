import { sweepCostingSchema, type SweepCosting } from "@/lib/schemas/costs";
import { installedCost } from "./cost-basis";
import { planTrain, type DesignedStage, type SnapshotVessel } from "./train-plan";

/** The costing a sweep recorded in its baseSpec, or null (volume sweeps, older sweeps). */
export function costingOf(baseSpec: Record<string, unknown>): SweepCosting | null {
  const parsed = sweepCostingSchema.safeParse(baseSpec.costing);
  return parsed.success ? parsed.data : null;
}

/** The engine's part of a baseSpec: everything but the costing the sweep records beside it. */
export function engineSpecOf<T extends Record<string, unknown>>(baseSpec: T): Omit<T, "costing"> {
  const { costing: _costing, ...rest } = baseSpec;
  return rest;
}

interface CostableRow {
  feasible: boolean;
  totalCost: number | null;
  stages: Record<string, unknown>[];
}

/**
 * Adds installed cost, and with reuse the inventory plan, to a scenario's candidate rows.
 * Without reuse, installed cost = purchase cost × installation factor; with reuse, it is the
 * least-cost plan's total (see planTrain).
 */
export function withCosting<R extends CostableRow>(
  rows: R[],
  sweep: { baseSpec: Record<string, unknown>; inventory: Record<string, unknown>[] | null },
): (R & { installedCost: number | null; inventoryPlan: Record<string, unknown> | null })[] {
  const costing = costingOf(sweep.baseSpec);
  return rows.map((row) => {
    if (!costing || !row.feasible || row.totalCost === null) return { ...row, installedCost: null, inventoryPlan: null };
    if (!costing.reuseInventory || !sweep.inventory) {
      return { ...row, installedCost: installedCost(row.totalCost, costing.installationFactor), inventoryPlan: null };
    }
    const plan = planTrain(row.stages as unknown as DesignedStage[], sweep.inventory as unknown as SnapshotVessel[], costing.installationFactor);
    return { ...row, installedCost: plan.totalCost, inventoryPlan: plan as unknown as Record<string, unknown> };
  });
}
