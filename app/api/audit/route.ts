import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, readQuery, route } from "@/lib/http";
import { auditQuerySchema } from "@/lib/schemas/audit";
import { listAuditEntries } from "@/lib/services/audit";

export const GET = route(async (req) => {
  const actor = await requireActor();
  const { entityType, entityId } = readQuery(req, auditQuerySchema);
  const entries = await listAuditEntries(getDb(), actor, { entityType, entityId });
  return json({ entries });
});
