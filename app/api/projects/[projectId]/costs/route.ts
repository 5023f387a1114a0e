import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { costBasisSchema } from "@/lib/schemas/costs";
import { getCostBasis, saveCostBasis } from "@/lib/services/costs";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ costs: await getCostBasis(db, actor, id) }));

export const PUT = onProject(async ({ req, actor, db, id }) => {
  const input = await readJson(req, costBasisSchema);
  return json({ costs: await saveCostBasis(db, actor, id, input) });
});
