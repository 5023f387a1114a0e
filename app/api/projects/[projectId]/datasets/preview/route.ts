import { readUpload } from "@/lib/http/read-upload";
import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { datasetPreviewFieldsSchema } from "@/lib/schemas/datasets";
import { previewDataset } from "@/lib/services/datasets";

/** Reads an upload (multipart: file + mapping) and answers with its rows and problems; stores nothing. */
export const POST = recordRoute("projectId", "project")(async ({ req, actor, db, id }) => {
  const { upload, fields } = await readUpload(req, datasetPreviewFieldsSchema);
  return json({ preview: await previewDataset(db, actor, id, { ...upload, mapping: fields.mapping }) });
});
