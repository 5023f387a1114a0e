import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { rateRequestSchema } from "@/lib/schemas/costs";
import { rateFixedTrain } from "@/lib/services/rating";

export const POST = recordRoute("projectId", "project")(async ({ req, actor, db, id }) => {
  const input = await readJson(req, rateRequestSchema);
  return json({ rating: await rateFixedTrain(db, actor, id, input) });
});
