import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { invitationCreateSchema } from "@/lib/schemas/accounts";
import { createInvitation, listOpenInvitations } from "@/lib/services/members";

export const GET = signedInRoute(async ({ actor, db }) => json({ invitations: await listOpenInvitations(db, actor) }));

export const POST = signedInRoute(async ({ req, actor, db }) => {
  const input = await readJson(req, invitationCreateSchema);
  return json({ invitation: await createInvitation(db, actor, input) }, 201);
});
