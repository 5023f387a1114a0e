import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { tokenCreateSchema } from "@/lib/schemas/sweeps";
import { createApiToken, listApiTokens } from "@/lib/services/tokens";

export const GET = route(async () => {
  const actor = await requireActor();
  return json({ tokens: await listApiTokens(getDb(), actor) });
});

/** The token is in this response only; it is stored as a hash. */
export const POST = route(async (req) => {
  const actor = await requireActor();
  const input = await readJson(req, tokenCreateSchema);
  return json({ token: await createApiToken(getDb(), actor, input) }, 201);
});
