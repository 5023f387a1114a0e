import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { listScenarios } from "@/lib/services/sweeps";

export const GET = recordRoute("sweepId", "sweep")(async ({ actor, db, id }) => json({ scenarios: await listScenarios(db, actor, id) }));
