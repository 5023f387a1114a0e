import { json, readJsonOfKind } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { isNetworkKineticsBody, kineticsVersionCreateSchema, networkKineticsVersionCreateSchema } from "@/lib/schemas/sweeps";
import { addKineticsVersion } from "@/lib/services/kinetics";

/** A new version of either kind; the service refuses one of the other kind than the model's (409). */
export const POST = recordRoute("modelId", "kinetics model")(async ({ req, actor, db, id }) => {
  const input = await readJsonOfKind(req, isNetworkKineticsBody, networkKineticsVersionCreateSchema, kineticsVersionCreateSchema);
  return json({ version: await addKineticsVersion(db, actor, id, input) }, 201);
});
