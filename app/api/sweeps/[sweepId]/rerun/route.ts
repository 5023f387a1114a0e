import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { rerunSweep } from "@/lib/services/sweeps";

export const POST = recordRoute("sweepId", "sweep")(async ({ actor, db, id }) => json({ sweep: await rerunSweep(db, actor, id) }, 201));
