import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { inventoryVesselSchema } from "@/lib/schemas/inventory";
import { createVessel, listInventory } from "@/lib/services/inventory";

export const GET = route(async () => {
  const actor = await requireActor();
  return json(await listInventory(getDb(), actor));
});

export const POST = route(async (req) => {
  const actor = await requireActor();
  const input = await readJson(req, inventoryVesselSchema);
  return json({ vessel: await createVessel(getDb(), actor, input) }, 201);
});
