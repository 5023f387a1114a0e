import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { kineticsVersionCreateSchema } from "@/lib/schemas/sweeps";
import { addKineticsVersion } from "@/lib/services/kinetics";

type Ctx = { params: Promise<{ modelId: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const modelId = await uuidParam(ctx, "modelId", "kinetics model");
  const input = await readJson(req, kineticsVersionCreateSchema);
  return json({ version: await addKineticsVersion(getDb(), actor, modelId, input) }, 201);
});
