import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { invitationCreateSchema } from "@/lib/schemas/accounts";
import { createInvitation, listOpenInvitations } from "@/lib/services/members";

export const GET = route(async () => {
  const actor = await requireActor();
  return json({ invitations: await listOpenInvitations(getDb(), actor) });
});

export const POST = route(async (req) => {
  const actor = await requireActor();
  const input = await readJson(req, invitationCreateSchema);
  return json({ invitation: await createInvitation(getDb(), actor, input) }, 201);
});
