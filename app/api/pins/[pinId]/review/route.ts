import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { reviewSchema } from "@/lib/schemas/sweeps";
import { reviewPin } from "@/lib/services/pins";

export const POST = recordRoute("pinId", "pinned design")(async ({ req, actor, db, id }) => {
  const input = await readJson(req, reviewSchema);
  return json({ pin: await reviewPin(db, actor, id, input) });
});
