import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { json, readQuery, route, uuidParam } from "@/lib/http";
import { candidateQuerySchema } from "@/lib/schemas/sweeps";
import { listCandidates } from "@/lib/services/candidates";

type Ctx = { params: Promise<{ sweepId: string; index: string }> };

/** Ranked candidates of one scenario: ?sort=&dir=&feasible=&contains=&stages=&page=&pageSize=&include=levenspiel */
export const GET = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const sweepId = await uuidParam(ctx, "sweepId", "sweep");
  const { index } = await ctx.params;
  if (!/^\d{1,6}$/.test(index)) throw new AppError("not_found", "No such scenario");
  const q = readQuery(req, candidateQuerySchema);
  return json(await listCandidates(getDb(), actor, sweepId, Number(index), q));
});
