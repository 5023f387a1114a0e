import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { getDataset } from "@/lib/services/datasets";

type Ctx = { params: Promise<{ datasetId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ dataset: await getDataset(getDb(), actor, await uuidParam(ctx, "datasetId", "dataset")) });
});
