import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { inventoryVesselSchema } from "@/lib/schemas/inventory";
import { createVessel, listInventory } from "@/lib/services/inventory";

export const GET = signedInRoute(async ({ actor, db }) => json(await listInventory(db, actor)));

export const POST = signedInRoute(async ({ req, actor, db }) => {
  const input = await readJson(req, inventoryVesselSchema);
  return json({ vessel: await createVessel(db, actor, input) }, 201);
});
