import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { getDisplayPreference, setDisplayPreference } from "@/lib/services/display-units";
import { displayUnitsSchema } from "@/lib/schemas/display-units";

/** The signed-in user's display-unit choice. */
export const GET = route(async () => {
  const actor = await requireActor();
  return json({ displayUnits: await getDisplayPreference(getDb(), actor.userId) });
});

/** Sets it; the screens, the report, its PDF and the exports follow it from the next load. */
export const PUT = route(async (req) => {
  const actor = await requireActor();
  const { displayUnits } = await readJson(req, displayUnitsSchema);
  return json({ displayUnits: await setDisplayPreference(getDb(), actor, displayUnits) });
});
