import { cookies } from "next/headers";
import { z } from "zod";
import { getDb } from "@/db/client";
import { requireActor, TEAM_COOKIE } from "@/lib/auth/session";
import { listTeamsOfUser } from "@/lib/authz/actor";
import { notFound } from "@/lib/errors";
import { json, readJson, route } from "@/lib/http";
import { uuidSchema } from "@/lib/schemas/ids";

const switchSchema = z.object({ teamId: uuidSchema }).strict();

/** Switches the active team; only teams the user belongs to are accepted. */
export const POST = route(async (req) => {
  const actor = await requireActor();
  const { teamId } = await readJson(req, switchSchema);
  const choice = (await listTeamsOfUser(getDb(), actor.userId)).find((t) => t.teamId === teamId);
  if (!choice) throw notFound("team");
  (await cookies()).set(TEAM_COOKIE, teamId, { httpOnly: true, sameSite: "lax", path: "/" });
  return json({ team: { id: choice.teamId, name: choice.teamName, role: choice.role } });
});
