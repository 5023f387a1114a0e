import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { rateRequestSchema } from "@/lib/schemas/costs";
import { rateFixedTrain } from "@/lib/services/rating";

type Ctx = { params: Promise<{ projectId: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const projectId = await uuidParam(ctx, "projectId", "project");
  const input = await readJson(req, rateRequestSchema);
  return json({ rating: await rateFixedTrain(getDb(), actor, projectId, input) });
});
