import { json, noContent, readJson, uuidParam } from "@/lib/http";
import { recordRoute, signedInRoute } from "@/lib/http/signed-in-route";
import { memberUpdateSchema } from "@/lib/schemas/accounts";
import { removeMember, updateMemberRole } from "@/lib/services/members";

type Ctx = { params: Promise<{ userId: string }> };

// Not recordRoute: the body first, so a bad role is named even when the member id is wrong too.
export const PATCH = signedInRoute<Ctx>(async ({ req, ctx, actor, db }) => {
  const { role } = await readJson(req, memberUpdateSchema);
  const userId = await uuidParam(ctx, "userId", "member");
  return json({ member: await updateMemberRole(db, actor, userId, role) });
});

export const DELETE = recordRoute("userId", "member")(async ({ actor, db, id }) => {
  await removeMember(db, actor, id);
  return noContent();
});
