import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readQuery, route } from "@/lib/http";
import { compareQuerySchema } from "@/lib/schemas/sweeps";
import { compareCandidates } from "@/lib/services/candidates";

/** ?ids=a,b[,c,d]: two to four candidates side by side. */
export const GET = route(async (req) => {
  const actor = await requireActor();
  const { ids } = readQuery(req, compareQuerySchema);
  return json({ candidates: await compareCandidates(getDb(), actor, ids) });
});
