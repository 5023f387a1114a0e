import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { robustnessCreateSchema } from "@/lib/schemas/robustness";
import { createPinRun, listPinRuns } from "@/lib/services/robustness";

type Ctx = { params: Promise<{ pinId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json(await listPinRuns(getDb(), actor, await uuidParam(ctx, "pinId", "pinned design")));
});

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const pinId = await uuidParam(ctx, "pinId", "pinned design");
  const input = await readJson(req, robustnessCreateSchema);
  const run = await createPinRun(getDb(), actor, pinId, input);
  return json({ run }, run.status === "succeeded" ? 201 : 202);
});
