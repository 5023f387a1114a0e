import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { projectCreateSchema } from "@/lib/schemas/projects";
import { createProject, listProjects } from "@/lib/services/projects";

export const GET = route(async (req) => {
  const actor = await requireActor();
  const includeArchived = new URL(req.url).searchParams.get("archived") === "include";
  return json({ projects: await listProjects(getDb(), actor, { includeArchived }) });
});

export const POST = route(async (req) => {
  const actor = await requireActor();
  const input = await readJson(req, projectCreateSchema);
  return json({ project: await createProject(getDb(), actor, input) }, 201);
});
