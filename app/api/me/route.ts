import { listTeamsOfUser } from "@/lib/authz/actor";
import { json } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";

export const GET = signedInRoute(async ({ actor, db }) => {
  const teams = await listTeamsOfUser(db, actor.userId);
  return json({ user: { id: actor.userId, email: actor.email, name: actor.name }, team: { id: actor.teamId, name: actor.teamName, role: actor.role }, teams });
});
