import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { listScenarios } from "@/lib/services/sweeps";

type Ctx = { params: Promise<{ sweepId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ scenarios: await listScenarios(getDb(), actor, await uuidParam(ctx, "sweepId", "sweep")) });
});
