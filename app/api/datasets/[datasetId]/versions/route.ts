import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { readUpload } from "@/lib/http/read-upload";
import { json, route, uuidParam } from "@/lib/http";
import { datasetVersionFieldsSchema } from "@/lib/schemas/datasets";
import { addDatasetVersion } from "@/lib/services/datasets";

type Ctx = { params: Promise<{ datasetId: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const datasetId = await uuidParam(ctx, "datasetId", "dataset");
  const { upload, fields } = await readUpload(req, datasetVersionFieldsSchema);
  const { mapping, ...rest } = fields;
  return json({ version: await addDatasetVersion(getDb(), actor, datasetId, { ...rest, upload: { ...upload, mapping } }) }, 201);
});
