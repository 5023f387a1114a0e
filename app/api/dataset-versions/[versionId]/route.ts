import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { getDatasetVersion } from "@/lib/services/datasets";

type Ctx = { params: Promise<{ versionId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ version: await getDatasetVersion(getDb(), actor, await uuidParam(ctx, "versionId", "dataset version")) });
});
