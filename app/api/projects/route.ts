import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { projectCreateSchema } from "@/lib/schemas/projects";
import { createProject, listProjects } from "@/lib/services/projects";

export const GET = signedInRoute(async ({ req, actor, db }) => {
  const includeArchived = new URL(req.url).searchParams.get("archived") === "include";
  return json({ projects: await listProjects(db, actor, { includeArchived }) });
});

export const POST = signedInRoute(async ({ req, actor, db }) => {
  const input = await readJson(req, projectCreateSchema);
  return json({ project: await createProject(db, actor, input) }, 201);
});
