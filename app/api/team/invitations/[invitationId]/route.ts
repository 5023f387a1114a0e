import { noContent } from "@/lib/http";
import { recordRoute } from "@/lib/http/signed-in-route";
import { revokeInvitation } from "@/lib/services/members";

export const DELETE = recordRoute("invitationId", "open invitation")(async ({ actor, db, id }) => {
  await revokeInvitation(db, actor, id);
  return noContent();
});
