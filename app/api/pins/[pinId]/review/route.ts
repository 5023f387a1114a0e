import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { reviewSchema } from "@/lib/schemas/sweeps";
import { reviewPin } from "@/lib/services/pins";

type Ctx = { params: Promise<{ pinId: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const pinId = await uuidParam(ctx, "pinId", "pinned design");
  const input = await readJson(req, reviewSchema);
  return json({ pin: await reviewPin(getDb(), actor, pinId, input) });
});
