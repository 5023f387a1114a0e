import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route, uuidParam } from "@/lib/http";
import { compareCandidates } from "@/lib/services/candidates";

type Ctx = { params: Promise<{ candidateId: string }> };

/** One candidate of the actor's team with its stages, plot data, scenario and sweep (the candidate view). */
export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const [candidate] = await compareCandidates(getDb(), actor, [await uuidParam(ctx, "candidateId", "candidate")]);
  return json({ candidate });
});
