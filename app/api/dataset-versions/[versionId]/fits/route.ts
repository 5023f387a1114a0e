import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { fitRequestSchema } from "@/lib/schemas/fits";
import { fitDatasetVersion } from "@/lib/services/fits";

type Ctx = { params: Promise<{ versionId: string }> };

/** Fits the chosen rate laws to a dataset version, computed on demand (nothing stored). */
export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const versionId = await uuidParam(ctx, "versionId", "dataset version");
  const input = await readJson(req, fitRequestSchema);
  return json(await fitDatasetVersion(getDb(), actor, versionId, input));
});
