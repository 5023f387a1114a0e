import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { inventoryVesselUpdateSchema } from "@/lib/schemas/inventory";
import { deleteVessel, getVessel, updateVessel } from "@/lib/services/inventory";

type Ctx = { params: Promise<{ vesselId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ vessel: await getVessel(getDb(), actor, await uuidParam(ctx, "vesselId", "vessel")) });
});

export const PATCH = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const id = await uuidParam(ctx, "vesselId", "vessel");
  const input = await readJson(req, inventoryVesselUpdateSchema);
  return json({ vessel: await updateVessel(getDb(), actor, id, input) });
});

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  await deleteVessel(getDb(), actor, await uuidParam(ctx, "vesselId", "vessel"));
  return new Response(null, { status: 204 });
});
