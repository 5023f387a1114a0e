import { json, readJsonOfKind } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { isNetworkKineticsBody, kineticsModelCreateSchema, networkKineticsModelCreateSchema } from "@/lib/schemas/sweeps";
import { createKineticsModel, listKineticsModels } from "@/lib/services/kinetics";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ models: await listKineticsModels(db, actor, id) }));

/** A model of one reaction, or of several (a spec with "reactions"). */
export const POST = onProject(async ({ req, actor, db, id }) => {
  const input = await readJsonOfKind(req, isNetworkKineticsBody, networkKineticsModelCreateSchema, kineticsModelCreateSchema);
  return json(await createKineticsModel(db, actor, id, input), 201);
});
