import { cookies } from "next/headers";
import { z } from "zod";
import { TEAM_COOKIE } from "@/lib/auth/session";
import { listTeamsOfUser } from "@/lib/authz/actor";
import { notFound } from "@/lib/errors";
import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { uuidSchema } from "@/lib/schemas/ids";

const switchSchema = z.object({ teamId: uuidSchema }).strict();

/** Switches the active team; only teams the user belongs to are accepted. */
export const POST = signedInRoute(async ({ req, actor, db }) => {
  const { teamId } = await readJson(req, switchSchema);
  const choice = (await listTeamsOfUser(db, actor.userId)).find((t) => t.teamId === teamId);
  if (!choice) throw notFound("team");
  (await cookies()).set(TEAM_COOKIE, teamId, { httpOnly: true, sameSite: "lax", path: "/" });
  return json({ team: { id: choice.teamId, name: choice.teamName, role: choice.role } });
});
