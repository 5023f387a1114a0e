import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { getDisplayPreference, setDisplayPreference } from "@/lib/services/display-units";
import { displayUnitsSchema } from "@/lib/schemas/display-units";

/** The signed-in user's display-unit choice. */
export const GET = signedInRoute(async ({ actor, db }) => json({ displayUnits: await getDisplayPreference(db, actor.userId) }));

/** Sets it; the screens, the report, its PDF and the exports follow it from the next load. */
export const PUT = signedInRoute(async ({ req, actor, db }) => {
  const { displayUnits } = await readJson(req, displayUnitsSchema);
  return json({ displayUnits: await setDisplayPreference(db, actor, displayUnits) });
});
