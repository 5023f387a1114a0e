import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { kineticsModelCreateSchema } from "@/lib/schemas/sweeps";
import { createKineticsModel, listKineticsModels } from "@/lib/services/kinetics";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ models: await listKineticsModels(db, actor, id) }));

export const POST = onProject(async ({ req, actor, db, id }) => {
  const input = await readJson(req, kineticsModelCreateSchema);
  return json(await createKineticsModel(db, actor, id, input), 201);
});
