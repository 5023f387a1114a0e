import { index, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";

/* The append-only audit trail (a trigger refuses updates and deletes). */

/** Append-only: a trigger in the migrations refuses UPDATE and DELETE. */
export const auditEntries = pgTable(
  "audit_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "set null" }),
    actorId: text("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    details: jsonb("details").$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_team_at_idx").on(t.teamId, t.at), index("audit_entity_idx").on(t.entityType, t.entityId)],
);

export type AuditEntry = typeof auditEntries.$inferSelect;
