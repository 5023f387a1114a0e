import { json, readQuery } from "@/lib/http";
import { scenarioRoute } from "@/lib/http/signed-in-route";
import { candidateQuerySchema } from "@/lib/schemas/sweeps";
import { listCandidates } from "@/lib/services/candidates";

/** Ranked candidates of one scenario: ?sort=&dir=&feasible=&contains=&stages=&page=&pageSize=&include=levenspiel */
export const GET = scenarioRoute(async ({ req, actor, db, sweepId, index }) => {
  const q = readQuery(req, candidateQuerySchema);
  return json(await listCandidates(db, actor, sweepId, index, q));
});
