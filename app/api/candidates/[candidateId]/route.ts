import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { compareCandidates } from "@/lib/services/candidates";

/** One candidate of the actor's team with its stages, plot data, scenario and sweep (the candidate view). */
export const GET = recordRoute("candidateId", "candidate")(async ({ actor, db, id }) => {
  const [candidate] = await compareCandidates(db, actor, [id]);
  return json({ candidate });
});
