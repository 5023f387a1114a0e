import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { pinCreateSchema } from "@/lib/schemas/sweeps";
import { pinCandidate } from "@/lib/services/pins";

export const POST = recordRoute("candidateId", "candidate")(async ({ req, actor, db, id }) => {
  const input = await readJson(req, pinCreateSchema);
  return json({ pin: await pinCandidate(db, actor, id, input) }, 201);
});
