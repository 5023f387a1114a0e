import { noContent } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { revokeApiToken } from "@/lib/services/tokens";

export const DELETE = recordRoute("tokenId", "token")(async ({ actor, db, id }) => {
  await revokeApiToken(db, actor, id);
  return noContent();
});
