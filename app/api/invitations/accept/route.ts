import { getDb } from "@/db/client";
import { json, readJson, route } from "@/lib/http";
import { invitationAcceptSchema } from "@/lib/schemas/accounts";
import { acceptInvitation } from "@/lib/services/members";

/** Public: the one-time token in the body is the credential. */
export const POST = route(async (req) => {
  const input = await readJson(req, invitationAcceptSchema);
  return json(await acceptInvitation(getDb(), input), 201);
});
