import { json, readQuery } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { compareQuerySchema } from "@/lib/schemas/sweeps";
import { compareCandidates } from "@/lib/services/candidates";

/** ?ids=a,b[,c,d]: two to four candidates side by side. */
export const GET = signedInRoute(async ({ req, actor, db }) => {
  const { ids } = readQuery(req, compareQuerySchema);
  return json({ candidates: await compareCandidates(db, actor, ids) });
});
