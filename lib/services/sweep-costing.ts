import { and, asc, eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { inventoryVessels } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import type { SweepCosting } from "@/lib/schemas/costs";
import type { SweepCreate } from "@/lib/schemas/sweeps";

/**
 * What a sweep records about costs at submission: the costing beside its engine spec and, when
 * reuse is asked for, a snapshot of the team's available vessels (later edits to the inventory do
 * not change a sweep's results).
 */
export async function sweepCostingFor(db: Database, actor: Actor, input: SweepCreate): Promise<{ costing: SweepCosting | null; inventory: Record<string, unknown>[] | null }> {
  const costing = input.costing ?? null;
  if (!costing) return { costing: null, inventory: null };
  if (input.objective?.minimise !== "cost") {
    const message = "Installed cost and reuse need the cost objective";
    throw new AppError("bad_request", message, { fields: { "costing.installationFactor": [message] } });
  }
  if (!costing.reuseInventory) return { costing, inventory: null };
  const rows = await db
    .select({ id: inventoryVessels.id, tag: inventoryVessels.tag, type: inventoryVessels.type, volume: inventoryVessels.volume, reuseCost: inventoryVessels.reuseCost, location: inventoryVessels.location })
    .from(inventoryVessels)
    .where(and(eq(inventoryVessels.teamId, actor.teamId), eq(inventoryVessels.available, true)))
    .orderBy(asc(inventoryVessels.tag));
  return { costing, inventory: rows.map((r) => ({ ...r, available: true })) };
}
