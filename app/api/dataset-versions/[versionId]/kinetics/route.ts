import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { fitSaveSchema } from "@/lib/schemas/fits";
import { saveFitAsKinetics } from "@/lib/services/fits";

/** Refits one law and saves it as a kinetics model or a new version, with its source. */
export const POST = recordRoute("versionId", "dataset version")(async ({ req, actor, db, id }) =>
  json(await saveFitAsKinetics(db, actor, id, await readJson(req, fitSaveSchema)), 201),
);
