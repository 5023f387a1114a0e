import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getSweep } from "@/lib/services/sweeps";

/** The sweep with its progress (done/total, elapsed and estimated remaining seconds). */
export const GET = recordRoute("sweepId", "sweep")(async ({ actor, db, id }) => json({ sweep: await getSweep(db, actor, id) }));
