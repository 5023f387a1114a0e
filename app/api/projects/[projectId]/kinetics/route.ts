import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { kineticsModelCreateSchema } from "@/lib/schemas/sweeps";
import { createKineticsModel, listKineticsModels } from "@/lib/services/kinetics";

type Ctx = { params: Promise<{ projectId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ models: await listKineticsModels(getDb(), actor, await uuidParam(ctx, "projectId", "project")) });
});

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const projectId = await uuidParam(ctx, "projectId", "project");
  const input = await readJson(req, kineticsModelCreateSchema);
  return json(await createKineticsModel(getDb(), actor, projectId, input), 201);
});
