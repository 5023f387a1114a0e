import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { sweepCreateSchema } from "@/lib/schemas/sweeps";
import { createSweep, listSweeps, sweepView } from "@/lib/services/sweeps";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ sweeps: await listSweeps(db, actor, id) }));

export const POST = onProject(async ({ req, actor, db, id }) => {
  const input = await readJson(req, sweepCreateSchema);
  return json({ sweep: sweepView(await createSweep(db, actor, id, input)) }, 201);
});
