import { z } from "zod";
import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { getDisplayPreference, setDisplayPreference } from "@/lib/services/display-units";
import { DISPLAY_PREFERENCES } from "@/lib/units/display-preference";

const bodySchema = z
  .object({
    displayUnits: z.enum(DISPLAY_PREFERENCES, { error: "Show results in: choose one of the offered unit sets" }),
  })
  .strict();

/** The signed-in user's display-unit choice. */
export const GET = route(async () => {
  const actor = await requireActor();
  return json({ displayUnits: await getDisplayPreference(getDb(), actor.userId) });
});

/** Sets it; the screens, the report, its PDF and the exports follow it from the next load. */
export const PUT = route(async (req) => {
  const actor = await requireActor();
  const { displayUnits } = await readJson(req, bodySchema);
  return json({ displayUnits: await setDisplayPreference(getDb(), actor, displayUnits) });
});
