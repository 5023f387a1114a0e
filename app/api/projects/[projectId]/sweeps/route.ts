import { json, readJsonOfKind } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { isNetworkSweepBody, networkSweepCreateSchema, sweepCreateSchema } from "@/lib/schemas/sweeps";
import { createSweep, listSweeps, sweepView } from "@/lib/services/sweeps";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ sweeps: await listSweeps(db, actor, id) }));

/** A sweep of a model of one reaction (a body with a target) or of several (limits, heat mode, maximise/minimise). */
export const POST = onProject(async ({ req, actor, db, id }) => {
  const input = await readJsonOfKind(req, isNetworkSweepBody, networkSweepCreateSchema, sweepCreateSchema);
  return json({ sweep: sweepView(await createSweep(db, actor, id, input)) }, 201);
});
