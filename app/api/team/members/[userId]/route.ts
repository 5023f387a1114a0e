import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readJson, route } from "@/lib/http";
import { memberUpdateSchema } from "@/lib/schemas/foundation";
import { removeMember, updateMemberRole } from "@/lib/services/members";

type Ctx = { params: Promise<{ userId: string }> };

export const PATCH = route<Ctx>(async (req, ctx) => {
  const actor = await requireActor();
  const { userId } = await ctx.params;
  const { role } = await readJson(req, memberUpdateSchema);
  return json({ member: await updateMemberRole(getDb(), actor, userId, role) });
});

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const actor = await requireActor();
  const { userId } = await ctx.params;
  await removeMember(getDb(), actor, userId);
  return new Response(null, { status: 204 });
});
