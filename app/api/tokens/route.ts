import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { tokenCreateSchema } from "@/lib/schemas/sweeps";
import { createApiToken, listApiTokens } from "@/lib/services/tokens";

export const GET = signedInRoute(async ({ actor, db }) => json({ tokens: await listApiTokens(db, actor) }));

/** The token is in this response only; it is stored as a hash. */
export const POST = signedInRoute(async ({ req, actor, db }) => {
  const input = await readJson(req, tokenCreateSchema);
  return json({ token: await createApiToken(db, actor, input) }, 201);
});
