import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { listTeamsOfUser } from "@/lib/authz/actor";
import { json, route } from "@/lib/http";

export const GET = route(async () => {
  const actor = await requireActor();
  const teams = await listTeamsOfUser(getDb(), actor.userId);
  return json({ user: { id: actor.userId, email: actor.email, name: actor.name }, team: { id: actor.teamId, name: actor.teamName, role: actor.role }, teams });
});
