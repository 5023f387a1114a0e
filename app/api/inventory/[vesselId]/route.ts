import { json, noContent, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { inventoryVesselUpdateSchema } from "@/lib/schemas/inventory";
import { deleteVessel, getVessel, updateVessel } from "@/lib/services/inventory";

const onVessel = recordRoute("vesselId", "vessel");

export const GET = onVessel(async ({ actor, db, id }) => json({ vessel: await getVessel(db, actor, id) }));

export const PATCH = onVessel(async ({ req, actor, db, id }) => {
  const input = await readJson(req, inventoryVesselUpdateSchema);
  return json({ vessel: await updateVessel(db, actor, id, input) });
});

export const DELETE = onVessel(async ({ actor, db, id }) => {
  await deleteVessel(db, actor, id);
  return noContent();
});
