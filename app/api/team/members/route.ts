import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route } from "@/lib/http";
import { listMembers } from "@/lib/services/members";

export const GET = route(async () => {
  const actor = await requireActor();
  return json({ members: await listMembers(getDb(), actor) });
});
