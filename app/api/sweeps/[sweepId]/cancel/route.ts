import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { cancelSweep } from "@/lib/services/sweeps";

type Ctx = { params: Promise<{ sweepId: string }> };

export const POST = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ sweep: await cancelSweep(getDb(), actor, await uuidParam(ctx, "sweepId", "sweep")) });
});
