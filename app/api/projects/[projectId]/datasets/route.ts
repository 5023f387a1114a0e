import { readUpload } from "@/lib/http/read-upload";
import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { datasetCreateFieldsSchema } from "@/lib/schemas/datasets";
import { createDataset, listDatasets } from "@/lib/services/datasets";

const onProject = recordRoute("projectId", "project");

export const GET = onProject(async ({ actor, db, id }) => json({ datasets: await listDatasets(db, actor, id) }));

export const POST = onProject(async ({ req, actor, db, id }) => {
  const { upload, fields } = await readUpload(req, datasetCreateFieldsSchema);
  const { mapping, ...rest } = fields;
  return json(await createDataset(db, actor, id, { ...rest, upload: { ...upload, mapping } }), 201);
});
