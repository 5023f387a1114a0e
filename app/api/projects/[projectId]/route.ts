import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { projectUpdateSchema } from "@/lib/schemas/projects";
import { getProjectById, updateProject } from "@/lib/services/projects";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ project: await getProjectById(db, actor, id) }));

export const PATCH = onProject(async ({ req, actor, db, id }) => {
  const input = await readJson(req, projectUpdateSchema);
  return json({ project: await updateProject(db, actor, id, input) });
});
