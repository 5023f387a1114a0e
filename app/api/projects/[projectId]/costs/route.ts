import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { costBasisSchema } from "@/lib/schemas/costs";
import { getCostBasis, saveCostBasis } from "@/lib/services/costs";

type Ctx = { params: Promise<{ projectId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ costs: await getCostBasis(getDb(), actor, await uuidParam(ctx, "projectId", "project")) });
});

export const PUT = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const projectId = await uuidParam(ctx, "projectId", "project");
  const input = await readJson(req, costBasisSchema);
  return json({ costs: await saveCostBasis(getDb(), actor, projectId, input) });
});
