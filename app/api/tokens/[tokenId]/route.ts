import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { route, uuidParam } from "@/lib/http";
import { revokeApiToken } from "@/lib/services/tokens";

type Ctx = { params: Promise<{ tokenId: string }> };

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  await revokeApiToken(getDb(), actor, await uuidParam(ctx, "tokenId", "token"));
  return new Response(null, { status: 204 });
});
