import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getDataset } from "@/lib/services/datasets";

export const GET = recordRoute("datasetId", "dataset")(async ({ actor, db, id }) => json({ dataset: await getDataset(db, actor, id) }));
