import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { listPins } from "@/lib/services/pins";

type Ctx = { params: Promise<{ projectId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ pins: await listPins(getDb(), actor, await uuidParam(ctx, "projectId", "project")) });
});
