import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { robustnessCreateSchema } from "@/lib/schemas/robustness";
import { createCandidateRun, listCandidateRuns } from "@/lib/services/robustness";

type Ctx = { params: Promise<{ candidateId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json(await listCandidateRuns(getDb(), actor, await uuidParam(ctx, "candidateId", "candidate")));
});

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const candidateId = await uuidParam(ctx, "candidateId", "candidate");
  const input = await readJson(req, robustnessCreateSchema);
  const run = await createCandidateRun(getDb(), actor, candidateId, input);
  return json({ run }, run.status === "succeeded" ? 201 : 202);
});
