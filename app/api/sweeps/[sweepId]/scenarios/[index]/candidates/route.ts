import { readQuery } from "@/lib/http";
import { scenarioRoute } from "@/lib/http/signed-in-route";
import { candidateQuerySchema } from "@/lib/schemas/sweeps";
import { readCandidates } from "@/lib/services/candidate-reads";

/**
 * Ranked candidates of one scenario: ?sort=&dir=&feasible=&contains=&stages=&page=&pageSize=&include=levenspiel
 * A finished sweep's answer, and a running sweep's for a scenario already stored, carries a strong ETag
 * and may be kept by the browser; a repeat naming the tag gets 304 (after the access check). A running
 * sweep's answer for a scenario not yet stored is never kept.
 */
export const GET = scenarioRoute(async ({ req, actor, db, sweepId, index }) => {
  const q = readQuery(req, candidateQuerySchema);
  const answer = await readCandidates(db, actor, sweepId, index, q, req.headers.get("if-none-match"));
  const headers: Record<string, string> = { "Cache-Control": answer.cacheControl };
  if (answer.etag) headers.ETag = answer.etag;
  if (answer.status === 304) return new Response(null, { status: 304, headers });
  return new Response(answer.body, { status: 200, headers: { ...headers, "Content-Type": "application/json" } });
});
