import { and, desc, eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { auditEntries, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";

export interface AuditInput {
  teamId: string | null;
  actorId: string | null;
  action: string;
  entityType: string;
  entityId: string;
  details?: Record<string, unknown>;
}

/** Appends one entry; call inside the same transaction as the change it records. */
export async function recordAudit(tx: Executor, entry: AuditInput): Promise<void> {
  await tx.insert(auditEntries).values({ ...entry, details: entry.details ?? {} });
}

export async function listAuditEntries(
  db: Executor,
  actor: Actor,
  opts: { entityType?: string; entityId?: string; limit?: number } = {},
) {
  assertCan(actor, "audit.read");
  const filters = [eq(auditEntries.teamId, actor.teamId)];
  if (opts.entityType) filters.push(eq(auditEntries.entityType, opts.entityType));
  if (opts.entityId) filters.push(eq(auditEntries.entityId, opts.entityId));
  return db
    .select({
      id: auditEntries.id,
      action: auditEntries.action,
      entityType: auditEntries.entityType,
      entityId: auditEntries.entityId,
      details: auditEntries.details,
      at: auditEntries.at,
      actorName: users.name,
      actorEmail: users.email,
    })
    .from(auditEntries)
    .leftJoin(users, eq(users.id, auditEntries.actorId))
    .where(and(...filters))
    .orderBy(desc(auditEntries.at))
    .limit(Math.min(opts.limit ?? 100, 500));
}
