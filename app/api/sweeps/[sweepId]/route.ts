import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { getSweep } from "@/lib/services/sweeps";

type Ctx = { params: Promise<{ sweepId: string }> };

/** The sweep with its progress (done/total, elapsed and estimated remaining seconds). */
export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ sweep: await getSweep(getDb(), actor, await uuidParam(ctx, "sweepId", "sweep")) });
});
