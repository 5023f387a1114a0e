import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getDatasetVersion } from "@/lib/services/datasets";

export const GET = recordRoute("versionId", "dataset version")(async ({ actor, db, id }) => json({ version: await getDatasetVersion(db, actor, id) }));
