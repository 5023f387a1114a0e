import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { route, uuidParam } from "@/lib/http";
import { revokeInvitation } from "@/lib/services/members";

type Ctx = { params: Promise<{ invitationId: string }> };

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const invitationId = await uuidParam(ctx, "invitationId", "open invitation");
  await revokeInvitation(getDb(), actor, invitationId);
  return new Response(null, { status: 204 });
});
