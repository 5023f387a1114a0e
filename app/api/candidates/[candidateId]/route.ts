import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getCandidate } from "@/lib/services/candidate-detail";

/**
 * One candidate of the actor's team with its stages, plot data, scenario and sweep (the candidate view);
 * a network candidate also with its chemistry, concentration profiles and paths.
 */
export const GET = recordRoute("candidateId", "candidate")(async ({ actor, db, id }) => json({ candidate: await getCandidate(db, actor, id) }));
