import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getKineticsModel } from "@/lib/services/kinetics";

export const GET = recordRoute("modelId", "kinetics model")(async ({ actor, db, id }) => json({ model: await getKineticsModel(db, actor, id) }));
