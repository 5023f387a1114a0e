import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { getRun } from "@/lib/services/robustness";

type Ctx = { params: Promise<{ runId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ run: await getRun(getDb(), actor, await uuidParam(ctx, "runId", "robustness run")) });
});
