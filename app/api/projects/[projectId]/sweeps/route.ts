import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { sweepCreateSchema } from "@/lib/schemas/sweeps";
import { createSweep, listSweeps, sweepView } from "@/lib/services/sweeps";

type Ctx = { params: Promise<{ projectId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ sweeps: await listSweeps(getDb(), actor, await uuidParam(ctx, "projectId", "project")) });
});

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const projectId = await uuidParam(ctx, "projectId", "project");
  const input = await readJson(req, sweepCreateSchema);
  return json({ sweep: sweepView(await createSweep(getDb(), actor, projectId, input)) }, 201);
});
