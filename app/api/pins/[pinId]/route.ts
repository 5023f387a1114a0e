import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getPin } from "@/lib/services/pins";

export const GET = recordRoute("pinId", "pinned design")(async ({ actor, db, id }) => json({ pin: await getPin(db, actor, id) }));
