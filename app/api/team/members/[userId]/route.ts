import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route, uuidParam } from "@/lib/http";
import { memberUpdateSchema } from "@/lib/schemas/accounts";
import { removeMember, updateMemberRole } from "@/lib/services/members";

type Ctx = { params: Promise<{ userId: string }> };

export const PATCH = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  // The body first: a bad role is named even when the member id is wrong too.
  const { role } = await readJson(req, memberUpdateSchema);
  const userId = await uuidParam(ctx, "userId", "member");
  return json({ member: await updateMemberRole(getDb(), actor, userId, role) });
});

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const userId = await uuidParam(ctx, "userId", "member");
  await removeMember(getDb(), actor, userId);
  return new Response(null, { status: 204 });
});
