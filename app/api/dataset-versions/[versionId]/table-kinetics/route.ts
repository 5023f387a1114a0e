import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { tableKineticsSchema } from "@/lib/schemas/datasets";
import { createTableKinetics } from "@/lib/services/datasets";

type Ctx = { params: Promise<{ versionId: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const versionId = await uuidParam(ctx, "versionId", "dataset version");
  const input = await readJson(req, tableKineticsSchema);
  return json(await createTableKinetics(getDb(), actor, versionId, input), 201);
});
