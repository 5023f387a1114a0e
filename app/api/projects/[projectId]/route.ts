import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { projectUpdateSchema } from "@/lib/schemas/projects";
import { getProjectById, updateProject } from "@/lib/services/projects";

type Ctx = { params: Promise<{ projectId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ project: await getProjectById(getDb(), actor, await uuidParam(ctx, "projectId", "project")) });
});

export const PATCH = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const id = await uuidParam(ctx, "projectId", "project");
  const input = await readJson(req, projectUpdateSchema);
  return json({ project: await updateProject(getDb(), actor, id, input) });
});
