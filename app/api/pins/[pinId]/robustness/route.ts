import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { robustnessCreateSchema } from "@/lib/schemas/robustness";
import { createPinRun, listPinRuns } from "@/lib/services/robustness";

const onPin = recordRoute("pinId", "pinned design");

export const GET = onPin(async ({ actor, db, id }) => json(await listPinRuns(db, actor, id)));

export const POST = onPin(async ({ req, actor, db, id }) => {
  const run = await createPinRun(db, actor, id, await readJson(req, robustnessCreateSchema));
  return json({ run }, run.status === "succeeded" ? 201 : 202);
});
