import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { uuidSchema } from "@/lib/schemas/foundation";
import { revokeInvitation } from "@/lib/services/members";

type Ctx = { params: Promise<{ invitationId: string }> };

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const { invitationId } = await ctx.params;
  if (!uuidSchema.safeParse(invitationId).success) throw notFound("open invitation");
  await revokeInvitation(getDb(), actor, invitationId);
  return new Response(null, { status: 204 });
});
