import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { readUpload } from "@/lib/http/read-upload";
import { json, route, uuidParam } from "@/lib/http";
import { datasetPreviewFieldsSchema } from "@/lib/schemas/datasets";
import { previewDataset } from "@/lib/services/datasets";

type Ctx = { params: Promise<{ projectId: string }> };

/** Reads an upload (multipart: file + mapping) and answers with its rows and problems; stores nothing. */
export const POST = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const projectId = await uuidParam(ctx, "projectId", "project");
  const { upload, fields } = await readUpload(req, datasetPreviewFieldsSchema);
  return json({ preview: await previewDataset(getDb(), actor, projectId, { ...upload, mapping: fields.mapping }) });
});
