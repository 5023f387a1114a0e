import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { readUpload } from "@/lib/http/read-upload";
import { json, route, uuidParam } from "@/lib/http";
import { datasetCreateFieldsSchema } from "@/lib/schemas/datasets";
import { createDataset, listDatasets } from "@/lib/services/datasets";

type Ctx = { params: Promise<{ projectId: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  return json({ datasets: await listDatasets(getDb(), actor, await uuidParam(ctx, "projectId", "project")) });
});

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const projectId = await uuidParam(ctx, "projectId", "project");
  const { upload, fields } = await readUpload(req, datasetCreateFieldsSchema);
  const { mapping, ...rest } = fields;
  return json(await createDataset(getDb(), actor, projectId, { ...rest, upload: { ...upload, mapping } }), 201);
});
