import { json, readQuery } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { auditQuerySchema } from "@/lib/schemas/audit";
import { listAuditEntries } from "@/lib/services/audit";

export const GET = signedInRoute(async ({ req, actor, db }) => {
  const { entityType, entityId } = readQuery(req, auditQuerySchema);
  const entries = await listAuditEntries(db, actor, { entityType, entityId });
  return json({ entries });
});
