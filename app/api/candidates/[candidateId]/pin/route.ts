import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { pinCreateSchema } from "@/lib/schemas/sweeps";
import { pinCandidate } from "@/lib/services/pins";

type Ctx = { params: Promise<{ candidateId: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const candidateId = await uuidParam(ctx, "candidateId", "candidate");
  const input = await readJson(req, pinCreateSchema);
  return json({ pin: await pinCandidate(getDb(), actor, candidateId, input) }, 201);
});
