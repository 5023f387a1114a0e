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
  rank: number;
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
  const costed = rows.map((row) => {
    if (!costing || !row.feasible || row.totalCost === null) return { ...row, installedCost: null, inventoryPlan: null };
    if (!costing.reuseInventory || !sweep.inventory) {
      return { ...row, installedCost: installedCost(row.totalCost, costing.installationFactor), inventoryPlan: null };
    }
    const plan = planTrain(row.stages as unknown as DesignedStage[], sweep.inventory as unknown as SnapshotVessel[], costing.installationFactor);
    return { ...row, installedCost: plan.totalCost, inventoryPlan: plan as unknown as Record<string, unknown> };
  });
  return costing?.reuseInventory && sweep.inventory ? rerankByInstalledCost(costed) : costed;
}

/**
 * With reuse the engine's order (all-new purchase cost) is not what the user will pay: rank again by
 * the installed cost with reuse, the engine's rank breaking ties. Only the rank numbers change, never
 * the order of the array, so callers may still pair rows with other per-row lists by index.
 */
function rerankByInstalledCost<R extends { rank: number; feasible: boolean; installedCost: number | null }>(rows: R[]): R[] {
  const key = (r: R) => (r.feasible && r.installedCost !== null ? r.installedCost : Infinity);
  const order = rows.map((r, i) => i).sort((i, j) => key(rows[i]) - key(rows[j]) || rows[i].rank - rows[j].rank);
  const rank = new Map(order.map((i, k) => [i, k + 1]));
  return rows.map((r, i) => ({ ...r, rank: rank.get(i) as number }));
}
