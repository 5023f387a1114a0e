import { json } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { getRun } from "@/lib/services/robustness";

export const GET = recordRoute("runId", "robustness run")(async ({ actor, db, id }) => json({ run: await getRun(db, actor, id) }));
