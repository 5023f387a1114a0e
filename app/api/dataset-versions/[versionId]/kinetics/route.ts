import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { fitSaveSchema } from "@/lib/schemas/fits";
import { saveFitAsKinetics } from "@/lib/services/fits";

type Ctx = { params: Promise<{ versionId: string }> };

/** Refits one law and saves it as a kinetics model or a new version, with its source. */
export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const versionId = await uuidParam(ctx, "versionId", "dataset version");
  const input = await readJson(req, fitSaveSchema);
  return json(await saveFitAsKinetics(getDb(), actor, versionId, input), 201);
});
