import { readUpload } from "@/lib/http/read-upload";
import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { datasetVersionFieldsSchema } from "@/lib/schemas/datasets";
import { addDatasetVersion } from "@/lib/services/datasets";

export const POST = recordRoute("datasetId", "dataset")(async ({ req, actor, db, id }) => {
  const { upload, fields } = await readUpload(req, datasetVersionFieldsSchema);
  const { mapping, ...rest } = fields;
  return json({ version: await addDatasetVersion(db, actor, id, { ...rest, upload: { ...upload, mapping } }) }, 201);
});
