import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { kineticsVersionCreateSchema } from "@/lib/schemas/sweeps";
import { addKineticsVersion } from "@/lib/services/kinetics";

export const POST = recordRoute("modelId", "kinetics model")(async ({ req, actor, db, id }) => {
  const input = await readJson(req, kineticsVersionCreateSchema);
  return json({ version: await addKineticsVersion(db, actor, id, input) }, 201);
});
