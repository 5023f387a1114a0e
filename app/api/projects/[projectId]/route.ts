import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { json, readJson, route } from "@/lib/http";
import { projectUpdateSchema, uuidSchema } from "@/lib/schemas/foundation";
import { getProjectById, updateProject } from "@/lib/services/projects";

type Ctx = { params: Promise<{ projectId: string }> };

async function projectIdOf(ctx: Ctx): Promise<string> {
  const { projectId } = await ctx.params;
  if (!uuidSchema.safeParse(projectId).success) throw notFound("project");
  return projectId;
}

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ project: await getProjectById(getDb(), actor, await projectIdOf(ctx)) });
});

export const PATCH = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const id = await projectIdOf(ctx);
  const input = await readJson(req, projectUpdateSchema);
  return json({ project: await updateProject(getDb(), actor, id, input) });
});
