import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { fitRequestSchema } from "@/lib/schemas/fits";
import { fitDatasetVersion } from "@/lib/services/fits";

/** Fits the chosen rate laws to a dataset version, computed on demand (nothing stored). */
export const POST = recordRoute("versionId", "dataset version")(async ({ req, actor, db, id }) =>
  json(await fitDatasetVersion(db, actor, id, await readJson(req, fitRequestSchema))),
);
