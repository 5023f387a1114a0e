import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { robustnessCreateSchema } from "@/lib/schemas/robustness";
import { createCandidateRun, listCandidateRuns } from "@/lib/services/robustness";

const onCandidate = recordRoute("candidateId", "candidate");

export const GET = onCandidate(async ({ actor, db, id }) => json(await listCandidateRuns(db, actor, id)));

export const POST = onCandidate(async ({ req, actor, db, id }) => {
  const run = await createCandidateRun(db, actor, id, await readJson(req, robustnessCreateSchema));
  return json({ run }, run.status === "succeeded" ? 201 : 202);
});
