import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { listPins } from "@/lib/services/pins";

export const GET = recordRoute("projectId", "project")(async ({ actor, db, id }) => json({ pins: await listPins(db, actor, id) }));
