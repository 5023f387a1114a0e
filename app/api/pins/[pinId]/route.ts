import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { getPin } from "@/lib/services/pins";

type Ctx = { params: Promise<{ pinId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ pin: await getPin(getDb(), actor, await uuidParam(ctx, "pinId", "pinned design")) });
});
