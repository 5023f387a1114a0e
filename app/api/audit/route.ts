import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route } from "@/lib/http";
import { listAuditEntries } from "@/lib/services/audit";

export const GET = route(async (req) => {
  const actor = await requireActor();
  const q = new URL(req.url).searchParams;
  const entries = await listAuditEntries(getDb(), actor, {
    entityType: q.get("entityType") ?? undefined,
    entityId: q.get("entityId") ?? undefined,
  });
  return json({ entries });
});
