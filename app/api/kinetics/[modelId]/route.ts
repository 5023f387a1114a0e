import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { getKineticsModel } from "@/lib/services/kinetics";

type Ctx = { params: Promise<{ modelId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ model: await getKineticsModel(getDb(), actor, await uuidParam(ctx, "modelId", "kinetics model")) });
});
