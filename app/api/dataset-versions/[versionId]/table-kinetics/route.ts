import { json, readJson } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { tableKineticsSchema } from "@/lib/schemas/datasets";
import { createTableKinetics } from "@/lib/services/datasets";

export const POST = recordRoute("versionId", "dataset version")(async ({ req, actor, db, id }) =>
  json(await createTableKinetics(db, actor, id, await readJson(req, tableKineticsSchema)), 201),
);
